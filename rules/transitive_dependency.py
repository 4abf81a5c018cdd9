"""``transitive-dependency``: a non-key column depends on a non-key, so the table is not in 3NF."""
from __future__ import annotations

from linter.rule import Rule
from rules import read_page
from rules.violations import violation_check

ID = "transitive-dependency"
SEVERITY = "warning"
RULE = Rule(
    ID,
    SEVERITY,
    "A non-key column depends on columns that are not a key, so the table is not in 3NF.",
    read_page(ID),
    violation_check(ID, "transitive", SEVERITY),
)
