"""``normguard rules``: the list, one rule's page, and an unknown id."""
from __future__ import annotations

from linter.cli.main import main
from rules import all_rules


def test_lists_every_rule(runner):
    outcome = runner.invoke(main, ["rules"])
    assert outcome.exit_code == 0
    lines = outcome.stdout.splitlines()
    assert [line.split()[0] for line in lines] == [rule.id for rule in all_rules()]
    assert all(line.split()[1] in ("error", "warning", "note") for line in lines)


def test_prints_a_page(runner):
    outcome = runner.invoke(main, ["rules", "bcnf-violation"])
    assert outcome.exit_code == 0 and outcome.stdout.startswith("# bcnf-violation\n")


def test_unknown_rule_suggests(runner):
    outcome = runner.invoke(main, ["rules", "transitive"])
    assert outcome.exit_code == 2
    assert outcome.stderr == "normguard: unknown rule 'transitive'; did you mean transitive-dependency?\n"
