"""Small helpers shared by the rule tests: pick one rule's findings and their places."""
from __future__ import annotations

from linter.engine import Result
from linter.model import Finding


def of_rule(result: Result, rule: str) -> list[Finding]:
    """The kept findings of one rule."""
    return [finding for finding in result.findings if finding.rule == rule]


def places(findings: list[Finding]) -> list[tuple[int, int]]:
    """(line, column) of each finding."""
    return [(finding.span.line, finding.span.column) for finding in findings]
