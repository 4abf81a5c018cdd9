"""``bcnf-violation``: a non-key left side while 3NF holds, so the table is not in BCNF."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page
from rules.violations import violation_check

ID = "bcnf-violation"
SEVERITY = "warning"
RULE = Rule(
    ID,
    SEVERITY,
    "A dependency's left side is not a key, though 3NF holds, so the table is not in BCNF.",
    read_page(ID),
    violation_check(ID, "bcnf", SEVERITY),
)
