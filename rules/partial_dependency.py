"""``partial-dependency``: a column depends on part of a key, so the table is not in 2NF."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page
from rules.violations import violation_check

ID = "partial-dependency"
SEVERITY = "warning"
RULE = Rule(
    ID,
    SEVERITY,
    "A column depends on part of a candidate key, so the table is not in 2NF.",
    read_page(ID),
    violation_check(ID, "partial", SEVERITY),
)
