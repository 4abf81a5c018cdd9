"""Option values shared by commands: rule lists, dialect names, colour and the exit status.

>>> split_ids(("missing-key,nullable-unique", " bcnf-violation "))
('missing-key', 'nullable-unique', 'bcnf-violation')
>>> use_color(None, is_tty=True, environ={"NO_COLOR": ""})
True
>>> use_color(None, is_tty=True, environ={"NO_COLOR": "1"})
False
>>> use_color(True, is_tty=False, environ={"NO_COLOR": "1"})
True
"""
from __future__ import annotations

import difflib
from collections.abc import Iterable, Mapping

from linter.cli.errors import Failure
from linter.config_check import DIALECTS
from linter.model import Finding
from linter.reporters.ordering import RANK


def split_ids(values: Iterable[str]) -> tuple[str, ...]:
    """Rule ids from repeated and/or comma-separated option values, in order, blanks dropped."""
    return tuple(part.strip() for value in values for part in value.split(",") if part.strip())


def checked_dialect(name: str | None) -> str | None:
    """``name`` lower-cased when sqlglot knows it; an unknown dialect fails with suggestions."""
    if name is None:
        return None
    if name.lower() in DIALECTS:
        return name.lower()
    close = difflib.get_close_matches(name.lower(), sorted(DIALECTS), n=3)
    hint = f"; did you mean {', '.join(close)}?" if close else ""
    raise Failure(f"unknown dialect '{name}'{hint} (known: {', '.join(sorted(DIALECTS))})")


def use_color(flag: bool | None, *, is_tty: bool, environ: Mapping[str, str]) -> bool:
    """An explicit flag wins; otherwise colour on a terminal unless NO_COLOR is set and not empty."""
    if flag is not None:
        return flag
    return is_tty and not environ.get("NO_COLOR", "")


def exit_status(findings: Iterable[Finding], fail_on: str) -> int:
    """1 when any finding is at or above the ``fail_on`` severity, else 0."""
    return 1 if any(RANK[f.severity] >= RANK[fail_on] for f in findings) else 0
