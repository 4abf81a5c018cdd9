"""sqlglot dialects by name, and the tokenizer the reader uses for each: ``get_dialect``.

>>> type(get_dialect("postgres")).__name__, type(tokenizer_for(get_dialect("tsql"))).__name__
('Postgres', '_TSQLTokenizer')
>>> get_dialect("postgress")  # doctest: +ELLIPSIS
Traceback (most recent call last):
...
linter.reader.dialects.UnknownDialectError: unknown SQL dialect 'postgress'; known dialects: ...
"""
from __future__ import annotations

from functools import lru_cache

import sqlglot.dialects  # noqa: F401  (registers every dialect before names are listed)
from sqlglot.dialects.dialect import Dialect
from sqlglot.dialects.tsql import TSQL
from sqlglot.tokens import Tokenizer, TokenType

__all__ = ["UnknownDialectError", "get_dialect", "tokenizer_for"]


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


class _TSQLTokenizer(TSQL.Tokenizer):
    """sqlglot's T-SQL tokenizer, except that END does not swallow the text after it.

    sqlglot lists END among T-SQL's command words, so after ``BEGIN ...; END`` it reads everything
    up to the next ``;`` as one string: an ``IF ... BEGIN DROP TABLE t; END`` followed by
    ``CREATE TABLE t (...)`` would hide the table.
    """

    COMMANDS = TSQL.Tokenizer.COMMANDS - {TokenType.END}


def tokenizer_for(dialect: Dialect) -> Tokenizer:
    """A tokenizer for the dialect (T-SQL's with END as a plain keyword)."""
    if isinstance(dialect, TSQL):
        return _TSQLTokenizer(dialect=dialect)
    return dialect.tokenizer()
