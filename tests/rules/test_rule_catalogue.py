"""Every rule module is found, and every rule has a valid severity, a one-line summary and a full page."""
from __future__ import annotations

import re

import pytest

from linter.model import SEVERITIES
from rules import all_rules, get_rule

from ..locations import ROOT

RULES_DIR = ROOT / "rules"
DEFAULTS = {
    "missing-key": "warning", "partial-dependency": "warning", "transitive-dependency": "warning",
    "bcnf-violation": "warning", "nullable-unique": "warning", "redundant-unique": "note",
    "lossy-split": "error", "unenforceable-dependency": "warning",
    "annotation-error": "error", "syntax-error": "error", "unsupported-statement": "warning",
    "schema-conflict": "warning", "file-error": "warning",
}


def test_every_module_defining_a_rule_is_discovered_in_id_order() -> None:
    defining = {path.stem for path in RULES_DIR.glob("*.py") if re.search(r"^RULE = ", path.read_text(), re.M)}
    ids = [rule.id for rule in all_rules()]
    assert ids == sorted(ids) and len(ids) == len(set(ids)) == len(defining)
    assert {rule_id.replace("-", "_") for rule_id in ids} == defining


def test_rules_keep_their_default_severity() -> None:
    assert {rule.id: rule.severity for rule in all_rules()} == DEFAULTS
    assert get_rule("no-such-rule") is None


@pytest.mark.parametrize("rule_id", sorted(DEFAULTS))
def test_summary_and_page(rule_id: str) -> None:
    rule = get_rule(rule_id)
    assert rule.severity in SEVERITIES
    assert "\n" not in rule.summary and rule.summary.endswith(".")
    assert rule.page.startswith(f"# {rule.id}\n")
    sections = ["**What it flags.**", "**Why it matters.**", "**Example.**", "**How to fix it.**"]
    at = [rule.page.find(section) for section in sections]
    assert -1 not in at and at == sorted(at)
    assert "```sql" in rule.page


@pytest.mark.parametrize("rule_id", sorted(DEFAULTS))
def test_pages_that_propose_a_migration_warn_about_it(rule_id: str) -> None:
    page = get_rule(rule_id).page
    fix = page[page.index("**How to fix it.**"):]
    if "```sql" in fix:
        assert "back up" in page and "never applies a migration" in page
