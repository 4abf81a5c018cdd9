"""Column lineage of CREATE TABLE ... AS SELECT, SELECT ... INTO and INSERT INTO ... SELECT."""
from __future__ import annotations

from .replay_support import replay_sql

_COURIERS = "CREATE TABLE couriers (id int PRIMARY KEY, name text NOT NULL, depot text, city text);\n"


def _lineage(catalog, target: str) -> list[tuple[str, dict]]:
    """(source table, lineage) of each data move into ``target`` still pending after the replay."""
    return [(split.original, piece.lineage) for split in catalog.splits for piece in split.pieces if piece.table == target]


def test_ctas_columns_are_named_and_typed_from_the_source() -> None:
    catalog = replay_sql("postgres", _COURIERS + "CREATE TABLE depots AS SELECT DISTINCT depot AS code, city, upper(city) FROM couriers;")
    depots = catalog.tables["depots"]
    assert [(c.name, c.type, c.nullable) for c in depots.columns] == [
        ("code", "TEXT", True), ("city", "TEXT", True), ("upper", "", True),
    ]
    assert depots.uniques == []


def test_ctas_with_column_list_and_star() -> None:
    catalog = replay_sql(
        "postgres",
        _COURIERS + "CREATE TABLE a (x, y) AS SELECT name, depot FROM couriers;\nCREATE TABLE b AS SELECT * FROM public.couriers;",
        "DROP TABLE couriers;",
    )
    assert catalog.tables["a"].column_names == ("x", "y")
    assert catalog.tables["b"].column_names == ("id", "name", "depot", "city")
    assert _lineage(catalog, "a") == [("couriers", {"x": "name", "y": "depot"})]
    assert _lineage(catalog, "b") == [("couriers", {"id": "id", "name": "name", "depot": "depot", "city": "city"})]


def test_insert_select_keeps_renames_and_marks_expressions_and_aggregates() -> None:
    catalog = replay_sql(
        "postgres",
        _COURIERS
        + "CREATE TABLE depots (code text, town text, riders int, label text);\n"
        + "INSERT INTO depots (code, town, riders, label) SELECT depot, c.city, count(*), depot || city FROM couriers c GROUP BY depot, c.city;\n"
        + "DROP TABLE couriers;",
    )
    assert _lineage(catalog, "depots") == [
        ("couriers", {"code": "depot", "town": "city", "riders": None, "label": None}),
    ]


def test_insert_without_column_list_follows_the_target_column_order() -> None:
    catalog = replay_sql(
        "postgres",
        _COURIERS + "CREATE TABLE names (courier int, full_name text);\nINSERT INTO names SELECT id, name FROM couriers;\n"
        "ALTER TABLE couriers DROP COLUMN name;",
    )
    assert _lineage(catalog, "names") == [("couriers", {"courier": "id", "full_name": "name"})]


def test_a_join_traces_nothing_so_its_target_is_no_piece() -> None:
    catalog = replay_sql(
        "postgres",
        _COURIERS + "CREATE TABLE depots (code text PRIMARY KEY, phone text);\n"
        "CREATE TABLE roster AS SELECT c.id, d.phone FROM couriers c JOIN depots d ON d.code = c.depot;\n"
        "CREATE TABLE riders AS SELECT c.id, c.name FROM couriers c;\n"
        "DROP TABLE couriers;",
    )
    assert [piece.table for split in catalog.splits for piece in split.pieces] == ["riders"]


def test_subquery_and_union_sources_are_not_traceable() -> None:
    catalog = replay_sql(
        "postgres",
        _COURIERS + "CREATE TABLE towns (town text, depot text);\n"
        "INSERT INTO towns SELECT city, depot FROM (SELECT city, depot FROM couriers) AS s;\n"
        "INSERT INTO towns SELECT city, depot FROM couriers UNION SELECT depot, city FROM couriers;\n"
        "INSERT INTO towns (depot) SELECT depot FROM couriers WHERE city IN (SELECT city FROM couriers);\n"
        "DROP TABLE couriers;",
    )
    assert _lineage(catalog, "towns") == [("couriers", {"depot": "depot"})]


def test_tsql_select_into_creates_the_table() -> None:
    catalog = replay_sql(
        "tsql",
        "CREATE TABLE Tickets (TicketNo INT NOT NULL PRIMARY KEY, PortId INT NOT NULL);\n"
        "SELECT TicketNo, PortId AS HomePort INTO dbo.TicketArchive FROM dbo.Tickets;\nDROP TABLE Tickets;",
    )
    assert catalog.tables["ticketarchive"].column_names == ("ticketno", "homeport")
    assert _lineage(catalog, "ticketarchive") == [("tickets", {"ticketno": "ticketno", "homeport": "portid"})]


def test_insert_values_is_skipped_and_insert_into_unknown_table_is_quiet() -> None:
    catalog = replay_sql("postgres", _COURIERS + "INSERT INTO couriers VALUES (1, 'Ada', 'N1', 'Leeds');\n"
                         "INSERT INTO ghosts SELECT id FROM couriers;")
    assert catalog.statements_skipped == 1
    assert catalog.findings == []
