"""``missing-key``: a table with no primary key and no unique key over NOT NULL columns.

>>> from linter.model import Catalog, Column, Span, Table
>>> span = Span("db/001.sql", 1, 14, 1, 21)
>>> table = Table("parcels", span, [Column("tag", "TEXT", True, span)])
>>> [f.message for f in check(Context(Catalog({"parcels": table}), {}))]
['parcels has no primary key and no unique key over NOT NULL columns, so it can hold duplicate rows']
"""
from __future__ import annotations

from collections.abc import Iterator

from linter.model import Finding, Table
from linter.rule import Context, Rule
from rules import read_page

ID = "missing-key"


def check(context: Context) -> Iterator[Finding]:
    """One finding per table without a key, at its CREATE TABLE; a keyless parent speaks for its partitions."""
    tables = context.catalog.tables
    for table in tables.values():
        parent = tables.get(table.partition_of) if table.partition_of else None
        if not table.keys and (parent is None or parent.keys):
            yield Finding(
                ID,
                RULE.severity,
                table.span,
                f"{table.name} has no primary key and no unique key over NOT NULL columns,"
                " so it can hold duplicate rows",
                table.name,
                explanation=_explanation(table, _partitions(tables, table)),
            )


def _partitions(tables: dict[str, Table], parent: Table) -> list[str]:
    """The keyless tables attached to ``parent`` as partitions, which share its finding."""
    return [t.name for t in tables.values() if t.partition_of == parent.name and t is not parent and not t.keys]


def _explanation(table: Table, partitions: list[str]) -> list[str]:
    """Why the uniques it has do not count, and what to declare instead."""
    lines = []
    if partitions:
        shown = ", ".join(partitions[:3]) + (f" and {len(partitions) - 3} more" if len(partitions) > 3 else "")
        lines.append(f"its partitions ({shown}) have no key either and are not reported one by one:"
                     " a key declared here reaches each of them")
    if table.partition_of:
        lines.append(f"it is a partition of {table.partition_of} but carries none of its keys:"
                     " a partition lacking a key column cannot take the key")
    for unique in table.uniques:
        columns = ", ".join(unique.columns)
        if unique.partial:
            lines.append(f"{unique.source} ({columns}) has a WHERE clause: it covers some rows only")
        elif unique.expression:
            lines.append(f"{unique.source} ({columns}) is over an expression, not plain columns")
        elif table.is_nullable_unique(unique):
            lines.append(f"{unique.source} ({columns}) allows NULLs, and NULLs never collide")
    lines.append("declare the columns that identify a row as PRIMARY KEY, or add a surrogate key")
    return lines


RULE = Rule(ID, "warning", "A table has no primary key and no unique key over NOT NULL columns.",
            read_page(ID), check)
