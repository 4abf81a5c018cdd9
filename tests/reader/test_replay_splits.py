"""Recorded splits: data moved then the original dropped or shrunk, in one file or two; declared splits."""
from __future__ import annotations

from linter.model import Split

from .replay_support import read_fixture, replay_sql


def _pieces(split: Split) -> dict[str, tuple[tuple[str, ...], dict]]:
    """Each piece's columns and lineage by table name."""
    return {piece.table: (piece.columns, piece.lineage) for piece in split.pieces}


def test_columns_moved_out_then_dropped_in_one_file() -> None:
    catalog = read_fixture("postgres", "courier_splits")
    split = catalog.splits[0]
    assert (split.how, split.original) == ("data", "couriers")
    assert split.original_columns == ("courier_id", "name", "depot_code", "depot_city", "depot_phone")
    assert split.original_keys == (("courier_id",),)
    assert [(d.lhs, d.rhs) for d in split.original_dependencies] == [(("depot_code",), ("depot_city", "depot_phone"))]
    assert _pieces(split) == {
        "depots": (("code", "city", "phone"), {"code": "depot_code", "city": "depot_city", "phone": "depot_phone"}),
        "couriers": (("courier_id", "name", "depot_code"),
                     {"courier_id": "courier_id", "name": "name", "depot_code": "depot_code"}),
    }
    assert split.span.path.endswith("002_move_depots_out.sql") and split.span.line == 4


def test_data_copied_in_one_file_and_original_dropped_in_the_next() -> None:
    catalog = read_fixture("postgres", "courier_splits")
    assert len(catalog.splits) == 2
    split = catalog.splits[1]
    assert split.original_columns == ("courier_id", "name", "depot_code")
    assert _pieces(split) == {
        "shifts": (("courier_id", "rider_name", "badge"), {"courier_id": "courier_id", "rider_name": "name", "badge": None}),
    }
    assert split.span.path.endswith("004_retire_couriers.sql") and split.span.line == 1


def test_copying_without_dropping_is_not_a_split() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE couriers (id int PRIMARY KEY, depot text, city text);",
        "CREATE TABLE depots AS SELECT DISTINCT depot, city FROM couriers;",
        "ALTER TABLE couriers ADD COLUMN phone text;",
    )
    assert catalog.splits == []


def test_a_shrink_without_data_moves_is_not_a_split_and_ends_earlier_moves() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE couriers (id int PRIMARY KEY, depot text, city text, phone text);\n"
        "CREATE TABLE depots AS SELECT DISTINCT depot, city FROM couriers;",
        "ALTER TABLE couriers DROP COLUMN phone;",  # a split of couriers into depots and couriers
        "ALTER TABLE couriers DROP COLUMN city;",  # nothing moved since: a plain column drop
    )
    assert [(s.span.path, s.span.line) for s in catalog.splits] == [("db/002.sql", 1)]


def test_data_moved_after_the_shrink_completes_the_split() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE couriers (id int PRIMARY KEY, depot text, city text, phone text);\n"
        "CREATE TABLE depots (depot text, city text);",
        "ALTER TABLE couriers DROP COLUMN phone;\nINSERT INTO depots SELECT depot, city FROM couriers;\n"
        "ALTER TABLE couriers DROP COLUMN city;",
    )
    split = catalog.splits[0]
    assert split.original_columns == ("id", "depot", "city", "phone")
    assert _pieces(split) == {
        "depots": (("depot", "city"), {"depot": "depot", "city": "city"}),
        "couriers": (("id", "depot"), {"id": "id", "depot": "depot"}),
    }
    assert split.span.line == 3


def test_insert_after_the_last_shrink_gives_the_split_its_span() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE couriers (id int PRIMARY KEY, depot text, city text, phone text);\n"
        "CREATE TABLE depots (depot text, city text);",
        "ALTER TABLE couriers DROP COLUMN phone;\nINSERT INTO depots SELECT depot, city FROM couriers;",
    )
    assert catalog.splits[0].span.line == 2


def test_mysql_column_moved_to_its_own_table() -> None:
    catalog = read_fixture("mysql", "ferries")
    split = catalog.splits[0]
    assert (split.how, split.original, split.span.line) == ("data", "ports", 4)
    assert [(d.lhs, d.rhs, d.span.line) for d in split.original_dependencies] == [(("name",), ("country",), 1)]
    assert _pieces(split) == {
        "countries": (("code",), {"code": "country"}),
        "ports": (("port_id", "code", "name"), {"port_id": "port_id", "code": "code", "name": "name"}),
    }
    assert catalog.tables["ports"].dependencies == []


def test_sqlite_rebuild_records_the_renamed_copy_as_a_piece() -> None:
    split = read_fixture("sqlite", "seedbank").splits[0]
    assert (split.how, split.original) == ("data", "accessions")
    assert split.original_keys == (("accession_no",),)
    assert _pieces(split) == {
        "accessions": (("accession_no", "species", "vault_id", "collected_on"),
                       {c: c for c in ("accession_no", "species", "vault_id", "collected_on")}),
        "species": (("name", "genus"), {"name": "species", "genus": "genus"}),
    }
    assert split.span.line == 11


def test_pieces_dropped_again_do_not_count() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE couriers (id int PRIMARY KEY, depot text);\n"
        "CREATE TABLE scratch AS SELECT depot FROM couriers;\nDROP TABLE scratch;\nDROP TABLE couriers;",
    )
    assert catalog.splits == []


def test_declared_split_gathers_pieces_across_files() -> None:
    catalog = read_fixture("postgres", "seedbank")
    declared = [s for s in catalog.splits if s.how == "declared"]
    assert len(declared) == 1 and len(catalog.splits) == 1
    split = declared[0]
    assert split.original == "lots"
    assert split.original_columns == ("lot_id", "species", "genus", "family", "vault", "vault_city", "sown_on")
    assert split.original_keys == (("lot_id",),)
    assert [(d.lhs, d.rhs) for d in split.original_dependencies] == [(("genus",), ("family",)), (("vault",), ("vault_city",))]
    assert _pieces(split) == {
        "genera": (("genus", "family"), {"genus": "genus", "family": "family"}),
        "lot_species": (("lot_id", "species", "genus"), {"lot_id": "lot_id", "species": "species", "genus": "genus"}),
    }
    assert split.span.path.endswith("003_lot_species.sql") and split.span.line == 1
    assert catalog.tables["genera"].split_from == "lots"


def test_declared_split_of_a_table_dropped_earlier_uses_its_last_state() -> None:
    catalog = replay_sql(
        "mysql",
        "CREATE TABLE cabins (cabin_no int NOT NULL PRIMARY KEY, deck int, deck_colour text);",
        "ALTER TABLE cabins DROP COLUMN deck_colour;\nDROP TABLE cabins;",
        "-- normguard: split-from cabins\nCREATE TABLE decks (deck int NOT NULL PRIMARY KEY);",
    )
    split = catalog.splits[0]
    assert (split.how, split.original_columns, split.original_keys) == ("declared", ("cabin_no", "deck"), (("cabin_no",),))
    assert _pieces(split) == {"decks": (("deck",), {"deck": "deck"})}
