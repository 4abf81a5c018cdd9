"""``nullable-unique``: a UNIQUE over plain columns that allow NULL, so it is not a key.

>>> from linter.model import Catalog, Column, Span, Table, Unique
>>> at = Span("db/002.sql", 3, 5, 3, 20)
>>> columns = [Column("rider_id", "INT", False, at), Column("badge_no", "TEXT", True, at)]
>>> keys = [Unique(("rider_id",), "primary key", at), Unique(("badge_no",), "unique constraint", at)]
>>> table = Table("riders", at, columns, keys)
>>> [f.message for f in check(Context(Catalog({"riders": table}), {}))]
['unique constraint (badge_no) of riders is not a key: badge_no allows NULL, and NULLs never collide']
"""
from __future__ import annotations

from collections.abc import Iterator

from linter.model import Finding, Table, Unique
from linter.rule import Context, Rule
from rules import read_page

ID = "nullable-unique"


def check(context: Context) -> Iterator[Finding]:
    """One finding per nullable unique rule whose columns do not already contain a key."""
    dialect_for = context.settings.get("dialect_for", lambda path: "postgres")
    for table in context.catalog.tables.values():
        for unique in table.uniques:
            if table.is_nullable_unique(unique) and not _contains_key(table, unique):
                nullable = [c for c in unique.columns if _nullable(table, c)]
                yield Finding(
                    ID,
                    RULE.severity,
                    unique.span,
                    f"{unique.source} ({', '.join(unique.columns)}) of {table.name} is not a key:"
                    f" {', '.join(nullable)} {'allows' if len(nullable) == 1 else 'allow'} NULL,"
                    " and NULLs never collide",
                    table.name,
                    explanation=_fixes(nullable, dialect_for(unique.span.path)),
                    subject=",".join(unique.columns),
                )


def _nullable(table: Table, name: str) -> bool:
    """True when the column allows NULL (or is unknown, which the reader reports)."""
    column = table.column(name)
    return column is None or column.nullable


def _contains_key(table: Table, unique: Unique) -> bool:
    """True when a key's columns all belong to ``unique`` (``redundant-unique`` reports it)."""
    return any(set(key.columns) <= set(unique.columns) for key in table.keys)


def _fixes(nullable: list[str], dialect: str) -> list[str]:
    """How to make it a key in ``dialect``."""
    lines = [f"if every row has a value, declare {', '.join(nullable)} NOT NULL"]
    if dialect == "postgres":
        lines.append("on PostgreSQL 15 and later, UNIQUE NULLS NOT DISTINCT allows one NULL at most")
    if dialect == "tsql":
        # SQL Server's UNIQUE admits a single NULL (from memory), yet a key column should be NOT NULL
        lines.append("SQL Server admits one NULL here, but normguard counts only NOT NULL keys")
    lines.append("if many rows may lack a value, say so: a unique index WHERE ... IS NOT NULL")
    return lines


RULE = Rule(
    ID, "warning", "A UNIQUE constraint or index covers a nullable column, so it is not a key.", read_page(ID), check
)
