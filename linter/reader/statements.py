"""One SQL file -> statements with exact source spans and the comments around them: ``split_file``.

sqlglot's tokenizer reads the whole file once (``tokens.tokenize``); the file is cut into the
batches its client tool would send (``batches``: T-SQL ``GO``, SQL*Plus ``/``, mysql
``DELIMITER``, psql ``\\`` meta-commands), each batch at top-level ``;`` tokens (``slices``), and
each statement is parsed alone from its tokens (``parse``), so one bad statement never hides the
next ones. Token offsets are file offsets: an ``Identifier``'s ``meta`` start/end index
``source.text``. The names other modules use are importable from here.

>>> from linter.reader.sources import Source
>>> text = "-- depots\\nCREATE TABLE depot (city text);\\nEND;"
>>> script = split_file(Source("db/001.sql", text), "postgres")
>>> [(s.expression.key, s.span.line, s.text) for s in script.statements]
[('create', 2, 'CREATE TABLE depot (city text)'), ('commit', 3, 'END')]
>>> script.statements[0].comments[0].text, script.statements[0].comments[0].span.line
(' depots', 1)
"""
from __future__ import annotations

import bisect
import logging
from collections.abc import Iterator
from contextlib import contextmanager

from sqlglot.dialects.oracle import Oracle

from linter.reader.batches import client_batches
from linter.reader.dialects import UnknownDialectError, get_dialect
from linter.reader.line_index import LineIndex
from linter.reader.parse import parse_statements
from linter.reader.read_state import ReadState
from linter.reader.script import Comment, Script, Statement
from linter.reader.slices import statement_slices
from linter.reader.sources import Source

__all__ = [
    "Comment",
    "LineIndex",
    "Script",
    "Statement",
    "UnknownDialectError",
    "get_dialect",
    "split_file",
]


def split_file(source: Source, dialect: str | None) -> Script:
    """Read the statements of one file in the given sqlglot dialect.

    Raises ``UnknownDialectError`` for a dialect sqlglot does not know; every problem in the file
    itself becomes a finding (``syntax-error``) and reading goes on with the next statement.
    """
    sqlglot_dialect = get_dialect(dialect)
    script = Script(source.path, findings=list(source.problems))
    if source.skipped or not source.text:
        return script
    lines = LineIndex(source.path, source.text)
    everything: list[Statement] = []
    oracle = isinstance(sqlglot_dialect, Oracle)
    with _quiet_sqlglot():
        state = ReadState(source.text, sqlglot_dialect, lines)
        for batch in client_batches(state):
            for tokens, terminator in statement_slices(batch.tokens, batch.whole, oracle):
                everything.extend(parse_statements(state, tokens, terminator, batch.whole))
    script.trailing_comments = _attach_comments(everything, state.comments, lines)
    for statement in everything:
        replayed = statement.kind in ("ast", "opaque", "error")
        (script.statements if replayed else script.skipped).append(statement)
    problems = [s.problem for s in everything if s.problem is not None]
    findings = sorted(state.findings + problems, key=lambda f: (f.span.line, f.span.column))
    script.findings.extend(findings)
    return script


@contextmanager
def _quiet_sqlglot() -> Iterator[None]:
    """Silence sqlglot's 'falling back to Command' warnings: the reader reports those itself."""
    logger = logging.getLogger("sqlglot")
    level = logger.level
    logger.setLevel(logging.ERROR)
    try:
        yield
    finally:
        logger.setLevel(level)


def _attach_comments(
    statements: list[Statement], comments: list[Comment], lines: LineIndex
) -> tuple[Comment, ...]:
    """Give each comment to the statement it is in or above; return those after the last one.

    A comment that starts on the line where a statement ends (after its ``;``) belongs to that
    statement, unless the next statement starts on the same line as the comment ends.
    """
    owned: list[list[Comment]] = [[] for _ in statements]
    ends = [s.end for s in statements]
    trailing: list[Comment] = []
    for comment in sorted(comments, key=lambda c: c.start):
        k = bisect.bisect_right(ends, comment.start)
        inside = k < len(statements) and comment.start >= statements[k].offset
        if k > 0 and not inside:
            before = statements[k - 1]
            end_line = lines.position(before.end - 1)[0]
            next_line = statements[k].span.line if k < len(statements) else -1
            if comment.span.line == end_line and comment.span.end_line != next_line:
                owned[k - 1].append(comment)
                continue
        if k < len(statements):
            owned[k].append(comment)
        else:
            trailing.append(comment)
    for statement, mine in zip(statements, owned):
        statement.comments = tuple(mine)
    return tuple(trailing)
