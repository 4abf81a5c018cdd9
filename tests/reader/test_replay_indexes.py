"""CREATE UNIQUE INDEX and DROP INDEX: plain keys, partial and expression indexes, drops by name."""
from __future__ import annotations

from .replay_support import keys, located, read_fixture, replay_sql, uniques


def test_partial_and_expression_indexes_are_kept_but_are_not_keys() -> None:
    parcels = read_fixture("postgres", "couriers").tables["parcels"]
    assert uniques(parcels) == {
        "parcels_open_ux": (("rider_id",), "unique index", True, False, False),
        "parcels_label_ux": (("label",), "unique index", False, True, False),
        "parcels_id_ux": (("parcel_id",), "unique index", False, False, True),
    }
    assert keys(parcels) == {("parcel_id",)}


def test_drop_index_finds_the_index_in_its_schema() -> None:
    catalog = read_fixture("postgres", "couriers")
    assert "bills_ref_ux" not in uniques(catalog.tables["billing.bills"])
    assert "parcels_tracking_ux" not in uniques(catalog.tables["parcels"])
    drops = [e.detail for e in catalog.tables["billing.bills"].history if e.detail.startswith("dropped unique index")]
    assert drops == ["dropped unique index bills_ref_ux (invoice_no, depot_id)"]


def test_same_index_name_in_two_schemas() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE routes (code text NOT NULL);\nCREATE TABLE archive.routes (code text NOT NULL);\n"
        "CREATE UNIQUE INDEX routes_code_ux ON routes (code);\n"
        "CREATE UNIQUE INDEX routes_code_ux ON archive.routes (code);",
        "DROP INDEX archive.routes_code_ux;",
    )
    assert keys(catalog.tables["routes"]) == {("code",)}
    assert keys(catalog.tables["archive.routes"]) == set()


def test_mysql_prefix_index_is_an_expression_index() -> None:
    catalog = replay_sql(
        "mysql",
        "CREATE TABLE passengers (id int NOT NULL PRIMARY KEY, email varchar(255) NOT NULL);\n"
        "CREATE UNIQUE INDEX passengers_email_uk ON passengers (email(191));",
    )
    passengers = catalog.tables["passengers"]
    assert uniques(passengers)["passengers_email_uk"] == (("email",), "unique index", False, True, False)
    assert keys(passengers) == {("id",)}


def test_mysql_drop_index_on_table() -> None:
    ports = read_fixture("mysql", "ferries").tables["ports"]
    assert "ports_code_uk" not in uniques(ports)


def test_tsql_unique_nonclustered_index_and_filtered_index() -> None:
    catalog = replay_sql(
        "tsql",
        "CREATE TABLE Cabins (CabinNo INT NOT NULL, Deck INT NOT NULL, Berth NVARCHAR(4) NULL);\n"
        "CREATE UNIQUE NONCLUSTERED INDEX UX_Cabins ON dbo.Cabins (Deck ASC, CabinNo ASC);\n"
        "CREATE UNIQUE INDEX UX_Berth ON Cabins (Berth) WHERE Berth IS NOT NULL;",
        "DROP INDEX UX_Berth ON dbo.Cabins;",
    )
    cabins = catalog.tables["cabins"]
    assert uniques(cabins) == {"ux_cabins": (("deck", "cabinno"), "unique index", False, False, True)}


def test_sqlite_collated_index_column_is_still_the_column() -> None:
    vaults = read_fixture("sqlite", "seedbank").tables["vaults"]
    assert uniques(vaults)["vaults_label_nocase"] == (("label",), "unique index", False, False, True)


def test_plain_index_is_skipped_and_its_drop_is_quiet() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE stops (id int PRIMARY KEY, street text);\nCREATE INDEX stops_street_ix ON stops (street);",
        "DROP INDEX stops_street_ix;",
    )
    assert keys(catalog.tables["stops"]) == {("id",)}
    assert catalog.statements_skipped == 1
    assert catalog.findings == []


def test_unique_index_over_missing_column_or_table_is_a_conflict() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE stops (id int PRIMARY KEY);\n"
        "CREATE UNIQUE INDEX stops_name_ux ON stops (name);\n"
        "CREATE UNIQUE INDEX depots_ux ON depots (code);",
    )
    assert uniques(catalog.tables["stops"]) == {"stops_pkey": (("id",), "primary key", False, False, True)}
    assert located(catalog.findings, "schema-conflict") == [("001.sql", 2), ("001.sql", 3)]
