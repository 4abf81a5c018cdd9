"""A file -> the batches its dialect's client tool would send, tokenized: ``client_batches``.

T-SQL files are cut at ``GO`` lines (sqlcmd), Oracle ones at SQL*Plus lines (``/`` alone, client
commands), postgres ones at psql ``\\`` meta-commands and around ``COPY ... FROM stdin`` data, and
MySQL ones honour the mysql client's ``DELIMITER xx``: the text up to ``xx`` is one statement.

>>> from linter.reader.dialects import get_dialect
>>> from linter.reader.line_index import LineIndex
>>> from linter.reader.read_state import ReadState
>>> text = "CREATE TABLE depot (city text)\\nGO 2\\nSELECT 1"
>>> state = ReadState(text, get_dialect("tsql"), LineIndex("db/001.sql", text))
>>> [(batch.tokens[0].text, len(batch.tokens), batch.whole) for batch in client_batches(state)]
[('CREATE', 7, False), ('SELECT', 2, False)]
"""
from __future__ import annotations

import bisect
import re
from collections.abc import Callable, Sequence
from dataclasses import dataclass

from sqlglot.dialects.mysql import MySQL
from sqlglot.dialects.oracle import Oracle
from sqlglot.dialects.postgres import Postgres
from sqlglot.dialects.tsql import TSQL
from sqlglot.tokens import Token, TokenType

from linter.reader.read_state import ReadState
from linter.reader.tokens import QUOTED_TOKENS, token_at, tokenize, word

__all__ = ["Batch", "client_batches"]


@dataclass
class Batch:
    """Tokens sent together by a client tool; ``whole`` when they form one statement (DELIMITER)."""

    tokens: list[Token]
    whole: bool = False


# sqlcmd and SSMS cut batches at a line holding only GO (an optional count, a -- comment) without
# looking at SQL at all, and sqlglot's T-SQL tokenizer reads GO as a command swallowing the text up
# to the next ';', so these lines are found by line, as the client tool finds them.
_GO_LINE = re.compile(r"^[ \t]*GO(?:[ \t]+\d+)?[ \t]*(?:--[^\r\n]*)?\r?$", re.IGNORECASE | re.MULTILINE)
# SQL*Plus commands: a line of their own at a statement start, no ';' needed (SQL*Plus manual).
_SQLPLUS_COMMANDS = frozenset(
    {"CONNECT", "CONN", "DISCONNECT", "SPOOL", "PROMPT", "EXIT", "QUIT", "WHENEVER", "DEFINE",
     "UNDEFINE", "REM", "REMARK", "PAUSE", "ACCEPT", "SET", "SHOW", "COLUMN", "TTITLE", "BTITLE",
     "BREAK", "COMPUTE", "CLEAR", "VARIABLE", "HOST", "STORE", "TIMING"}
)
_SQL_AFTER_SET = frozenset({"TRANSACTION", "ROLE", "CONSTRAINT", "CONSTRAINTS"})
# A quick check before looking for psql meta-commands among the tokens.
_MAYBE_META_LINE = re.compile(r"^[ \t]*\\", re.MULTILINE)
# psql's COPY ... FROM stdin reads data rows up to a line holding only '\.': they are not SQL (the
# sqlglot tokenizer would choke on their quotes), so they are found by line, as psql finds them.
_COPY_FROM_STDIN = re.compile(r"\bCOPY\b[^;]*?\bFROM\s+STDIN\b[^;]*;[^\n]*\n", re.IGNORECASE)
_END_OF_DATA = re.compile(r"^\\\.[ \t]*\r?$", re.MULTILINE)

_Separator = Callable[[Sequence[Token], int, bool], int]


def client_batches(state: ReadState) -> list[Batch]:
    """Tokenize the file and cut it where the dialect's client tool would send a batch."""
    dialect = state.dialect
    if isinstance(dialect, TSQL):
        return _go_batches(state)
    if isinstance(dialect, Postgres) and _MAYBE_META_LINE.search(state.text):
        batches = []
        for start, end in _outside_copy_data(state.text):
            batches.extend(_cut_at_lines(tokenize(state, start, end), _psql_meta))
        return batches
    tokens = tokenize(state, 0, len(state.text))
    if isinstance(dialect, Oracle):
        return _cut_at_lines(tokens, _sqlplus_line)
    if isinstance(dialect, MySQL):
        return _mysql_batches(state, tokens)
    return [Batch(tokens)]


def _outside_copy_data(text: str) -> list[tuple[int, int]]:
    """The (start, end) regions of a psql script that are SQL, around COPY data rows."""
    regions, start = [], 0
    while True:
        copy = _COPY_FROM_STDIN.search(text, start)
        if copy is None:
            break
        finish = _END_OF_DATA.search(text, copy.end())
        regions.append((start, copy.end()))
        if finish is None:  # data to the end of the file
            return regions
        start = finish.end()
    regions.append((start, len(text)))
    return regions


def _rest_of_line(tokens: Sequence[Token], i: int) -> int:
    """How many tokens from ``i`` end on the line of tokens[i]; 0 unless tokens[i] starts its line."""
    line = tokens[i].line
    if i > 0 and tokens[i - 1].line == line:
        return 0
    width = 1
    while i + width < len(tokens) and tokens[i + width].line == line:
        width += 1
    return width


def _sqlplus_line(tokens: Sequence[Token], i: int, at_start: bool) -> int:
    """Tokens of a SQL*Plus line at ``i``: ``/`` alone (run the buffer) or a client command."""
    token = tokens[i]
    if token.token_type == TokenType.SLASH:
        return 1 if _rest_of_line(tokens, i) == 1 else 0
    head = word(token)
    if not at_start or not (head in _SQLPLUS_COMMANDS or head.startswith("@")):
        return 0
    if head == "SET" and word(token_at(tokens, i + 1)) in _SQL_AFTER_SET:
        return 0  # SQL, not SQL*Plus
    return _rest_of_line(tokens, i)


def _go_batches(state: ReadState) -> list[Batch]:
    """The T-SQL batches between ``GO`` lines, each tokenized alone."""
    batches, start = [], 0
    for line in _GO_LINE.finditer(state.text):
        batches.append(Batch(tokenize(state, start, line.start())))
        start = line.end()
    batches.append(Batch(tokenize(state, start, len(state.text))))
    return [batch for batch in batches if batch.tokens]


def _psql_meta(tokens: Sequence[Token], i: int, at_start: bool) -> int:
    """Tokens of a psql meta-command line (``\\c db``, ``\\set x 1``) at ``i``."""
    return _rest_of_line(tokens, i) if tokens[i].token_type == TokenType.BACKSLASH else 0


def _cut_at_lines(tokens: list[Token], separator: _Separator) -> list[Batch]:
    """Cut the tokens at client lines found by ``separator(tokens, i, at_statement_start) -> width``."""
    batches: list[Batch] = []
    current: list[Token] = []
    i = 0
    while i < len(tokens):
        at_start = not current or current[-1].token_type == TokenType.SEMICOLON
        width = separator(tokens, i, at_start)
        if width:
            batches.append(Batch(current))
            current = []
            i += width
        else:
            current.append(tokens[i])
            i += 1
    batches.append(Batch(current))
    return [batch for batch in batches if batch.tokens]


def _mysql_batches(state: ReadState, tokens: list[Token]) -> list[Batch]:
    """Honour the mysql client's ``DELIMITER xx`` lines: text up to ``xx`` is one statement."""
    text = state.text
    marks, custom = [], False
    for i, token in enumerate(tokens):
        # DELIMITER counts at the start of a line where a statement may start (a column called
        # delimiter on a line of its own inside CREATE TABLE does not).
        if word(token) != "DELIMITER" or (i and tokens[i - 1].line == token.line):
            continue
        if custom or i == 0 or tokens[i - 1].token_type == TokenType.SEMICOLON:
            line_end = text.find("\n", token.end)
            words = text[token.end + 1 : len(text) if line_end < 0 else line_end].split()
            if words:
                marks.append(i)
                custom = words[0] != ";"
    if not marks:
        return [Batch(tokens)]
    batches = [Batch(tokens[: marks[0]])]
    for n, mark in enumerate(marks):
        line_end = text.find("\n", tokens[mark].end)
        line_end = len(text) if line_end < 0 else line_end
        words = text[tokens[mark].end + 1 : line_end].split()
        delimiter = words[0] if words else ";"
        region_end = tokens[marks[n + 1]].start if n + 1 < len(marks) else len(text)
        after = [t for t in tokens[mark + 1 :] if t.start > line_end and t.end < region_end]
        if delimiter == ";":
            batches.append(Batch(after))
            continue
        # The tokens of this region may run over the delimiter (END$$): tokenize each piece anew.
        cuts = _delimiter_cuts(state, after, delimiter, line_end, region_end)
        state.comments = [c for c in state.comments if not line_end <= c.start < region_end]
        piece_start = line_end
        for cut in cuts:
            batches.append(Batch(tokenize(state, piece_start, cut), whole=True))
            piece_start = cut + len(delimiter)
        batches.append(Batch(tokenize(state, piece_start, region_end), whole=True))
    return [batch for batch in batches if batch.tokens]


def _delimiter_cuts(
    state: ReadState, tokens: Sequence[Token], delimiter: str, start: int, end: int
) -> list[int]:
    """Offsets of ``delimiter`` in ``text[start:end]`` outside strings, quoted names and comments."""
    quoted = [(t.start, t.end) for t in tokens if t.token_type in QUOTED_TOKENS]
    comments = [(c.start, c.end - 1) for c in state.comments if start <= c.start < end]
    blocked = sorted(quoted + comments)
    starts = [a for a, _ in blocked]
    cuts, i = [], state.text.find(delimiter, start, end)
    while i >= 0:
        k = bisect.bisect_right(starts, i) - 1
        if k >= 0 and blocked[k][0] <= i <= blocked[k][1]:
            i = state.text.find(delimiter, blocked[k][1] + 1, end)
            continue
        cuts.append(i)
        i = state.text.find(delimiter, i + len(delimiter), end)
    return cuts
