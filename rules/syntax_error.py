"""``syntax-error``: found by the reader; this module gives it a level, a summary and a page."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page, reader_findings

ID = "syntax-error"
RULE = Rule(
    ID,
    "error",
    "A statement cannot be parsed in the dialect chosen for its file.",
    read_page(ID),
    reader_findings(ID),
)
