"""Annotation comments: the grammar, name folding per dialect, errors at their own line."""
from __future__ import annotations

import pytest

from linter.model import Allow, Finding, Span
from linter.reader.annotations import (
    FdAnnotation,
    SplitFromAnnotation,
    parse_annotation,
    parse_annotations,
)
from linter.reader.sources import Source
from linter.reader.statements import Comment, split_file


def _line_comment(text: str, line: int = 7) -> Comment:
    """A ``--`` comment starting at column 1 of ``line``."""
    return Comment(text, Span("db/001.sql", line, 1, line, 3 + len(text)))


def _error(text: str, dialect: str = "postgres") -> str:
    found = parse_annotation(_line_comment(text), dialect)
    assert isinstance(found, Finding) and found.rule == "annotation-error" and found.severity == "error"
    assert found.span.line == 7
    return found.message


def test_fd_without_and_with_a_table() -> None:
    plain = parse_annotation(_line_comment(" normguard: fd depot, shift_day -> rider_id"), "postgres")
    assert plain == FdAnnotation(
        None, ("depot", "shift_day"), ("rider_id",), Span("db/001.sql", 7, 4, 7, 46),
        None, ("depot", "shift_day"), ("rider_id",),
    )
    named = parse_annotation(_line_comment(" normguard: fd couriers: depot -> city"), "postgres")
    assert isinstance(named, FdAnnotation) and named.table == "couriers" and named.lhs == ("depot",)


@pytest.mark.parametrize(
    ("dialect", "text", "table", "lhs"),
    [
        ("postgres", 'fd Billing."Couriers": Depot, "Shift" -> b', "billing.Couriers", ("depot", "Shift")),
        ("postgres", "fd public.couriers: a -> b", "couriers", ("a",)),  # default schema dropped
        ("mysql", "fd `Ferry Trips`: `Vessel` -> b", "Ferry Trips", ("vessel",)),  # MySQL columns ignore case
        ("tsql", "fd [dbo].[Vessels]: [IMO] -> b", "vessels", ("imo",)),
        ("sqlite", 'fd "Lots": Genus -> b', "lots", ("genus",)),  # SQLite names ignore case, quoted too
        ("postgres", "fd lots: date, key -> b", "lots", ("date", "key")),  # keywords as column names
    ],
)
def test_names_fold_as_the_dialect_folds_them(
    dialect: str, text: str, table: str, lhs: tuple[str, ...]
) -> None:
    found = parse_annotation(_line_comment(" normguard: " + text), dialect)
    assert isinstance(found, FdAnnotation)
    assert (found.table, found.lhs, found.rhs) == (table, lhs, ("b",))


def test_written_names_keep_their_quotes() -> None:
    found = parse_annotation(_line_comment(' normguard: fd "Lots": "Genus" -> family'), "postgres")
    assert found.table_written == '"Lots"' and found.lhs_written == ('"Genus"',)


def test_allow_with_reasons_and_split_from() -> None:
    text = " normguard: allow missing-key, transitive-dependency: the vault list is fixed"
    allow = parse_annotation(_line_comment(text), "postgres")
    assert allow == Allow(
        ("missing-key", "transitive-dependency"), "the vault list is fixed", allow.span
    )
    split = parse_annotation(_line_comment(" normguard: split-from public.lots"), "postgres")
    assert split == SplitFromAnnotation("lots", split.span, "public.lots")


def test_ordinary_comments_are_none() -> None:
    for text in (" depots hold bikes", " normguards are people", "", " see normguard: docs", "---- x ----"):
        assert parse_annotation(_line_comment(text), "postgres") is None


@pytest.mark.parametrize(
    ("text", "expected"),
    [
        (" normguard: fd a ->", "the right side of '->' is empty"),
        (" normguard: fd -> b", "the left side of '->' is empty"),
        (" normguard: fd a, b", "has no '->'"),
        (" normguard: fd a -> b -> c", "more than one '->'"),
        (" normguard: fd a b -> c", "expected ',' between column names"),
        (" normguard: fd a, -> c", "missing after the last ','"),
        (" normguard: fd 3 -> c", "'3' is not a column name"),
        (" normguard: fd t: u: a -> c", "more than one ':'"),
        (" normguard: fd : a -> c", "the table name is missing"),
        (" normguard: fd 'a' -> c", "is a string in this dialect"),
        (' normguard: fd "a -> c', "unterminated quoted name"),
        (" normguard: fdd a -> b", "unknown annotation 'fdd': expected one of fd, allow, split-from"),
        (" normguard: FD a -> b", "unknown annotation 'FD'"),
        (" normguard:", "empty annotation"),
        (" normguard: allow missing-key", "allow annotation needs a reason"),
        (" normguard: allow missing-key:   ", "allow annotation needs a reason"),
        (" normguard: allow : because", "names no rule"),
        (" normguard: allow Missing_Key: because", "'Missing_Key' is not a rule id"),
        (" normguard: allow a,, b: because", "is not a rule id"),
        (" normguard: split-from", "name the original table"),
        (" normguard: split-from a b", "is not a table name"),
        (" normguard fd a -> b", "annotations start with 'normguard:'"),
        (" NormGuard: fd a -> b", "annotations start with 'normguard:'"),
        (" normguard : fd a -> b", "annotations start with 'normguard:'"),
    ],
)
def test_malformed_annotations_say_what_was_expected(text: str, expected: str) -> None:
    assert expected in _error(text)


def test_a_block_comment_holds_one_annotation_per_line_each_at_its_line() -> None:
    text = (
        "CREATE TABLE lots (\n"
        "    lot_id int PRIMARY KEY, genus text, family text, vault text, vault_city text\n"
        ");\n"
        "/* Seed lots.\n"
        " * normguard: fd genus -> family\n"
        " * normguard: allow transitive-dependency: the vault list is fixed\n"
        " * normguard fd vault -> vault_city\n"
        " */\n"
    )
    script = split_file(Source("db/001_lots.sql", text), "postgres")
    (comment,) = script.trailing_comments
    found = parse_annotations(comment, "postgres")
    assert [type(f).__name__ for f in found] == ["FdAnnotation", "Allow", "Finding"]
    assert [(f.span.line, f.span.column) for f in found] == [(5, 4), (6, 4), (7, 4)]
    fd_span = found[0].span
    assert text.splitlines()[4][fd_span.column - 1 : fd_span.end_column - 1] == "normguard: fd genus -> family"
    assert parse_annotation(comment, "postgres") == found[0]


def test_spans_of_annotations_in_real_comments() -> None:
    text = "CREATE TABLE t (a int, b int); /* normguard: fd a -> b */\n  # normguard: allow x: y\n"
    script = split_file(Source("db/001.sql", text), "mysql")
    (first,), (second,) = script.statements[0].comments, script.trailing_comments
    for comment, expected in ((first, "normguard: fd a -> b"), (second, "normguard: allow x: y")):
        (found,) = parse_annotations(comment, "mysql")
        line = text.splitlines()[found.span.line - 1]
        assert line[found.span.column - 1 : found.span.end_column - 1] == expected


def test_trailing_sql_comment_after_an_annotation_is_ignored() -> None:
    found = parse_annotation(_line_comment(" normguard: fd a -> b -- because riders move"), "postgres")
    assert isinstance(found, FdAnnotation) and found.rhs == ("b",)
