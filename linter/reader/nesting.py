"""Parenthesis and ``BEGIN ... END`` block depth before each token of a statement: ``nesting``.

>>> from linter.reader.dialects import get_dialect
>>> tokens = get_dialect("sqlite").tokenize("CREATE TRIGGER t AFTER INSERT ON a BEGIN SELECT (1); END")
>>> levels, open_blocks = nesting(tokens)
>>> [(t.text, levels[i]) for i, t in enumerate(tokens) if t.text in ("BEGIN", "(", ";", "END")]
[('BEGIN', (0, 0)), ('(', (0, 1)), (';', (0, 1)), ('END', (0, 1))]
>>> open_blocks
0
"""
from __future__ import annotations

from collections.abc import Sequence

from sqlglot.tokens import Token, TokenType

from linter.reader.tokens import word

__all__ = ["nesting"]

_NESTING = frozenset(
    {TokenType.SEMICOLON, TokenType.L_PAREN, TokenType.R_PAREN, TokenType.BEGIN, TokenType.END, TokenType.CASE}
)
_NON_BLOCK_AFTER_BEGIN = frozenset(
    {"TRANSACTION", "TRAN", "WORK", "DISTRIBUTED", "DEFERRED", "IMMEDIATE", "EXCLUSIVE",
     "ISOLATION", "READ", "NOT", "DEFERRABLE", ";"}
)
_END_OF_UNCOUNTED = frozenset({"IF", "LOOP", "WHILE", "REPEAT", "FOR"})


def nesting(tokens: Sequence[Token]) -> tuple[list[tuple[int, int]], int]:
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
            following = word(tokens[i + 1]) if i + 1 < len(tokens) else ";"
            if kind == TokenType.BEGIN and following not in _NON_BLOCK_AFTER_BEGIN:
                depth += 1
            elif kind == TokenType.CASE and depth:
                depth += 1
            elif kind == TokenType.END and depth:
                skip = following in _END_OF_UNCOUNTED or following == "CASE"
                if following not in _END_OF_UNCOUNTED:
                    depth -= 1
    return levels, depth
