"""partial-dependency, transitive-dependency and bcnf-violation on annotated fixtures.

Sources, from memory: the verdicts follow the definitions of 2NF and 3NF (E. F. Codd, 1971,
"Further normalization of the data base relational model") and of BCNF (E. F. Codd, 1974,
"Recent investigations in relational data base systems"); the proposed split on X -> X+ is
lossless by Heath's theorem (I. J. Heath, 1971). The fixtures are invented; the published worked
examples renamed into our scenarios are in test_rule_published_examples.py.
"""
from __future__ import annotations

import pytest

from linter.config import Config, TableSettings
from linter.engine import run

from .rule_helpers import of_rule, places

NF_RULES = ("partial-dependency", "transitive-dependency", "bcnf-violation")


def test_transitive_dependency_at_its_annotation(check) -> None:
    found = of_rule(check("transitive-dependency/postgres_fires.sql"), "transitive-dependency")
    assert places(found) == [(8, 8), (17, 8), (18, 8)]
    couriers = found[0]
    assert couriers.message == (
        "depot -> city, region: depot is not a key of couriers (keys: courier_id), so rows with the"
        " same depot store the same city, region again (breaks 3NF)"
    )
    assert couriers.dependency == (("depot",), ("city", "region"))
    assert couriers.span.end_column == 8 + len("normguard: fd depot -> city, region")
    assert couriers.explanation == [
        "to remove it, split couriers on depot -> city, region:",
        "  couriers (courier_id, name, depot), key courier_id",
        "  couriers_by_depot (depot, city, region), key depot",
        "lossless: the chase confirms that joining them on depot gives back exactly the rows of couriers",
    ]


def test_same_left_side_on_two_lines_gives_two_findings(check) -> None:
    _, tier, rate = of_rule(check("transitive-dependency/postgres_fires.sql"), "transitive-dependency")
    assert (tier.dependency, rate.dependency) == ((("sender",), ("sender_tier",)), (("sender",), ("sender_rate",)))
    assert tier.fingerprint != rate.fingerprint


def test_transitive_dependency_annotated_above_a_mysql_table(check) -> None:
    [found] = of_rule(check("transitive-dependency/mysql_fires.sql", dialect="mysql"), "transitive-dependency")
    assert places([found]) == [(2, 4)]
    assert found.message.startswith("route_code -> fare_band: route_code is not a key of tickets (keys: ticket_no)")


def test_partial_dependency(check) -> None:
    [found] = of_rule(check("partial-dependency/postgres_fires.sql"), "partial-dependency")
    assert places([found]) == [(8, 8)]
    assert found.message == (
        "accession_no -> species: accession_no is only part of the key (accession_no, tested_on) of"
        " germination_tests, so rows with the same accession_no store the same species again (breaks 2NF)"
    )
    assert "  germination_tests_by_accession_no (accession_no, species), key accession_no" in found.explanation


def test_partial_dependency_from_an_annotation_naming_its_table(check) -> None:
    [found] = of_rule(check("partial-dependency/sqlite_fires.sql", dialect="sqlite"), "partial-dependency")
    assert places([found]) == [(10, 4)]
    assert found.table == "shipments"


def test_bcnf_violation_names_the_dependency_a_split_cannot_keep(check) -> None:
    [found] = of_rule(check("bcnf-violation/postgres_fires.sql"), "bcnf-violation")
    assert places([found]) == [(7, 8)]
    assert "berth -> port: berth is not a key of berth_assignments (keys: (vessel, port), (vessel, berth))" in found.message
    assert found.message.endswith("3NF holds only because port belongs to a key (breaks BCNF)")
    assert any(line.startswith("lossless: the chase confirms") for line in found.explanation)
    assert found.explanation[-1].startswith(
        "no BCNF decomposition normguard finds keeps vessel, port -> berth inside one table"
    )


def test_bcnf_violation_in_tsql(check) -> None:
    [found] = of_rule(check("bcnf-violation/tsql_fires.sql", dialect="tsql"), "bcnf-violation")
    assert places([found]) == [(7, 8)]
    assert found.dependency == (("gate",), ("terminal",))


@pytest.mark.parametrize("name", ["transitive-dependency", "partial-dependency", "bcnf-violation"])
def test_clean_fixtures_break_no_normal_form(check, name: str) -> None:
    result = check(f"{name}/postgres_clean.sql")
    assert result.catalog.tables
    assert [f for f in result.findings if f.rule in NF_RULES] == []
    assert {a.report.form for a in result.analyses.values()} == {"BCNF"}


def test_target_3nf_turns_bcnf_violation_into_a_note(check) -> None:
    [found] = of_rule(check("bcnf-violation/postgres_fires.sql", target="3nf"), "bcnf-violation")
    assert found.severity == "note"
    assert found.explanation[-1] == "reported as a note: the target of berth_assignments is 3NF"


def test_target_2nf_silences_transitive_but_not_partial(check) -> None:
    result = check("transitive-dependency/postgres_fires.sql", "partial-dependency/postgres_fires.sql", target="2nf")
    assert {f.severity for f in of_rule(result, "transitive-dependency")} == {"note"}
    assert {f.severity for f in of_rule(result, "partial-dependency")} == {"warning"}


def test_per_table_target_overrides_the_global_one(check) -> None:
    result = check("transitive-dependency/postgres_fires.sql", tables={"Parcels": TableSettings(target="2nf")})
    severities = {(f.table, f.severity) for f in of_rule(result, "transitive-dependency")}
    assert severities == {("couriers", "warning"), ("parcels", "note")}


def test_configured_severity_keeps_notes_below_target(check) -> None:
    result = check("transitive-dependency/postgres_fires.sql", target="2nf",
                   tables={"couriers": TableSettings(target="bcnf")},
                   severity={"transitive-dependency": "error"})
    severities = {(f.table, f.severity) for f in of_rule(result, "transitive-dependency")}
    assert severities == {("couriers", "error"), ("parcels", "note")}


def test_derived_dependency_is_reported_where_its_right_side_is_stated(tmp_path, monkeypatch) -> None:
    monkeypatch.chdir(tmp_path)
    (tmp_path / "shifts.sql").write_text(
        "CREATE TABLE shifts (\n"
        "    shift_id int PRIMARY KEY, rider text NOT NULL, depot text NOT NULL, city text NOT NULL\n"
        "    -- normguard: fd rider -> depot\n"
        "    -- normguard: fd rider, depot -> city\n"
        ");\n",
        encoding="utf-8",
    )
    found = [f for f in run(Config(paths=("shifts.sql",))).findings if f.rule == "transitive-dependency"]
    assert [(f.span.line, f.dependency) for f in found] == [(3, (("rider",), ("depot",))), (4, (("rider",), ("city",)))]
    assert found[1].explanation[0] == (
        "follows from rider -> depot (annotation, shifts.sql:3:8); rider, depot -> city (annotation, shifts.sql:4:8)"
    )
