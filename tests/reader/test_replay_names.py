"""Identifier folding, quoting and schema-qualified names, per dialect."""
from __future__ import annotations

from .replay_support import keys, read_fixture, replay_sql


def test_postgres_folds_unquoted_names_and_keeps_quoted_ones() -> None:
    catalog = read_fixture("postgres", "couriers")
    assert "Riders" in catalog.tables and "riders" not in catalog.tables
    assert catalog.tables["Riders"].column_names[:2] == ("rider_id", "depot_id")


def test_schema_qualified_tables_stay_distinct_and_public_is_the_default() -> None:
    catalog = read_fixture("postgres", "couriers")
    assert {"invoices", "billing.bills"} <= set(catalog.tables)
    assert keys(catalog.tables["invoices"]) == {("invoice_ref",)}
    assert keys(catalog.tables["billing.bills"]) == {("depot_id", "invoice_no")}


def test_quoted_schema_keeps_its_case() -> None:
    catalog = replay_sql("postgres", 'CREATE TABLE "Billing".Credits (Id int PRIMARY KEY);')
    assert list(catalog.tables) == ["Billing.credits"]


def test_mysql_table_names_keep_case_and_column_names_fold() -> None:
    catalog = replay_sql("mysql", "CREATE TABLE Tickets (TicketNo int NOT NULL, PRIMARY KEY (ticketno));")
    assert list(catalog.tables) == ["Tickets"]
    assert keys(catalog.tables["Tickets"]) == {("ticketno",)}
    assert catalog.findings == []


def test_tsql_and_sqlite_fold_even_quoted_names_and_drop_the_default_schema() -> None:
    tsql = replay_sql("tsql", "CREATE TABLE [dbo].[Decks] ([DeckNo] INT NOT NULL PRIMARY KEY);\nALTER TABLE decks ADD Level INT NULL;")
    assert tsql.tables["decks"].column_names == ("deckno", "level")
    sqlite = replay_sql("sqlite", 'CREATE TABLE main."Packets" ("Grams" INTEGER);\nALTER TABLE packets ADD COLUMN lot TEXT;')
    assert sqlite.tables["packets"].column_names == ("grams", "lot")


def test_rename_keeps_the_schema_of_an_unqualified_new_name() -> None:
    catalog = replay_sql("postgres", "CREATE TABLE billing.invoices (no int);", "ALTER TABLE billing.invoices RENAME TO bills;")
    assert list(catalog.tables) == ["billing.bills"]
