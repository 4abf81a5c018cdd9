"""One SQL file -> statements with exact source spans and the comments around them: ``split_file``.

sqlglot's tokenizer reads the whole file once; statements are cut at top-level ``;`` tokens (so
strings, dollar-quoted bodies and ``BEGIN ... END`` blocks stay whole) and at client batch
separators (T-SQL ``GO``, SQL*Plus ``/``, mysql ``DELIMITER``, psql ``\\`` meta-commands). Each
statement is parsed alone from its tokens, so one bad statement never hides the next ones.
Token offsets are file offsets: an ``Identifier``'s ``meta`` start/end index ``source.text``.

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
import re
from collections.abc import Iterator, Sequence
from contextlib import contextmanager
from dataclasses import dataclass, field
from functools import lru_cache

import sqlglot.dialects  # noqa: F401  (registers every dialect before names are listed)
from sqlglot import exp
from sqlglot.dialects.dialect import Dialect
from sqlglot.dialects.mysql import MySQL
from sqlglot.dialects.oracle import Oracle
from sqlglot.dialects.postgres import Postgres
from sqlglot.dialects.tsql import TSQL
from sqlglot.errors import ErrorLevel, ParseError, TokenError
from sqlglot.tokens import Token, TokenType

from linter.model import Finding, Span
from linter.reader.sources import Source

__all__ = [
    "Comment",
    "LineIndex",
    "Script",
    "Statement",
    "UnknownDialectError",
    "get_dialect",
    "split_file",
    "split_statements",
]


class UnknownDialectError(ValueError):
    """A dialect name sqlglot does not know; the message lists the names it does know."""


@lru_cache(maxsize=None)
def get_dialect(name: str | None) -> Dialect:
    """The sqlglot dialect called ``name`` (``""``/None: sqlglot's dialect-neutral default)."""
    try:
        return Dialect.get_or_raise(name or None)
    except (ValueError, KeyError) as error:
        known = ", ".join(sorted(k for k in Dialect.classes if k))
        raise UnknownDialectError(f"unknown SQL dialect {name!r}; known dialects: {known}") from error


_LINE_BREAK = re.compile(r"\r\n?|\n")


class LineIndex:
    """Converts character offsets of one text to 1-based lines and columns.

    Lines end at ``\\n``, ``\\r\\n`` or a lone ``\\r``, as sqlglot's tokenizer counts them.
    """

    def __init__(self, path: str, text: str) -> None:
        self.path = path
        self.size = len(text)
        self.starts = [0]
        self.starts.extend(m.end() for m in _LINE_BREAK.finditer(text))

    def position(self, offset: int) -> tuple[int, int]:
        """(line, column) of the character at ``offset``, both 1-based."""
        offset = max(0, min(offset, self.size))
        line = bisect.bisect_right(self.starts, offset)
        return line, offset - self.starts[line - 1] + 1

    def offset(self, line: int, column: int) -> int:
        """The offset of a 1-based (line, column), clamped into the text."""
        line = max(1, min(line, len(self.starts)))
        return max(0, min(self.starts[line - 1] + column - 1, self.size))

    def span(self, start: int, end: int) -> Span:
        """The span of ``text[start:end]`` (``end`` exclusive)."""
        line, column = self.position(start)
        if end <= start:
            return Span(self.path, line, column, line, column)
        end_line, end_column = self.position(end - 1)
        return Span(self.path, line, column, end_line, end_column + 1)


@dataclass(frozen=True)
class Comment:
    """A ``--``/``#`` or ``/* */`` comment: its text without delimiters, and where it stands."""

    text: str
    span: Span
    start: int = field(default=0, compare=False)
    end: int = field(default=0, compare=False)


@dataclass
class Statement:
    """One statement of a file, parsed or not.

    ``kind`` is one of:

    - ``"ast"``: a real expression tree;
    - ``"opaque"``: an ``exp.Command`` for DDL the linter needs (CREATE TABLE, CREATE UNIQUE INDEX,
      ALTER TABLE ... ADD/DROP/RENAME, MySQL RENAME TABLE), so ``opaque`` is True;
    - ``"error"``: could not be parsed; ``expression`` is None and ``problem`` says why;
    - ``"unparsed"``: the same for a statement that cannot change a table (function, trigger,
      view, grant ...), reported as a note;
    - ``"command"``: any other ``exp.Command`` (functions, triggers, OWNER TO ...);
    - ``"fragment"``: a bare expression, left over from a body cut at ``;``.

    ``text`` runs from the first token to the last one before the ``;``; ``end`` is the offset
    after the ``;``. Node positions (``meta`` start/end) are offsets in the whole file.
    """

    expression: exp.Expression | None
    text: str
    span: Span
    offset: int
    comments: tuple[Comment, ...]
    opaque: bool
    kind: str = "ast"
    problem: Finding | None = field(default=None, repr=False)
    end: int = field(default=0, repr=False)
    lines: LineIndex | None = field(default=None, repr=False, compare=False)

    def span_of(self, node: exp.Expression | None) -> Span:
        """The file span of ``node``: from the first to the last token with a position under it."""
        if node is None or self.lines is None:
            return self.span
        start = end = None
        for sub in node.walk():
            meta = sub._meta
            if meta and "start" in meta and "end" in meta:
                if start is None or meta["start"] < start:
                    start = meta["start"]
                if end is None or meta["end"] > end:
                    end = meta["end"]
        if start is None or end is None:
            return self.span
        return self.lines.span(start, end + 1)


@dataclass
class Script:
    """What ``split_file`` read from one file.

    ``statements`` are the ones to replay (kinds ast, opaque and error, in file order);
    ``skipped`` the others (command, fragment, unparsed; kept for their comments); ``findings`` the
    file, tokenizer and parser problems met.
    """

    path: str
    statements: list[Statement] = field(default_factory=list)
    skipped: list[Statement] = field(default_factory=list)
    trailing_comments: tuple[Comment, ...] = ()
    findings: list[Finding] = field(default_factory=list)

    def count(self, kind: str) -> int:
        """How many statements of one ``kind`` (see ``Statement``) were read."""
        return sum(1 for s in (*self.statements, *self.skipped) if s.kind == kind)


def split_statements(source: Source, dialect: str | None) -> list[Statement]:
    """The statements of ``source`` to replay (see ``split_file`` for the rest)."""
    return split_file(source, dialect).statements


# ---------------------------------------------------------------------------- tokens and units


@dataclass
class _Unit:
    """Tokens sent together by a client tool; ``whole`` when they form one statement (DELIMITER)."""

    tokens: list[Token]
    whole: bool = False


@dataclass
class _Reader:
    """The state of reading one file."""

    text: str
    dialect: Dialect
    lines: LineIndex
    comments: list[Comment] = field(default_factory=list)
    findings: list[Finding] = field(default_factory=list)

    def finding(self, rule: str, severity: str, start: int, end: int, message: str) -> None:
        """Record a finding over ``text[start:end]``."""
        self.findings.append(Finding(rule, severity, self.lines.span(start, end), message))


_NON_BLOCK_AFTER_BEGIN = frozenset(
    {"TRANSACTION", "TRAN", "WORK", "DISTRIBUTED", "DEFERRED", "IMMEDIATE", "EXCLUSIVE",
     "ISOLATION", "READ", "NOT", "DEFERRABLE", ";"}
)
_END_OF_UNCOUNTED = frozenset({"IF", "LOOP", "WHILE", "REPEAT", "FOR"})
_PLSQL_OBJECTS = frozenset({"PROCEDURE", "FUNCTION", "PACKAGE", "TRIGGER", "TYPE", "LIBRARY"})
_CREATE_MODIFIERS = frozenset(
    {"OR", "REPLACE", "ALTER", "UNIQUE", "CLUSTERED", "NONCLUSTERED", "TEMP", "TEMPORARY", "GLOBAL",
     "LOCAL", "UNLOGGED", "EDITIONABLE", "NONEDITIONABLE", "MATERIALIZED", "RECURSIVE", "FORCE"}
)
_STATEMENT_OBJECTS = frozenset(
    {"TABLE", "INDEX", "VIEW", "SEQUENCE", "TYPE", "SCHEMA", "TRIGGER", "FUNCTION", "PROCEDURE",
     "PROC", "DOMAIN", "EXTENSION", "DATABASE"}
)
# Statements that cannot change a table, a column or a key: when sqlglot cannot parse one, the
# reader notes it and goes on (a MySQL procedure or a DB2 trigger is no error of the schema).
_NO_TABLE_OBJECTS = frozenset(
    {"FUNCTION", "PROCEDURE", "PROC", "TRIGGER", "VIEW", "TYPE", "EVENT", "PACKAGE",
     "DOMAIN", "RULE", "EXTENSION", "SEQUENCE", "AGGREGATE", "OPERATOR", "POLICY", "STATISTICS",
     "PUBLICATION", "SUBSCRIPTION", "ROLE", "USER", "LANGUAGE", "SERVER", "COLLATION", "CAST",
     "SYNONYM", "LIBRARY", "DATABASE"}
)
_NO_TABLE_STATEMENTS = frozenset(
    {"GRANT", "REVOKE", "DENY", "DEALLOCATE", "PREPARE", "EXECUTE", "EXEC", "CALL", "SET",
     "COMMENT", "ANALYZE", "VACUUM", "REINDEX", "LOCK", "PRINT", "USE", "SHOW", "SELECT", "DO",
     "CLUSTER", "REFRESH", "NOTIFY", "LISTEN", "DISCARD", "CHECKPOINT", "EXPLAIN", "END",
     "COMMIT", "ROLLBACK", "SAVEPOINT", "RELEASE", "START", "PRAGMA", "FLUSH", "OPTIMIZE"}
)
_NOT_BEFORE_STATEMENT = frozenset({"GRANT", "REVOKE", "DENY", ",", "TO", "ON"})
_QUOTED_TOKENS = frozenset(
    {TokenType.STRING, TokenType.IDENTIFIER, TokenType.NATIONAL_STRING, TokenType.HEREDOC_STRING,
     TokenType.RAW_STRING, TokenType.BYTE_STRING, TokenType.BIT_STRING, TokenType.HEX_STRING,
     TokenType.UNICODE_STRING}
)


def _word(token: Token | None) -> str:
    """A token's text in upper case ('' for no token)."""
    return token.text.upper() if token is not None else ""


def _tokenize(reader: _Reader, start: int, end: int) -> list[Token]:
    """Tokenize ``text[start:end]`` into file coordinates and collect its comments.

    When the tokenizer fails (an unterminated string ...) a ``syntax-error`` is reported at its
    position and the tokens before that point are kept.
    """
    chunk = reader.text[start:end]
    tokenizer = _tokenizer(reader.dialect)
    try:
        tokens = tokenizer.tokenize(chunk)
        stop = scan_end = end
    except TokenError as error:
        where, reason = _token_error(error, chunk, _comment_syntax(reader.dialect.tokenizer_class)[0])
        stop = start + where
        scan_end = end if reason is None else stop
        if reason is not None:
            skipped = reader.lines.position(end - 1)[0] - reader.lines.position(stop)[0]
            rest = f"; the {skipped} line(s) after it were not read" if skipped > 0 else ""
            reader.finding("syntax-error", "error", stop, min(stop + 1, end), f"{reason}{rest}")
        try:
            tokens = tokenizer.tokenize(chunk[:where])
        except TokenError:
            tokens = []
        if reason is not None:
            # The statement the error is in is incomplete: keep only what ends with a ';'.
            last = max((i for i, t in enumerate(tokens) if t.token_type == TokenType.SEMICOLON), default=-1)
            del tokens[last + 1 :]
    _place_command_text(tokenizer, chunk, tokens)
    if start:
        line0, column0 = reader.lines.position(start)
        for token in tokens:
            if token.line == 1:
                token.col += column0 - 1
            token.line += line0 - 1
            token.start += start
            token.end += start
    _collect_comments(reader, tokens, start, scan_end)
    return tokens


class _TSQLTokenizer(TSQL.Tokenizer):
    """sqlglot's T-SQL tokenizer, except that END does not swallow the text after it.

    sqlglot lists END among T-SQL's command words, so after ``BEGIN ...; END`` it reads everything
    up to the next ``;`` as one string: an ``IF ... BEGIN DROP TABLE t; END`` followed by
    ``CREATE TABLE t (...)`` would hide the table.
    """

    COMMANDS = TSQL.Tokenizer.COMMANDS - {TokenType.END}


def _tokenizer(dialect: Dialect):
    """A tokenizer for the dialect (T-SQL's with END as a plain keyword)."""
    if isinstance(dialect, TSQL):
        return _TSQLTokenizer(dialect=dialect)
    return dialect.tokenizer()


def _place_command_text(tokenizer, chunk: str, tokens: list[Token]) -> None:
    """Give correct offsets to the text sqlglot reads whole after a command word (RENAME, EXECUTE ...).

    The tokenizer turns everything from such a word at a statement start up to the next ``;`` into
    one STRING token, but records it with the offsets of the last token it scanned.
    """
    commands, prefixes = tokenizer.COMMANDS, tokenizer.COMMAND_PREFIX_TOKENS
    for i in [i for i, token in enumerate(tokens) if token.token_type in commands]:
        if i + 1 < len(tokens) and tokens[i + 1].token_type == TokenType.STRING and (
            i == 0 or tokens[i - 1].token_type in prefixes
        ):
            command, token = tokens[i], tokens[i + 1]
            begin = chunk.find(token.text, command.end + 1)
            if begin >= 0:
                token.start, token.end = begin, begin + len(token.text) - 1
                token.line = command.line + chunk.count("\n", command.end, token.end)


def _token_error(error: TokenError, chunk: str, comment_syntax) -> tuple[int, str | None]:
    """(offset in the chunk where the tokenizer gave up, reason) as far as its error tells.

    The reason is None when the tokenizer ran off the end inside an unclosed block comment: the
    comment scan reports that one itself.
    """
    cause = error.__cause__ or error.__context__
    message = str(cause or "")
    found = re.fullmatch(r"(Missing (.+?)|Numeric string .*?) from (\d+):(\d+)\s*", message)
    if found:
        where = min(int(found.group(4)), len(chunk))
        if found.group(2):
            return where, f"unterminated quoted text: no closing {found.group(2)} after this point"
        return where, "invalid characters in a numeric string literal"
    if isinstance(cause, IndexError):
        opened = max((chunk.rfind(opener) for opener, closer in comment_syntax.items() if closer), default=-1)
        if opened >= 0:
            return opened, None
    if error.start:  # the context snippet runs 50 characters either side of the stop
        where = min(error.start + 50, len(chunk))
    elif error.end is not None and error.end < len(chunk) - 1:
        where = max(error.end - 50, 0)
    else:
        where = 0
    return where, "cannot split this text into SQL tokens"


def _collect_comments(reader: _Reader, tokens: Sequence[Token], start: int, stop: int) -> None:
    """Find the comments between tokens, with positions (the tokenizer keeps them without).

    The text between two tokens holds only white space and comments, so every comment opener met
    outside a token and outside a comment already read starts a comment.
    """
    syntax, nested, openers = _comment_syntax(reader.dialect.tokenizer_class)
    text = reader.text
    starts = [token.start for token in tokens]
    done = start
    for match in openers.finditer(text, start, stop):
        i = match.start()
        if i < done:
            continue
        k = bisect.bisect_right(starts, i) - 1
        if k >= 0 and tokens[k].end >= i:
            continue  # inside a string, a quoted name or a command's text
        gap_end = starts[k + 1] if k + 1 < len(starts) else stop
        done = _read_comment(reader, i, match.group(), syntax[match.group()], gap_end, nested)


@lru_cache(maxsize=None)
def _comment_syntax(tokenizer_class: type) -> tuple[dict[str, str | None], bool, re.Pattern[str]]:
    """A dialect's comment openers with their closers, whether ``/* */`` nests, an opener regex."""
    pairs = {c: None for c in tokenizer_class.COMMENTS if isinstance(c, str)}
    pairs.update((c[0], c[1]) for c in tokenizer_class.COMMENTS if not isinstance(c, str))
    pairs["{#"] = "#}"  # sqlglot reads Jinja comments in every dialect
    pattern = "|".join(re.escape(opener) for opener in sorted(pairs, key=len, reverse=True))
    return pairs, bool(tokenizer_class.NESTED_COMMENTS), re.compile(pattern)


def _read_comment(reader: _Reader, i: int, opener: str, closer: str | None, end: int, nested: bool) -> int:
    """Record the comment opened at ``i`` (it ends by ``end``); return the offset after it."""
    text = reader.text
    body = i + len(opener)
    if closer is None:
        after = text.find("\n", body, end)
        after = end if after < 0 else after
        inner_end = after - 1 if after > body and text[after - 1] == "\r" else after
        shown = inner_end  # a line comment's span stops before its line break
    else:
        after, inner_end = _block_end(text, body, end, opener, closer, nested)
        if inner_end < 0:
            reader.finding(
                "syntax-error", "error", i, body,
                f"comment opened with {opener} is never closed: the rest of the file is ignored",
            )
            inner_end = after
        shown = after
    reader.comments.append(Comment(text[body:inner_end], reader.lines.span(i, shown), start=i, end=after))
    return after


def _block_end(text: str, body: int, end: int, opener: str, closer: str, nested: bool) -> tuple[int, int]:
    """(offset after the closer, offset of the closer) of a block comment; (end, -1) if unclosed."""
    depth, i = 1, body
    while i < end:
        close = text.find(closer, i, end)
        if close < 0:
            return end, -1
        if nested:
            inner = text.find(opener, i, close)
            if inner >= 0:
                depth += 1
                i = inner + len(opener)
                continue
        depth -= 1
        if depth == 0:
            return close + len(closer), close
        i = close + len(closer)
    return end, -1


# ---------------------------------------------------------------------------- client separators


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
# A quick check before looking for psql meta-commands among the tokens.
_MAYBE_META_LINE = re.compile(r"^[ \t]*\\", re.MULTILINE)


def _units(reader: _Reader) -> list[_Unit]:
    """Tokenize the file and cut it where the dialect's client tool would send a batch."""
    dialect = reader.dialect
    if isinstance(dialect, TSQL):
        return _go_batches(reader)
    if isinstance(dialect, Postgres) and _MAYBE_META_LINE.search(reader.text):
        units = []
        for start, end in _outside_copy_data(reader.text):
            units.extend(_cut_at_lines(_tokenize(reader, start, end), _psql_meta))
        return units
    tokens = _tokenize(reader, 0, len(reader.text))
    if isinstance(dialect, Oracle):
        return _cut_at_lines(tokens, _sqlplus_line)
    if isinstance(dialect, MySQL):
        return _mysql_units(reader, tokens)
    return [_Unit(tokens)]


# psql's COPY ... FROM stdin reads data rows up to a line holding only '\.': they are not SQL (the
# sqlglot tokenizer would choke on their quotes), so they are found by line, as psql finds them.
_COPY_FROM_STDIN = re.compile(r"\bCOPY\b[^;]*?\bFROM\s+STDIN\b[^;]*;[^\n]*\n", re.IGNORECASE)
_END_OF_DATA = re.compile(r"^\\\.[ \t]*\r?$", re.MULTILINE)


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
    word = _word(token)
    if not at_start or not (word in _SQLPLUS_COMMANDS or word.startswith("@")):
        return 0
    if word == "SET" and _word(_at(tokens, i + 1)) in ("TRANSACTION", "ROLE", "CONSTRAINT", "CONSTRAINTS"):
        return 0  # SQL, not SQL*Plus
    return _rest_of_line(tokens, i)


def _go_batches(reader: _Reader) -> list[_Unit]:
    """The T-SQL batches between ``GO`` lines, each tokenized alone."""
    units, start = [], 0
    for line in _GO_LINE.finditer(reader.text):
        units.append(_Unit(_tokenize(reader, start, line.start())))
        start = line.end()
    units.append(_Unit(_tokenize(reader, start, len(reader.text))))
    return [unit for unit in units if unit.tokens]


def _psql_meta(tokens: Sequence[Token], i: int, at_start: bool) -> int:
    """Tokens of a psql meta-command line (``\\c db``, ``\\set x 1``) at ``i``."""
    return _rest_of_line(tokens, i) if tokens[i].token_type == TokenType.BACKSLASH else 0


def _cut_at_lines(tokens: list[Token], separator) -> list[_Unit]:
    """Cut the tokens at client lines found by ``separator(tokens, i, at_statement_start) -> width``."""
    units, current, i = [], [], 0
    while i < len(tokens):
        at_start = not current or current[-1].token_type == TokenType.SEMICOLON
        width = separator(tokens, i, at_start)
        if width:
            units.append(_Unit(current))
            current = []
            i += width
        else:
            current.append(tokens[i])
            i += 1
    units.append(_Unit(current))
    return [unit for unit in units if unit.tokens]


def _mysql_units(reader: _Reader, tokens: list[Token]) -> list[_Unit]:
    """Honour the mysql client's ``DELIMITER xx`` lines: text up to ``xx`` is one statement."""
    text = reader.text
    marks, custom = [], False
    for i, token in enumerate(tokens):
        # DELIMITER counts at the start of a line where a statement may start (a column called
        # delimiter on a line of its own inside CREATE TABLE does not).
        if _word(token) != "DELIMITER" or (i and tokens[i - 1].line == token.line):
            continue
        if custom or i == 0 or tokens[i - 1].token_type == TokenType.SEMICOLON:
            line_end = text.find("\n", token.end)
            words = text[token.end + 1 : len(text) if line_end < 0 else line_end].split()
            if words:
                marks.append(i)
                custom = words[0] != ";"
    if not marks:
        return [_Unit(tokens)]
    units = [_Unit(tokens[: marks[0]])]
    for n, mark in enumerate(marks):
        line_end = text.find("\n", tokens[mark].end)
        line_end = len(text) if line_end < 0 else line_end
        words = text[tokens[mark].end + 1 : line_end].split()
        delimiter = words[0] if words else ";"
        region_end = tokens[marks[n + 1]].start if n + 1 < len(marks) else len(text)
        after = [t for t in tokens[mark + 1 :] if t.start > line_end and t.end < region_end]
        if delimiter == ";":
            units.append(_Unit(after))
            continue
        # The tokens of this region may run over the delimiter (END$$): tokenize each piece anew.
        cuts = _delimiter_cuts(reader, after, delimiter, line_end, region_end)
        reader.comments = [c for c in reader.comments if not line_end <= c.start < region_end]
        piece_start = line_end
        for cut in cuts:
            units.append(_Unit(_tokenize(reader, piece_start, cut), whole=True))
            piece_start = cut + len(delimiter)
        units.append(_Unit(_tokenize(reader, piece_start, region_end), whole=True))
    return [unit for unit in units if unit.tokens]


def _delimiter_cuts(
    reader: _Reader, tokens: Sequence[Token], delimiter: str, start: int, end: int
) -> list[int]:
    """Offsets of ``delimiter`` in ``text[start:end]`` outside strings, quoted names and comments."""
    quoted = [(t.start, t.end) for t in tokens if t.token_type in _QUOTED_TOKENS]
    comments = [(c.start, c.end - 1) for c in reader.comments if start <= c.start < end]
    blocked = sorted(quoted + comments)
    starts = [a for a, _ in blocked]
    cuts, i = [], reader.text.find(delimiter, start, end)
    while i >= 0:
        k = bisect.bisect_right(starts, i) - 1
        if k >= 0 and blocked[k][0] <= i <= blocked[k][1]:
            i = reader.text.find(delimiter, blocked[k][1] + 1, end)
            continue
        cuts.append(i)
        i = reader.text.find(delimiter, i + len(delimiter), end)
    return cuts


# ---------------------------------------------------------------------------- statements


_NESTING = frozenset(
    {TokenType.SEMICOLON, TokenType.L_PAREN, TokenType.R_PAREN, TokenType.BEGIN, TokenType.END, TokenType.CASE}
)


def _nesting(tokens: Sequence[Token]) -> tuple[list[tuple[int, int]], int]:
    """(parenthesis depth, block depth) before each token, and the block depth after the last.

    ``BEGIN`` opens a block unless it starts a transaction (``BEGIN;``, ``BEGIN TRANSACTION`` ...);
    inside a block ``CASE`` opens one too; ``END`` closes one, but ``END IF``/``END LOOP`` ... close
    what was never counted. Words inside parentheses do not count (a column named ``begin``).
    """
    levels: list[tuple[int, int]] = []
    parens = depth = 0
    skip = False
    for i, token in enumerate(tokens):
        levels.append((parens, depth))
        kind = token.token_type
        if skip or kind not in _NESTING:
            skip = False
            continue
        if kind == TokenType.SEMICOLON:
            if depth == 0:
                parens = 0
        elif kind == TokenType.L_PAREN:
            parens += 1
        elif kind == TokenType.R_PAREN:
            parens = max(parens - 1, 0)
        elif not parens:
            following = _word(tokens[i + 1]) if i + 1 < len(tokens) else ";"
            if kind == TokenType.BEGIN and following not in _NON_BLOCK_AFTER_BEGIN:
                depth += 1
            elif kind == TokenType.CASE and depth:
                depth += 1
            elif kind == TokenType.END and depth:
                skip = following in _END_OF_UNCOUNTED or following == "CASE"
                if following not in _END_OF_UNCOUNTED:
                    depth -= 1
    return levels, depth


def _cut_at_semicolons(tokens: list[Token]) -> Iterator[tuple[list[Token], Token | None]]:
    """Cut at every ``;`` token, blocks or not."""
    start = 0
    for k, token in enumerate(tokens):
        if token.token_type == TokenType.SEMICOLON:
            if k > start:
                yield tokens[start:k], token
            start = k + 1
    if start < len(tokens):
        yield tokens[start:], None


def _statement_slices(unit: _Unit, dialect: Dialect) -> Iterator[tuple[list[Token], Token | None]]:
    """Cut a unit at top-level ``;`` tokens, keeping ``BEGIN ... END`` bodies whole.

    Yields (tokens without the ``;``, the ``;`` token or None). In Oracle a PL/SQL block runs to
    the end of its unit, as in SQL*Plus; a block that never closes is cut at every ``;``.
    """
    tokens = unit.tokens
    if unit.whole:
        yield tokens, None
        return
    oracle = isinstance(dialect, Oracle)
    if not oracle and not any(token.token_type == TokenType.BEGIN for token in tokens):
        yield from _cut_at_semicolons(tokens)
        return
    levels, open_blocks = _nesting(tokens)
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
        yield from _cut_at_semicolons(rest) if open_blocks else [(rest, None)]


def _is_plsql_head(tokens: Sequence[Token], i: int) -> bool:
    """True at ``DECLARE``, ``BEGIN`` or ``CREATE [OR REPLACE] PROCEDURE|FUNCTION|PACKAGE|...``."""
    word = _word(tokens[i])
    if word in ("DECLARE", "BEGIN"):
        return True
    if word != "CREATE":
        return False
    for token in tokens[i + 1 : i + 6]:
        word = _word(token)
        if word in _PLSQL_OBJECTS:
            return True
        if word not in _CREATE_MODIFIERS:
            return False
    return False


def _restart_points(tokens: Sequence[Token]) -> list[int]:
    """Indexes where a new DDL statement starts inside these tokens (a missing ``;``)."""
    points = []
    head = _word(tokens[0])
    levels, _ = _nesting(tokens)
    for i in range(1, len(tokens)):
        if levels[i] != (0, 0) or _word(tokens[i - 1]) in _NOT_BEFORE_STATEMENT:
            continue
        word = _word(tokens[i])
        if word == "CREATE" or (word in ("ALTER", "DROP") and head != "ALTER"):
            if _names_object(tokens, i):
                points.append(i)
        elif word == "ALTER" and _word(_at(tokens, i + 1)) in ("TABLE", "VIEW", "SEQUENCE", "TYPE"):
            points.append(i)
    return points


def _at(tokens: Sequence[Token], i: int) -> Token | None:
    """tokens[i], or None past the end."""
    return tokens[i] if i < len(tokens) else None


def _object_word(tokens: Sequence[Token], i: int) -> str:
    """The object kind after the CREATE/ALTER/DROP at ``i``, past modifiers ('' when none)."""
    for token in tokens[i + 1 : i + 6]:
        word = _word(token)
        if word not in _CREATE_MODIFIERS:
            return word
    return ""


def _names_object(tokens: Sequence[Token], i: int) -> bool:
    """True when the keyword at ``i`` is followed (after modifiers) by an object kind."""
    return _object_word(tokens, i) in _STATEMENT_OBJECTS


def _cannot_change_tables(tokens: Sequence[Token]) -> bool:
    """True for functions, triggers, views, grants, queries ...: nothing that shapes a table."""
    head = _word(tokens[0])
    if head in ("CREATE", "ALTER", "DROP"):
        return _object_word(tokens, 0) in _NO_TABLE_OBJECTS
    if head in ("BEGIN", "DECLARE"):  # a block runs now: it matters if it touches a table
        return not any(
            _word(token) in ("CREATE", "ALTER", "DROP") and _object_word(tokens, i) in ("TABLE", "INDEX")
            for i, token in enumerate(tokens)
        )
    return head in _NO_TABLE_STATEMENTS


def _opaque_ddl(tokens: Sequence[Token]) -> bool:
    """True for CREATE TABLE, CREATE UNIQUE INDEX, ALTER TABLE ... ADD/DROP/RENAME, RENAME TABLE."""
    words = [_word(t) for t in tokens[:8]]
    if not words:
        return False
    if words[0] == "CREATE":
        skip = ("OR", "REPLACE", "GLOBAL", "LOCAL", "TEMP", "TEMPORARY", "UNLOGGED")
        rest = [w for w in words[1:] if w not in skip]
        if rest[:1] == ["TABLE"]:
            return True
        rest = [w for w in rest if w not in ("CLUSTERED", "NONCLUSTERED")]
        return rest[:2] == ["UNIQUE", "INDEX"]
    if words[0] == "RENAME" and words[1:2] and words[1].split()[:1] == ["TABLE"]:  # MySQL
        return True  # (sqlglot reads the text after RENAME as one string token)
    if words[:2] == ["ALTER", "TABLE"]:
        levels, _ = _nesting(tokens)
        for i in range(2, len(tokens)):
            action = _word(tokens[i]) in ("ADD", "DROP", "RENAME")
            if action and levels[i][0] == 0 and not _adds_default(tokens, i):
                return True
    return False


def _adds_default(tokens: Sequence[Token], i: int) -> bool:
    """True at ``ADD [CONSTRAINT name] DEFAULT``: a T-SQL default, which no key depends on."""
    words = [_word(t) for t in tokens[i : i + 4]]
    return words[1:2] == ["DEFAULT"] or (words[1:2] == ["CONSTRAINT"] and words[3:4] == ["DEFAULT"])


def _is_fragment(expression: exp.Expression) -> bool:
    """A root that is no statement (``END`` parsed as a column ...): left by a body cut at ``;``."""
    if isinstance(expression, exp.EndStatement):
        return True
    return isinstance(expression, (exp.Condition, exp.Alias)) and not isinstance(expression, exp.Query)


_CLASS_NAME = re.compile(r"<class '(?:[\w.]*\.)?(\w+)'>")


def _clean_message(error: ParseError) -> tuple[str, str]:
    """(sqlglot's description without Python class names, the text it points at)."""
    first = error.errors[0] if error.errors else {}
    description = str(first.get("description") or str(error).split("\n")[0])
    description = _CLASS_NAME.sub(lambda m: m.group(1), description).strip().rstrip(".")
    return re.sub(r"\s+", " ", description), str(first.get("highlight") or "")


def _describe(tokens: Sequence[Token]) -> str:
    """The leading keywords of a statement, for messages (``CREATE UNIQUE INDEX``)."""
    words: list[str] = []
    for token in tokens[:4]:
        if token.token_type in _QUOTED_TOKENS or not token.text.replace("_", "").isalpha():
            break
        words.append(token.text.upper())
        if words[-1] in _STATEMENT_OBJECTS or words[0] not in ("CREATE", "ALTER", "DROP"):
            break
    return " ".join(words) or "this"


class _Parser:
    """Parses statements of one file from their tokens and classifies the results."""

    def __init__(self, reader: _Reader) -> None:
        self.reader = reader
        self.parser = reader.dialect.parser(error_level=ErrorLevel.IMMEDIATE)
        self.tsql = isinstance(reader.dialect, TSQL)

    def statements(self, tokens: list[Token], terminator: Token | None, whole: bool) -> list[Statement]:
        """The statement(s) in ``tokens``: one, or several when a ``;`` was missing between them.

        ``whole`` tokens were sent as one statement by the client (mysql DELIMITER): never re-cut.
        """
        if self.tsql and not whole:  # T-SQL needs no ';' between statements
            points = _restart_points(tokens)
            if points:
                return self._pieces(tokens, points, terminator, warn=False)
        statements = self._parse_all(tokens, terminator)
        if statements[0].kind == "error" and _word(tokens[0]) == "DROP":
            statements = self._each_dropped(tokens, terminator) or statements
        if not whole and len(statements) == 1 and statements[0].kind in ("error", "command", "opaque"):
            points = _restart_points(tokens)
            if points:
                return self._pieces(tokens, points, terminator, warn=True)
        return statements

    def _each_dropped(self, tokens: list[Token], terminator: Token | None) -> list[Statement]:
        """``DROP INDEX a, b CASCADE`` as one DROP per object, which sqlglot reads ([] if not)."""
        levels, _ = _nesting(tokens)
        commas = [i for i, t in enumerate(tokens) if t.token_type == TokenType.COMMA and levels[i][0] == 0]
        if not commas:
            return []
        head_end = 2
        while head_end < commas[0] and _word(tokens[head_end]) in ("IF", "EXISTS", "CONCURRENTLY"):
            head_end += 1
        head, tail = tokens[:head_end], []
        while len(tokens) - len(tail) - 1 > commas[-1] + 1 and _word(tokens[-len(tail) - 1]) in (
            "CASCADE", "RESTRICT"
        ):
            tail.insert(0, tokens[-len(tail) - 1])
        bounds = [head_end - 1, *commas, len(tokens) - len(tail)]
        start, stop = tokens[0].start, tokens[-1].end + 1
        pieces = []
        for a, b in zip(bounds, bounds[1:]):
            statement = self._parse(head + tokens[a + 1 : b] + tail, terminator)
            if statement.kind != "ast":
                return []
            # Each piece keeps the text and span of the statement as written.
            statement.text, statement.offset = self.reader.text[start:stop], start
            statement.span = self.reader.lines.span(start, stop)
            pieces.append(statement)
        return pieces

    def _parse_all(self, tokens: list[Token], terminator: Token | None) -> list[Statement]:
        """Parse tokens meant as one statement; cut them at every ``;`` if they hold several."""
        statement = self._parse(tokens, terminator)
        if statement.kind != "merged":
            return [statement]
        return [self._parse(piece, end) for piece, end in _cut_at_semicolons(tokens)]

    def _pieces(
        self, tokens: list[Token], points: list[int], terminator: Token | None, warn: bool
    ) -> list[Statement]:
        """Parse each piece between restart points; warn about the missing ``;``."""
        bounds = [0, *points, len(tokens)]
        result = []
        for n, (a, b) in enumerate(zip(bounds, bounds[1:])):
            if warn and a:
                token = tokens[a]
                self.reader.finding(
                    "syntax-error", "warning", token.start, token.end + 1,
                    f"missing ';' before this {_describe(tokens[a:])}: read as the start of a new statement",
                )
            last = n == len(bounds) - 2
            result.extend(self._parse_all(tokens[a:b], terminator if last else None))
        return result

    def _parse(self, tokens: list[Token], terminator: Token | None) -> Statement:
        """Parse tokens that hold one statement; a failure is kept as the statement's ``problem``."""
        reader = self.reader
        start, stop = tokens[0].start, tokens[-1].end + 1
        end = terminator.end + 1 if terminator is not None else stop
        statement = Statement(
            None, reader.text[start:stop], reader.lines.span(start, stop), start, (), False,
            kind="error", end=end, lines=reader.lines,
        )
        try:
            parsed = [
                e for e in self.parser.parse(tokens, reader.text)
                if e is not None and not isinstance(e, exp.Semicolon)
            ]
        except ParseError as error:
            statement.problem = self._problem(statement, tokens, error)
            if _cannot_change_tables(tokens):
                statement.kind = "unparsed"
                statement.problem.severity = "note"
                statement.problem.message += "; skipped, as it cannot change a table or key"
            return statement
        except RecursionError:
            message = f"{_describe(tokens)} statement is nested too deeply to read"
            statement.problem = self._failure(statement, message)
            return statement
        except Exception as error:  # sqlglot itself failed: report, never crash
            message = f"sqlglot could not read this {_describe(tokens)} statement ({error!s:.80})"
            statement.problem = self._failure(statement, message)
            return statement
        if not parsed:
            statement.kind = "command"
            return statement
        expression = parsed[0]
        statement.expression = expression
        if len(parsed) > 1 and not isinstance(expression, exp.Command):
            statement.kind = "merged"  # a BEGIN ... END guess joined statements: the caller cuts
        elif len(parsed) > 1 or isinstance(expression, exp.Command):
            statement.opaque = _opaque_ddl(tokens)
            statement.kind = "opaque" if statement.opaque else "command"
        elif _is_fragment(expression):
            statement.kind = "fragment"
        else:
            statement.kind = "ast"
        return statement

    def _failure(self, statement: Statement, message: str) -> Finding:
        """A ``syntax-error`` over the whole statement."""
        return Finding("syntax-error", "error", statement.span, message)

    def _problem(self, statement: Statement, tokens: Sequence[Token], error: ParseError) -> Finding:
        """A ``syntax-error`` at the token sqlglot stopped at, with its message."""
        lines = self.reader.lines
        description, highlight = _clean_message(error)
        first = error.errors[0] if error.errors else {}
        start, stop = statement.offset, statement.offset + len(statement.text)
        if first.get("line") and first.get("col") and highlight:
            last = lines.offset(int(first["line"]), int(first["col"]))
            begin = last - len(highlight) + 1
            if statement.offset <= begin <= last < stop and self.reader.text[begin : last + 1] == highlight:
                start, stop = begin, last + 1
        near = f" near '{highlight[:40]}'" if highlight else ""
        where = ""
        if lines.position(start)[0] != statement.span.line:
            where = f" (statement starts on line {statement.span.line})"
        message = f"cannot parse {_describe(tokens)} statement: {description}{near}{where}"
        return Finding("syntax-error", "error", lines.span(start, stop), message)


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
    reader = _Reader(source.text, sqlglot_dialect, lines)
    everything: list[Statement] = []
    with _quiet_sqlglot():
        parser = _Parser(reader)
        for unit in _units(reader):
            for tokens, terminator in _statement_slices(unit, sqlglot_dialect):
                everything.extend(parser.statements(tokens, terminator, unit.whole))
    script.trailing_comments = _attach_comments(everything, reader.comments, lines)
    for statement in everything:
        replayed = statement.kind in ("ast", "opaque", "error")
        (script.statements if replayed else script.skipped).append(statement)
    problems = [s.problem for s in everything if s.problem is not None]
    script.findings.extend(sorted(reader.findings + problems, key=lambda f: (f.span.line, f.span.column)))
    return script
