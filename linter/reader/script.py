"""What the reader makes of one file: ``Script``, its ``Statement`` list and their ``Comment`` list.

>>> from linter.reader.line_index import LineIndex
>>> text = "CREATE TABLE depot (city text)"
>>> lines = LineIndex("db/001.sql", text)
>>> statement = Statement(None, text, lines.span(0, len(text)), 0, (), False, lines=lines)
>>> Script("db/001.sql", statements=[statement]).count("ast")
1
"""
from __future__ import annotations

from dataclasses import dataclass, field

from sqlglot import exp

from linter.model import Finding, Span
from linter.reader.line_index import LineIndex

__all__ = ["Comment", "Script", "Statement"]


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
    - ``"error"``: could not be parsed, or names an object kind the dialect does not know
      (``CREATE TABEL``); ``expression`` is None and ``problem`` says why;
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
