"""missing-key: tables without a primary key or a unique key over NOT NULL columns.

Source, from memory: an SQL table is a multiset of rows, so without a PRIMARY KEY or a UNIQUE
over NOT NULL columns it may hold the same row twice (ISO/IEC 9075-2, tables and unique
constraints); a UNIQUE over a nullable column or with a WHERE clause does not prevent that.
"""
from __future__ import annotations

import pytest

from .rule_helpers import of_rule, places

RULE = "missing-key"


def test_fires_at_each_keyless_create_table(check) -> None:
    found = of_rule(check("missing-key/postgres_fires.sql"), RULE)
    assert places(found) == [(2, 14), (9, 14), (15, 14)]
    assert [f.table for f in found] == ["drawer_openings", "tray_labels", "cold_rooms"]
    assert found[0].span.end_column == 14 + len("drawer_openings")
    assert found[0].message == (
        "drawer_openings has no primary key and no unique key over NOT NULL columns,"
        " so it can hold duplicate rows"
    )
    assert found[0].severity == "warning"


def test_explains_why_a_unique_rule_is_no_key(check) -> None:
    _, nullable, partial = of_rule(check("missing-key/postgres_fires.sql"), RULE)
    assert "unique constraint (label_text) allows NULLs" in nullable.explanation[0]
    assert "unique index (room_no) has a WHERE clause" in partial.explanation[0]


@pytest.mark.parametrize(("dialect", "table"), [("mysql", "gangway_log"), ("sqlite", "gps_pings"),
                                                ("tsql", "ticketscans")])
def test_fires_in_other_dialects(check, dialect: str, table: str) -> None:
    found = of_rule(check(f"missing-key/{dialect}_fires.sql", dialect=dialect), RULE)
    assert places(found) == [(2, 14)]
    assert found[0].table == table


@pytest.mark.parametrize("dialect", ["postgres", "mysql", "sqlite", "tsql"])
def test_silent_when_every_table_has_a_key(check, dialect: str) -> None:
    result = check(f"missing-key/{dialect}_clean.sql", dialect=dialect)
    assert result.catalog.tables, "the clean fixture must declare tables"
    assert of_rule(result, RULE) == []
