"""Statements with exact spans: cutting, client batch separators, comments, parse failures.

Client separators follow each tool's manual (from memory): sqlcmd cuts batches at a line holding
only ``GO`` [count]; SQL*Plus runs the buffer at a line holding only ``/`` and reads PL/SQL blocks up
to it; the mysql client's ``DELIMITER xx`` ends statements at ``xx``; psql runs ``\\`` meta-commands
to the end of their line.
"""
from __future__ import annotations

import logging

import pytest
from sqlglot import exp

from linter.reader.sources import Source, read_source
from linter.reader.statements import Script, UnknownDialectError, split_file

from ..locations import ROOT, SHARED

FIXTURES = ROOT / "fixtures" / "reader"


def _split(text: str, dialect: str, path: str = "db/001.sql") -> Script:
    return split_file(Source(path, text), dialect)


def _fixture(dialect: str, name: str) -> tuple[str, Script]:
    source = read_source(str(FIXTURES / dialect / "statement_edges" / name))
    return source.text, split_file(source, dialect)


def _slice(text: str, span) -> str:
    """The text a span covers (single-line spans only)."""
    lines = text.splitlines(keepends=True)
    assert span.line == span.end_line
    return lines[span.line - 1][span.column - 1 : span.end_column - 1]


def _kinds(script: Script) -> list[tuple[str, int]]:
    everything = sorted([*script.statements, *script.skipped], key=lambda s: s.offset)
    return [(s.kind, s.span.line) for s in everything]


def test_statement_text_offset_and_span_agree_with_the_file() -> None:
    text, script = _fixture("postgres", "001_couriers.sql")
    for statement in [*script.statements, *script.skipped]:
        assert text[statement.offset : statement.offset + len(statement.text)] == statement.text
        first_line = text.splitlines()[statement.span.line - 1]
        assert first_line[statement.span.column - 1 :].startswith(statement.text.splitlines()[0])
        last_line = text.splitlines()[statement.span.end_line - 1]
        assert last_line[: statement.span.end_column - 1].endswith(statement.text.splitlines()[-1])


def test_semicolons_in_strings_comments_and_dollar_bodies_do_not_cut() -> None:
    text, script = _fixture("postgres", "001_couriers.sql")
    assert _kinds(script) == [
        ("ast", 5),  # depots: ';' in a default string and in a comment
        ("command", 11),  # plpgsql function: ';' in a $body$ string
        ("ast", 18),
        ("error", 20),  # PostgreSQL 18 'CONSTRAINT name NOT NULL col', which sqlglot cannot read
        ("ast", 23),  # read on after the failure
        ("ast", 25),  # after a psql \c line
    ]
    assert script.statements[0].text.endswith("region text\n)")


def test_psql_meta_commands_are_not_sql() -> None:
    _, script = _fixture("postgres", "001_couriers.sql")
    assert not any("\\" in s.text for s in [*script.statements, *script.skipped])
    assert [f.rule for f in script.findings] == ["syntax-error"]


def test_parse_failure_is_reported_at_the_token_with_a_clean_message() -> None:
    text, script = _fixture("postgres", "001_couriers.sql")
    (finding,) = script.findings
    assert (finding.rule, finding.severity, finding.span.line) == ("syntax-error", "error", 20)
    assert _slice(text, finding.span) == "rider_id"
    assert finding.message == "cannot parse CREATE TABLE statement: Expecting ) near 'rider_id'"
    failed = script.statements[2]
    assert failed.expression is None and failed.problem is finding


def test_error_messages_carry_no_python_class_names() -> None:
    script = _split("CREATE TABLE t (id int, CONSTRAINT PRIMARY KEY);\nCREATE TABLE u (id int);", "postgres")
    (finding,) = script.findings
    assert "<class" not in finding.message and "sqlglot." not in finding.message
    assert "missing for Constraint" in finding.message
    assert [s.kind for s in script.statements] == ["error", "ast"]


def test_comments_have_exact_spans_and_belong_to_the_statement_they_are_in_or_above() -> None:
    text, script = _fixture("postgres", "001_couriers.sql")
    depots, function, riders = script.statements[0], script.skipped[0], script.statements[1]
    assert [c.text for c in depots.comments] == [
        " Bicycle courier company: depots, riders and the shifts they work.",
        " Depots are where the bikes sleep.\n   normguard: fd depots: city -> region ",
        " e.g. 'NORTH;1'",
    ]
    block = depots.comments[1]
    assert (block.span.line, block.span.column, block.span.end_line) == (3, 1, 4)
    assert text.splitlines()[3].endswith("*/") and block.span.end_column == len(text.splitlines()[3]) + 1
    inline = depots.comments[2]
    assert _slice(text, inline.span) == "-- e.g. 'NORTH;1'"
    assert function.comments == ()  # '--' inside the $body$ string is text, not a comment
    # A comment after the ';' on the statement's own line belongs to that statement.
    assert [c.text for c in riders.comments] == [" normguard: allow missing-key: demo"]


def test_nested_block_comments_in_postgres_and_the_file_trailer() -> None:
    _, script = _fixture("postgres", "001_couriers.sql")
    index = script.statements[3]
    assert [c.text for c in index.comments] == [" nested /* comments */ are fine in postgres "]
    assert [c.text for c in script.trailing_comments] == [" trailing note for the file"]
    assert script.trailing_comments[0].span.line == 26


def test_span_of_a_node_is_its_identifier_in_the_file() -> None:
    text, script = _fixture("postgres", "001_couriers.sql")
    depots = script.statements[0]
    city = next(c for c in depots.expression.find_all(exp.ColumnDef) if c.name == "city")
    assert (depots.span_of(city.this).line, _slice(text, depots.span_of(city.this))) == (7, "city")
    assert _slice(text, depots.span_of(city)) == "city text NOT NULL DEFAULT 'Utrecht; NL'"  # name to literal
    assert depots.span_of(depots.expression.this.this).line == 5  # the table name
    assert depots.span_of(exp.Star()) == depots.span  # no position under it: the statement's


def test_mysql_delimiter_blocks_end_at_the_custom_delimiter_only() -> None:
    text, script = _fixture("mysql", "V1__ferry_triggers.sql")
    assert _kinds(script) == [("ast", 2), ("command", 9), ("unparsed", 15), ("ast", 21)]
    trigger = script.skipped[0]
    assert trigger.text.endswith("END IF;\nEND")  # '$$' inside a string does not end it
    procedure = script.skipped[1]
    assert procedure.text.startswith("CREATE PROCEDURE count_ports") and procedure.text.endswith("END")
    (note,) = script.findings
    assert note.severity == "note" and "cannot change a table or key" in note.message
    assert [c.text for c in script.statements[0].comments] == [" Ferry line: crossings between ports."]
    crossings = script.statements[1].expression
    assert isinstance(crossings, exp.Create) and crossings.this.this.name == "crossings"


def test_sqlite_trigger_bodies_stay_whole_and_transactions_are_not_blocks() -> None:
    _, script = _fixture("sqlite", "0001_seedbank.sql")
    assert _kinds(script) == [
        ("ast", 2),  # BEGIN TRANSACTION
        ("ast", 3),
        ("ast", 4),  # columns named "begin" and "end"
        ("command", 11),  # the trigger with CASE ... END inside BEGIN ... END
        ("opaque", 16),  # WITHOUT ROWID: sqlglot keeps only a Command
        ("ast", 17),
    ]
    trigger = script.skipped[0]
    assert trigger.text.rstrip().endswith("END")
    germination = script.statements[3]
    assert germination.opaque and germination.text.startswith("CREATE TABLE germination")


def test_tsql_go_batches_and_statements_without_semicolons() -> None:
    text, script = _fixture("tsql", "001_ferry_batches.sql")
    assert _kinds(script) == [("ast", 2), ("ast", 7), ("ast", 13), ("ast", 15), ("command", 17)]
    vessels, captains = script.statements[1], script.statements[2]
    assert vessels.text.endswith("([vessel_id])\n)")
    assert captains.text.startswith("CREATE TABLE [dbo].[captains]")
    assert not script.findings  # T-SQL needs no ';' between statements: no warning
    assert isinstance(script.statements[0].expression, exp.IfBlock)


def test_go_inside_a_name_or_string_is_not_a_separator() -> None:
    script = _split("SELECT 'GO' AS go\nGO\nCREATE TABLE goes (go INT)\n", "tsql")
    assert [s.kind for s in script.statements] == ["ast", "ast"]


def test_oracle_slash_lines_and_sqlplus_commands() -> None:
    text = (
        "SET DEFINE OFF\n"
        "CONNECT ferries/secret\n"
        "CREATE TABLE ports (port_id NUMBER PRIMARY KEY);\n"
        "CREATE OR REPLACE TRIGGER ports_bi BEFORE INSERT ON ports FOR EACH ROW\n"
        "BEGIN\n  :NEW.port_id := 1;\nEND;\n"
        "/\n"
        "CREATE TABLE berths (berth_id NUMBER PRIMARY KEY, port_id NUMBER)\n"
        "/\n"
        "exit\n"
    )
    script = _split(text, "oracle")
    assert _kinds(script) == [("ast", 3), ("command", 4), ("ast", 9)]
    assert script.skipped[0].text.endswith("END;")  # the PL/SQL block runs to the '/' line
    assert not script.findings


def test_missing_semicolon_between_ddl_statements_is_reported_and_recovered() -> None:
    # As in synapse main/delta/54/account_validity_with_renewal.sql (../shared/corpus).
    text = (
        "CREATE INDEX riders_depot ON riders(depot_code)\n"
        "CREATE UNIQUE INDEX riders_phone ON riders(phone);\n"
    )
    script = _split(text, "postgres")
    assert [(s.kind, s.span.line) for s in script.statements] == [("ast", 1), ("ast", 2)]
    assert script.statements[1].expression.args.get("unique")
    (warning,) = script.findings
    assert (warning.severity, warning.span.line, warning.span.column) == ("warning", 2, 1)
    assert "missing ';'" in warning.message


def test_the_synapse_file_with_a_missing_semicolon() -> None:
    corpus = SHARED / "corpus" / "synapse"
    path = corpus / "synapse/storage/schema/main/delta/54/account_validity_with_renewal.sql"
    if not path.is_file():
        pytest.skip(f"{path} is missing: this check reads the shared corpus")
    script = split_file(read_source(str(path)), "postgres")
    kinds = [(s.expression.key, bool(s.expression.args.get("unique"))) for s in script.statements if s.expression]
    assert ("create", True) in kinds
    assert any("missing ';'" in f.message for f in script.findings)


def test_opaque_ddl_is_replayed_other_commands_and_fragments_are_skipped() -> None:
    # The Command fallbacks named in ../shared/corpus/PARSE_REPORT.md (section "Main failure patterns").
    script = _split(
        "ALTER TABLE riders OWNER TO app;\n"
        "ALTER TABLE riders RENAME CONSTRAINT a TO b;\n"
        "CREATE UNIQUE INDEX u ON riders (phone) NULLS NOT DISTINCT;\n"
        "ALTER TYPE mood OWNER TO app;\n",
        "postgres",
    )
    replayed = [(s.kind, s.opaque, s.span.line) for s in script.statements]
    assert replayed == [("opaque", True, 2), ("opaque", True, 3)]
    assert [(s.kind, s.span.line) for s in script.skipped] == [("command", 1), ("command", 4)]
    assert script.count("opaque") == 2 and script.count("command") == 2
    # CHECK rules added in a form the parser keeps as text change no key (lemmy's modlog migrations)
    checks = _split(
        "ALTER TABLE riders ADD CHECK ((kind = 'a' AND num_nonnulls (x, y) = 2) OR kind = 'b');\n"
        "ALTER TABLE riders ADD CONSTRAINT c CHECK (num_nonnulls (x, y) = 1), ALTER CONSTRAINT f NOT DEFERRABLE;\n"
        "ALTER TABLE riders DROP CONSTRAINT k, ALTER CONSTRAINT f NOT DEFERRABLE;\n",
        "postgres",
    )
    assert [(s.kind, s.span.line) for s in checks.statements] == [("opaque", 3)]
    assert [(s.kind, s.span.line) for s in checks.skipped] == [("command", 1), ("command", 2)]
    fragment = _split("CREATE TABLE t (id int);\nleftover;\n", "postgres")
    assert [s.kind for s in fragment.skipped] == ["fragment"] and fragment.count("ast") == 1


def test_multi_object_drop_is_read_one_object_at_a_time() -> None:
    script = _split("DROP INDEX IF EXISTS riders_a, riders_b CASCADE;", "postgres")
    drops = [s.expression for s in script.statements]
    assert [d.args["tables"][0].name for d in drops] == ["riders_a", "riders_b"]
    assert all(d.args.get("exists") and d.args.get("cascade") for d in drops)
    assert not script.findings


def test_unterminated_string_keeps_what_came_before() -> None:
    text = "CREATE TABLE depots (code text);\nINSERT INTO depots VALUES ('north);\nCREATE TABLE x (a int);\n"
    script = _split(text, "postgres")
    assert [s.expression.key for s in script.statements] == ["create"]
    (finding,) = script.findings
    assert (finding.rule, finding.span.line, finding.span.column) == ("syntax-error", 2, 28)
    assert "unterminated quoted text" in finding.message
    assert "1 line(s) after it were not read" in finding.message


def test_unclosed_block_comment_is_reported_at_its_opener() -> None:
    text = "CREATE TABLE depots (code text);\n/* forgot to close\nCREATE TABLE x (a int);\n"
    script = _split(text, "postgres")
    assert [s.kind for s in script.statements] == ["ast"]
    (finding,) = script.findings
    assert (finding.span.line, finding.span.column) == (2, 1) and "never closed" in finding.message


def test_crlf_lines_and_columns() -> None:
    text = "-- depots\r\nCREATE TABLE depots (\r\n  code text,\r\n  city text\r\n);\r\n"
    script = _split(text, "postgres")
    (statement,) = script.statements
    span = statement.span
    assert (span.line, span.column, span.end_line, span.end_column) == (2, 1, 5, 2)
    assert statement.comments[0].text == " depots" and statement.comments[0].span.end_column == 10
    city = [c for c in statement.expression.find_all(exp.ColumnDef)][1]
    assert (statement.span_of(city).line, statement.span_of(city).column) == (4, 3)


def test_mysql_hash_comments_and_default_dialect() -> None:
    script = _split("# ports\nCREATE TABLE ports (id int); # trailing\n", "mysql")
    assert [c.text for c in script.statements[0].comments] == [" ports", " trailing"]
    plain = _split("CREATE TABLE ports (id int);", "")
    assert plain.statements[0].kind == "ast"


def test_empty_and_comment_only_files() -> None:
    assert _split("", "postgres").statements == []
    script = _split("-- nothing here\n/* at all */\n", "postgres")
    assert script.statements == [] and [c.span.line for c in script.trailing_comments] == [1, 2]


def test_unknown_dialect_is_a_value_error_naming_the_known_ones() -> None:
    with pytest.raises(UnknownDialectError) as raised:
        _split("SELECT 1", "postgress")
    assert isinstance(raised.value, ValueError)
    assert "postgres" in str(raised.value) and "tsql" in str(raised.value)


def test_sqlglot_warnings_do_not_leak(caplog: pytest.LogCaptureFixture) -> None:
    with caplog.at_level(logging.WARNING):
        _split("CREATE FUNCTION f() RETURNS int AS $$ SELECT 1 $$ LANGUAGE sql;", "postgres")
    assert not [r for r in caplog.records if r.name.startswith("sqlglot")]


def test_psql_copy_data_rows_are_not_sql() -> None:
    text = (
        "CREATE TABLE depots (code text PRIMARY KEY, city text);\n"
        "COPY public.depots (code, city) FROM stdin;\n"
        "N1\tUtrecht's north\n"
        "-- not a comment; data\n"
        "\\.\n"
        "-- about riders\n"
        "CREATE TABLE riders (id int);\n"
    )
    script = _split(text, "postgres")
    read = [(s.expression.key, s.span.line) for s in script.statements]
    assert read == [("create", 1), ("copy", 2), ("create", 7)]
    assert not script.findings
    assert [c.text for c in script.statements[2].comments] == [" about riders"]


def test_tsql_block_then_create_without_go_keeps_the_table() -> None:
    # sqlglot's T-SQL tokenizer would read the text after END up to the next ';' as one string.
    text = (
        "IF OBJECT_ID('dbo.vessels') IS NOT NULL\nBEGIN\n  DROP TABLE dbo.vessels;\nEND\n"
        "CREATE TABLE dbo.vessels (id INT PRIMARY KEY);\n"
    )
    script = _split(text, "tsql")
    assert [(s.expression.key, s.span.line) for s in script.statements] == [("ifblock", 1), ("create", 5)]


def test_a_block_sqlglot_cannot_read_is_an_error_when_it_touches_tables() -> None:
    text = (
        "BEGIN TRY\n  CREATE TABLE vessels (id INT);\nEND TRY\n"
        "BEGIN CATCH\n  PRINT 'x';\nEND CATCH;\nCREATE TABLE ports (id INT);"
    )
    script = _split(text, "tsql")
    assert [(s.kind, s.span.line) for s in script.statements] == [("error", 1), ("ast", 7)]
    assert [f.severity for f in script.findings] == ["error"]


def test_a_column_called_delimiter_is_not_a_client_command() -> None:
    text = "CREATE TABLE exports (\n  id int,\ndelimiter char(1)\n);\nDELIMITER //\nCREATE TABLE b (x int)//\n"
    script = _split(text, "mysql")
    assert [(s.kind, s.span.line) for s in script.statements] == [("ast", 1), ("ast", 6)]
    assert script.statements[0].text.endswith("delimiter char(1)\n)")
