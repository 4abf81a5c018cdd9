"""A misspelt object kind after CREATE, ALTER or DROP, as a ``syntax-error``: ``unknown_object_kind``.

sqlglot keeps ``CREATE TABEL couriers (...)`` as an opaque command without complaint, so the
reader checks the word after CREATE/ALTER/DROP (past modifiers such as OR REPLACE, TEMPORARY or
UNIQUE) against the words the dialect accepts there, and names the nearest one when there is one.

>>> from linter.reader.dialects import get_dialect
>>> from linter.reader.line_index import LineIndex
>>> text = "CREATE TEMPORARY TABEL couriers (id int)"
>>> dialect = get_dialect("postgres")
>>> problem = unknown_object_kind(dialect.tokenize(text), dialect, LineIndex("db/001.sql", text))
>>> problem.message, problem.span.column, problem.span.end_column
('unknown object kind TABEL after CREATE TEMPORARY; did you mean TABLE?', 18, 23)
>>> unknown_object_kind(dialect.tokenize("CREATE EXTENSION ltree"), dialect, LineIndex("a.sql", "")) is None
True
"""
from __future__ import annotations

import difflib
import re
from collections.abc import Sequence
from functools import lru_cache

from sqlglot.dialects.dialect import Dialect
from sqlglot.tokens import Token, TokenType

from linter.model import Finding
from linter.reader.kinds import CREATE_MODIFIERS, object_index
from linter.reader.line_index import LineIndex
from linter.reader.tokens import QUOTED_TOKENS, word

__all__ = ["known_object_words", "unknown_object_kind"]

_HEADS = frozenset({"CREATE", "ALTER", "DROP"})
_PLAIN_WORD = re.compile(r"[A-Za-z_][A-Za-z0-9_]*")

# Words sqlglot's Parser._parse_create, _parse_drop and _parse_alter match by token type or text
# before the object kind (sqlglot 30.30 parser.py), whatever the dialect.
_SQLGLOT_HEAD_WORDS = frozenset(
    {"OR", "REPLACE", "ALTER", "REFRESH", "UNIQUE", "CLUSTERED", "NONCLUSTERED", "COLUMNSTORE",
     "MATERIALIZED", "ICEBERG", "TEMPORARY"}
)
_HEAD_TOKEN_TYPES = frozenset({TokenType.OR, TokenType.REPLACE, TokenType.UNIQUE, TokenType.TEMPORARY})

# The first word of the object kinds in the CREATE, ALTER and DROP statements of the PostgreSQL,
# MySQL/MariaDB, SQLite, SQL Server, Oracle and Db2 SQL references, plus a few warehouse engines
# sqlglot reads (from memory of those manuals, no copy). A word right in one engine is no
# misspelling in another: the list is one for all dialects, so the check never fires on DDL that
# is merely meant for another engine.
_DOCUMENTED_KINDS = frozenset(
    # PostgreSQL
    {"ACCESS", "AGGREGATE", "CAST", "COLLATION", "CONSTRAINT", "CONVERSION", "DATABASE", "DEFAULT",
     "DOMAIN", "EVENT", "EXTENSION", "FOREIGN", "FUNCTION", "GROUP", "INDEX", "LANGUAGE", "LARGE",
     "OPERATOR", "OWNED", "POLICY", "PROCEDURAL", "PROCEDURE", "PROPERTY", "PUBLICATION", "RECURSIVE",
     "ROLE", "ROUTINE", "RULE", "SCHEMA", "SEQUENCE", "SERVER", "STATISTICS", "SUBSCRIPTION",
     "SYSTEM", "TABLE", "TABLESPACE", "TEXT", "TRANSFORM", "TRIGGER", "TRUSTED", "TYPE", "USER",
     "VIEW", "GLOBAL", "LOCAL", "TEMP", "UNLOGGED"}
    # MySQL and MariaDB
    | {"ALGORITHM", "DEFINER", "FULLTEXT", "IGNORE", "INSTANCE", "LOGFILE", "OFFLINE", "ONLINE",
       "PACKAGE", "PREPARE", "RESOURCE", "SPATIAL", "SQL", "UNDO"}
    # SQLite
    | {"VIRTUAL"}
    # SQL Server
    | {"APPLICATION", "ASSEMBLY", "ASYMMETRIC", "AUTHORIZATION", "AVAILABILITY", "BROKER",
       "CERTIFICATE", "COLUMN", "CONTRACT", "CREDENTIAL", "CRYPTOGRAPHIC", "ENDPOINT", "EXTERNAL",
       "JSON", "LOGIN", "MASTER", "MESSAGE", "PARTITION", "PRIMARY", "PROC", "QUEUE", "REMOTE",
       "ROUTE", "SEARCH", "SECURITY", "SELECTIVE", "SERVICE", "SYMMETRIC", "SYNONYM", "VECTOR",
       "WORKLOAD", "XML"}
    # Oracle
    | {"ANALYTIC", "ATTRIBUTE", "AUDIT", "BIGFILE", "BITMAP", "BLOCKCHAIN", "BODY", "CLUSTER",
       "CONTEXT", "CONTROLFILE", "DIMENSION", "DIRECTORY", "DISKGROUP", "DUPLICATED", "EDITION",
       "EDITIONABLE", "EDITIONING", "FLASHBACK", "FORCE", "HIERARCHY", "IMMUTABLE", "INDEXTYPE",
       "JAVA", "LIBRARY", "LOCKDOWN", "MLE", "MULTIVALUE", "NOFORCE", "NONEDITIONABLE", "OUTLINE",
       "PFILE", "PLUGGABLE", "PRIVATE", "PROFILE", "PUBLIC", "RESTORE", "ROLLBACK", "SESSION",
       "SHARDED", "SHARED", "SMALLFILE", "SPFILE"}
    # Db2
    | {"ALIAS", "AUXILIARY", "BUFFERPOOL", "DISTINCT", "HISTOGRAM", "LOB", "MASK", "METHOD", "MODULE",
       "NICKNAME", "NODEGROUP", "PERMISSION", "REGULAR", "STOGROUP", "THRESHOLD", "USAGE", "VARIABLE",
       "WORK", "WRAPPER"}
    # Engines sqlglot reads as another dialect or has its own for: Snowflake, BigQuery, DuckDB,
    # Databricks, ClickHouse, CockroachDB and YugabyteDB (read as postgres)
    | {"ALERT", "CATALOG", "CHANGEFEED", "CONNECTION", "DICTIONARY", "DYNAMIC", "HYBRID", "INTEGRATION",
       "INVERTED", "LIVE", "MACRO", "MODEL", "NAMED", "NETWORK", "PIPE", "QUOTA", "ROW", "SECRET",
       "SECURE", "SETTINGS", "SHARE", "SNAPSHOT", "STAGE", "STREAM", "STREAMING", "TABLEGROUP", "TASK",
       "TRANSIENT", "VOLUME", "WAREHOUSE"}
)
# Linking words that stand where the kind would, never worth suggesting: Oracle's CREATE OR
# REPLACE AND COMPILE JAVA SOURCE, Db2 for z/OS's CREATE UNIQUE WHERE NOT NULL INDEX.
_LINKING_WORDS = frozenset({"AND", "WHERE"})


@lru_cache(maxsize=None)
def known_object_words(dialect_class: type[Dialect]) -> tuple[frozenset[str], frozenset[str]]:
    """(every word the dialect accepts right after CREATE/ALTER/DROP, the ones worth suggesting).

    From sqlglot: the keywords of the token types its parser creates, alters or drops
    (``CREATABLES``, ``ALTERABLES``) and the properties it reads before the object kind
    (``PROPERTY_PARSERS``, such as ``DEFINER=`` or ``SQL SECURITY``); then the documented kinds.
    Only kinds and modifiers are suggested, never a property such as ``TTL``.
    """
    parser, tokenizer = dialect_class.parser_class, dialect_class.tokenizer_class
    types = {*parser.CREATABLES, *parser.ALTERABLES, *_HEAD_TOKEN_TYPES}
    keywords = {text.split()[0] for text, kind in tokenizer.KEYWORDS.items() if kind in types}
    suggested = frozenset(keywords | _SQLGLOT_HEAD_WORDS | CREATE_MODIFIERS | _DOCUMENTED_KINDS)
    properties = {text.split()[0] for text in parser.PROPERTY_PARSERS}
    return suggested | properties | _LINKING_WORDS, suggested


def unknown_object_kind(tokens: Sequence[Token], dialect: Dialect, lines: LineIndex) -> Finding | None:
    """A ``syntax-error`` at the word after CREATE/ALTER/DROP when the dialect knows no such kind."""
    if not tokens or word(tokens[0]) not in _HEADS:
        return None
    at = object_index(tokens, 0)
    if at < 0:
        return None
    token, (known, suggested) = tokens[at], known_object_words(type(dialect))
    written = token.text
    if token.token_type in QUOTED_TOKENS or not _PLAIN_WORD.fullmatch(written) or written.upper() in known:
        return None
    head = " ".join(t.text for t in tokens[:at])
    message = f"unknown object kind {written} after {head}"
    nearest = difflib.get_close_matches(written.upper(), sorted(suggested), n=1)
    if nearest:
        hint = nearest[0].lower() if written.islower() else nearest[0]
        message += f"; did you mean {hint}?"
    return Finding("syntax-error", "error", lines.span(token.start, token.end + 1), message)
