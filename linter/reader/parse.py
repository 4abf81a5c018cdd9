"""The tokens of one statement -> classified ``Statement`` objects: ``parse_statements``.

Each statement is parsed alone from its tokens, so one bad statement never hides the next ones. A
failure becomes the statement's ``problem``, a ``syntax-error`` at the token sqlglot stopped at.

>>> from linter.reader.dialects import get_dialect
>>> from linter.reader.line_index import LineIndex
>>> from linter.reader.read_state import ReadState
>>> text = "CREATE TABLE depot (city text) CREATE VIEW v AS SELECT 1"
>>> state = ReadState(text, get_dialect("postgres"), LineIndex("db/001.sql", text))
>>> [(s.kind, s.text) for s in parse_statements(state, state.dialect.tokenize(text), None, False)]
[('ast', 'CREATE TABLE depot (city text)'), ('ast', 'CREATE VIEW v AS SELECT 1')]
>>> state.findings[0].message
"missing ';' before this CREATE VIEW: read as the start of a new statement"
"""
from __future__ import annotations

import re
from collections.abc import Sequence

from sqlglot import exp
from sqlglot.dialects.tsql import TSQL
from sqlglot.errors import ParseError
from sqlglot.tokens import Token, TokenType

from linter.model import Finding
from linter.reader.key_decorations import without_key_decorations
from linter.reader.kinds import cannot_change_tables, describe, is_fragment, opaque_ddl
from linter.reader.nesting import nesting
from linter.reader.object_kinds import unknown_object_kind
from linter.reader.read_state import ReadState
from linter.reader.script import Statement
from linter.reader.slices import cut_at_semicolons, restart_points
from linter.reader.tokens import word

__all__ = ["parse_statements"]

_CLASS_NAME = re.compile(r"<class '(?:[\w.]*\.)?(\w+)'>")


def parse_statements(
    state: ReadState, tokens: list[Token], terminator: Token | None, whole: bool
) -> list[Statement]:
    """The statement(s) in ``tokens``: one, or several when a ``;`` was missing between them.

    ``whole`` tokens were sent as one statement by the client (mysql DELIMITER): never re-cut.
    """
    if isinstance(state.dialect, TSQL) and not whole:  # T-SQL needs no ';' between statements
        points = restart_points(tokens)
        if points:
            return _pieces(state, tokens, points, terminator, warn=False)
    statements = _parse_all(state, tokens, terminator)
    if statements[0].kind == "error" and word(tokens[0]) == "DROP":
        statements = _each_dropped(state, tokens, terminator) or statements
    if not whole and len(statements) == 1 and statements[0].kind in ("error", "command", "opaque"):
        points = restart_points(tokens)
        if points:
            return _pieces(state, tokens, points, terminator, warn=True)
    return statements


def _each_dropped(state: ReadState, tokens: list[Token], terminator: Token | None) -> list[Statement]:
    """``DROP INDEX a, b CASCADE`` as one DROP per object, which sqlglot reads ([] if not)."""
    levels, _ = nesting(tokens)
    commas = [i for i, t in enumerate(tokens) if t.token_type == TokenType.COMMA and levels[i][0] == 0]
    if not commas:
        return []
    head_end = 2
    while head_end < commas[0] and word(tokens[head_end]) in ("IF", "EXISTS", "CONCURRENTLY"):
        head_end += 1
    head, tail = tokens[:head_end], []
    while len(tokens) - len(tail) - 1 > commas[-1] + 1 and word(tokens[-len(tail) - 1]) in (
        "CASCADE", "RESTRICT"
    ):
        tail.insert(0, tokens[-len(tail) - 1])
    bounds = [head_end - 1, *commas, len(tokens) - len(tail)]
    start, stop = tokens[0].start, tokens[-1].end + 1
    pieces = []
    for a, b in zip(bounds, bounds[1:]):
        statement = _parse(state, head + tokens[a + 1 : b] + tail, terminator)
        if statement.kind != "ast":
            return []
        # Each piece keeps the text and span of the statement as written.
        statement.text, statement.offset = state.text[start:stop], start
        statement.span = state.lines.span(start, stop)
        pieces.append(statement)
    return pieces


def _parse_all(state: ReadState, tokens: list[Token], terminator: Token | None) -> list[Statement]:
    """Parse tokens meant as one statement; cut them at every ``;`` if they hold several."""
    statement = _parse(state, tokens, terminator)
    if statement.kind != "merged":
        return [statement]
    return [_parse(state, piece, end) for piece, end in cut_at_semicolons(tokens)]


def _pieces(
    state: ReadState, tokens: list[Token], points: list[int], terminator: Token | None, warn: bool
) -> list[Statement]:
    """Parse each piece between restart points; warn about the missing ``;``."""
    bounds = [0, *points, len(tokens)]
    result = []
    for n, (a, b) in enumerate(zip(bounds, bounds[1:])):
        if warn and a:
            token = tokens[a]
            state.finding(
                "syntax-error", "warning", token.start, token.end + 1,
                f"missing ';' before this {describe(tokens[a:])}: read as the start of a new statement",
            )
        last = n == len(bounds) - 2
        result.extend(_parse_all(state, tokens[a:b], terminator if last else None))
    return result


def _parse(state: ReadState, tokens: list[Token], terminator: Token | None) -> Statement:
    """Parse tokens that hold one statement; a failure is kept as the statement's ``problem``."""
    start, stop = tokens[0].start, tokens[-1].end + 1
    end = terminator.end + 1 if terminator is not None else stop
    statement = Statement(
        None, state.text[start:stop], state.lines.span(start, stop), start, (), False,
        kind="error", end=end, lines=state.lines,
    )
    try:
        parsed = [
            e for e in state.parser.parse(tokens, state.text)
            if e is not None and not isinstance(e, exp.Semicolon)
        ]
    except ParseError as error:
        retry = without_key_decorations(tokens)
        if retry is not None:
            recovered = _parse(state, retry, terminator)
            if recovered.kind != "error":
                return recovered
        statement.problem = _problem(state, statement, tokens, error)
        if cannot_change_tables(tokens):
            statement.kind = "unparsed"
            statement.problem.severity = "note"
            statement.problem.message += "; skipped, as it cannot change a table or key"
        return statement
    except RecursionError:
        message = f"{describe(tokens)} statement is nested too deeply to read"
        statement.problem = Finding("syntax-error", "error", statement.span, message)
        return statement
    except Exception as error:  # sqlglot itself failed: report, never crash
        message = f"sqlglot could not read this {describe(tokens)} statement ({error!s:.80})"
        statement.problem = Finding("syntax-error", "error", statement.span, message)
        return statement
    _classify(state, statement, parsed, tokens)
    return statement


def _classify(
    state: ReadState, statement: Statement, parsed: list[exp.Expression], tokens: Sequence[Token]
) -> None:
    """Set the statement's expression and kind from what sqlglot parsed (see ``Statement``).

    A command whose CREATE/ALTER/DROP names no object kind the dialect knows is an error there.
    """
    if not parsed:
        statement.kind = "command"
        return
    expression = parsed[0]
    if isinstance(expression, exp.Command):
        statement.problem = unknown_object_kind(tokens, state.dialect, state.lines)
        if statement.problem is not None:
            return  # still kind "error", without an expression
    statement.expression = expression
    if len(parsed) > 1 and not isinstance(expression, exp.Command):
        statement.kind = "merged"  # a BEGIN ... END guess joined statements: the caller cuts
    elif len(parsed) > 1 or isinstance(expression, exp.Command):
        statement.opaque = opaque_ddl(tokens)
        statement.kind = "opaque" if statement.opaque else "command"
    elif is_fragment(expression):
        statement.kind = "fragment"
    else:
        statement.kind = "ast"


def _clean_message(error: ParseError) -> tuple[str, str]:
    """(sqlglot's description without Python class names, the text it points at)."""
    first = error.errors[0] if error.errors else {}
    description = str(first.get("description") or str(error).split("\n")[0])
    description = _CLASS_NAME.sub(lambda m: m.group(1), description).strip().rstrip(".")
    return re.sub(r"\s+", " ", description), str(first.get("highlight") or "")


def _problem(state: ReadState, statement: Statement, tokens: Sequence[Token], error: ParseError) -> Finding:
    """A ``syntax-error`` at the token sqlglot stopped at, with its message."""
    lines = state.lines
    description, highlight = _clean_message(error)
    first = error.errors[0] if error.errors else {}
    start, stop = statement.offset, statement.offset + len(statement.text)
    if first.get("line") and first.get("col") and highlight:
        last = lines.offset(int(first["line"]), int(first["col"]))
        begin = last - len(highlight) + 1
        if statement.offset <= begin <= last < stop and state.text[begin : last + 1] == highlight:
            start, stop = begin, last + 1
    near = f" near '{highlight[:40]}'" if highlight else ""
    where = ""
    if lines.position(start)[0] != statement.span.line:
        where = f" (statement starts on line {statement.span.line})"
    message = f"cannot parse {describe(tokens)} statement: {description}{near}{where}"
    return Finding("syntax-error", "error", lines.span(start, stop), message)
