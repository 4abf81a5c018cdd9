"""``normguard explain`` on split fixtures: why a split with no finding is fine, for its original and its pieces."""
from __future__ import annotations

import pytest
from click.testing import CliRunner

from linter.cli.main import main

from ..locations import ROOT
from .split_support import FIXTURES, dialect_of


def _explain(case: str, table: str, monkeypatch: pytest.MonkeyPatch) -> list[str]:
    monkeypatch.chdir(ROOT)
    outcome = CliRunner().invoke(main, ["explain", f"{FIXTURES}/{case}", "--table", table,
                                        "--dialect", dialect_of(case), "--no-sql"])
    assert outcome.exit_code == 0, outcome.output
    return outcome.stdout.splitlines()


def test_dropped_original_shows_its_split_and_the_chased_tableau(monkeypatch: pytest.MonkeyPatch) -> None:
    lines = _explain("postgres_chase_three_way_trials", "germination_trials", monkeypatch)
    assert lines[0] == ("split of germination_trials into lot_protocols, lot_seasons and season_protocols"
                        f" (data moved, {FIXTURES}/postgres_chase_three_way_trials/002_three_pieces.sql:22:1)")
    start = lines.index("    piece             seed_lot  trial_season  species  protocol")
    assert lines[start - 1].startswith("  lossless by the chase: in the final tableau the row of lot_seasons")
    assert lines[start + 1:start + 4] == [
        "    lot_protocols     a1        b2            a3       a4",
        "    lot_seasons       a1        a2            a3       a4",
        "    season_protocols  b1        a2            a3       a4",
    ]
    assert lines[-3:] == [
        "  every dependency is preserved:",
        "    seed_lot -> species: held by lot_protocols",
        "    trial_season, species -> protocol: held by season_protocols",
    ]


def test_piece_shows_its_table_then_the_split_with_the_key_that_makes_it_lossless(
        monkeypatch: pytest.MonkeyPatch) -> None:
    lines = _explain("sqlite_renamed_vessels", "departures", monkeypatch)
    assert lines[0].startswith("table departures (")
    start = lines.index(f"split of sailings into vessels and departures (data moved,"
                        f" {FIXTURES}/sqlite_renamed_vessels/002_vessels.sql:14:1)")
    assert lines[start + 1:start + 3] == [
        "  vessels: code (from vessel_code), name (from vessel_name)",
        "  departures: sailing_id, vessel (from vessel_code), departs_at",
    ]
    assert "  lossless: the common column vessel_code is a key of vessels (vessel_code -> vessel_name)" in lines


def test_piece_of_a_split_that_loses_a_dependency_says_which(monkeypatch: pytest.MonkeyPatch) -> None:
    lines = _explain("sqlite_lost_dependency_berths", "terminals", monkeypatch)
    assert "  lossless: the common column terminal is a key of terminals (terminal -> port)" in lines
    assert lines[-2:] == [
        "    terminal -> port: held by terminals",
        "    port, pier -> terminal: not preserved: it needs a join to check (unenforceable-dependency)",
    ]


def test_lossy_split_shows_its_counterexample(monkeypatch: pytest.MonkeyPatch) -> None:
    lines = _explain("mysql_declared_vault_drawers", "vaults", monkeypatch)
    start = lines.index("  lossy: the pieces do not join back into the original rows (lossy-split)")
    assert lines[start + 1] == "  for example, these two rows of vault_drawers satisfy its dependencies:"
    assert "split of vault_drawers into drawers and vaults (declared by split-from," in "\n".join(lines)
