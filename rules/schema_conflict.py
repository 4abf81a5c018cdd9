"""``schema-conflict``: found by the reader; this module gives it a level, a summary and a page."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page, reader_findings

ID = "schema-conflict"
RULE = Rule(
    ID,
    "warning",
    "A statement does not fit the schema replayed before it.",
    read_page(ID),
    reader_findings(ID),
)
