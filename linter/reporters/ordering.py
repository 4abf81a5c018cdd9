"""Report order and the closing summary shared by the formats.

>>> from linter.model import Finding, Span
>>> a = Finding("missing-key", "warning", Span("b.sql", 2, 1, 2, 5), "no key")
>>> b = Finding("bcnf-violation", "error", Span("a.sql", 9, 1, 9, 5), "breaks BCNF")
>>> [f.rule for f in ordered([a, b])]
['bcnf-violation', 'missing-key']
>>> summary([a, b], suppressed=1, files=2)
'normguard: 1 error, 1 warning, 0 notes in 2 files (1 suppressed)'
"""
from __future__ import annotations

from collections.abc import Iterable

from linter.baseline import plural
from linter.model import SEVERITIES, Finding

RANK: dict[str, int] = {severity: rank for rank, severity in enumerate(SEVERITIES)}


def _key(finding: Finding) -> tuple[str, int, int, int, str, str]:
    """Sort key: file, position, the more severe first, then rule and message."""
    span = finding.span
    return (span.path, span.line, span.column, -RANK[finding.severity], finding.rule, finding.message)


def ordered(findings: Iterable[Finding]) -> list[Finding]:
    """Findings in a stable report order, so two runs on the same input print the same bytes."""
    return sorted(findings, key=_key)


def counts(findings: Iterable[Finding]) -> dict[str, int]:
    """How many findings there are of each severity."""
    tally = dict.fromkeys(SEVERITIES, 0)
    for finding in findings:
        tally[finding.severity] += 1
    return tally


def _count(count: int, word: str) -> str:
    """``1 error`` / ``2 errors``."""
    return f"{count} {plural(count, word)}"


def summary(findings: Iterable[Finding], *, suppressed: int, files: int) -> str:
    """The closing line: counts by severity, files read and findings suppressed."""
    tally = counts(findings)
    parts = ", ".join(_count(tally[s], s) for s in reversed(SEVERITIES))
    line = f"normguard: {parts} in {_count(files, 'file')}"
    return f"{line} ({suppressed} suppressed)" if suppressed else line
