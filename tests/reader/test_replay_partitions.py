"""PostgreSQL partitions and inheritance: the keys and columns a child table takes from its parent.

Outside sources for the expectations: an index on a partitioned table is made on (or matched to)
every existing and later partition, and ``ALTER INDEX ... ATTACH PARTITION`` completes one made with
ONLY (PostgreSQL commit "Local partitioned indexes", pgsql-hackers 2017); unique and primary key
constraints are not inherited through INHERITS, check and not-null constraints are (PostgreSQL
manual, "Inheritance", as quoted on pgsql-novice in 2009). The corpus checks read pagila and sakila
(../shared/corpus; PARSE_REPORT.md counts 55 ATTACH PARTITION statements kept as text).
"""
from __future__ import annotations

from linter.model import Catalog
from linter.reader import read_catalog
from linter.rule import Context
from rules.missing_key import check as missing_key

from ..locations import shared_path
from .replay_support import keys, located, read_fixture, replay_sql


def _inherited(catalog: Catalog, name: str) -> list[tuple]:
    """(name, columns, source, parent, file, line, column) of each rule a table took from a parent."""
    return [(u.name, u.columns, u.source, u.inherited_from, u.span.path.rsplit("/", 1)[-1], u.span.line,
             u.span.column) for u in catalog.tables[name].uniques if u.inherited_from]


def _missing_key(catalog: Catalog) -> dict[str, list[str]]:
    """The tables the missing-key rule reports, with the explanation of each."""
    return {f.table or "": f.explanation for f in missing_key(Context(catalog, {}))}


def test_attached_and_declared_partitions_take_the_parent_key_at_their_name() -> None:
    catalog = read_fixture("postgres", "ferry_partitions")
    assert _inherited(catalog, "crossings_2024_06") == [
        ("crossings_pkey", ("route_code", "sailed_at"), "primary key", "crossings", "001_crossings.sql", 20, 14),
    ]
    june = catalog.tables["crossings_2024_06"]
    assert june.partition_of == "crossings"
    assert june.column_names == ("route_code", "sailed_at", "vessel", "fare")
    assert june.history[0].detail.startswith("created as a partition of crossings")


def test_a_key_added_after_attach_reaches_the_attached_partitions() -> None:
    catalog = read_fixture("postgres", "ferry_partitions")
    pkey = ("deck_slots_pkey", ("vessel", "deck", "slot", "sailing_day"), "primary key", "deck_slots")
    # the span is the partition's name in its ATTACH statement: line 23, after "ATTACH PARTITION "
    assert _inherited(catalog, "deck_slots_aurora") == [(*pkey, "002_deck_slots.sql", 23, 53)]
    aurora = catalog.tables["deck_slots_aurora"]
    assert [(e.action, e.detail, e.span.line) for e in aurora.history if e.action == "attached"] == [
        ("attached", "attached as a partition of deck_slots", 23),
    ]
    conflicts = [f for f in catalog.findings if f.rule == "schema-conflict"]
    assert [(f.span.line, f.table) for f in conflicts] == [(26, "deck_slots_nordlys")]
    assert "lacks column(s) sailing_day of primary key deck_slots_pkey" in conflicts[0].message
    assert keys(catalog.tables["deck_slots_nordlys"]) == set()


def test_detach_takes_the_inherited_key_away() -> None:
    catalog = read_fixture("postgres", "ferry_partitions")
    may = catalog.tables["crossings_2024_05"]
    assert may.partition_of is None and may.uniques == []
    assert may.history[-1].action == "detached"
    assert may.history[-1].detail == "detached from crossings; lost primary key (route_code, sailed_at)"


def test_inherits_takes_columns_in_parent_order_but_no_keys() -> None:
    catalog = read_fixture("postgres", "ferry_partitions")
    assert catalog.tables["harbour_fees_2019"].column_names == ("harbour", "charged_on", "amount")
    fees_2020 = catalog.tables["harbour_fees_2020"]
    assert fees_2020.column_names == ("harbour", "charged_on", "amount", "waived")
    assert fees_2020.uniques == [] and fees_2020.partition_of is None
    assert not any(c.nullable for c in fees_2020.columns)  # not-null constraints are inherited


def test_missing_key_speaks_once_for_a_keyless_parent_and_skips_covered_partitions() -> None:
    found = _missing_key(read_fixture("postgres", "ferry_partitions"))
    assert sorted(found) == [
        "crossings_2024_05", "deck_slots_nordlys", "gate_scans", "harbour_fees_2019", "harbour_fees_2020",
    ]
    assert found["gate_scans"][0].startswith("its partitions (gate_scans_2024, gate_scans_2025) have no key")
    assert found["deck_slots_nordlys"][0].startswith("it is a partition of deck_slots but carries none")


def test_keys_follow_the_parent_through_drops_renames_and_levels() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE berths (pier text NOT NULL, berth int NOT NULL, CONSTRAINT berths_uq UNIQUE (pier, berth))"
        " PARTITION BY LIST (pier);\n"
        "CREATE TABLE berths_north PARTITION OF berths FOR VALUES IN ('north') PARTITION BY RANGE (berth);\n"
        "CREATE TABLE berths_north_low PARTITION OF berths_north FOR VALUES FROM (0) TO (10);\n"
        "ALTER TABLE berths RENAME TO moorings;\n"
        "CREATE UNIQUE INDEX moorings_berth_ux ON moorings (berth, pier);\n",
        "ALTER TABLE moorings DROP CONSTRAINT berths_uq;\n",
    )
    low = catalog.tables["berths_north_low"]
    assert catalog.tables["berths_north"].partition_of == "moorings"
    assert [(u.name, u.inherited_from) for u in low.uniques] == [("moorings_berth_ux", "berths_north")]
    assert located(catalog.findings, "schema-conflict") == []


def test_attach_and_detach_that_do_not_fit_are_conflicts_and_never_unsupported() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE tickets (id int PRIMARY KEY) PARTITION BY HASH (id);\n"
        "CREATE TABLE tickets_0 (id int NOT NULL);\n"
        "ALTER TABLE tickets ATTACH PARTITION tickets_9 FOR VALUES WITH (MODULUS 2, REMAINDER 1);\n"  # 3
        "ALTER TABLE IF EXISTS lockers ATTACH PARTITION tickets_0 DEFAULT;\n"  # quiet
        "ALTER TABLE lockers ATTACH PARTITION tickets_0 DEFAULT;\n"  # 5
        "ALTER TABLE tickets DETACH PARTITION tickets_0;\n"  # 6 not attached
        "ALTER TABLE tickets ATTACH PARTITION tickets_0 FOR VALUES WITH (MODULUS 2, REMAINDER 0);\n"
        "ALTER TABLE tickets ATTACH PARTITION tickets_0 DEFAULT;\n"  # 8 already attached
        "ALTER TABLE tickets DETACH PARTITION tickets_0 CONCURRENTLY;\n"
        "ALTER TABLE tickets DETACH PARTITION tickets_0 FINALIZE;\n"  # quiet: completes line 9
        "ALTER TABLE tickets_0 ATTACH PARTITION tickets DEFAULT;\n",  # fine: now a plain table
    )
    assert located(catalog.findings, "schema-conflict") == [("001.sql", n) for n in (3, 5, 6, 8)]
    assert located(catalog.findings, "unsupported-statement") == []
    assert catalog.statements_skipped == 0
    assert catalog.tables["tickets"].partition_of == "tickets_0"
    assert keys(catalog.tables["tickets"]) == {("id",)}


def test_pagila_payment_partitions_carry_the_payment_keys() -> None:
    path = shared_path("corpus", "pagila", "pagila-schema.sql")
    catalog = read_catalog([str(path)], dialect="postgres")
    partitions = {name: t for name, t in catalog.tables.items() if t.partition_of == "payment"}
    assert len(partitions) == 55  # PARSE_REPORT.md: 55 ATTACH PARTITION statements
    for table in partitions.values():
        assert keys(table) == {("payment_date", "payment_id"), ("uuid", "payment_date")}, table.name
    assert not [name for name in _missing_key(catalog) if name.startswith("payment")]


def test_sakila_partition_of_gives_keys_and_inherits_gives_none() -> None:
    root = shared_path("corpus", "sakila")
    partitioned = read_catalog([str(root / "yugabytedb-sakila-db" / "yugabytedb-sakila-schema.sql")],
                               dialect="postgres")
    children = [t for t in partitioned.tables.values() if t.partition_of == "payment"]
    assert len(children) == 7 and all(keys(t) == {("payment_id", "payment_date")} for t in children)
    inherited = read_catalog([str(root / "postgres-sakila-db" / "postgres-sakila-schema.sql")], dialect="postgres")
    payment = inherited.tables["payment"]
    children = [t for name, t in inherited.tables.items() if name.startswith("payment_p2007_")]
    assert len(children) == 6
    assert all(t.column_names == payment.column_names and t.uniques == [] for t in children)
