"""Exit status 2 with one line on stderr for usage, settings and internal errors; reports written whole.

Exit codes follow GNU diff's convention (0 nothing, 1 findings, 2 trouble; FORMATS.md §6, GNU-DIFF);
messages use the GNU ``program: message`` form (GNU Coding Standards §4.4).
"""
from __future__ import annotations

import pytest

import linter.cli.check
from linter.cli.main import main

from ..locations import one_line_error


def test_bad_settings_name_the_file_key_and_line(example, runner):
    (example / ".normguard.yaml").write_text("paths: [migrations]\ntargets: 3nf\n", encoding="utf-8")
    line = one_line_error(runner.invoke(main, ["check"]))
    assert line == "normguard: .normguard.yaml:2: targets: unknown key (did you mean 'target'?)"


def test_bad_value_in_settings(example, runner):
    (example / "strict.yaml").write_text("fail-on: sometimes\n", encoding="utf-8")
    line = one_line_error(runner.invoke(main, ["check", "--config", "strict.yaml"]))
    assert "strict.yaml:1" in line and "fail-on" in line


def test_missing_settings_file(example, runner):
    line = one_line_error(runner.invoke(main, ["check", "--config", "absent.yaml"]))
    assert "absent.yaml" in line


def test_unknown_dialect_suggests(example, runner):
    line = one_line_error(runner.invoke(main, ["check", "--dialect", "postgresql"]))
    assert "unknown dialect 'postgresql'; did you mean postgres" in line


def test_a_folder_without_sql_says_nothing_was_checked(example, runner):
    (example / "notes").mkdir()
    (example / "notes" / "README.txt").write_text("no SQL here\n", encoding="utf-8")
    outcome = runner.invoke(main, ["check", "notes"])
    assert outcome.exit_code == 0
    assert outcome.stderr == "normguard: no SQL file found under notes (include: **/*.sql); nothing was checked\n"


def test_missing_path(example, runner):
    line = one_line_error(runner.invoke(main, ["check", "migrations/0099_missing.sql"]))
    assert line == "normguard: migrations/0099_missing.sql: no such file or directory (given on the command line)"


def test_unknown_option_and_format(example, runner):
    assert "--bogus" in one_line_error(runner.invoke(main, ["check", "--bogus"]))
    assert "--format" in one_line_error(runner.invoke(main, ["check", "--format", "xml"]))


def test_internal_error_has_a_traceback_only_with_debug(example, runner, monkeypatch):
    def broken(*args, **kwargs):
        raise RuntimeError("replay exploded")

    monkeypatch.setattr(linter.cli.check, "run", broken)
    line = one_line_error(runner.invoke(main, ["check"]))
    assert line.startswith("normguard: internal error: RuntimeError: replay exploded")
    debug = runner.invoke(main, ["check", "--debug"])
    assert debug.exit_code == 2
    assert "Traceback (most recent call last)" in debug.stderr
    assert debug.stderr.splitlines()[-1].startswith("normguard: internal error: RuntimeError")


def test_output_is_written_whole_and_replaces_the_old_report(example, runner):
    target = example / "report.json"
    target.write_text("old report\n", encoding="utf-8")
    outcome = runner.invoke(main, ["check", "--format", "json", "--output", "report.json"])
    assert outcome.exit_code == 1 and outcome.stdout == ""
    assert target.read_text(encoding="utf-8").startswith("{")
    assert sorted(p.name for p in example.iterdir() if p.name.startswith(".report")) == []


@pytest.mark.parametrize("args", [["--dialect", "nosuch"], ["--debug"]])
def test_output_untouched_when_the_run_fails(example, runner, monkeypatch, args):
    def broken(*a, **k):
        raise RuntimeError("boom")

    monkeypatch.setattr(linter.cli.check, "run", broken)
    target = example / "report.sarif"
    target.write_text("previous report\n", encoding="utf-8")
    outcome = runner.invoke(main, ["check", "--format", "sarif", "--output", "report.sarif", *args])
    assert outcome.exit_code == 2
    assert target.read_text(encoding="utf-8") == "previous report\n"
    assert [p.name for p in example.iterdir() if p.name.endswith(".tmp")] == []


def test_output_never_overwrites_an_input_file(example, runner):
    migration = example / "migrations" / "0002_routes.sql"
    before = migration.read_bytes()
    line = one_line_error(runner.invoke(main, ["check", "-o", "migrations/0002_routes.sql"]))
    assert line.endswith("refusing to write the report over a SQL file that was just read")
    assert migration.read_bytes() == before


def test_output_into_a_missing_folder(example, runner):
    line = one_line_error(runner.invoke(main, ["check", "--output", "no/such/dir/report.txt"]))
    assert "no/such/dir/report.txt" in line


def test_no_arguments_prints_usage(runner):
    outcome = runner.invoke(main, [])
    assert outcome.exit_code == 2 and "Usage: normguard" in outcome.stderr
