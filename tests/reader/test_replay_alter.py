"""ALTER TABLE forms: columns, NOT NULL, constraints added and dropped, renames, MySQL MODIFY/CHANGE."""
from __future__ import annotations

from .replay_support import keys, read_fixture, replay_sql, uniques


def test_postgres_alter_forms_from_the_courier_migrations() -> None:
    catalog = read_fixture("postgres", "couriers")
    riders = catalog.tables["Riders"]
    assert riders.column_names == ("rider_id", "depot_id", "display_name", "email")
    assert riders.column("display_name").nullable is False
    assert set(uniques(riders)) == {"riders_pk", "riders_display_uq"}
    display = next(u for u in riders.uniques if u.name == "riders_display_uq")
    assert display.columns == ("display_name", "depot_id") and riders.is_nullable_unique(display)
    assert keys(catalog.tables["invoices"]) == {("invoice_ref",)}
    assert catalog.tables["invoices"].column("invoice_ref").nullable is False
    bills = catalog.tables["billing.bills"]
    assert "billing.invoices" not in catalog.tables
    assert [f.name for f in bills.foreign_keys] == ["invoices_depot_id_fkey"]
    assert [(e.action, e.span.line) for e in bills.history] == [
        ("created", 19), ("renamed", 9), ("altered", 10), ("altered", 14), ("altered", 18),
    ]


def test_history_records_each_change_with_its_file_and_line() -> None:
    depots = read_fixture("postgres", "couriers").tables["depots"]
    assert [(e.action, e.span.path.rsplit("/", 1)[1], e.span.line) for e in depots.history] == [
        ("created", "001_depots_and_riders.sql", 2),
        ("altered", "002_alter_riders.sql", 6),
        ("altered", "002_alter_riders.sql", 7),
        ("altered", "002_alter_riders.sql", 7),
    ]


def test_set_not_null_turns_a_nullable_unique_into_a_key_and_back() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE bikes (frame_no text UNIQUE, colour text);",
        "ALTER TABLE bikes ALTER COLUMN frame_no SET NOT NULL;",
    )
    assert keys(catalog.tables["bikes"]) == {("frame_no",)}
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE bikes (frame_no text NOT NULL UNIQUE, colour text);",
        "ALTER TABLE bikes ALTER COLUMN frame_no DROP NOT NULL;",
    )
    assert keys(catalog.tables["bikes"]) == set()


def test_rename_column_follows_keys_foreign_keys_and_dependencies() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE depots (depot_code text PRIMARY KEY, city text);\n"
        "CREATE TABLE riders (rider_id int PRIMARY KEY, depot text REFERENCES depots (depot_code),\n"
        "    -- normguard: fd depot -> rider_id\n"
        "    shift text);",
        "ALTER TABLE depots RENAME COLUMN depot_code TO code;\nALTER TABLE riders RENAME COLUMN depot TO depot_code;",
    )
    depots, riders = catalog.tables["depots"], catalog.tables["riders"]
    assert keys(depots) == {("code",)}
    assert [(f.columns, f.ref_columns) for f in riders.foreign_keys] == [(("depot_code",), ("code",))]
    assert [(d.lhs, d.rhs) for d in riders.dependencies] == [(("depot_code",), ("rider_id",))]


def test_drop_column_drops_keys_and_declared_dependencies_with_a_history_event() -> None:
    catalog = replay_sql(
        "postgres",
        "-- normguard: fd depot -> city\n"
        "CREATE TABLE riders (rider_id int PRIMARY KEY, email text NOT NULL, depot text, city text,\n"
        "    UNIQUE (email, depot));",
        "ALTER TABLE riders DROP COLUMN city;",
    )
    riders = catalog.tables["riders"]
    assert keys(riders) == {("rider_id",)}
    assert riders.dependencies == []
    events = [(e.action, e.span.path, e.span.line) for e in riders.history]
    assert ("dependency dropped", "db/002.sql", 1) in events


def test_mysql_modify_change_and_index_drops() -> None:
    catalog = read_fixture("mysql", "ferries")
    vessels = catalog.tables["vessels"]
    assert vessels.column_names == ("vessel_id", "imo_number", "home_port_id")
    assert keys(vessels) == {("vessel_id",), ("imo_number",)}
    assert [f.columns for f in vessels.foreign_keys] == [("home_port_id",)]
    ports = catalog.splits[0].original_columns, catalog.splits[0].original_keys  # ports before V3 moved country out
    assert ports == (("port_id", "code", "name", "country"), (("port_id",), ("name", "country")))
    sailings = catalog.tables["sailings"]
    assert "crossings" not in catalog.tables
    assert keys(sailings) == {("vessel_id", "departs_at", "from_port")}
    assert [f.name for f in sailings.foreign_keys] == ["crossings_ibfk_1"]
    captain = next(u for u in sailings.uniques if u.name == "crossings_captain_uk")
    assert (captain.columns, captain.expression) == (("captain_email",), True)


def test_mysql_modify_without_not_null_makes_the_column_nullable() -> None:
    catalog = replay_sql(
        "mysql",
        "CREATE TABLE cabins (cabin_no int NOT NULL PRIMARY KEY, deck_code char(2) NOT NULL UNIQUE);",
        "ALTER TABLE cabins MODIFY deck_code char(3);",
    )
    assert keys(catalog.tables["cabins"]) == {("cabin_no",)}


def test_tsql_alter_column_not_null_and_add_without_column_keyword() -> None:
    catalog = replay_sql(
        "tsql",
        "CREATE TABLE Gangways (Pier INT NOT NULL, Code NVARCHAR(4) NULL, CONSTRAINT UQ_Code UNIQUE (Code));",
        "ALTER TABLE Gangways ALTER COLUMN Code NVARCHAR(4) NOT NULL;\nALTER TABLE dbo.Gangways ADD Width INT NULL;",
    )
    gangways = catalog.tables["gangways"]
    assert gangways.column_names == ("pier", "code", "width")
    assert keys(gangways) == {("code",)}


def test_add_and_drop_constraints_by_name_and_by_implied_name() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE hubs (id int, code text NOT NULL UNIQUE, region int);",
        "ALTER TABLE hubs ADD PRIMARY KEY (id), ADD CONSTRAINT hubs_region_uq UNIQUE (region, code);",
        "ALTER TABLE hubs DROP CONSTRAINT hubs_code_key, DROP CONSTRAINT IF EXISTS no_such_rule;",
    )
    hubs = catalog.tables["hubs"]
    assert uniques(hubs) == {
        "hubs_pkey": (("id",), "primary key", False, False, True),
        "hubs_region_uq": (("region", "code"), "unique constraint", False, False, False),
    }
    assert catalog.findings == []
