"""The rule runner: allow annotations, rule selection, severities, report paths, order and callbacks."""
from __future__ import annotations

from pathlib import Path

import pytest

from linter.config import Config, TableSettings
from linter.engine import run, selected_rules
from rules import all_rules

from ..locations import ROOT

ALLOWED = "fixtures/rules/allow/postgres_allowed.sql"


@pytest.fixture
def project(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Path:
    """A migrations folder: a table with a keyless neighbour, then an annotation in a later file."""
    monkeypatch.chdir(tmp_path)
    (tmp_path / "db").mkdir()
    (tmp_path / "db/001_couriers.sql").write_text(
        "CREATE TABLE couriers (courier_id int PRIMARY KEY, depot text NOT NULL, city text NOT NULL);\n"
        "CREATE TABLE pings (courier_id int, seen_at timestamp);\n",
        encoding="utf-8",
    )
    (tmp_path / "db/002_depots.sql").write_text("-- normguard: fd couriers: depot -> city\n", encoding="utf-8")
    return tmp_path


def test_allow_moves_findings_to_suppressed(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.chdir(ROOT)
    result = run(Config(paths=(ALLOWED,)))
    assert sorted((f.rule, f.table) for f in result.suppressed) == [
        ("missing-key", "ping_log"), ("transitive-dependency", "depot_report")]
    assert [(f.rule, f.span.line, f.span.column) for f in result.findings] == [
        ("annotation-error", 14, 8), ("missing-key", 18, 14), ("annotation-error", 19, 8)]


def test_allow_of_an_unknown_rule_is_an_annotation_error(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.chdir(ROOT)
    unknown = run(Config(paths=(ALLOWED,))).findings[0]
    assert unknown.severity == "error" and unknown.table == "depot_report"
    assert unknown.message == "allow names rule 'missing-kee', which normguard does not have (did you mean 'missing-key'?)"


def test_allow_without_reason_is_reported_by_the_reader_and_allows_nothing(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.chdir(ROOT)
    result = run(Config(paths=(ALLOWED,)))
    no_reason = result.findings[2]
    assert no_reason.message.startswith("allow annotation needs a reason")
    assert result.findings[1].table == "scratch"


def test_select_runs_only_the_rules_named(project: Path) -> None:
    result = run(Config(paths=("db",), select=("missing-key",)))
    assert [rule.id for rule in result.rules] == ["missing-key"]
    assert [f.rule for f in result.findings] == ["missing-key"]


def test_ignore_and_off_remove_rules(project: Path) -> None:
    config = Config(paths=("db",), ignore=("missing-key",), severity={"transitive-dependency": "off"})
    ids = {rule.id for rule in selected_rules(config)}
    assert ids == {rule.id for rule in all_rules()} - {"missing-key", "transitive-dependency"}
    assert run(config).findings == []


def test_severity_setting_changes_the_level(project: Path) -> None:
    result = run(Config(paths=("db",), severity={"missing-key": "error", "transitive-dependency": "note"}))
    assert [(f.rule, f.severity) for f in result.findings] == [("missing-key", "error"), ("transitive-dependency", "note")]


def test_report_paths_keep_findings_of_those_files_only(project: Path) -> None:
    everything = run(Config(paths=("db",)))
    assert [(f.rule, f.span.path) for f in everything.findings] == [
        ("missing-key", "db/001_couriers.sql"), ("transitive-dependency", "db/002_depots.sql")]
    staged = run(Config(paths=("db",)), report_paths=["db/002_depots.sql"])
    assert [(f.rule, f.span.path) for f in staged.findings] == [("transitive-dependency", "db/002_depots.sql")]
    assert set(staged.catalog.tables) == {"couriers", "pings"}
    assert run(Config(paths=("db",)), report_paths=[str(project / "db")]).findings == everything.findings
    assert run(Config(paths=("db",)), report_paths=[]).findings == []


def test_paths_argument_overrides_the_configured_ones(project: Path) -> None:
    result = run(Config(paths=("nowhere",)), ["db/001_couriers.sql"])
    assert result.catalog.files == ["db/001_couriers.sql"]


def test_on_file_hears_of_every_file(project: Path) -> None:
    heard: list[tuple[int, int, str]] = []
    run(Config(paths=("db",)), on_file=lambda index, total, path: heard.append((index, total, path)))
    assert heard == [(0, 2, "db/001_couriers.sql"), (1, 2, "db/002_depots.sql")]


def test_findings_are_sorted_and_fingerprinted(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.chdir(ROOT)
    result = run(Config(paths=("fixtures/rules/missing-key", "fixtures/rules/nullable-unique")))
    keys = [(f.span.path, f.span.line, f.span.column, f.rule) for f in result.findings]
    assert keys == sorted(keys)
    assert all(len(f.fingerprint) == 16 for f in result.findings)


def test_analyses_carry_each_table_target(project: Path) -> None:
    result = run(Config(paths=("db",), target="3nf", tables={"pings": TableSettings(target="2nf")}))
    assert {name: a.target for name, a in result.analyses.items()} == {"couriers": "3nf", "pings": "2nf"}
