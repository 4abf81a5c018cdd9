"""Bad input becomes findings at the statement, never an exception: conflicts, opaque DDL, internal errors."""
from __future__ import annotations

import importlib

import pytest

from .replay_support import keys, located, replay_sql

replay_module = importlib.import_module("linter.reader.replay")


def test_statements_that_do_not_fit_the_schema_are_conflicts() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE bells (id int PRIMARY KEY, tone text, id int);\n"  # 1 duplicate column
        "CREATE TABLE bells (x int);\n"  # 2 exists
        "CREATE TABLE IF NOT EXISTS bells (x int);\n"  # quiet
        "ALTER TABLE horns ADD COLUMN x int;\n"  # 4 no such table
        "ALTER TABLE IF EXISTS horns ADD COLUMN x int;\n"  # quiet
        "DROP TABLE horns;\n"  # 6 no such table
        "DROP TABLE IF EXISTS horns;\n"  # quiet
        "ALTER TABLE bells ADD CONSTRAINT bells_uq UNIQUE (pitch);\n"  # 8 key over a missing column
        "ALTER TABLE bells ADD PRIMARY KEY (tone);\n"  # 9 a second primary key
        "ALTER TABLE bells DROP COLUMN pitch;\n"  # 10
        "ALTER TABLE bells DROP COLUMN IF EXISTS pitch;\n"  # quiet
        "ALTER TABLE bells RENAME COLUMN tone TO id;\n"  # 12 target exists
        "ALTER TABLE bells ALTER COLUMN pitch SET NOT NULL;\n"  # 13
        "ALTER TABLE bells ADD COLUMN tone text;\n"  # 14 exists
        "ALTER TABLE bells ADD COLUMN IF NOT EXISTS tone text;\n"  # quiet
        "CREATE TABLE horns (id int);\nALTER TABLE horns RENAME TO bells;",  # 17 target name taken
    )
    assert located(catalog.findings, "schema-conflict") == [
        ("001.sql", n) for n in (1, 2, 4, 6, 8, 9, 10, 12, 13, 14, 17)
    ]
    assert all(f.severity == "warning" for f in catalog.findings if f.rule == "schema-conflict")
    bells = catalog.tables["bells"]
    assert bells.column_names == ("id", "tone")
    assert keys(bells) == {("id",)}
    catalog = replay_sql("mysql", "CREATE TABLE horns (id int);\nALTER TABLE horns DROP PRIMARY KEY;")
    assert located(catalog.findings, "schema-conflict") == [("001.sql", 2)]


def test_conflict_messages_name_table_and_column() -> None:
    catalog = replay_sql("postgres", "CREATE TABLE bells (id int);\nCREATE UNIQUE INDEX bells_ux ON bells (pitch);")
    assert [(f.rule, f.table, f.message) for f in catalog.findings] == [
        ("schema-conflict", "bells", "unique index on bells names missing column(s) pitch"),
    ]


def test_opaque_ddl_is_reported_as_unsupported() -> None:
    catalog = replay_sql(
        "sqlite",
        "CREATE TABLE lots (id INTEGER PRIMARY KEY, code TEXT) WITHOUT ROWID;\nCREATE TABLE vaults (id INTEGER PRIMARY KEY);",
    )
    assert located(catalog.findings, "unsupported-statement") == [("001.sql", 1)]
    assert catalog.findings[0].message.startswith("could not analyse: ")
    assert list(catalog.tables) == ["vaults"]
    assert (catalog.statements_read, catalog.statements_skipped) == (2, 1)


def test_rename_constraint_is_read_from_tokens() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE berths (id int, code text NOT NULL);\n"
        "ALTER TABLE berths ADD CONSTRAINT berths_id_uq UNIQUE (code, id), ADD FOREIGN KEY (id) REFERENCES piers;",
        "ALTER TABLE ONLY berths RENAME CONSTRAINT berths_id_uq TO berths_code_id_uq;\n"
        "ALTER TABLE berths RENAME CONSTRAINT berths_id_fkey TO berths_pier_fk;\n"
        "ALTER TABLE IF EXISTS moorings RENAME CONSTRAINT a TO b;\n"
        "ALTER TABLE moorings RENAME CONSTRAINT a TO b;",
        "ALTER TABLE berths DROP CONSTRAINT berths_code_id_uq;",
    )
    berths = catalog.tables["berths"]
    assert berths.uniques == []
    assert [f.name for f in berths.foreign_keys] == ["berths_pier_fk"]
    assert located(catalog.findings, "schema-conflict") == [("002.sql", 4)]
    assert located(catalog.findings, "unsupported-statement") == []


def test_several_indexes_in_one_drop() -> None:
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE berths (code text NOT NULL, pier text NOT NULL);\n"
        "CREATE UNIQUE INDEX berths_code_ux ON berths (code);\nCREATE UNIQUE INDEX berths_pier_ux ON berths (pier, code);",
        "DROP INDEX CONCURRENTLY IF EXISTS berths_code_ux, public.berths_pier_ux CASCADE;",
    )
    assert catalog.tables["berths"].uniques == []
    assert catalog.findings == []


def test_an_unexpected_error_in_one_statement_becomes_a_finding(monkeypatch: pytest.MonkeyPatch) -> None:
    def broken(state, expression):
        raise RuntimeError("the replay tripped")

    monkeypatch.setattr(replay_module, "create_table", broken)
    catalog = replay_sql(
        "postgres",
        "CREATE TABLE bells (id int);\nCREATE INDEX bells_ix ON bells (id);\nINSERT INTO bells VALUES (1);",
    )
    assert [(f.rule, f.span.line) for f in catalog.findings] == [("unsupported-statement", 1)]
    assert "the replay tripped" in catalog.findings[0].message
    assert catalog.statements_read == 3


def test_an_unexpected_error_in_annotations_becomes_a_finding(monkeypatch: pytest.MonkeyPatch) -> None:
    def broken(state, comments, host):
        raise ValueError("annotation trouble")

    monkeypatch.setattr(replay_module, "attach_comments", broken)
    catalog = replay_sql("postgres", "-- normguard: fd a -> b\nCREATE TABLE bells (a int, b int);")
    assert "bells" in catalog.tables
    assert [(f.rule, f.severity) for f in catalog.findings][:1] == [("annotation-error", "error")]
    assert "annotation trouble" in catalog.findings[0].message


def test_syntax_errors_and_file_problems_reach_the_catalog(tmp_path) -> None:
    from linter.reader import read_catalog

    (tmp_path / "001_bad.sql").write_text("CREATE TABLE bells (id int PRIMARY KEY;\nCREATE TABLE horns (id int);\n")
    (tmp_path / "002_latin1.sql").write_bytes("-- caf\xe9\nCREATE TABLE gongs (id int);\n".encode("latin-1"))
    catalog = read_catalog([str(tmp_path)])
    assert {f.rule for f in catalog.findings} == {"syntax-error", "file-error"}
    assert set(catalog.tables) == {"horns", "gongs"}
