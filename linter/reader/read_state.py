"""The state of reading one file into statements: ``ReadState``.

>>> from linter.reader.dialects import get_dialect
>>> from linter.reader.line_index import LineIndex
>>> state = ReadState("SELECT 1;", get_dialect("postgres"), LineIndex("db/001.sql", "SELECT 1;"))
>>> state.finding("syntax-error", "error", 7, 8, "an example")
>>> [(f.rule, f.span.column, f.span.end_column) for f in state.findings]
[('syntax-error', 8, 9)]
"""
from __future__ import annotations

from dataclasses import dataclass, field

from sqlglot.dialects.dialect import Dialect
from sqlglot.errors import ErrorLevel
from sqlglot.parser import Parser

from linter.model import Finding
from linter.reader.line_index import LineIndex
from linter.reader.script import Comment

__all__ = ["ReadState"]


@dataclass
class ReadState:
    """One file's text and dialect, with the comments and problems met so far and its parser."""

    text: str
    dialect: Dialect
    lines: LineIndex
    comments: list[Comment] = field(default_factory=list)
    findings: list[Finding] = field(default_factory=list)
    parser: Parser = field(init=False, repr=False)

    def __post_init__(self) -> None:
        self.parser = self.dialect.parser(error_level=ErrorLevel.IMMEDIATE)

    def finding(self, rule: str, severity: str, start: int, end: int, message: str) -> None:
        """Record a finding over ``text[start:end]``."""
        self.findings.append(Finding(rule, severity, self.lines.span(start, end), message))
