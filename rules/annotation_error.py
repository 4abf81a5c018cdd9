"""``annotation-error``: found by the reader; this module gives it a level, a summary and a page."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page, reader_findings

ID = "annotation-error"
RULE = Rule(
    ID,
    "error",
    "A normguard annotation is malformed or names something that does not exist.",
    read_page(ID),
    reader_findings(ID),
)
