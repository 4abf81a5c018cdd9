"""Shared by the split tests: where the fixtures are, their dialects, and the findings of the split rules."""
from __future__ import annotations

from linter.engine import Result
from linter.model import Finding

FIXTURES = "fixtures/splits"
SPLIT_RULES = ("lossy-split", "unenforceable-dependency")


def dialect_of(case: str) -> str:
    """A fixture folder's dialect: the prefix of its name (``mysql_lossy_seed_lots`` -> mysql)."""
    return case.split("_", 1)[0]


def split_findings(result: Result) -> list[Finding]:
    """The findings of the two split rules, in the engine's order."""
    return [finding for finding in result.findings if finding.rule in SPLIT_RULES]
