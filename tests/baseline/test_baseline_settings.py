"""A finding drawn by a dependency in the settings file lies in that file, outside the folder read.

A full run reads the settings too, so its baseline entry is matched, re-recorded once and reported
fixed like any other; a run on some files only keeps it aside.
"""
from __future__ import annotations

from pathlib import Path

import yaml

from linter.cli.main import main

BASELINE = ".normguard-baseline.yaml"
SETTINGS = 'tables:\n  tool:\n    dependencies: ["kind -> maker"]\n'


def _settings_entries() -> list[dict[str, str]]:
    """The entries of the baseline file located in the settings file."""
    entries = yaml.safe_load(Path(BASELINE).read_text(encoding="utf-8"))["findings"]
    return [e for e in entries if e["path"] == ".normguard.yaml"]


def test_a_settings_finding_is_matched_and_recorded_once(library, runner):
    Path(".normguard.yaml").write_text(SETTINGS, encoding="utf-8")
    for _ in range(2):
        recorded = runner.invoke(main, ["baseline", "migrations"])
        assert recorded.exit_code == 0, recorded.output
        assert "recorded 4 findings" in recorded.stderr and "kept" not in recorded.stderr
        assert [e["rule"] for e in _settings_entries()] == ["transitive-dependency"]
    outcome = runner.invoke(main, ["check", "--baseline", BASELINE, "migrations"])
    assert outcome.exit_code == 0, outcome.output
    assert "4 findings recorded in" in outcome.stdout


def test_a_settings_finding_gone_is_fixed(library, runner):
    Path(".normguard.yaml").write_text(SETTINGS, encoding="utf-8")
    assert runner.invoke(main, ["baseline", "migrations"]).exit_code == 0
    Path(".normguard.yaml").write_text("target: bcnf\n", encoding="utf-8")
    outcome = runner.invoke(main, ["check", "--baseline", BASELINE, "migrations"])
    assert outcome.exit_code == 0, outcome.output
    assert ".normguard.yaml: fixed since the baseline (tool)" in outcome.stdout
