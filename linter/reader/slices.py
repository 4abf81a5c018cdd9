"""A batch of tokens -> the token slices of its statements: ``statement_slices``.

Statements end at top-level ``;`` tokens, so strings, dollar-quoted bodies and ``BEGIN ... END``
blocks stay whole; ``restart_points`` finds DDL that starts after a missing ``;``.

>>> from linter.reader.dialects import get_dialect
>>> tokens = get_dialect("sqlite").tokenize(
...     "CREATE TRIGGER t AFTER INSERT ON a BEGIN DELETE FROM b; END; DROP TABLE c")
>>> [(piece[0].text, len(piece), end and end.text) for piece, end in statement_slices(tokens, False, False)]
[('CREATE', 13, ';'), ('DROP', 3, None)]
>>> restart_points(get_dialect("postgres").tokenize("CREATE TABLE a (x int) CREATE INDEX i ON a (x)"))
[7]
"""
from __future__ import annotations

from collections.abc import Iterator, Sequence

from sqlglot.tokens import Token, TokenType

from linter.reader.kinds import names_object, object_word
from linter.reader.nesting import nesting
from linter.reader.tokens import token_at, word

__all__ = ["cut_at_semicolons", "restart_points", "statement_slices"]

_PLSQL_OBJECTS = frozenset({"PROCEDURE", "FUNCTION", "PACKAGE", "TRIGGER", "TYPE", "LIBRARY"})
_NOT_BEFORE_STATEMENT = frozenset({"GRANT", "REVOKE", "DENY", ",", "TO", "ON"})


def cut_at_semicolons(tokens: list[Token]) -> Iterator[tuple[list[Token], Token | None]]:
    """Cut at every ``;`` token, blocks or not."""
    start = 0
    for k, token in enumerate(tokens):
        if token.token_type == TokenType.SEMICOLON:
            if k > start:
                yield tokens[start:k], token
            start = k + 1
    if start < len(tokens):
        yield tokens[start:], None


def statement_slices(
    tokens: list[Token], whole: bool, oracle: bool
) -> Iterator[tuple[list[Token], Token | None]]:
    """Cut a batch at top-level ``;`` tokens, keeping ``BEGIN ... END`` bodies whole.

    Yields (tokens without the ``;``, the ``;`` token or None); a ``whole`` batch is one statement.
    In Oracle a PL/SQL block runs to the end of its batch, as in SQL*Plus; a block that never
    closes is cut at every ``;``.
    """
    if whole:
        yield tokens, None
        return
    if not oracle and not any(token.token_type == TokenType.BEGIN for token in tokens):
        yield from cut_at_semicolons(tokens)
        return
    levels, open_blocks = nesting(tokens)
    begin = 0
    for i, token in enumerate(tokens):
        if i == begin and oracle and _is_plsql_head(tokens, i):
            yield tokens[i:], None
            return
        if token.token_type == TokenType.SEMICOLON and levels[i][1] == 0:
            if i > begin:
                yield tokens[begin:i], token
            begin = i + 1
    if begin < len(tokens):
        rest = tokens[begin:]
        yield from cut_at_semicolons(rest) if open_blocks else [(rest, None)]


def _is_plsql_head(tokens: Sequence[Token], i: int) -> bool:
    """True at ``DECLARE``, ``BEGIN`` or ``CREATE [OR REPLACE] PROCEDURE|FUNCTION|PACKAGE|...``."""
    head = word(tokens[i])
    if head in ("DECLARE", "BEGIN"):
        return True
    return head == "CREATE" and object_word(tokens, i) in _PLSQL_OBJECTS


def restart_points(tokens: Sequence[Token]) -> list[int]:
    """Indexes where a new DDL statement starts inside these tokens (a missing ``;``)."""
    points = []
    head = word(tokens[0])
    levels, _ = nesting(tokens)
    for i in range(1, len(tokens)):
        if levels[i] != (0, 0) or word(tokens[i - 1]) in _NOT_BEFORE_STATEMENT:
            continue
        current = word(tokens[i])
        if current == "CREATE" or (current in ("ALTER", "DROP") and head != "ALTER"):
            if names_object(tokens, i):
                points.append(i)
        elif current == "ALTER" and word(token_at(tokens, i + 1)) in ("TABLE", "VIEW", "SEQUENCE", "TYPE"):
            points.append(i)
    return points
