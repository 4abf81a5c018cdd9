"""CREATE TABLE in four dialects: columns, nullability, keys inline and table-level, foreign keys, checks."""
from __future__ import annotations

from linter.reader import read_catalog

from ..locations import shared_path
from .replay_support import keys, read_fixture, replay_sql, uniques


def test_postgres_columns_keys_and_references() -> None:
    catalog = read_fixture("postgres", "couriers")
    depots = catalog.tables["depots"]
    assert [(c.name, c.type, c.nullable) for c in depots.columns] == [
        ("depot_id", "INT", False), ("code", "TEXT", False), ("city", "VARCHAR(80)", True), ("phone", "TEXT", False),
    ]
    assert keys(depots) == {("depot_id",), ("code",), ("phone",)}
    assert uniques(depots)["depots_pkey"][1] == "primary key"
    assert len(depots.checks) == 1 and "code" in depots.checks[0].lower()
    riders = catalog.tables["Riders"]
    fk = riders.foreign_keys[0]
    assert (fk.columns, fk.ref_table, fk.ref_columns) == (("depot_id",), "depots", ())
    bills = catalog.tables["billing.bills"]
    assert keys(bills) == {("depot_id", "invoice_no")}
    assert [(f.columns, f.ref_table, f.ref_columns) for f in bills.foreign_keys] == [
        (("depot_id",), "depots", ("depot_id",)),
    ]


def test_spans_point_at_names_in_the_file() -> None:
    depots = read_fixture("postgres", "couriers").tables["depots"]
    assert depots.span.path.endswith("fixtures/reader/postgres/couriers/001_depots_and_riders.sql")
    assert (depots.span.line, depots.span.column, depots.span.end_column) == (2, 14, 20)
    code_key = next(u for u in depots.uniques if u.columns == ("code",))
    assert (code_key.span.line, code_key.span.column) == (4, 5)
    assert [c.span.line for c in depots.columns] == [3, 4, 5, 6]


def test_primary_key_implies_not_null_and_nullable_unique_is_no_key() -> None:
    catalog = replay_sql("postgres", "CREATE TABLE lockers (site text, slot int, tag text UNIQUE, PRIMARY KEY (site, slot));")
    lockers = catalog.tables["lockers"]
    assert [c.nullable for c in lockers.columns] == [False, False, True]
    assert keys(lockers) == {("site", "slot")}
    tag = next(u for u in lockers.uniques if u.columns == ("tag",))
    assert lockers.is_nullable_unique(tag)


def test_mysql_key_forms() -> None:
    catalog = replay_sql("mysql", (
        "CREATE TABLE `crew` (`crew_id` int NOT NULL AUTO_INCREMENT, `Badge` varchar(8) NOT NULL,"
        " licence varchar(20) DEFAULT NULL, shift int NOT NULL,"
        " PRIMARY KEY (`crew_id`), UNIQUE KEY `crew_badge_uk` (`Badge`), UNIQUE INDEX crew_licence_uk (licence),"
        " KEY `crew_shift_ix` (shift)) ENGINE=InnoDB;"
    ))
    crew = catalog.tables["crew"]
    assert uniques(crew) == {
        "PRIMARY": (("crew_id",), "primary key", False, False, True),
        "crew_badge_uk": (("badge",), "unique constraint", False, False, True),
        "crew_licence_uk": (("licence",), "unique constraint", False, False, False),
    }


def test_sqlite_forms_and_default_schema() -> None:
    catalog = read_fixture("sqlite", "seedbank")
    vaults = catalog.tables["vaults"]
    assert vaults.column_names == ("vault_id", "label", "temp_c", "humidity")
    assert keys(vaults) == {("vault_id",), ("label",)}
    tests = catalog.tables["germination_tests"]
    assert keys(tests) == {("accession_no", "tested_on")}
    assert [(f.columns, f.ref_table, f.ref_columns) for f in tests.foreign_keys] == [(("accession_no",), "accessions", ())]
    assert "main.accessions" not in catalog.tables


def test_tsql_clustered_and_nonclustered_constraints() -> None:
    catalog = read_fixture("tsql", "ferries")
    ports = catalog.tables["ports"]
    assert uniques(ports) == {
        "pk_ports": (("portid",), "primary key", False, False, True),
        "uq_ports_name": (("name",), "unique constraint", False, False, True),
    }
    tickets = catalog.tables["tickets"]
    assert tickets.column_names == ("ticketno", "portid", "passenger", "seatlabel", "deck")
    assert uniques(tickets) == {
        "pk_tickets": (("ticketno", "portid"), "primary key", False, False, True),
        "ux_tickets_seat": (("seatlabel", "portid"), "unique index", False, False, True),
    }
    assert [(f.name, f.ref_table, f.ref_columns) for f in tickets.foreign_keys] == [("fk_tickets_ports", "ports", ("portid",))]
    assert [(d.lhs, d.rhs, d.span.line) for d in tickets.dependencies] == [(("seatlabel", "portid"), ("deck",), 35)]
    assert catalog.tables["ticketarchive"].column_names == ("ticketno", "homeport")
    assert catalog.findings == []


def test_tsql_unique_nonclustered_column_lists() -> None:
    catalog = replay_sql("tsql", (
        "CREATE TABLE berths (pier INT NOT NULL, berth INT NOT NULL, code CHAR(3) NOT NULL,"
        " CONSTRAINT pk_berths PRIMARY KEY CLUSTERED (pier ASC, berth ASC),"
        " CONSTRAINT uq_berths UNIQUE NONCLUSTERED (code DESC));"
    ))
    assert keys(catalog.tables["berths"]) == {("pier", "berth"), ("code",)}


def test_create_if_not_exists_keeps_the_first_definition() -> None:
    catalog = replay_sql("postgres", "CREATE TABLE hubs (id int PRIMARY KEY);", "CREATE TABLE IF NOT EXISTS hubs (name text);")
    assert catalog.tables["hubs"].column_names == ("id",)
    assert catalog.findings == []


def test_tsql_primary_key_with_its_index_kind_inline_or_unnamed() -> None:
    # sqlglot 30.30 fails on both forms (../shared/corpus/PARSE_REPORT.md, point 4: all 16 Sakila
    # SQL Server tables); the index kind is dropped and the key kept, at the same positions.
    catalog = replay_sql(
        "tsql",
        "CREATE TABLE ferries (\n"
        "  ferry_id INT NOT NULL IDENTITY ,\n"
        "  name VARCHAR(45) NOT NULL,\n"
        "  PRIMARY KEY NONCLUSTERED (ferry_id)\n"
        "  )\n"
        "GO\n"
        "CREATE TABLE berths (berth_id INT NOT NULL PRIMARY KEY CLUSTERED, code CHAR(4) NOT NULL UNIQUE NONCLUSTERED)\n"
        "GO\n",
    )
    assert not catalog.findings
    assert keys(catalog.tables["ferries"]) == {("ferry_id",)}
    assert keys(catalog.tables["berths"]) == {("berth_id",), ("code",)}
    (primary,) = [u for u in catalog.tables["ferries"].uniques if u.is_primary]
    assert (primary.span.line, primary.span.column) == (4, 29)


def test_sakila_sql_server_schema_keeps_every_table() -> None:
    # PARSE_REPORT.md: 16 CREATE TABLE in the Sakila SQL Server schema, 0 read by bare sqlglot.
    path = shared_path("corpus", "sakila", "sql-server-sakila-db", "sql-server-sakila-schema.sql")
    catalog = read_catalog([str(path)], dialect="tsql")
    assert len(catalog.tables) == 16
    assert all(keys(table) for table in catalog.tables.values())
    assert not [f for f in catalog.findings if f.rule == "syntax-error" and f.severity == "error"]


def test_sqlite_conflict_clauses_and_ordered_key_columns() -> None:
    # Both make sqlglot 30.30 fail on the whole table (../shared/corpus/PARSE_REPORT.md, point 4);
    # neither changes a key (SQLite manual, "CREATE TABLE": conflict clause, indexed columns; from memory).
    catalog = replay_sql(
        "sqlite",
        "CREATE TABLE seeds (id INTEGER PRIMARY KEY ON CONFLICT IGNORE, code TEXT NOT NULL UNIQUE ON CONFLICT REPLACE);\n"
        "CREATE TABLE lots (seed_id INT NOT NULL, lot_no INT NOT NULL, PRIMARY KEY (seed_id DESC, lot_no ASC));\n",
    )
    assert not catalog.findings
    assert keys(catalog.tables["seeds"]) == {("id",), ("code",)}
    assert keys(catalog.tables["lots"]) == {("seed_id", "lot_no")}


def test_quoted_column_named_like_a_key_decoration_stays_in_the_key() -> None:
    # A quoted name is never a keyword (SQL standard delimited identifiers; from memory): the retry
    # without ASC / DESC / CLUSTERED must keep a column called "desc" or [asc] in its key.
    catalog = replay_sql(
        "sqlite",
        'CREATE TABLE lots (seed_id INT NOT NULL, "desc" INT NOT NULL, PRIMARY KEY (seed_id DESC, "desc"));\n'
        'CREATE TABLE jars (jar_no INT NOT NULL, "asc" INT NOT NULL, UNIQUE (jar_no, "asc") ON CONFLICT ABORT);\n',
    )
    assert not catalog.findings
    assert keys(catalog.tables["lots"]) == {("seed_id", "desc")}
    assert keys(catalog.tables["jars"]) == {("jar_no", "asc")}
    catalog = replay_sql("tsql", "CREATE TABLE berths (pier INT NOT NULL, [asc] INT NOT NULL,"
                                 " CONSTRAINT pk_berths PRIMARY KEY NONCLUSTERED (pier, [asc]))")
    assert keys(catalog.tables["berths"]) == {("pier", "asc")}
