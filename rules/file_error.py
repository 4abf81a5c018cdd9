"""``file-error``: found by the reader; this module gives it a level, a summary and a page."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page, reader_findings

ID = "file-error"
RULE = Rule(
    ID,
    "warning",
    "A file cannot be read, so its statements are missing from the replay.",
    read_page(ID),
    reader_findings(ID),
)
