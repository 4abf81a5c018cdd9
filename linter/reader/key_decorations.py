"""Words that decorate a key but change no key, which sqlglot cannot parse in some places.

``without_key_decorations`` returns the statement's tokens without them (the others keep their
positions), so a CREATE TABLE that failed only on them can be read again:

- T-SQL ``PRIMARY KEY NONCLUSTERED`` / ``UNIQUE CLUSTERED``: how the index is stored;
- SQLite ``ON CONFLICT REPLACE`` (and the other resolutions) after a constraint: what an insert does
  on a clash;
- ``ASC`` / ``DESC`` on a column of a ``PRIMARY KEY (...)`` or ``UNIQUE (...)`` list: the index order.

A quoted name is never one of these words: a column called ``"desc"`` stays in its key.

../shared/corpus/PARSE_REPORT.md (point 4) lists each as a failure that loses the whole table.

>>> from linter.reader.dialects import get_dialect
>>> from linter.reader.tokens import word
>>> sql = "CREATE TABLE t (a INT UNIQUE ON CONFLICT REPLACE, PRIMARY KEY (a DESC))"
>>> tokens = get_dialect("sqlite").tokenize(sql)
>>> " ".join(word(t) for t in without_key_decorations(tokens))
'CREATE TABLE T ( A INT UNIQUE , PRIMARY KEY ( A ) )'
"""
from __future__ import annotations

from collections.abc import Sequence

from sqlglot.tokens import Token

from linter.reader.tokens import QUOTED_TOKENS, word

_KEY_WORDS = ("PRIMARY KEY", "KEY", "UNIQUE")
_INDEX_KINDS = ("CLUSTERED", "NONCLUSTERED")
_CONFLICT_CLAUSES = [["CONFLICT", resolution] for resolution in ("ROLLBACK", "ABORT", "FAIL", "IGNORE", "REPLACE")]
"""``CONFLICT <resolution>`` for each SQLite resolution, to compare with a slice of words."""
_ORDERS = ("ASC", "DESC")


def without_key_decorations(tokens: Sequence[Token]) -> list[Token] | None:
    """The tokens without the decorations above, or None when the statement has none."""
    dropped: set[int] = set()
    words = ["" if token.token_type in QUOTED_TOKENS else word(token) for token in tokens]
    for i, current in enumerate(words):
        if current in _INDEX_KINDS and i and words[i - 1] in _KEY_WORDS:
            dropped.add(i)
        elif current == "ON" and words[i + 1 : i + 3] in _CONFLICT_CLAUSES:
            dropped.update((i, i + 1, i + 2))
        elif current in _ORDERS and _in_key_list(words, i):
            dropped.add(i)
    if not dropped:
        return None
    return [token for i, token in enumerate(tokens) if i not in dropped]


def _in_key_list(words: Sequence[str], i: int) -> bool:
    """True when word ``i`` sits directly in the parentheses after PRIMARY KEY, KEY or UNIQUE."""
    depth = 0
    for j in range(i - 1, -1, -1):
        if words[j] == ")":
            depth += 1
        elif words[j] == "(":
            if depth == 0:
                before = [w for w in words[max(0, j - 2) : j] if w not in _INDEX_KINDS]
                return bool(before) and before[-1] in _KEY_WORDS
            depth -= 1
    return False
