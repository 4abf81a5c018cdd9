"""CREATE TABLE, CREATE UNIQUE INDEX, DROP TABLE and DROP INDEX replayed onto the catalog.

Each handler returns True when it understood the statement (False: the replay counts it skipped).
A unique index is a key only over plain columns without WHERE; otherwise it is kept flagged
``expression`` or ``partial`` so rules can still talk about it.

>>> from linter.model import Catalog
>>> from linter.reader.sources import Source
>>> from linter.reader.statements import split_file
>>> sql = "CREATE TABLE depots (id INT PRIMARY KEY, city TEXT);"
>>> [statement] = split_file(Source("db/001.sql", sql), "postgres").statements
>>> state = ReplayState(Catalog())
>>> state.begin_statement(statement)
>>> create_table(state, statement.expression)
True
>>> [(u.source, u.columns, u.span.column) for u in state.catalog.tables["depots"].keys]
[('primary key', ('id',), 22)]
"""
from __future__ import annotations

from sqlglot import exp

from linter.model import Table, Unique
from linter.reader.constraints import column_spec, table_constraints
from linter.reader.names import column_name, fold_column, schema_of, table_name
from linter.reader.partitions import create_partition, inherit_columns, share_keys
from linter.reader.state import ReplayState
from linter.reader.tables import add_column, add_constraints


def create_table(state: ReplayState, create: exp.Create) -> bool:
    """Add the table a CREATE TABLE with a column list (or PostgreSQL's PARTITION OF) declares."""
    properties = create.args.get("properties")
    partition_of = properties.find(exp.PartitionedOfProperty) if properties is not None else None
    if partition_of is not None:
        return create_partition(state, create, partition_of)
    schema = create.this
    if not isinstance(schema, exp.Schema) or not isinstance(schema.this, exp.Table):
        return False
    name = table_name(schema.this, state.dialect)
    if state.table(name) is not None:
        if not create.args.get("exists"):
            state.conflict(f"table {name} already exists", name)
        return True
    table = Table(name, state.span_of(schema.this))
    state.catalog.tables[name] = table
    items = list(schema.expressions)
    for item in items:
        if isinstance(item, exp.ColumnDef):
            add_column(state, table, column_spec(item, state.dialect))
    inherit_columns(state, table, create)
    for item in items:
        if not isinstance(item, exp.ColumnDef):
            add_constraints(state, table, table_constraints(item, state.dialect))
    state.event(table, "created", f"created with columns {', '.join(table.column_names)}")
    return True


def create_index(state: ReplayState, create: exp.Create) -> bool:
    """Record a CREATE UNIQUE INDEX on its table (plain indexes are not keys and are skipped)."""
    index = create.this
    if not create.args.get("unique") or not isinstance(index, exp.Index):
        return False
    target = index.args.get("table")
    params = index.args.get("params")
    if not isinstance(target, exp.Table) or params is None:
        return False
    name = table_name(target, state.dialect)
    table = state.table(name)
    if table is None and name in state.views:
        return False  # an index on a materialized view: no key of a table
    if table is None:
        state.conflict(f"unique index on table {name}, which does not exist", name)
        return True
    index_name = fold_column(index.this, state.dialect) if isinstance(index.this, exp.Identifier) else None
    if create.args.get("exists") and any(u.name == index_name for u in table.uniques):
        return True
    items = list(params.args.get("columns") or [])
    columns = [column_name(item, state.dialect) for item in items]
    missing = state.missing(table, columns)
    if missing:
        state.conflict(f"unique index on {name} names missing column(s) {', '.join(missing)}", name)
        return True
    plain = tuple(c for c in columns if c is not None)
    plain += tuple(c for item in items for c in _expression_columns(item, table, state.dialect) if c not in plain)
    unique = Unique(plain, "unique index", state.span_of(index), index_name,
                    partial=params.args.get("where") is not None, expression=None in columns)
    table.uniques.append(unique)
    flags = " (partial)" * unique.partial + " (expression)" * unique.expression
    state.event(table, "altered", f"added unique index {index_name or ''} ({', '.join(plain)}){flags}")
    share_keys(state, table)
    return True


def _expression_columns(item: exp.Expression, table: Table, dialect: str) -> list[str]:
    """Columns an expression item of an index reads (``lower(label)``, MySQL prefix ``email(191)``)."""
    if column_name(item, dialect) is not None:
        return []
    node = item.this if isinstance(item, exp.Ordered) else item
    found = [fold_column(c.this, dialect) for c in node.find_all(exp.Column) if isinstance(c.this, exp.Identifier)]
    if isinstance(node, exp.Anonymous) and table.column(fold_column(exp.to_identifier(node.name), dialect)):
        found.append(fold_column(exp.to_identifier(node.name), dialect))
    return [c for c in dict.fromkeys(found) if table.column(c) is not None]


def drop(state: ReplayState, statement: exp.Drop) -> bool:
    """DROP TABLE (several names, IF EXISTS) and DROP INDEX; DROP VIEW and other DROPs are skipped."""
    kind = (statement.args.get("kind") or "").upper()
    targets = [t for t in statement.args.get("tables") or [] if isinstance(t, exp.Table)]
    if kind == "TABLE":
        for target in targets:
            drop_table(state, table_name(target, state.dialect), bool(statement.args.get("exists")))
        return True
    if kind == "VIEW":
        for target in targets:
            state.views.pop(table_name(target, state.dialect), None)
        return False
    if kind == "INDEX":
        on = statement.args.get("cluster")
        owner = table_name(on.this, state.dialect) if isinstance(on, exp.OnProperty) else None
        for target in targets:
            drop_index(state, table_name(target, state.dialect), owner)
        return True
    return False


def drop_table(state: ReplayState, name: str, if_exists: bool) -> None:
    """Drop one table, keeping its last state in ``catalog.dropped``."""
    table = state.table(name)
    if table is None:
        if not if_exists:
            state.conflict(f"DROP TABLE of {name}, which does not exist", name)
        return
    state.shrink(table)
    state.event(table, "dropped", f"dropped table {name}")
    del state.catalog.tables[name]
    state.catalog.dropped.append(table)


def drop_index(state: ReplayState, qualified: str, owner: str | None) -> None:
    """Remove the unique rule a dropped index name stands for (unknown names are plain indexes).

    ``qualified`` is the index name with its schema; T-SQL's old ``table.index`` form is tried too.
    """
    schema, _, index_name = qualified.rpartition(".")
    if owner is not None:
        candidates = [state.table(owner)]
    else:
        candidates = [t for t in state.catalog.tables.values() if schema_of(t.name) == schema]
        candidates += [state.table(schema)] if schema else []
    for table in candidates:
        if table is not None and remove_unique(state, table, index_name):
            return


def remove_unique(state: ReplayState, table: Table, name: str) -> bool:
    """Drop the non-primary unique rule called ``name`` from ``table``; False when there is none."""
    found = next((u for u in table.uniques if u.name == name and not u.is_primary), None)
    if found is None:
        return False
    table.uniques.remove(found)
    state.event(table, "altered", f"dropped {found.source} {name} ({', '.join(found.columns)})")
    share_keys(state, table)
    return True
