"""Identifier folding: how a dialect resolves the names a statement writes.

Unquoted names fold as the dialect folds them (sqlglot's normalization strategy), quoted names keep
their case. A table's catalog key is its qualified name as written-and-folded ("billing.invoices"),
except that the dialect's default schema is dropped: ``public.x`` is ``x`` in postgres, ``dbo.x``
is ``x`` in tsql and ``main.x`` is ``x`` in sqlite, because dumps qualify every name while
migrations do not, and both mean the same table.

>>> from sqlglot import exp
>>> table_name(exp.to_table('public."Couriers"', dialect="postgres"), "postgres")
'Couriers'
>>> table_name(exp.to_table("Billing.Invoices", dialect="postgres"), "postgres")
'billing.invoices'
>>> column_name(exp.to_column("Depot", dialect="postgres"), "postgres")
'depot'
"""
from __future__ import annotations

from sqlglot import exp
from sqlglot.dialects.dialect import Dialect
from sqlglot.tokens import Token, TokenType

DEFAULT_SCHEMAS: dict[str, str] = {"postgres": "public", "tsql": "dbo", "sqlite": "main"}
# MySQL column and index names are case-insensitive on every platform while table names follow
# the file system (MySQL manual, "Identifier Case Sensitivity"; from memory): fold the former.
_CASE_INSENSITIVE_COLUMNS: frozenset[str] = frozenset({"mysql"})


def token_identifier(token: Token) -> exp.Identifier:
    """The identifier a name token stands for (quoted when written in quotes)."""
    return exp.Identifier(this=token.text, quoted=token.token_type == TokenType.IDENTIFIER)


def fold(identifier: exp.Identifier, dialect: str) -> str:
    """The name ``identifier`` resolves to in ``dialect`` (unquoted names folded)."""
    return Dialect.get_or_raise(dialect).normalize_identifier(identifier.copy()).name


def fold_column(identifier: exp.Identifier, dialect: str) -> str:
    """A column or index name as ``dialect`` resolves it."""
    name = fold(identifier, dialect)
    return name.lower() if dialect in _CASE_INSENSITIVE_COLUMNS else name


def table_name(table: exp.Table, dialect: str) -> str:
    """The catalog key of a table reference: folded parts joined by dots, default schema dropped."""
    parts = [part for part in table.parts if isinstance(part, exp.Identifier)]
    names = [fold(part, dialect) for part in parts]
    if len(names) == 2 and names[0] == DEFAULT_SCHEMAS.get(dialect):
        names = names[1:]
    return ".".join(names)


def schema_of(name: str) -> str:
    """The schema part of a catalog key ('' for an unqualified name)."""
    return name.rpartition(".")[0]


def column_name(node: exp.Expression, dialect: str) -> str | None:
    """The column a list item names (Identifier, Column, Ordered(Column), COLLATE), None for an expression."""
    if isinstance(node, exp.Ordered):
        node = node.this
    if isinstance(node, exp.Collate):  # unique under a collation implies unique as stored
        node = node.this
    if isinstance(node, exp.Column) and not node.table and isinstance(node.this, exp.Identifier):
        node = node.this
    if isinstance(node, exp.Identifier):
        return fold_column(node, dialect)
    return None


def parse_table_name(text: str, dialect: str) -> str:
    """The catalog key of a table name given as text (annotations, configuration)."""
    return table_name(exp.to_table(text.strip(), dialect=dialect), dialect)


def parse_column_name(text: str, dialect: str) -> str:
    """A column name given as text, folded as the dialect folds it (quotes keep its case)."""
    column = exp.to_column(text.strip(), dialect=dialect)
    return fold_column(column.this, dialect) if isinstance(column.this, exp.Identifier) else text


def implied_name(dialect: str, table: str, kind: str, columns: tuple[str, ...], ordinal: int = 1) -> str | None:
    """The name the database gives an unnamed constraint, so a later DROP CONSTRAINT finds it.

    PostgreSQL: ``<table>_pkey``, ``<table>_<cols>_key``, ``<table>_<cols>_fkey``, the longer part
    cut first to fit 63 characters; MySQL: ``PRIMARY``, a unique key named after its first column,
    the ``ordinal``-th foreign key ``<table>_ibfk_<ordinal>`` (from memory of both databases).
    """
    bare = table.rpartition(".")[2]
    if dialect == "postgres":
        label = {"primary key": "pkey", "unique constraint": "key", "foreign key": "fkey"}[kind]
        return _postgres_name(bare, "" if kind == "primary key" else "_".join(columns), label)
    if dialect == "mysql":
        names = {"primary key": "PRIMARY", "foreign key": f"{bare}_ibfk_{ordinal}"}
        return names.get(kind, columns[0] if columns else None)
    return None


def _postgres_name(first: str, second: str, label: str) -> str:
    """PostgreSQL's ``first_second_label``, shortening the longer of the two names until it fits."""
    room = 63 - len(label) - 1 - (1 if second else 0)
    a, b = len(first), len(second)
    while a + b > room:
        if a > b:
            a -= 1
        else:
            b -= 1
    return "_".join(part for part in (first[:a], second[:b], label) if part)
