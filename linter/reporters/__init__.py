"""The output formats: each module renders an engine result as one string.

>>> sorted(FORMATS)
['github', 'json', 'junit', 'sarif', 'text']
"""
from __future__ import annotations

from collections.abc import Callable
from typing import TYPE_CHECKING

from linter.reporters.github import render_github
from linter.reporters.json_report import render_json
from linter.reporters.junit import render_junit
from linter.reporters.sarif import render_sarif
from linter.reporters.text import render_text

if TYPE_CHECKING:
    from linter.engine import Result

FORMATS: dict[str, Callable[..., str]] = {
    "text": render_text,
    "json": render_json,
    "sarif": render_sarif,
    "github": render_github,
    "junit": render_junit,
}


def render(fmt: str, result: Result, *, color: bool = False, exit_code: int = 0) -> str:
    """Render ``result`` in the format named ``fmt``; colour applies to text only."""
    if fmt == "text":
        return render_text(result, color=color)
    if fmt == "sarif":
        return render_sarif(result, exit_code=exit_code)
    return FORMATS[fmt](result)
