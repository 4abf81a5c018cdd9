"""The split rules end to end on each fixture folder: exactly these findings, at these lines."""
from __future__ import annotations

from pathlib import Path

import pytest

from linter.config import Config
from linter.engine import run

from ..locations import ROOT
from .split_support import FIXTURES, split_findings

CASES = sorted(p.name for p in (ROOT / FIXTURES).iterdir() if p.is_dir())

# case -> [(rule, file, line, dependency or None, parts of the message)]
EXPECTED: dict[str, list[tuple[str, str, int, tuple | None, tuple[str, ...]]]] = {
    "postgres_lossless_riders": [],
    "mysql_lossy_seed_lots": [
        ("lossy-split", "002_split_collectors.sql", 14, None,
         ("split of seed_lots into lot_species and species_collectors is lossy",
          "on their common column species", "rows seed_lots never held")),
        ("unenforceable-dependency", "002_split_collectors.sql", 14, (("lot_id",), ("collector",)),
         ("no single table holds lot_id -> collector", "went to lot_species and species_collectors",
          "needs a join on every write")),
    ],
    "sqlite_lost_dependency_berths": [
        ("unenforceable-dependency", "002_terminals.sql", 13, (("port", "pier"), ("terminal",)),
         ("after the split of berths", "no single table holds port, pier -> terminal",
          "went to terminals and terminal_piers")),
    ],
    "postgres_chase_three_way_trials": [],
    "sqlite_renamed_vessels": [],
    "mysql_declared_vault_drawers": [
        ("lossy-split", "001_vault_schema.sql", 18, None,
         ("split of vault_drawers into drawers and vaults is lossy", "on their common column vault_city")),
        ("unenforceable-dependency", "001_vault_schema.sql", 18, (("drawer_code",), ("vault",)),
         ("no single table holds drawer_code -> vault", "went to drawers and vaults")),
    ],
    "postgres_two_files_depots": [
        ("lossy-split", "003_retire_couriers.sql", 2, None,
         ("split of couriers into depots and courier_cities is lossy", "on their common column depot_city")),
        ("unenforceable-dependency", "003_retire_couriers.sql", 2, (("courier_id",), ("depot_code",)),
         ("no single table holds courier_id -> depot_code", "went to depots and courier_cities")),
    ],
    "sqlite_untraced_senders": [
        ("lossy-split", "002_senders.sql", 13, None,
         ("split of parcels into senders and parcel_weights is lossy", "they share no column")),
        ("unenforceable-dependency", "002_senders.sql", 13, (("sender_email",), ("sender_name",)),
         ("no single table holds sender_email -> sender_name", "went to senders and parcel_weights")),
    ],
}


def test_every_fixture_folder_has_its_expectations() -> None:
    assert sorted(EXPECTED) == CASES


@pytest.mark.parametrize("case", CASES)
def test_fixture_findings_are_exactly_these(check, case: str) -> None:
    found = split_findings(check(case))
    shape = [(f.rule, Path(f.span.path).name, f.span.line, f.dependency) for f in found]
    assert shape == [(rule, name, line, dep) for rule, name, line, dep, _ in EXPECTED[case]]
    for finding, (*_, parts) in zip(found, EXPECTED[case]):
        assert finding.span.path.startswith(f"{FIXTURES}/{case}/")
        assert f"split of {finding.table}" in finding.message
        for part in parts:
            assert part in finding.message


@pytest.mark.parametrize("case", CASES)
def test_severities_are_the_rules_defaults(check, case: str) -> None:
    levels = {f.rule: f.severity for f in split_findings(check(case))}
    assert set(levels.items()) <= {("lossy-split", "error"), ("unenforceable-dependency", "warning")}


def test_lossy_finding_names_the_sides_shows_the_rows_and_the_fix(check) -> None:
    [lossy, _] = split_findings(check("mysql_lossy_seed_lots"))
    assert lossy.explanation[0] == (
        "species would need to be a key of lot_species (it does not determine lot_id, vault)"
        " or of species_collectors (it does not determine collector)")
    assert lossy.explanation[1:] == [
        "for example, these two rows of seed_lots satisfy its dependencies:",
        "  lot_id  species  collector  vault",
        "  a1      a2       b3         a4",
        "  b1      a2       a3         b4",
        "yet joining their projections also gives this row, which is not one of them:",
        "  lot_id  species  collector  vault",
        "  a1      a2       a3         a4",
        "fix: carry a key of seed_lots (lot_id) into species_collectors, or make the common columns a key of one side",
    ]


def test_lost_dependency_names_where_columns_went_and_a_3nf_design(check) -> None:
    [lost] = split_findings(check("sqlite_lost_dependency_berths"))
    assert lost.explanation[0] == (
        "port went to terminals; pier went to terminal_piers; terminal went to terminals and terminal_piers")
    assert "a trigger or an assertion that joins terminals and terminal_piers" in lost.explanation[2]
    # The street/city/zip shape is already in 3NF: synthesis keeps the relation whole.
    assert lost.explanation[3:] == [
        "a lossless, dependency-preserving 3NF design of the same columns:",
        "  berths (port, pier, terminal), keys (port, pier), (pier, terminal)",
    ]


def test_lost_dependency_3nf_design_separates_the_determinant(check) -> None:
    [_, lost] = split_findings(check("postgres_two_files_depots"))
    assert lost.explanation[-2:] == [
        "  couriers (courier_id, name, depot_code), key courier_id",
        "  couriers_by_depot_code (depot_code, depot_city), key depot_code",
    ]


def test_untraceable_expression_is_said_not_guessed(check) -> None:
    lossy, lost = split_findings(check("sqlite_untraced_senders"))
    said = ("senders.email comes from an expression normguard cannot trace to one column of parcels;"
            " it is not counted as carrying any column")
    assert said in lossy.explanation
    assert said in lost.explanation
    assert lossy.explanation[0] == "senders and parcel_weights share no column"


def test_split_over_two_files_is_reported_only_with_both_files(check) -> None:
    """Copying in one file and dropping in a later one is a split; neither file alone, nor the copy alone, is."""
    case = "postgres_two_files_depots"
    files = sorted(p.name for p in (ROOT / FIXTURES / case).iterdir())
    for name in files:
        assert split_findings(check(f"{case}/{name}")) == []
    assert split_findings(check(f"{case}/{files[0]}", f"{case}/{files[1]}")) == []
    assert [f.rule for f in split_findings(check(case))] == ["lossy-split", "unenforceable-dependency"]


_SPLITS_OF_COURIERS = {
    # the original still exists: the split only dropped a column
    "shrunk": "CREATE TABLE courier_cities AS SELECT courier_id, city FROM couriers;\n"
              "ALTER TABLE couriers DROP COLUMN city;\n",
    # the original is gone: a split's findings still belong to it
    "dropped": "CREATE TABLE courier_depots AS SELECT courier_id, depot FROM couriers;\n"
               "CREATE TABLE courier_cities AS SELECT courier_id, city FROM couriers;\n"
               "DROP TABLE couriers;\n",
}


@pytest.mark.parametrize("how", sorted(_SPLITS_OF_COURIERS))
def test_allow_on_the_original_moves_split_findings_to_suppressed(how: str, tmp_path: Path, monkeypatch) -> None:
    """The original's allow annotation applies to its split, whether it was shrunk or dropped."""
    monkeypatch.chdir(tmp_path)
    (tmp_path / "001_couriers.sql").write_text(
        "CREATE TABLE couriers (\n"
        "    courier_id integer PRIMARY KEY,\n"
        "    depot text NOT NULL,\n"
        "    city text NOT NULL\n"
        "    -- normguard: fd depot -> city\n"
        "    -- normguard: allow unenforceable-dependency: a trigger on courier_cities checks it\n"
        ");\n", encoding="utf-8")
    (tmp_path / "002_cities.sql").write_text(_SPLITS_OF_COURIERS[how], encoding="utf-8")
    result = run(Config(paths=(".",)))
    assert split_findings(result) == []
    assert [(f.rule, f.dependency) for f in result.suppressed] == [
        ("unenforceable-dependency", (("depot",), ("city",)))]
