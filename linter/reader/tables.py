"""Edits of one catalog table: columns, keys, foreign keys, renames, each checked and logged.

Every edit checks the statement against the table as replayed so far (a key over a missing column is
a ``schema-conflict``), and records what it did in the table's history.

>>> from linter.model import Catalog, Span, Table
>>> state = ReplayState(Catalog())
>>> table = Table("depots", Span("a.sql", 1, 1, 1, 2))
>>> table.columns.append(Column("city", "TEXT", True, table.span))
>>> rename_column(state, table, "city", "town")
>>> table.column_names
('town',)
"""
from __future__ import annotations

from dataclasses import replace

from linter.model import Column, Dependency, ForeignKey, Table, Unique
from linter.reader.constraints import (
    CheckSpec,
    ColumnSpec,
    ForeignKeySpec,
    KeySpec,
    Spec,
)
from linter.reader.names import implied_name
from linter.reader.state import ReplayState


def add_column(state: ReplayState, table: Table, spec: ColumnSpec) -> bool:
    """Add a column and its inline constraints; False (and a conflict) when it already exists."""
    if table.column(spec.name) is not None:
        state.conflict(f"table {table.name} already has a column {spec.name}", table.name)
        return False
    nullable = spec.nullable is not False
    table.columns.append(Column(spec.name, spec.type, nullable, state.span_of(spec.node.this)))
    add_constraints(state, table, spec.constraints)
    return True


def add_constraints(state: ReplayState, table: Table, specs: tuple[Spec, ...] | list[Spec]) -> list[str]:
    """Record keys, foreign keys and checks on ``table``; returns what was added, for history."""
    added: list[str] = []
    for spec in specs:
        if isinstance(spec, CheckSpec):
            table.checks.append(spec.text)
            added.append("check")
        elif isinstance(spec, KeySpec) and _add_key(state, table, spec):
            added.append(f"{spec.source} ({', '.join(c or '<expression>' for c in spec.columns)})")
        elif isinstance(spec, ForeignKeySpec) and _add_foreign_key(state, table, spec):
            added.append(f"foreign key ({', '.join(spec.columns)}) -> {spec.ref_table}")
    return added


def _lacks(state: ReplayState, table: Table, columns: tuple[str | None, ...], what: str) -> bool:
    """True (and a conflict) when a constraint names columns the table does not have."""
    missing = state.missing(table, columns)
    if missing:
        state.conflict(f"{what} of {table.name} names missing column(s) {', '.join(missing)}", table.name)
    return bool(missing)


def _add_key(state: ReplayState, table: Table, spec: KeySpec) -> bool:
    """Record a PRIMARY KEY / UNIQUE constraint (a primary key makes its columns NOT NULL)."""
    if _lacks(state, table, spec.columns, spec.source):
        return False
    if spec.source == "primary key" and any(u.is_primary for u in table.uniques):
        state.conflict(f"table {table.name} already has a primary key", table.name)
        return False
    columns = tuple(c for c in spec.columns if c is not None)
    name = spec.name or implied_name(state.dialect, table.name, spec.source, columns)
    expression = None in spec.columns
    table.uniques.append(Unique(columns, spec.source, state.span_of(spec.node), name, expression=expression))
    if spec.source == "primary key":
        set_nullable(table, columns, False)
    return True


def _add_foreign_key(state: ReplayState, table: Table, spec: ForeignKeySpec) -> bool:
    """Record a FOREIGN KEY / REFERENCES over existing columns."""
    if _lacks(state, table, spec.columns, "foreign key"):
        return False
    ordinal = 1 + sum(1 for f in table.foreign_keys if f.name and "_ibfk_" in f.name)
    name = spec.name or implied_name(state.dialect, table.name, "foreign key", spec.columns, ordinal)
    span = state.span_of(spec.node)
    table.foreign_keys.append(ForeignKey(spec.columns, spec.ref_table, spec.ref_columns, span, name))
    return True


def set_nullable(table: Table, columns: tuple[str, ...], nullable: bool) -> None:
    """Mark existing columns NULL or NOT NULL."""
    wanted = set(columns)
    table.columns = [replace(c, nullable=nullable) if c.name in wanted else c for c in table.columns]


def drop_column(state: ReplayState, table: Table, name: str) -> None:
    """Remove a column with the keys, foreign keys and declared dependencies that mention it."""
    table.columns = [c for c in table.columns if c.name != name]
    lost = [u for u in table.uniques if name in u.columns]
    table.uniques = [u for u in table.uniques if name not in u.columns]
    table.foreign_keys = [f for f in table.foreign_keys if name not in f.columns]
    gone = [d for d in table.dependencies if name in d.lhs + d.rhs]
    table.dependencies = [d for d in table.dependencies if name not in d.lhs + d.rhs]
    detail = f"dropped column {name}" + "".join(f"; lost {u.source} ({', '.join(u.columns)})" for u in lost)
    state.event(table, "altered", detail)
    for dependency in gone:
        lhs, rhs = ", ".join(dependency.lhs), ", ".join(dependency.rhs)
        state.event(table, "dependency dropped",
                    f"{lhs} -> {rhs} (declared at {dependency.span.gnu()}) mentions dropped column {name}")


def _renamed(columns: tuple[str, ...], old: str, new: str) -> tuple[str, ...]:
    """A column tuple with ``old`` renamed to ``new``."""
    return tuple(new if c == old else c for c in columns)


def rename_column(state: ReplayState, table: Table, old: str, new: str) -> None:
    """Rename a column everywhere the catalog mentions it: keys, foreign keys, dependencies."""
    table.columns = [replace(c, name=new) if c.name == old else c for c in table.columns]
    table.uniques = [replace(u, columns=_renamed(u.columns, old, new)) for u in table.uniques]
    table.foreign_keys = [replace(f, columns=_renamed(f.columns, old, new)) for f in table.foreign_keys]
    table.dependencies = [_rename_in_dependency(d, old, new) for d in table.dependencies]
    for other in state.catalog.tables.values():
        other.foreign_keys = [
            replace(f, ref_columns=_renamed(f.ref_columns, old, new)) if f.ref_table == table.name else f
            for f in other.foreign_keys
        ]


def _rename_in_dependency(dependency: Dependency, old: str, new: str) -> Dependency:
    """A declared dependency with a column renamed."""
    return replace(dependency, lhs=_renamed(dependency.lhs, old, new), rhs=_renamed(dependency.rhs, old, new))


def rename_table(state: ReplayState, table: Table, new: str) -> None:
    """Rename a table, and the references other tables hold to it."""
    old = table.name
    del state.catalog.tables[old]
    table.name = new
    state.catalog.tables[new] = table
    for other in state.catalog.tables.values():
        other.foreign_keys = [replace(f, ref_table=new) if f.ref_table == old else f for f in other.foreign_keys]
        other.uniques = [replace(u, inherited_from=new) if u.inherited_from == old else u for u in other.uniques]
        other.partition_of = new if other.partition_of == old else other.partition_of
    state.event(table, "renamed", f"renamed from {old} to {new}")
