"""CREATE TABLE sketches for the pieces of a proposed decomposition, clearly marked as a proposal.

>>> from linter.analysis import analyse
>>> from linter.model import Column, Dependency, Span, Table, Unique
>>> at = Span("db/001.sql", 1, 1, 1, 9)
>>> table = Table("couriers", at, [Column("courier_id", "INT", False, at), Column("depot", "TEXT", False, at),
...               Column("city", "TEXT", True, at)], [Unique(("courier_id",), "primary key", at)],
...               dependencies=[Dependency(("depot",), ("city",), at, "annotation")])
>>> analysis = analyse(table, "bcnf")
>>> print("\\n".join(ddl_sketch(analysis, analysis.bcnf)[len(CAUTION):]))
<BLANKLINE>
CREATE TABLE couriers_by_depot (
    depot TEXT NOT NULL,
    city TEXT,
    PRIMARY KEY (depot)
);
<BLANKLINE>
CREATE TABLE couriers (
    courier_id INT NOT NULL,
    depot TEXT NOT NULL,
    PRIMARY KEY (courier_id)
);
"""
from __future__ import annotations

from linter.analysis import TableAnalysis
from linter.dependencies import Decomposition

CAUTION: tuple[str, ...] = (
    "-- PROPOSAL ONLY, not a migration: normguard never applies SQL.",
    "-- Generated migrations can destroy data. Review this, back up the data and test the",
    "-- change (tables, data copy, constraints, foreign keys) on a copy before applying it.",
)


def _column(analysis: TableAnalysis, name: str, in_key: bool) -> str:
    """One column line: the original type, NOT NULL when the original had it or a key needs it."""
    column = analysis.table.column(name)
    kind = column.type if column is not None and column.type else "text"
    not_null = in_key or (column is not None and not column.nullable)
    return f"    {name} {kind}{' NOT NULL' if not_null else ''}"


def ddl_sketch(analysis: TableAnalysis, decomposition: Decomposition) -> list[str]:
    """The caution, then one CREATE TABLE per piece with its first key primary, the others unique."""
    names = analysis.attributes
    lines = list(CAUTION)
    for title, piece in zip(analysis.piece_names(decomposition), decomposition.pieces):
        keys = [names.to_names(key) for key in piece.keys]
        key_columns = {column for key in keys[:1] for column in key}
        body = [_column(analysis, column, column in key_columns) for column in names.to_names(piece.attrs)]
        body += [f"    PRIMARY KEY ({', '.join(keys[0])})"] if keys else []
        body += [f"    UNIQUE ({', '.join(key)})" for key in keys[1:]]
        lines += ["", f"CREATE TABLE {title} (", ",\n".join(body), ");"]
    return lines
