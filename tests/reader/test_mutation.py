"""Mutated SQL never crashes the reader, and every problem it reports points inside the file.

The seeds are the reader fixtures; the mutations delete, duplicate or swap whitespace-separated
words, insert random characters or bytes, and truncate (common practice for robustness tests, no
source).
"""
from __future__ import annotations

import re

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from linter.model import Finding
from linter.reader.annotations import parse_annotations
from linter.reader.sources import Source, read_source
from linter.reader.statements import split_file

from ..locations import ROOT

FIXTURES = ROOT / "fixtures" / "reader"
SEEDS = [
    (dialect, path.read_text(encoding="utf-8"))
    for dialect in ("postgres", "mysql", "sqlite", "tsql")
    for path in sorted((FIXTURES / dialect).rglob("*.sql"))
] + [("oracle", "CREATE TABLE t (a NUMBER);\nBEGIN\n  NULL;\nEND;\n/\nSET DEFINE OFF\n")]
NOISE = st.sampled_from(
    list("';\"`$()[]/*-#\\\n\r\t,.:")
    + ["$$", "/*", "*/", "--", "GO", "\nGO\n", "\n/\n", "DELIMITER //\n", "BEGIN", "END", "\x00", "\ufeff", "\udcff"]
)


@st.composite
def mutated(draw: st.DrawFn) -> tuple[str, str]:
    """A seed file with a few random edits."""
    dialect, text = draw(st.sampled_from(SEEDS))
    words = text.split(" ")
    for _ in range(draw(st.integers(1, 6))):
        if not words:
            break
        i = draw(st.integers(0, len(words) - 1))
        action = draw(st.sampled_from(["delete", "duplicate", "swap", "insert", "random"]))
        if action == "delete":
            del words[i]
        elif action == "duplicate":
            words.insert(i, words[i])
        elif action == "swap" and i + 1 < len(words):
            words[i], words[i + 1] = words[i + 1], words[i]
        elif action == "insert":
            words.insert(i, draw(NOISE))
        else:
            words.insert(i, draw(st.text(max_size=8)))
    text = " ".join(words)
    if draw(st.booleans()):
        text = text[: draw(st.integers(0, len(text)))]
    return dialect, text


def _inside(finding: Finding, text: str) -> bool:
    lines = re.split(r"\r\n?|\n", text)  # the line breaks sqlglot and the reader count
    span = finding.span
    if not (1 <= span.line <= span.end_line <= len(lines) and span.column >= 1):
        return False
    first, last = lines[span.line - 1], lines[span.end_line - 1]
    return span.column <= len(first) + 1 and span.end_column <= len(last) + 1


def _check(dialect: str, text: str) -> None:
    script = split_file(Source("db/001.sql", text), dialect)
    for finding in script.findings:
        assert isinstance(finding, Finding) and finding.rule in ("syntax-error", "file-error")
        assert _inside(finding, text), (finding, text)
    everything = [*script.statements, *script.skipped]
    for statement in everything:
        assert text[statement.offset : statement.offset + len(statement.text)] == statement.text
        for comment in statement.comments:
            for found in parse_annotations(comment, dialect):
                assert not isinstance(found, Finding) or _inside(found, text)
        if statement.expression is not None:
            for node in statement.expression.walk():
                statement.span_of(node)
    for comment in script.trailing_comments:
        parse_annotations(comment, dialect)


@settings(max_examples=300, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(mutated())
def test_mutated_sql_never_escapes_an_exception(case: tuple[str, str]) -> None:
    _check(*case)


@settings(max_examples=100, deadline=None)
@given(st.binary(max_size=300), st.sampled_from(["postgres", "mysql", "sqlite", "tsql", "oracle", ""]))
def test_random_bytes_read_as_a_file(tmp_path_factory, data: bytes, dialect: str) -> None:
    path = tmp_path_factory.mktemp("bytes") / "random.sql"
    path.write_bytes(data)
    source = read_source(str(path))
    assert all(p.rule == "file-error" for p in source.problems)
    _check(dialect, source.text)
