"""A baseline taken on the tool-library migrations, then the SQL edited the way teams edit it.

Lines move, a CREATE TABLE is reformatted and a new violation comes in: only the new one is
reported. A violation is fixed: it is reported as fixed, and ``--prune`` drops its entry alone.
"""
from __future__ import annotations

import json
import re
from pathlib import Path

import yaml

from linter.cli.main import main

BASELINE = ".normguard-baseline.yaml"

REFORMATTED_MEMBERS = """-- Members of the tool library (reformatted by hand: one line, lower-case keywords).


create table member ( member_no integer primary key, full_name text not null,
  branch_code text not null, branch_street text not null -- normguard: fd branch_code -> branch_street
);
"""


def _entries(path: str = BASELINE) -> list[dict[str, str]]:
    """The entries of a baseline file as written."""
    return yaml.safe_load(Path(path).read_text(encoding="utf-8"))["findings"]


def _finding_lines(output: str) -> list[str]:
    """The GNU finding lines of a text report (``path:line:column: severity: ...``)."""
    return [line for line in output.splitlines() if re.match(r"migrations/[^:]+:\d+:\d+: ", line)]


def _take_baseline(runner) -> list[dict[str, str]]:
    """Run ``normguard baseline migrations`` and return the entries it wrote."""
    outcome = runner.invoke(main, ["baseline", "migrations"])
    assert outcome.exit_code == 0, outcome.output
    assert f"recorded 3 findings in {BASELINE}" in outcome.stderr
    return _entries()


def test_baseline_records_every_finding_with_a_header(library, runner):
    entries = _take_baseline(runner)
    document = yaml.safe_load(Path(BASELINE).read_text(encoding="utf-8"))
    assert document["normguard-baseline"] == 1
    assert sorted((e["rule"], e["table"], e["path"]) for e in entries) == [
        ("missing-key", "loan", "migrations/003_loans.sql"),
        ("nullable-unique", "tool", "migrations/002_tools.sql"),
        ("transitive-dependency", "member", "migrations/001_members.sql"),
    ]
    assert all(len(e["fingerprint"]) == 16 and e["message"] for e in entries)


def test_nothing_new_right_after_the_baseline(library, runner):
    _take_baseline(runner)
    outcome = runner.invoke(main, ["check", "--baseline", BASELINE, "migrations"])
    assert outcome.exit_code == 0, outcome.output
    assert _finding_lines(outcome.stdout) == []
    assert f"3 findings recorded in {BASELINE} not shown" in outcome.stdout


def test_moved_reformatted_and_new(library, runner):
    _take_baseline(runner)
    (library / "001_members.sql").write_text(REFORMATTED_MEMBERS, encoding="utf-8")
    tools = library / "002_tools.sql"
    tools.write_text("-- lines pushed down\n\n\n\n" + tools.read_text(encoding="utf-8"), encoding="utf-8")
    (library / "004_workshops.sql").write_text(
        "CREATE TABLE workshop_slot (starts_at timestamp, room text);\n", encoding="utf-8"
    )
    outcome = runner.invoke(main, ["check", "--baseline", BASELINE, "migrations"])
    assert outcome.exit_code == 1, outcome.output
    lines = _finding_lines(outcome.stdout)
    assert len(lines) == 1 and lines[0].startswith("migrations/004_workshops.sql:1:")
    assert "[missing-key]" in lines[0] and "workshop_slot" in lines[0]
    assert "fixed since the baseline" not in outcome.stdout


def test_fixed_entry_is_reported_then_pruned_alone(library, runner):
    before = _take_baseline(runner)
    text_before = Path(BASELINE).read_text(encoding="utf-8")
    loans = library / "003_loans.sql"
    keyed = loans.read_text(encoding="utf-8").replace("due_on    date", "due_on    date,\n    PRIMARY KEY (tag_no, lent_on)")
    loans.write_text(keyed, encoding="utf-8")
    outcome = runner.invoke(main, ["check", "--baseline", BASELINE, "migrations"])
    assert outcome.exit_code == 0, outcome.output
    assert _finding_lines(outcome.stdout) == []
    fixed = [line for line in outcome.stdout.splitlines() if "fixed since the baseline" in line]
    assert fixed == [
        "migrations/003_loans.sql: fixed since the baseline (loan): loan has no primary key and no unique key"
        " over NOT NULL columns, so it can hold duplicate rows [missing-key]"
    ]
    assert "1 baseline entry fixed; `normguard baseline --prune` drops it" in outcome.stdout

    pruned = runner.invoke(main, ["baseline", "--prune", "migrations"])
    assert pruned.exit_code == 0, pruned.output
    assert "dropped 1 fixed entry" in pruned.stderr
    assert _entries() == [e for e in before if e["rule"] != "missing-key"]
    kept_text = Path(BASELINE).read_text(encoding="utf-8")
    assert len(kept_text.splitlines()) == len(text_before.splitlines()) - 5  # one entry of five lines
    again = runner.invoke(main, ["baseline", "--prune", "migrations"])
    assert again.exit_code == 0 and "nothing to prune" in again.stderr
    assert Path(BASELINE).read_text(encoding="utf-8") == kept_text


def test_prune_keeps_entries_it_cannot_match(library, runner):
    """Pruning never adds the new findings: a new violation stays reported until a new baseline."""
    _take_baseline(runner)
    (library / "004_workshops.sql").write_text("CREATE TABLE workshop_slot (room text);\n", encoding="utf-8")
    runner.invoke(main, ["baseline", "--prune", "migrations"])
    assert len(_entries()) == 3
    outcome = runner.invoke(main, ["check", "--baseline", BASELINE, "migrations"])
    assert outcome.exit_code == 1 and len(_finding_lines(outcome.stdout)) == 1


def test_a_partial_check_says_nothing_of_other_files(library, runner):
    """Checking one file (as pre-commit does) neither reports nor fixes entries of the others."""
    _take_baseline(runner)
    outcome = runner.invoke(
        main, ["check", "--baseline", BASELINE, "--context", "migrations", "migrations/002_tools.sql"]
    )
    assert outcome.exit_code == 0, outcome.output
    assert "fixed since the baseline" not in outcome.stdout
    assert "1 finding recorded in" in outcome.stdout


def test_rerecording_one_file_keeps_the_entries_of_the_others(library, runner):
    _take_baseline(runner)
    (library / "002_tools.sql").write_text(
        (library / "002_tools.sql").read_text(encoding="utf-8").replace("serial_no text UNIQUE", "serial_no text"),
        encoding="utf-8",
    )
    outcome = runner.invoke(main, ["baseline", "migrations/002_tools.sql"])
    assert outcome.exit_code == 0, outcome.output
    assert "kept 2 entries for files not read this time" in outcome.stderr
    assert sorted(e["rule"] for e in _entries()) == ["missing-key", "transitive-dependency"]


def test_machine_formats_keep_stdout_clean(library, runner):
    """With --format json the report stays pure JSON; the baseline notes go to stderr."""
    _take_baseline(runner)
    loans = library / "003_loans.sql"
    loans.write_text(loans.read_text(encoding="utf-8").replace("due_on    date", "due_on    date PRIMARY KEY"),
                     encoding="utf-8")
    outcome = runner.invoke(main, ["check", "--baseline", BASELINE, "--format", "json", "migrations"])
    assert outcome.exit_code == 0, outcome.output
    assert json.loads(outcome.stdout)["findings"] == []
    assert "migrations/003_loans.sql: fixed since the baseline (loan)" in outcome.stderr
