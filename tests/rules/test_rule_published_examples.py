"""Verdicts checked against published worked examples (renamed into our scenarios), plus bounds.

Sources, both from memory (the shapes, not the text):
- C. J. Date, "An Introduction to Database Systems", the suppliers-and-parts relations used to
  introduce 2NF and 3NF: FIRST(S#, STATUS, CITY, P#, QTY) with key (S#, P#), S# -> CITY and
  CITY -> STATUS is in 1NF only; SECOND(S#, STATUS, CITY) is in 2NF, not 3NF; the 3NF design is
  SP(S#, P#, QTY), SC(S#, CITY), CS(CITY, STATUS).
- J. D. Ullman and J. Widom, "A First Course in Database Systems", the street/city/zip relation:
  street, city -> zip and zip -> city; 3NF but not BCNF, and a BCNF decomposition cannot preserve
  street, city -> zip, while 3NF synthesis keeps the relation whole.
"""
from __future__ import annotations

from pathlib import Path

from linter.config import Config, load_config
from linter.engine import run

from .rule_helpers import of_rule


def test_suppliers_shape_first_is_1nf_with_a_partial_and_a_transitive_dependency(check) -> None:
    result = check("published/postgres_courier_routes.sql")
    routes = result.analyses["courier_routes"]
    assert routes.report.form == "1NF"
    kinds = {(routes.attributes.format_fd(v.fd), v.kind) for v in routes.report.violations}
    assert kinds == {("courier_id -> city", "partial"), ("city -> pay_band", "transitive")}
    assert [f.dependency for f in of_rule(result, "partial-dependency")] == [(("courier_id",), ("city",))]


def test_suppliers_shape_second_is_2nf_not_3nf(check) -> None:
    result = check("published/postgres_courier_routes.sql")
    assert result.analyses["courier_cities"].report.form == "2NF"
    tables = [f.table for f in of_rule(result, "transitive-dependency")]
    assert tables == ["courier_routes", "courier_cities"]


def test_suppliers_shape_3nf_design_matches_the_book(check) -> None:
    routes = check("published/postgres_courier_routes.sql").analyses["courier_routes"]
    pieces = {routes.attributes.to_names(piece.attrs) for piece in routes.synthesis.pieces}
    assert pieces == {("courier_id", "route_id", "trips"), ("courier_id", "city"), ("city", "pay_band")}


def test_street_city_zip_shape_is_3nf_not_bcnf_and_loses_a_dependency(check) -> None:
    result = check("published/postgres_drop_points.sql")
    points = result.analyses["drop_points"]
    assert points.report.form == "3NF"
    assert points.format_keys(points.keys.keys) == "(street, city), (street, postcode)"
    assert [points.attributes.format_fd(fd) for fd in points.bcnf.lost] == ["street, city -> postcode"]
    assert [points.attributes.format(p.attrs) for p in points.synthesis.pieces] == ["street, city, postcode"]
    [found] = of_rule(result, "bcnf-violation")
    assert found.dependency == (("postcode",), ("city",))
    assert "street, city -> postcode inside one table" in found.explanation[-1]


def test_incomplete_key_search_is_said(tmp_path: Path, monkeypatch) -> None:
    """Ten interchangeable column pairs give 2**10 candidate keys, past the bound of 1000."""
    monkeypatch.chdir(tmp_path)
    pairs = [(f"a{i}", f"b{i}") for i in range(10)]
    columns = ", ".join(f"{a} int NOT NULL, {b} int NOT NULL" for a, b in pairs)
    notes = "".join(f"-- normguard: fd {a} -> {b}\n-- normguard: fd {b} -> {a}\n" for a, b in pairs)
    Path("swaps.sql").write_text(
        f"CREATE TABLE swaps (\n{notes}{columns}, depot int NOT NULL, city int NOT NULL\n"
        "-- normguard: fd depot -> city\n);\n",
        encoding="utf-8",
    )
    result = run(Config(paths=("swaps.sql",)))
    assert not result.analyses["swaps"].keys.complete
    [found] = [f for f in result.findings if f.dependency == (("depot",), ("city",))]
    assert found.explanation[0].startswith("the key search stopped at its bound")


def test_dependency_declared_in_settings_is_reported_in_the_settings_file(tmp_path: Path, monkeypatch) -> None:
    monkeypatch.chdir(tmp_path)
    Path("db").mkdir()
    Path("db/001_couriers.sql").write_text(
        "CREATE TABLE couriers (courier_id int PRIMARY KEY, depot text NOT NULL, city text NOT NULL);\n",
        encoding="utf-8",
    )
    Path(".normguard.yaml").write_text(
        "paths: [db]\ntables:\n  couriers:\n    dependencies:\n      - depot -> city\n", encoding="utf-8"
    )
    [found] = run(load_config()).findings
    assert (found.rule, found.span.path, found.span.line, found.span.column) == (
        "transitive-dependency", ".normguard.yaml", 5, 9)
