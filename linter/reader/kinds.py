"""What the leading words of a statement say about it: ``opaque_ddl``, ``cannot_change_tables`` ...

>>> from linter.reader.dialects import get_dialect
>>> tokens = get_dialect("postgres").tokenize("CREATE OR REPLACE FUNCTION f() RETURNS int")
>>> object_word(tokens, 0), cannot_change_tables(tokens), opaque_ddl(tokens), describe(tokens)
('FUNCTION', True, False, 'CREATE OR REPLACE FUNCTION')
>>> opaque_ddl(get_dialect("postgres").tokenize("ALTER TABLE depots ADD PRIMARY KEY (id)"))
True
"""
from __future__ import annotations

from collections.abc import Sequence

from sqlglot import exp
from sqlglot.tokens import Token

from linter.reader.nesting import nesting
from linter.reader.tokens import QUOTED_TOKENS, word

__all__ = [
    "CREATE_MODIFIERS",
    "STATEMENT_OBJECTS",
    "cannot_change_tables",
    "describe",
    "is_fragment",
    "names_object",
    "object_index",
    "object_word",
    "opaque_ddl",
]

CREATE_MODIFIERS = frozenset(
    {"OR", "REPLACE", "ALTER", "UNIQUE", "CLUSTERED", "NONCLUSTERED", "TEMP", "TEMPORARY", "GLOBAL",
     "LOCAL", "UNLOGGED", "EDITIONABLE", "NONEDITIONABLE", "MATERIALIZED", "RECURSIVE", "FORCE"}
)
"""Words between CREATE (or ALTER, DROP) and the kind of object it makes."""
STATEMENT_OBJECTS = frozenset(
    {"TABLE", "INDEX", "VIEW", "SEQUENCE", "TYPE", "SCHEMA", "TRIGGER", "FUNCTION", "PROCEDURE",
     "PROC", "DOMAIN", "EXTENSION", "DATABASE"}
)
"""Object kinds whose CREATE/ALTER/DROP starts a new statement even without a ``;`` before it."""
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


def object_index(tokens: Sequence[Token], i: int) -> int:
    """The index of the object kind after the CREATE/ALTER/DROP at ``i``, past modifiers (-1: none)."""
    for k in range(i + 1, min(i + 6, len(tokens))):
        if word(tokens[k]) not in CREATE_MODIFIERS:
            return k
    return -1


def object_word(tokens: Sequence[Token], i: int) -> str:
    """The object kind after the CREATE/ALTER/DROP at ``i``, past modifiers ('' when none)."""
    k = object_index(tokens, i)
    return word(tokens[k]) if k >= 0 else ""


def names_object(tokens: Sequence[Token], i: int) -> bool:
    """True when the keyword at ``i`` is followed (after modifiers) by an object kind."""
    return object_word(tokens, i) in STATEMENT_OBJECTS


def cannot_change_tables(tokens: Sequence[Token]) -> bool:
    """True for functions, triggers, views, grants, queries ...: nothing that shapes a table."""
    head = word(tokens[0])
    if head in ("CREATE", "ALTER", "DROP"):
        return object_word(tokens, 0) in _NO_TABLE_OBJECTS
    if head in ("BEGIN", "DECLARE"):  # a block runs now: it matters if it touches a table
        return not any(
            word(token) in ("CREATE", "ALTER", "DROP") and object_word(tokens, i) in ("TABLE", "INDEX")
            for i, token in enumerate(tokens)
        )
    return head in _NO_TABLE_STATEMENTS


def opaque_ddl(tokens: Sequence[Token]) -> bool:
    """True for CREATE TABLE, CREATE UNIQUE INDEX, ALTER TABLE ... ADD/DROP/RENAME/ATTACH/DETACH, RENAME TABLE."""
    words = [word(t) for t in tokens[:8]]
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
        levels, _ = nesting(tokens)
        for i in range(2, len(tokens)):
            action = word(tokens[i]) in ("ADD", "DROP", "RENAME", "ATTACH", "DETACH")
            if action and levels[i][0] == 0 and not _adds_check_or_default(tokens, i):
                return True
    return False


def _adds_check_or_default(tokens: Sequence[Token], i: int) -> bool:
    """True at ``ADD [CONSTRAINT name] CHECK|DEFAULT``: a rule or a T-SQL default, no key depends on it."""
    words = [word(t) for t in tokens[i : i + 4]]
    kinds = (["CHECK"], ["DEFAULT"])
    return words[0] == "ADD" and (words[1:2] in kinds or (words[1:2] == ["CONSTRAINT"] and words[3:4] in kinds))


def is_fragment(expression: exp.Expression) -> bool:
    """A root that is no statement (``END`` parsed as a column ...): left by a body cut at ``;``."""
    if isinstance(expression, exp.EndStatement):
        return True
    return isinstance(expression, (exp.Condition, exp.Alias)) and not isinstance(expression, exp.Query)


def describe(tokens: Sequence[Token]) -> str:
    """The leading keywords of a statement, for messages (``CREATE UNIQUE INDEX``)."""
    words: list[str] = []
    for token in tokens[:4]:
        if token.token_type in QUOTED_TOKENS or not token.text.replace("_", "").isalpha():
            break
        words.append(token.text.upper())
        if words[-1] in STATEMENT_OBJECTS or words[0] not in ("CREATE", "ALTER", "DROP"):
            break
    return " ".join(words) or "this"
