"""PostgreSQL partitions and inheritance: which columns and keys a child table takes from its parent.

A partition (``CREATE TABLE c PARTITION OF p ...`` or ``ALTER TABLE p ATTACH PARTITION c ...``)
carries every primary key and unique rule of its partitioned table: an index on a partitioned table
is made on its existing partitions and on every later one, or matched to one the partition has
(PostgreSQL commit "Local partitioned indexes", pgsql-hackers 2017, and the ALTER TABLE ATTACH
PARTITION reference). A key the parent gains after ``ALTER TABLE ONLY`` still reaches them: a dump
follows it with one ``ALTER INDEX ... ATTACH PARTITION`` per partition (pgsql-hackers, July 2023).
``DETACH PARTITION`` takes the copies away again. A child of ``INHERITS (p)`` takes the parent's
columns but none of its keys (PostgreSQL manual, "Inheritance": check and not-null constraints are
inherited, unique, primary key and foreign key constraints are not; quoted on pgsql-novice, 2009).

>>> from linter.model import Catalog, Column, Span, Table, Unique
>>> span = Span("db/001.sql", 1, 1, 1, 2)
>>> state = ReplayState(Catalog())
>>> crossings = Table("crossings", span, [Column("sailed_on", "date", False, span)])
>>> crossings.uniques.append(Unique(("sailed_on",), "primary key", span, "crossings_pkey"))
>>> june = Table("crossings_june", span, [Column("sailed_on", "date", False, span)])
>>> state.catalog.tables.update(crossings=crossings, crossings_june=june)
>>> attach(state, "crossings", "crossings_june", span, False)
>>> [(u.name, u.columns, u.inherited_from) for u in june.keys], june.partition_of
([('crossings_pkey', ('sailed_on',), 'crossings')], 'crossings')
"""
from __future__ import annotations

from dataclasses import replace

from sqlglot import exp

from linter.model import Column, Event, Span, Table, Unique
from linter.reader.constraints import table_constraints
from linter.reader.names import table_name
from linter.reader.state import ReplayState
from linter.reader.tables import add_constraints, set_nullable


def create_partition(state: ReplayState, create: exp.Create, of: exp.PartitionedOfProperty) -> bool:
    """``CREATE TABLE c PARTITION OF p [(constraints)] FOR VALUES ...``: p's columns and keys."""
    if not isinstance(create.this, exp.Table):
        return False
    schema = of.this if isinstance(of.this, exp.Schema) else None
    target = schema.this if schema is not None else of.this
    if not isinstance(target, exp.Table):
        return False
    name, parent_name = table_name(create.this, state.dialect), table_name(target, state.dialect)
    if state.table(name) is not None:
        if not create.args.get("exists"):
            state.conflict(f"table {name} already exists", name)
        return True
    parent = state.table(parent_name)
    if parent is None:
        state.conflict(f"{name} is declared a partition of {parent_name}, which does not exist", name)
        return True
    table = Table(name, state.span_of(create.this), list(parent.columns), partition_of=parent.name)
    state.catalog.tables[name] = table
    for item in schema.expressions if schema is not None else []:
        if not isinstance(item, exp.ColumnDef):
            add_constraints(state, table, table_constraints(item, state.dialect))
    state.event(table, "created", f"created as a partition of {parent.name}, "
                                  f"with its columns {', '.join(table.column_names)}")
    _share(state, parent, table, table.span)
    return True


def inherit_columns(state: ReplayState, table: Table, create: exp.Create) -> None:
    """``INHERITS (p, ...)``: the parents' columns first, a same-named own column merged in; no keys."""
    properties = create.args.get("properties")
    inherits = properties.find(exp.InheritsProperty) if properties is not None else None
    if inherits is None:
        return
    inherited: dict[str, Column] = {}
    for target in inherits.expressions:
        parent_name = table_name(target, state.dialect) if isinstance(target, exp.Table) else ""
        parent = state.table(parent_name)
        if parent is None:
            state.conflict(f"{table.name} inherits from {parent_name}, which does not exist", table.name)
            continue
        for column in parent.columns:
            inherited.setdefault(column.name, column)
    own = {column.name: column for column in table.columns}
    merged = [replace(own[name], nullable=own[name].nullable and column.nullable) if name in own else column
              for name, column in inherited.items()]
    table.columns = merged + [column for column in table.columns if column.name not in inherited]


def attach(state: ReplayState, parent_name: str, name: str, span: Span, if_exists: bool) -> None:
    """``ALTER TABLE p ATTACH PARTITION c``: c takes p's keys; ``span`` is c's name in the statement."""
    parent, table = state.table(parent_name), state.table(name)
    if parent is None:
        if not if_exists:
            state.conflict(f"ATTACH PARTITION to {parent_name}, which does not exist", parent_name)
        return
    if table is None:
        state.conflict(f"ATTACH PARTITION of {name}, which does not exist", parent_name)
        return
    if table.partition_of is not None:
        state.conflict(f"ATTACH PARTITION of {name}, already a partition of {table.partition_of}", name)
        return
    if _above(state, parent, table):
        state.conflict(f"ATTACH PARTITION of {name} to {parent.name}, which is {name} or one of its partitions", name)
        return
    table.partition_of = parent.name
    table.history.append(Event("attached", f"attached as a partition of {parent.name}", span))
    state.event(parent, "altered", f"attached partition {name}")
    _share(state, parent, table, span)


def detach(state: ReplayState, parent_name: str, name: str, if_exists: bool, finalize: bool) -> None:
    """``ALTER TABLE p DETACH PARTITION c``: c keeps its columns and loses the keys it had from p."""
    parent, table = state.table(parent_name), state.table(name)
    if parent is None and if_exists:
        return
    if table is not None and finalize and table.partition_of is None:
        return  # FINALIZE completes a DETACH ... CONCURRENTLY already replayed
    if table is None or table.partition_of != parent_name:
        state.conflict(f"DETACH PARTITION of {name}, which is not a partition of {parent_name}", parent_name)
        return
    lost = [u for u in table.uniques if u.inherited_from == parent_name]
    table.uniques = [u for u in table.uniques if u.inherited_from != parent_name]
    table.partition_of = None
    share_keys(state, table)
    detail = "".join(f"; lost {u.source} ({', '.join(u.columns)})" for u in lost)
    state.event(table, "detached", f"detached from {parent_name}{detail}")
    if parent is not None:
        state.event(parent, "altered", f"detached partition {name}")


def share_keys(state: ReplayState, parent: Table) -> None:
    """Bring the copies of ``parent``'s unique rules on its partitions in line with the parent's own."""
    for table in list(state.catalog.tables.values()):
        if table.partition_of == parent.name and table is not parent:
            _share(state, parent, table, _joined_at(table))


def _above(state: ReplayState, parent: Table, table: Table) -> bool:
    """True when ``table`` is ``parent`` or a table ``parent`` is (through partitions) part of."""
    seen: set[str] = set()
    current: Table | None = parent
    while current is not None and current.name not in seen:
        if current is table:
            return True
        seen.add(current.name)
        current = state.table(current.partition_of) if current.partition_of else None
    return False


def _joined_at(table: Table) -> Span:
    """Where the partition joined its parent: its name in the last ATTACH, else in its CREATE TABLE."""
    return next((e.span for e in reversed(table.history) if e.action == "attached"), table.span)


def _share(state: ReplayState, parent: Table, table: Table, span: Span) -> None:
    """Give ``table`` a copy of each unique rule of ``parent`` it lacks; drop copies the parent lost."""
    before = len(table.uniques)
    table.uniques = [u for u in table.uniques if u.inherited_from != parent.name or _has(parent.uniques, u)]
    changed = len(table.uniques) != before
    copies = [u for u in table.uniques if u.inherited_from == parent.name]
    for unique in parent.uniques:
        if not _has(copies, unique) and _take(state, parent, table, unique, span):
            changed = True
    if changed:
        share_keys(state, table)  # a partition can be partitioned in turn


def _has(uniques: list[Unique], unique: Unique) -> bool:
    """True when ``uniques`` hold a rule of the same name, kind and columns as ``unique``."""
    return any((u.name, u.source, u.columns) == (unique.name, unique.source, unique.columns) for u in uniques)


def _take(state: ReplayState, parent: Table, table: Table, unique: Unique, span: Span) -> bool:
    """Copy one rule of the parent onto a partition; False when it has its own or lacks a column."""
    if any(set(u.columns) == set(unique.columns) and u.inherited_from is None for u in table.uniques):
        return False  # the partition's own index, which a dump attaches to the parent's
    missing = [c for c in unique.columns if table.column(c) is None]
    if missing:
        state.conflict(f"partition {table.name} of {parent.name} lacks column(s) {', '.join(missing)} "
                       f"of {unique.source} {unique.name or ''} ({', '.join(unique.columns)})", table.name)
        return False
    if unique.is_primary and any(u.is_primary for u in table.uniques):
        state.conflict(f"partition {table.name} has a primary key other than the one of {parent.name}", table.name)
        return False
    table.uniques.append(replace(unique, span=span, inherited_from=parent.name))
    if unique.is_primary:
        set_nullable(table, unique.columns, False)
    state.event(table, "altered", f"took {unique.source} {unique.name or ''} ({', '.join(unique.columns)}) "
                                  f"from {parent.name}")
    return True
