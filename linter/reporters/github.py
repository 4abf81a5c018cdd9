"""GitHub Actions workflow commands: one ``::error``/``::warning``/``::notice`` line per finding.

Escaping follows the actions toolkit (``packages/core/src/command.ts``): message data escapes ``%``,
CR and LF; property values also escape ``:`` and ``,``.

>>> escape_property("a,b:c%")
'a%2Cb%3Ac%25'
>>> escape_data("two\\nlines")
'two%0Alines'
"""
from __future__ import annotations

from typing import TYPE_CHECKING

from linter.model import Finding
from linter.reporters.ordering import RANK, counts, ordered, summary

if TYPE_CHECKING:
    from linter.engine import Result

_COMMAND: dict[str, str] = {"error": "error", "warning": "warning", "note": "notice"}
_SHOWN_PER_KIND = 10  # the runner shows at most 10 annotations of each kind per step


def escape_data(text: str) -> str:
    """Escape the message part of a workflow command."""
    return text.replace("%", "%25").replace("\r", "%0D").replace("\n", "%0A")


def escape_property(text: str) -> str:
    """Escape a property value (``file=``, ``title=`` ...) of a workflow command."""
    return escape_data(text).replace(":", "%3A").replace(",", "%2C")


def _properties(finding: Finding) -> str:
    """``file=...,line=...`` with inclusive end column; columns only for a one-line span."""
    span = finding.span
    props = [("file", span.path), ("line", str(span.line)), ("endLine", str(span.end_line))]
    if span.line == span.end_line:
        last = max(span.column, span.end_column - 1)
        props += [("col", str(span.column)), ("endColumn", str(last))]
    props.append(("title", f"normguard {finding.rule}"))
    return ",".join(f"{name}={escape_property(value)}" for name, value in props)


def annotation(finding: Finding) -> str:
    """The workflow command for one finding; the explanation follows the message on new lines."""
    text = "\n".join([finding.message, *finding.explanation])
    return f"::{_COMMAND[finding.severity]} {_properties(finding)}::{escape_data(text)}"


def render_github(result: Result) -> str:
    """Annotations, most severe first (the runner drops those past its limit), then a summary."""
    findings = sorted(ordered(result.findings), key=lambda f: -RANK[f.severity])
    lines = [annotation(finding) for finding in findings]
    hidden = sum(max(0, n - _SHOWN_PER_KIND) for n in counts(findings).values())
    if hidden:
        lines.append(
            f"normguard: {hidden} findings past the runner's limit of {_SHOWN_PER_KIND} annotations"
            " per kind are not shown on the pull request; use --format text or sarif to see all"
        )
    files = len(result.catalog.files)
    lines.append(summary(result.findings, suppressed=len(result.suppressed), files=files))
    return "\n".join(lines) + "\n"
