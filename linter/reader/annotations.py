"""Annotation comments -> declared dependencies, allowances and splits: ``parse_annotations``.

The grammar, one annotation per comment line::

    normguard: fd [table:] a, b -> c, d       a functional dependency (the table is implied by
                                              the statement the comment belongs to when omitted)
    normguard: allow rule-id[, rule-id]: why  suppress rules for the table; the reason is required
    normguard: split-from old_table           on a CREATE TABLE: this table is a piece of old_table

Names are read with the dialect's own tokenizer, so they may be quoted the dialect's way
(``"Depot"``, ```depot```, ``[depot]``) and tables may be schema-qualified. Unquoted column names
fold as the dialect folds them (``Depot`` is ``depot`` in postgres).

Nothing is ignored silently: a comment line whose first word is ``normguard`` in any case, with or
without the colon, is an annotation, and one that does not follow the grammar exactly (``NormGuard:``,
``normguard fd``, an unknown verb, an empty side, an allow without a reason) is an
``annotation-error`` at its own line saying what was expected.

>>> from linter.model import Span
>>> note = Comment(" normguard: fd couriers: Depot -> city", Span("a.sql", 3, 1, 3, 41))
>>> fd = parse_annotation(note, "postgres")
>>> fd.table, fd.lhs, fd.rhs, fd.lhs_written, (fd.span.line, fd.span.column)
('couriers', ('depot',), ('city',), ('Depot',), (3, 4))
>>> parse_annotation(Comment(" normguard: allow missing-key", Span("a.sql", 4, 1, 4, 31)), "postgres").message
"allow annotation needs a reason: write 'normguard: allow missing-key: <why this is fine>'"
>>> parse_annotation(Comment(" just a remark", Span("a.sql", 5, 1, 5, 17)), "postgres") is None
True
"""
from __future__ import annotations

import re
from dataclasses import dataclass

from sqlglot.errors import TokenError
from sqlglot.tokens import Token, TokenType

from linter.model import Allow, Finding, Span
from linter.reader.dialects import get_dialect
from linter.reader.names import fold_column, parse_table_name, token_identifier
from linter.reader.script import Comment

__all__ = [
    "Annotation",
    "FdAnnotation",
    "SplitFromAnnotation",
    "parse_annotation",
    "parse_annotations",
]

VERBS: tuple[str, ...] = ("fd", "allow", "split-from")
_MARKER = "normguard:"
_LINE_BREAK = re.compile(r"\r\n?|\n")
_LEAD = re.compile(r"[\s*-]*")
_FIRST_WORD = re.compile(r"[A-Za-z][\w-]*")
_RULE_ID = re.compile(r"[a-z][a-z0-9]*(?:-[a-z0-9]+)*")
_FD_SHAPE = "'normguard: fd [table:] a, b -> c, d'"
_QUOTED_STRING = frozenset({TokenType.STRING, TokenType.NATIONAL_STRING})


@dataclass(frozen=True)
class FdAnnotation:
    """``normguard: fd [table:] lhs -> rhs``.

    ``lhs``/``rhs`` are folded column names, ready to compare with the catalog's; ``table`` is the
    catalog key of the table named (folded, default schema dropped) or None when implied. The
    ``*_written`` fields keep the names as written, quotes included.
    """

    table: str | None
    lhs: tuple[str, ...]
    rhs: tuple[str, ...]
    span: Span
    table_written: str | None = None
    lhs_written: tuple[str, ...] = ()
    rhs_written: tuple[str, ...] = ()


@dataclass(frozen=True)
class SplitFromAnnotation:
    """``normguard: split-from old_table``: ``table`` is the catalog key, ``table_written`` as written."""

    table: str
    span: Span
    table_written: str = ""


Annotation = FdAnnotation | Allow | SplitFromAnnotation
"""What one annotation line says; an allow is the catalog's ``Allow`` as it stands."""


class _Malformed(Exception):
    """An annotation that does not follow the grammar; the message says what was expected."""


def parse_annotation(comment: Comment, dialect: str | None) -> Annotation | Finding | None:
    """The annotation in ``comment``, an ``annotation-error`` finding, or None for a plain comment.

    A comment holding several annotation lines gives the first here; ``parse_annotations`` gives
    all of them.
    """
    found = parse_annotations(comment, dialect)
    return found[0] if found else None


def parse_annotations(comment: Comment, dialect: str | None) -> list[Annotation | Finding]:
    """Every annotation (or annotation error) in ``comment``, one per line, in order."""
    found: list[Annotation | Finding] = []
    for number, (column, line) in enumerate(_lines(comment)):
        lead = _LEAD.match(line).end()
        word = _FIRST_WORD.match(line, lead)
        if word is None or word.group().lower() != "normguard":
            continue
        body = line[lead:].rstrip()
        span = _line_span(comment, number, column + lead, len(body))
        try:
            if not body.startswith(_MARKER):
                raise _Malformed(
                    f"annotations start with '{_MARKER}' in lower case followed by a colon, "
                    f"then one of {', '.join(VERBS)}; read {body[:40]!r}"
                )
            found.append(_parse_body(body[len(_MARKER):], span, dialect))
        except _Malformed as error:
            found.append(Finding("annotation-error", "error", span, str(error)))
    return found


def _lines(comment: Comment) -> list[tuple[int, str]]:
    """(column of the line's first character, text) for each line of the comment's text."""
    lines = _LINE_BREAK.split(comment.text)
    first_column = comment.span.column + _opener_width(comment)
    return [(first_column if n == 0 else 1, line) for n, line in enumerate(lines)]


def _opener_width(comment: Comment) -> int:
    """Length of the comment's opening delimiter (``--``, ``/*``, ``#``) from its span."""
    if comment.span.line == comment.span.end_line:
        width = comment.span.end_column - comment.span.column - len(comment.text)
        if width >= 4:  # /* ... */ or {# ... #}
            return 2
        if width in (1, 2):  # # ... or -- ...
            return width
    return 2


def _line_span(comment: Comment, number: int, column: int, width: int) -> Span:
    """The span of ``width`` characters from ``column`` on the comment's line ``number``."""
    line = comment.span.line + number
    return Span(comment.span.path, line, column, line, column + width)


def _parse_body(text: str, span: Span, dialect: str | None) -> Annotation:
    """Parse what follows ``normguard:``."""
    verb_match = re.match(r"\s*(\S+?)(?=\s|:|$)", text)
    verb = verb_match.group(1) if verb_match else ""
    rest = text[verb_match.end():] if verb_match else ""
    if verb == "fd":
        return _parse_fd(rest, span, dialect)
    if verb == "allow":
        return _parse_allow(rest, span)
    if verb == "split-from":
        return _parse_split_from(rest, span, dialect)
    if not verb:
        raise _Malformed(f"empty annotation: expected one of {', '.join(VERBS)} after 'normguard:'")
    raise _Malformed(f"unknown annotation {verb!r}: expected one of {', '.join(VERBS)}")


def _parse_allow(text: str, span: Span) -> Allow:
    """``rule-id[, rule-id]: reason``."""
    rules_text, colon, reason = text.partition(":")
    rules = tuple(part.strip() for part in rules_text.split(","))
    if not rules_text.strip():
        raise _Malformed("allow annotation names no rule: write 'normguard: allow rule-id: <reason>'")
    bad = [rule for rule in rules if not _RULE_ID.fullmatch(rule)]
    if bad:
        raise _Malformed(
            f"allow annotation: {bad[0] or 'an empty name'!r} is not a rule id "
            "(lower-case words joined by dashes, separated by commas)"
        )
    if not colon or not reason.strip():
        shape = f"normguard: allow {', '.join(rules)}: <why this is fine>"
        raise _Malformed(f"allow annotation needs a reason: write '{shape}'")
    return Allow(rules, reason.strip(), span)


def _tokens(text: str, dialect: str | None, what: str) -> list[Token]:
    """The dialect's tokens for the annotation text."""
    try:
        return get_dialect(dialect).tokenize(text)
    except TokenError:
        raise _Malformed(f"{what} annotation: unterminated quoted name") from None


def _name(token: Token, dialect: str | None) -> bool:
    """True when the token can stand for a name (plain word, keyword or quoted identifier)."""
    if token.token_type in _QUOTED_STRING:
        quote = "`" if dialect and get_dialect(dialect).tokenizer_class.IDENTIFIERS[0] == "`" else '"'
        raise _Malformed(f"{token.text!r} is a string in this dialect, not a name: quote names with {quote}")
    return token.token_type == TokenType.IDENTIFIER or bool(re.fullmatch(r"[A-Za-z_][\w$#@]*", token.text))


def _written(text: str, tokens: list[Token]) -> str:
    """The text the tokens were read from, quotes included."""
    return text[tokens[0].start : tokens[-1].end + 1]


def _table(text: str, tokens: list[Token], dialect: str | None, what: str) -> tuple[str, str]:
    """(catalog key, as written) of a possibly qualified table name made of ``tokens``."""
    if not tokens:
        raise _Malformed(f"{what} annotation: the table name is missing")
    for i, token in enumerate(tokens):
        expected_dot = i % 2 == 1
        misplaced = expected_dot != (token.token_type == TokenType.DOT)
        if misplaced or (not expected_dot and not _name(token, dialect)):
            raise _Malformed(f"{what} annotation: {_written(text, tokens)!r} is not a table name")
    if tokens[-1].token_type == TokenType.DOT:
        raise _Malformed(f"{what} annotation: {_written(text, tokens)!r} is not a table name")
    written = _written(text, tokens)
    return parse_table_name(written, dialect or ""), written


def _columns(
    text: str, tokens: list[Token], dialect: str | None, side: str
) -> tuple[tuple[str, ...], tuple[str, ...]]:
    """(folded, as written) column names of one side of an fd: ``a, b``."""
    if not tokens:
        raise _Malformed(f"fd annotation: the {side} side of '->' is empty; expected {_FD_SHAPE}")
    folded, written = [], []
    for i, token in enumerate(tokens):
        if i % 2 == 1:
            if token.token_type != TokenType.COMMA:
                raise _Malformed(
                    f"fd annotation: expected ',' between column names on the {side} side, "
                    f"read {token.text!r}; expected {_FD_SHAPE}"
                )
            continue
        if not _name(token, dialect):
            raise _Malformed(f"fd annotation: {token.text!r} is not a column name; expected {_FD_SHAPE}")
        folded.append(fold_column(token_identifier(token), dialect or ""))
        written.append(text[token.start : token.end + 1])
    if tokens[-1].token_type == TokenType.COMMA:
        raise _Malformed(f"fd annotation: a column name is missing after the last ',' on the {side} side")
    return tuple(folded), tuple(written)


def _parse_fd(text: str, span: Span, dialect: str | None) -> FdAnnotation:
    """``[table:] a, b -> c, d``."""
    tokens = _tokens(text, dialect, "fd")
    arrows = [i for i, token in enumerate(tokens) if token.token_type == TokenType.ARROW]
    if len(arrows) != 1:
        problem = "no '->'" if not arrows else "more than one '->'"
        raise _Malformed(f"fd annotation has {problem}: expected {_FD_SHAPE}")
    left, right = tokens[: arrows[0]], tokens[arrows[0] + 1 :]
    colons = [i for i, token in enumerate(left) if token.token_type == TokenType.COLON]
    table = written_table = None
    if colons:
        if len(colons) > 1:
            raise _Malformed(f"fd annotation has more than one ':' before '->': expected {_FD_SHAPE}")
        table, written_table = _table(text, left[: colons[0]], dialect, "fd")
        left = left[colons[0] + 1 :]
    lhs, lhs_written = _columns(text, left, dialect, "left")
    rhs, rhs_written = _columns(text, right, dialect, "right")
    return FdAnnotation(table, lhs, rhs, span, written_table, lhs_written, rhs_written)


def _parse_split_from(text: str, span: Span, dialect: str | None) -> SplitFromAnnotation:
    """``old_table``."""
    tokens = _tokens(text, dialect, "split-from")
    if not tokens:
        raise _Malformed("split-from annotation: name the original table: 'normguard: split-from old_table'")
    table, written = _table(text, tokens, dialect, "split-from")
    return SplitFromAnnotation(table, span, written)
