"""Every rule normguard runs: one module per rule in this package, each defining ``RULE``.

A new rule is a new file here; nothing else needs registering.

>>> ids = [rule.id for rule in all_rules()]
>>> ids == sorted(ids) and "missing-key" in ids
True
>>> get_rule("missing-key").severity
'warning'
"""
from __future__ import annotations

import importlib
import pkgutil
from collections.abc import Callable, Iterator
from functools import cache
from importlib import resources

from linter.model import Finding
from linter.rule import Context, Rule


@cache
def _discovered() -> tuple[Rule, ...]:
    """The ``RULE`` of every module in this package, sorted by id; a repeated id is a bug."""
    found: dict[str, Rule] = {}
    for info in pkgutil.iter_modules(__path__):
        module = importlib.import_module(f"{__name__}.{info.name}")
        rule = getattr(module, "RULE", None)
        if not isinstance(rule, Rule):
            continue
        if rule.id in found:
            raise RuntimeError(f"rule id '{rule.id}' is defined twice (rules/{info.name}.py)")
        found[rule.id] = rule
    return tuple(found[rule_id] for rule_id in sorted(found))


def all_rules() -> list[Rule]:
    """Every rule, sorted by id."""
    return list(_discovered())


def get_rule(rule_id: str) -> Rule | None:
    """The rule called ``rule_id``, or None."""
    return next((rule for rule in _discovered() if rule.id == rule_id), None)


def read_page(rule_id: str) -> str:
    """The Markdown page ``rules/<rule_id>.md`` shipped beside the rule modules."""
    return resources.files(__name__).joinpath(f"{rule_id}.md").read_text(encoding="utf-8")


def reader_findings(rule_id: str) -> Callable[[Context], Iterator[Finding]]:
    """A check that passes on the findings the reader recorded under ``rule_id``."""

    def check(context: Context) -> Iterator[Finding]:
        return (finding for finding in context.catalog.findings if finding.rule == rule_id)

    return check
