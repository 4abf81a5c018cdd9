"""Annotations in every placement, and config-declared dependencies, checked against the catalog."""
from __future__ import annotations

from linter.model import Dependency, Span

from .replay_support import located, read_fixture, replay_sql


def test_annotations_above_inside_and_naming_their_table() -> None:
    catalog = read_fixture("postgres", "seedbank")
    lots = catalog.dropped[-1]
    assert lots.name == "lots"
    assert [(d.lhs, d.rhs, d.span.line, d.source) for d in lots.dependencies] == [
        (("genus",), ("family",), 6, "annotation"),
        (("vault",), ("vault_city",), 13, "annotation"),
    ]
    assert [(a.rules, a.reason, a.span.line) for a in lots.allows] == [
        (("transitive-dependency",), "the vault list is tiny and fixed", 9),
    ]


def test_misplaced_or_dangling_annotations_are_errors_at_their_own_line() -> None:
    catalog = read_fixture("postgres", "seedbank")
    assert located(catalog.findings, "annotation-error") == [
        ("001_lots.sql", 16),  # fd above an ALTER without a table name
        ("001_lots.sql", 18),  # a column lots does not have
        ("001_lots.sql", 19),  # a table that does not exist
        ("001_lots.sql", 20),  # allow above an ALTER
        ("001_lots.sql", 21),  # split-from above an ALTER
        ("003_lot_species.sql", 7),  # split-from a table that never existed
        ("003_lot_species.sql", 10),  # trailing comment about a table dropped just before
    ]
    assert all(f.severity == "error" for f in catalog.findings)
    assert "planted_on" in catalog.findings[1].message


def test_annotation_above_a_create_table_belongs_to_that_table_only() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE depots (code text PRIMARY KEY, city text);\n"
        "-- normguard: fd depot -> city\n"
        "CREATE TABLE riders (id int PRIMARY KEY, depot text, city text);\n",
    )
    assert catalog.tables["depots"].dependencies == []
    assert [(d.lhs, d.rhs) for d in catalog.tables["riders"].dependencies] == [(("depot",), ("city",))]


def test_quoted_and_folded_names_in_annotations() -> None:
    catalog = replay_sql(
        "postgres",
        '-- normguard: fd "DepotCode" -> City\nCREATE TABLE riders ("DepotCode" text, city text);',
    )
    assert [(d.lhs, d.rhs) for d in catalog.tables["riders"].dependencies] == [(("DepotCode",), ("city",))]


def test_annotation_written_before_the_column_exists_is_an_error() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE riders (id int PRIMARY KEY, depot text);\n-- normguard: fd riders: depot -> city\n"
        "ALTER TABLE riders ADD COLUMN town text;",
    )
    assert located(catalog.findings, "annotation-error") == [("001.sql", 2)]
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE riders (id int PRIMARY KEY, depot text);\n-- normguard: fd riders: depot -> city\n"
        "ALTER TABLE riders ADD COLUMN city text;",
    )
    assert catalog.findings == []
    assert [(d.lhs, d.rhs) for d in catalog.tables["riders"].dependencies] == [(("depot",), ("city",))]


def test_config_dependencies_attach_to_final_tables() -> None:
    config = Span(".normguard.yaml", 7, 5, 7, 30)
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE ferries (id int PRIMARY KEY, Home_Port text, port_city text);",
        config={
            "ferries": [
                Dependency(("home_port",), ("port_city",), config, "config"),
                Dependency(("home_port",), ("harbour",), Span(".normguard.yaml", 8, 5, 8, 30), "config"),
            ],
            "Tugboats": [Dependency(("a",), ("b",), Span(".normguard.yaml", 10, 5, 10, 30), "config")],
        },
    )
    ferries = catalog.tables["ferries"]
    assert [(d.lhs, d.rhs, d.source, d.span) for d in ferries.dependencies] == [
        (("home_port",), ("port_city",), "config", config),
    ]
    assert [(f.span.path, f.span.line, f.severity) for f in catalog.findings] == [
        (".normguard.yaml", 8, "error"), (".normguard.yaml", 10, "error"),
    ]
    assert "tugboats" in catalog.findings[1].message


def test_malformed_annotation_is_reported_from_the_front_half() -> None:
    catalog = replay_sql("postgres", "-- normguard: fd depot city\nCREATE TABLE riders (depot text, city text);")
    assert located(catalog.findings, "annotation-error") == [("001.sql", 1)]
    assert catalog.tables["riders"].dependencies == []


def test_allow_on_mysql_table_with_block_comment_inside() -> None:
    catalog = replay_sql(
        "mysql",
        "CREATE TABLE `cabins` (\n  /* normguard: allow missing-key: a staging copy, emptied nightly */\n  `deck` int\n);",
    )
    assert [(a.rules, a.span.line) for a in catalog.tables["cabins"].allows] == [(("missing-key",), 2)]
