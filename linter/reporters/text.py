"""GNU-style diagnostics: ``path:line:column: severity: message [rule-id]``, then the explanation.

The location prefix follows the GNU Coding Standards, section 4.4 "Formatting Error Messages";
columns count characters from 1.

>>> from types import SimpleNamespace
>>> from linter.model import Catalog, Finding, Span
>>> found = Finding("missing-key", "warning", Span("db/001.sql", 3, 1, 3, 13),
...                 "table parcels has no key", explanation=["add a primary key"])
>>> result = SimpleNamespace(findings=[found], suppressed=[], catalog=Catalog(files=["db/001.sql"]))
>>> print(render_text(result), end="")
db/001.sql:3:1: warning: table parcels has no key [missing-key]
    add a primary key
normguard: 0 errors, 1 warning, 0 notes in 1 file
"""
from __future__ import annotations

from typing import TYPE_CHECKING

from linter.model import Finding
from linter.reporters.ordering import ordered, summary

if TYPE_CHECKING:
    from linter.engine import Result

_RESET = "\033[0m"
_BOLD = "\033[1m"
_SEVERITY_COLOR: dict[str, str] = {
    "error": "\033[1;31m",
    "warning": "\033[1;35m",
    "note": "\033[1;36m",
}


def _one_line(text: str) -> str:
    """Collapse line breaks so a message stays on its own line."""
    return " ".join(text.splitlines())


def _line(finding: Finding, color: bool) -> str:
    """The GNU line of one finding."""
    where, severity, rule = finding.span.gnu(), finding.severity, f"[{finding.rule}]"
    if color:
        where = f"{_BOLD}{where}{_RESET}"
        severity = f"{_SEVERITY_COLOR[severity]}{severity}{_RESET}"
    return f"{where}: {severity}: {_one_line(finding.message)} {rule}"


def render_text(result: Result, *, color: bool = False) -> str:
    """Every finding in report order with its explanation indented, and a closing summary."""
    lines: list[str] = []
    for finding in ordered(result.findings):
        lines.append(_line(finding, color))
        lines.extend(f"    {_one_line(text)}" for text in finding.explanation)
    files = len(result.catalog.files)
    lines.append(summary(result.findings, suppressed=len(result.suppressed), files=files))
    return "\n".join(lines) + "\n"
