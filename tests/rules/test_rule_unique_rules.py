"""nullable-unique and redundant-unique: unique rules that are not keys, or add nothing to one.

Sources, all from memory:
- A UNIQUE constraint holds as long as no two rows have equal values that are all non-null, so
  any number of rows may hold NULL (ISO/IEC 9075-2, the UNIQUE predicate; the PostgreSQL, MySQL and
  SQLite manuals on unique constraints say the same). UNIQUE NULLS NOT DISTINCT arrived in
  PostgreSQL 15 (its release notes); SQL Server's UNIQUE admits a single NULL (its manual).
- A set of columns holding a key is a superkey: it is unique in every instance the key allows,
  so a unique rule over it rejects no further row (the definition of superkey in any database text).
"""
from __future__ import annotations

from pathlib import Path

import pytest

from linter.config import Config
from linter.engine import run

from .rule_helpers import of_rule, places


def test_nullable_unique_fires_on_column_constraint_and_index(check) -> None:
    found = of_rule(check("nullable-unique/postgres_fires.sql"), "nullable-unique")
    assert places(found) == [(4, 5), (8, 21)]
    assert found[0].message == (
        "unique constraint (badge_no) of riders is not a key: badge_no allows NULL, and NULLs never collide"
    )
    assert found[1].message.startswith("unique index (phone) of riders is not a key: phone allows NULL")
    assert any("NULLS NOT DISTINCT" in line for line in found[0].explanation)


@pytest.mark.parametrize(
    ("dialect", "place", "columns"),
    [("mysql", (6, 14), "imo_number"), ("sqlite", (5, 13), "barcode"), ("tsql", (5, 16), "label")],
)
def test_nullable_unique_in_other_dialects(check, dialect: str, place: tuple[int, int], columns: str) -> None:
    [found] = of_rule(check(f"nullable-unique/{dialect}_fires.sql", dialect=dialect), "nullable-unique")
    assert places([found]) == [place]
    assert f"({columns})" in found.message
    assert not any("NULLS NOT DISTINCT" in line for line in found.explanation)
    assert any("SQL Server" in line for line in found.explanation) == (dialect == "tsql")


def test_nullable_unique_silent_on_keys_partial_and_expression_indexes(check) -> None:
    result = check("nullable-unique/postgres_clean.sql")
    assert len(result.catalog.tables["riders"].uniques) == 4
    assert of_rule(result, "nullable-unique") == []


def test_nullable_unique_leaves_a_rule_holding_a_key_to_redundant_unique(tmp_path: Path, monkeypatch) -> None:
    monkeypatch.chdir(tmp_path)
    Path("schema.sql").write_text(
        "CREATE TABLE bikes (bike_id int PRIMARY KEY, tag text, UNIQUE (bike_id, tag));\n", encoding="utf-8"
    )
    result = run(Config(paths=("schema.sql",)))
    assert [f.rule for f in result.findings] == ["redundant-unique"]


def test_redundant_unique_fires_on_duplicate_and_superset(check) -> None:
    found = of_rule(check("redundant-unique/postgres_fires.sql"), "redundant-unique")
    assert places(found) == [(6, 13), (8, 21)]
    assert found[0].message == (
        "unique constraint (sailing_id) of sailings repeats the primary key (sailing_id):"
        " it rejects no row that key accepts"
    )
    assert "contains the primary key (sailing_id)" in found[1].message
    assert {f.severity for f in found} == {"note"}


def test_redundant_unique_in_mysql(check) -> None:
    [found] = of_rule(check("redundant-unique/mysql_fires.sql", dialect="mysql"), "redundant-unique")
    assert places([found]) == [(6, 14)]
    assert "(deck, cabin_id) of cabins contains the primary key (cabin_id)" in found.message


def test_redundant_unique_spares_foreign_key_targets_and_distinct_keys(check) -> None:
    result = check("redundant-unique/postgres_clean.sql")
    assert len(result.catalog.tables["sailings"].uniques) == 3
    assert of_rule(result, "redundant-unique") == []


def test_findings_of_one_table_have_distinct_fingerprints(check) -> None:
    found = of_rule(check("nullable-unique/postgres_fires.sql"), "nullable-unique")
    assert len({f.fingerprint for f in found}) == 2
