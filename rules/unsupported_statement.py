"""``unsupported-statement``: found by the reader; this module gives it a level, a summary and a page."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page, reader_findings

ID = "unsupported-statement"
RULE = Rule(
    ID,
    "warning",
    "A statement that may change the schema is not replayed.",
    read_page(ID),
    reader_findings(ID),
)
