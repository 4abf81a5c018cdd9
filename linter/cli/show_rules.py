"""``normguard rules [RULE]``: list the rules, or print one rule's page."""
from __future__ import annotations

import difflib

import click

from linter.cli.errors import Failure
from rules import all_rules


def unknown_rule(rule_id: str, known: list[str]) -> Failure:
    """The failure for a rule id normguard does not have, with the closest ids as suggestions."""
    close = [k for k in known if rule_id and rule_id in k]
    close = close or difflib.get_close_matches(rule_id, known, n=3, cutoff=0.5)
    hint = f"; did you mean {', '.join(close)}?" if close else "; 'normguard rules' lists them"
    return Failure(f"unknown rule '{rule_id}'{hint}")


@click.command("rules")
@click.argument("rule_id", required=False, metavar="[RULE]")
def show_rules(rule_id: str | None) -> None:
    """List every rule with its default severity, or print the page of RULE."""
    rules = {rule.id: rule for rule in all_rules()}
    if rule_id is None:
        width = max(len(name) for name in rules)
        for rule in sorted(rules.values(), key=lambda r: r.id):
            click.echo(f"{rule.id:<{width}}  {rule.severity:<7}  {rule.summary}")
        return
    if rule_id not in rules:
        raise unknown_rule(rule_id, sorted(rules))
    click.echo(rules[rule_id].page.rstrip("\n"))
