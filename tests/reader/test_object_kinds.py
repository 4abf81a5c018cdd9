"""A misspelt object kind after CREATE, ALTER or DROP is a syntax-error at the word, with a hint.

sqlglot keeps such a statement as an opaque command without complaint, so without this check a
``CREATE TABEL`` would vanish from the schema in silence. The legitimate statements below are the
kinds each engine's SQL reference lists (PostgreSQL "SQL Commands", MySQL "Data Definition
Statements", SQLite "SQL As Understood By SQLite", SQL Server "Data Definition Language (DDL)
statements"; from memory) in statements sqlglot 30.30 keeps as commands; the corpus side of the
check (no such finding on nine projects' real migrations) is in ``test_corpus_parse.py``.
"""
from __future__ import annotations

import pytest
from sqlglot import exp

from linter.reader.sources import Source
from linter.reader.statements import Script, split_file

from .replay_support import replay_sql


def _split(text: str, dialect: str) -> Script:
    return split_file(Source("db/001.sql", text), dialect)


def _errors(script: Script) -> list[tuple[int, int, int, str]]:
    """(line, column, end column, message) of each syntax-error finding."""
    return [
        (f.span.line, f.span.column, f.span.end_column, f.message)
        for f in script.findings
        if f.rule == "syntax-error" and f.severity == "error"
    ]


def _kinds(script: Script) -> list[tuple[str, int]]:
    everything = sorted([*script.statements, *script.skipped], key=lambda s: s.offset)
    return [(s.kind, s.span.line) for s in everything]


def test_postgres_create_and_alter_tabel_are_errors_at_the_word_and_reading_goes_on() -> None:
    text = (
        "CREATE TABLE depots (id int PRIMARY KEY, city text);\n"
        "CREATE TABEL couriers (id int primary key);\n"
        "ALTER TABEL depots ADD COLUMN zone int;\n"
        "CREATE TABLE rides (id int PRIMARY KEY, courier int);\n"
    )
    script = _split(text, "postgres")
    assert _errors(script) == [
        (2, 8, 13, "unknown object kind TABEL after CREATE; did you mean TABLE?"),
        (3, 7, 12, "unknown object kind TABEL after ALTER; did you mean TABLE?"),
    ]
    assert _kinds(script) == [("ast", 1), ("error", 2), ("error", 3), ("ast", 4)]
    catalog = replay_sql("postgres", text)
    assert sorted(catalog.tables) == ["depots", "rides"]
    assert catalog.tables["depots"].column_names == ("id", "city")


MISSPELT = [
    pytest.param(
        "mysql",
        "create temporary tabel deck_plan (id int);\n"
        "CREATE OR REPLACE VEIW sailings_today AS SELECT 1;\n"
        "CREATE TABLE vessels (id int PRIMARY KEY);\n",
        [
            (1, 18, 23, "unknown object kind tabel after create temporary; did you mean table?"),
            (2, 19, 23, "unknown object kind VEIW after CREATE OR REPLACE; did you mean VIEW?"),
        ],
        ("ast", 3),
        id="mysql-modifiers-passed-hint-in-the-case-written",
    ),
    pytest.param(
        "sqlite",
        "CREATE UNIQE INDEX lots_code ON lots (code);\n"
        "DROP TABEL lots;\n"
        "CREATE GIZMO seed_counter (n int);\n",
        [
            (1, 8, 13, "unknown object kind UNIQE after CREATE; did you mean UNIQUE?"),
            (2, 6, 11, "unknown object kind TABEL after DROP; did you mean TABLE?"),
            (3, 8, 13, "unknown object kind GIZMO after CREATE"),
        ],
        ("error", 3),
        id="sqlite-unique-drop-and-a-word-with-no-close-kind",
    ),
    pytest.param(
        "tsql",
        "CREATE TABEL dbo.vessels (id int PRIMARY KEY)\nGO\n"
        "ALTER TABEL dbo.vessels ADD tonnage int\nGO\n"
        "CREATE OR ALTER PROCEDUR dbo.touch AS SELECT 1\nGO\n"
        "CREATE TABEL dbo.berths (id int PRIMARY KEY)\n"
        "CREATE TABLE dbo.ports (code char(5) PRIMARY KEY)\n",
        [
            (1, 8, 13, "unknown object kind TABEL after CREATE; did you mean TABLE?"),
            (3, 7, 12, "unknown object kind TABEL after ALTER; did you mean TABLE?"),
            (5, 17, 25, "unknown object kind PROCEDUR after CREATE OR ALTER; did you mean PROCEDURE?"),
            (7, 8, 13, "unknown object kind TABEL after CREATE; did you mean TABLE?"),
        ],
        ("ast", 8),
        id="tsql-in-go-batches-and-without-semicolons",
    ),
]


@pytest.mark.parametrize(("dialect", "text", "errors", "last"), MISSPELT)
def test_misspelt_kind_is_an_error_at_the_word_and_reading_goes_on(
    dialect: str, text: str, errors: list[tuple[int, int, int, str]], last: tuple[str, int]
) -> None:
    script = _split(text, dialect)
    assert _errors(script) == errors
    assert _kinds(script)[-1] == last


LEGITIMATE = {
    "postgres": [
        "CREATE EXTENSION IF NOT EXISTS ltree",
        "CREATE POLICY own_rides ON rides USING (courier = current_user)",
        "ALTER DEFAULT PRIVILEGES IN SCHEMA dispatch GRANT SELECT ON TABLES TO planner",
        "CREATE TEXT SEARCH CONFIGURATION dispatch_search (COPY = english)",
        "CREATE EVENT TRIGGER audit_ddl ON ddl_command_end EXECUTE FUNCTION audit()",
        "CREATE FOREIGN TABLE archive_rides (id int) SERVER archive",
        "ALTER SEQUENCE rides_id_seq RESTART WITH 10",
        "CREATE AGGREGATE total_km (float8) (sfunc = float8pl, stype = float8)",
        "CREATE OR REPLACE RULE no_delete AS ON DELETE TO rides DO INSTEAD NOTHING",
        "DROP OWNED BY planner",
        "CREATE PUBLICATION rides_pub FOR TABLE rides",
        "CREATE STATISTICS ride_stats ON depot, city FROM rides",
        "ALTER SYSTEM SET work_mem = '64MB'",
        "CREATE ACCESS METHOD heap2 TYPE TABLE HANDLER heap_tableam_handler",
        "CREATE CAST (text AS depot_code) WITH INOUT",
        "CREATE PROPERTY GRAPH rides_graph VERTEX TABLES (depots)",
        "CREATE TRUSTED LANGUAGE plsample HANDLER sample_handler",
    ],
    "mysql": [
        "CREATE EVENT purge_manifests ON SCHEDULE EVERY 1 DAY DO DELETE FROM manifests",
        "CREATE SPATIAL INDEX harbour_area ON harbours (area)",
        "CREATE FULLTEXT INDEX notice_text ON notices (body)",
        "ALTER INSTANCE ROTATE INNODB MASTER KEY",
        "CREATE LOGFILE GROUP ferry_log ADD UNDOFILE 'ferry.dat'",
        "CREATE ROLE purser",
        "CREATE RESOURCE GROUP batch TYPE = USER",
        "ALTER IGNORE TABLE sailings ADD UNIQUE (code)",
        "ALTER TABLESPACE ferry_space RENAME TO fleet_space",
    ],
    "sqlite": [
        "CREATE TEMP TRIGGER lot_added AFTER INSERT ON lots BEGIN SELECT 1; END",
        "CREATE TRIGGER IF NOT EXISTS lot_gone AFTER DELETE ON seeds BEGIN DELETE FROM lots; END",
    ],
    "tsql": [
        "CREATE LOGIN purser WITH PASSWORD = 'harbour'",
        "CREATE SYNONYM crossings FOR dbo.sailings",
        "CREATE PARTITION FUNCTION by_year (int) AS RANGE LEFT FOR VALUES (2020)",
        "CREATE XML SCHEMA COLLECTION manifests AS N'<x/>'",
        "ALTER AUTHORIZATION ON SCHEMA::ferry TO purser",
        "CREATE PRIMARY XML INDEX manifest_xml ON manifests (doc)",
        "CREATE FULLTEXT CATALOG notices",
        "CREATE STATISTICS port_stats ON sailings (port)",
        "CREATE SPATIAL INDEX port_area ON ports (location)",
        "CREATE DEFAULT zero_tonnage AS 0",
        "CREATE APPLICATION ROLE booking WITH PASSWORD = 'harbour'",
        "ALTER DATABASE SCOPED CONFIGURATION SET MAXDOP = 1",
        "CREATE QUEUE boarding_queue",
    ],
}


@pytest.mark.parametrize(
    ("dialect", "statement"),
    [(dialect, statement) for dialect, statements in LEGITIMATE.items() for statement in statements],
)
def test_kinds_the_dialect_knows_but_sqlglot_keeps_as_commands_are_no_error(dialect: str, statement: str) -> None:
    script = _split(statement + ";\n", dialect)
    assert [s.kind for s in script.statements + script.skipped] == ["command"]
    assert isinstance(script.skipped[0].expression, exp.Command)  # the check did look at it
    assert script.findings == []
