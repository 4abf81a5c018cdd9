"""``normguard check`` in process on the courier example: every rule fires where the example puts it.

Each expected (rule, file, line) was planted by hand in ``examples/courier``; the normal-form cases
follow the usual definitions (from memory): a non-key column fixed by part of a composite key breaks
2NF (route_stops), by a non-key column breaks 3NF (couriers, tariffs), and a non-key determinant of
a key column breaks BCNF while 3NF holds (zone_dispatch: dispatcher -> zone).
"""
from __future__ import annotations

import json

from linter.cli.main import main
from rules import all_rules

EXPECTED = {
    ("transitive-dependency", ".normguard.yaml", 11),
    ("transitive-dependency", "migrations/0001_depots_and_couriers.sql", 9),
    ("nullable-unique", "migrations/0001_depots_and_couriers.sql", 15),
    ("redundant-unique", "migrations/0001_depots_and_couriers.sql", 19),
    ("partial-dependency", "migrations/0002_routes.sql", 2),
    ("bcnf-violation", "migrations/0003_dispatch.sql", 2),
    ("missing-key", "migrations/0004_delivery_log.sql", 2),
    ("annotation-error", "migrations/0004_delivery_log.sql", 15),
    ("schema-conflict", "migrations/0005_fix_ups.sql", 2),
    ("syntax-error", "migrations/0005_fix_ups.sql", 7),
    ("unsupported-statement", "migrations/0005_fix_ups.sql", 13),
    ("file-error", "migrations/0006_depot_notes.sql", 1),
    ("lossy-split", "migrations/0007_split_shifts.sql", 15),
    ("unenforceable-dependency", "migrations/0007_split_shifts.sql", 15),
}


def _findings(runner, *args: str) -> tuple[int, list[dict]]:
    """Exit status and findings of ``check --format json``."""
    outcome = runner.invoke(main, ["check", "--format", "json", *args])
    return outcome.exit_code, json.loads(outcome.stdout)["findings"]


def test_every_rule_fires_on_the_example(example, runner):
    code, findings = _findings(runner)
    assert code == 1
    assert {(f["rule"], f["path"], f["line"]) for f in findings} == EXPECTED
    assert {rule for rule, _, _ in EXPECTED} == {rule.id for rule in all_rules()}


def test_allow_annotation_suppresses_and_the_summary_says_so(example, runner):
    outcome = runner.invoke(main, ["check"])
    assert "partner_scans" not in outcome.stdout
    assert outcome.stdout.splitlines()[-1] == "normguard: 3 errors, 10 warnings, 1 note in 7 files (1 suppressed)"


def test_fail_on_sets_the_threshold(example, runner):
    assert runner.invoke(main, ["check", "--select", "redundant-unique"]).exit_code == 0
    assert runner.invoke(main, ["check", "--select", "redundant-unique", "--fail-on", "note"]).exit_code == 1
    assert runner.invoke(main, ["check", "--ignore", "syntax-error,lossy-split", "--ignore", "annotation-error",
                                "--fail-on", "error"]).exit_code == 0


def test_select_and_ignore_take_lists(example, runner):
    _, findings = _findings(runner, "--select", "missing-key,nullable-unique", "--select", "file-error")
    assert {f["rule"] for f in findings} == {"missing-key", "nullable-unique", "file-error"}
    _, findings = _findings(runner, "--ignore", "transitive-dependency")
    assert "transitive-dependency" not in {f["rule"] for f in findings}


def test_target_lowers_beyond_target_findings_to_notes(example, runner):
    _, findings = _findings(runner, "--target", "3nf")
    (bcnf,) = [f for f in findings if f["rule"] == "bcnf-violation"]
    assert bcnf["severity"] == "note"


def test_given_files_are_checked_in_the_context_of_the_migrations_folder(example, runner):
    code, findings = _findings(runner, "migrations/0003_dispatch.sql")
    assert code == 1
    assert {f["rule"] for f in findings} == {"bcnf-violation"}
    # read alone, 0005 would not know couriers; with the folder as context it conflicts with 0001
    _, findings = _findings(runner, "migrations/0005_fix_ups.sql")
    assert {f["path"] for f in findings} == {"migrations/0005_fix_ups.sql"}
    assert "schema-conflict" in {f["rule"] for f in findings}


def test_asking_for_the_whole_folder_reports_everything(example, runner):
    _, findings = _findings(runner, "migrations")
    assert {(f["rule"], f["path"], f["line"]) for f in findings} == EXPECTED


def test_context_option_without_settings(example, runner, tmp_path):
    (example / ".normguard.yaml").unlink()
    _, alone = _findings(runner, "migrations/0005_fix_ups.sql")
    assert "schema-conflict" in {f["rule"] for f in alone}  # ALTER of a table it never saw
    assert "couriers" in {f["table"] for f in alone}
    _, within = _findings(runner, "--context", "migrations", "migrations/0005_fix_ups.sql")
    assert {f["path"] for f in within} == {"migrations/0005_fix_ups.sql"}
    assert [f["message"] for f in within if f["rule"] == "schema-conflict"] == [
        "table couriers already has a column phone"
    ]
