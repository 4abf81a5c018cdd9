"""ALTER TABLE replayed action by action: columns, NOT NULL, constraints, renames.

Covers ADD / DROP / RENAME COLUMN, ALTER COLUMN SET / DROP NOT NULL and type changes (T-SQL
``ALTER COLUMN c INT NOT NULL`` too), MySQL MODIFY / CHANGE, ADD / DROP CONSTRAINT, DROP PRIMARY KEY,
MySQL DROP INDEX / DROP FOREIGN KEY and RENAME TO. Actions sqlglot leaves opaque are ignored.

>>> from linter.model import Catalog
>>> from linter.reader.ddl import create_table
>>> from linter.reader.sources import Source
>>> from linter.reader.statements import split_file
>>> sql = "CREATE TABLE ferries (id INT, name TEXT);\\nALTER TABLE ferries ADD CONSTRAINT ferry_name UNIQUE (name);"
>>> create, alter = split_file(Source("db/002.sql", sql), "postgres").statements
>>> state = ReplayState(Catalog())
>>> for statement, handler in ((create, create_table), (alter, alter_table)):
...     state.begin_statement(statement)
...     _ = handler(state, statement.expression)
>>> [(u.name, u.columns, u.span.line, state.catalog.tables["ferries"].is_nullable_unique(u))
...  for u in state.catalog.tables["ferries"].uniques]
[('ferry_name', ('name',), 2, True)]
"""
from __future__ import annotations

from dataclasses import replace

from sqlglot import exp

from linter.model import Table
from linter.reader.constraints import column_spec, table_constraints
from linter.reader.ddl import remove_unique
from linter.reader.names import fold_column, schema_of, table_name
from linter.reader.partitions import share_keys
from linter.reader.state import ReplayState
from linter.reader.tables import (
    add_column,
    add_constraints,
    drop_column,
    rename_column,
    rename_table,
    set_nullable,
)


def alter_table(state: ReplayState, alter: exp.Alter) -> bool:
    """Apply every action of an ALTER TABLE to its table."""
    if (alter.args.get("kind") or "").upper() != "TABLE" or not isinstance(alter.this, exp.Table):
        return False
    name = table_name(alter.this, state.dialect)
    table = state.table(name)
    if table is None:
        if not alter.args.get("exists"):
            state.conflict(f"ALTER TABLE of {name}, which does not exist", name)
        return True
    renamed = _column_rename_without_keyword(alter)
    if renamed is not None:
        _rename_column(state, table, *renamed)
        return True
    before = list(table.uniques)
    for action in alter.args.get("actions") or []:
        _action(state, table, action)
    if table.uniques != before:
        share_keys(state, table)  # a partitioned table's keys reach its partitions, even with ONLY
    return True


def _column_rename_without_keyword(alter: exp.Alter) -> tuple[exp.Expression, exp.Expression] | None:
    """PostgreSQL's ``RENAME old TO new`` (COLUMN left out), which sqlglot reads as a table rename + TO."""
    actions = alter.args.get("actions") or []
    options = alter.args.get("options") or []
    if len(actions) == 1 and isinstance(actions[0], exp.AlterRename) and len(options) == 1 \
            and isinstance(options[0], exp.ToTableProperty):
        old, new = actions[0].this, options[0].this
        if isinstance(old, exp.Table) and isinstance(new, exp.Table) and not old.db and not new.db:
            return old.this, new.this
    return None


def _action(state: ReplayState, table: Table, action: exp.Expression) -> None:
    """Dispatch one ALTER TABLE action."""
    if isinstance(action, exp.ColumnDef):
        _add_column(state, table, action)
    elif isinstance(action, exp.Drop):
        _drop(state, table, action)
    elif isinstance(action, exp.AlterColumn):
        _alter_column(state, table, action)
    elif isinstance(action, exp.ModifyColumn):
        _modify_column(state, table, action)
    elif isinstance(action, exp.RenameColumn) and action.args.get("to") is not None:
        _rename_column(state, table, action.this, action.args["to"])
    elif isinstance(action, exp.AlterRename):
        _rename_table(state, table, action)
    elif isinstance(action, exp.AddConstraint):
        specs = [spec for item in action.expressions for spec in table_constraints(item, state.dialect)]
        added = add_constraints(state, table, specs)
        if added:
            state.event(table, "altered", "added " + "; ".join(added))
    elif isinstance(action, exp.DropPrimaryKey):
        _drop_primary_key(state, table)


def _column(state: ReplayState, table: Table, identifier: exp.Expression, verb: str) -> str | None:
    """The folded column an action names, or None (and a conflict) when the table lacks it."""
    node = identifier.this if isinstance(identifier, exp.Column) else identifier
    name = fold_column(node, state.dialect)
    if state.missing(table, [name]):
        state.conflict(f"{verb} column {name} of {table.name}, which has no such column", table.name)
        return None
    return name


def _add_column(state: ReplayState, table: Table, coldef: exp.ColumnDef) -> None:
    """ADD COLUMN (IF NOT EXISTS) with its inline constraints."""
    spec = column_spec(coldef, state.dialect)
    if coldef.args.get("exists") and table.column(spec.name) is not None:
        return
    if add_column(state, table, spec):
        state.event(table, "altered", f"added column {spec.name}")


def _drop(state: ReplayState, table: Table, action: exp.Drop) -> None:
    """DROP COLUMN / CONSTRAINT / INDEX / FOREIGN KEY inside an ALTER TABLE."""
    kind = (action.args.get("kind") or "").upper()
    if_exists = bool(action.args.get("exists"))
    for target in action.args.get("tables") or []:
        node = target.this if isinstance(target, (exp.Column, exp.Table)) else target
        if not isinstance(node, exp.Identifier):
            continue
        if kind == "COLUMN":
            if if_exists and table.column(fold_column(node, state.dialect)) is None:
                continue
            name = _column(state, table, node, "DROP")
            if name is not None:
                state.shrink(table)
                drop_column(state, table, name)
        else:
            _drop_constraint(state, table, fold_column(node, state.dialect))


def _drop_constraint(state: ReplayState, table: Table, name: str) -> None:
    """Drop a key, unique rule or foreign key by name (unknown names: checks, system names)."""
    primary = next((u for u in table.uniques if u.is_primary and u.name == name), None)
    if primary is not None:
        table.uniques.remove(primary)
        state.event(table, "altered", f"dropped primary key {name} ({', '.join(primary.columns)})")
        return
    if remove_unique(state, table, name):
        return
    kept = [f for f in table.foreign_keys if f.name != name]
    if len(kept) != len(table.foreign_keys):
        table.foreign_keys = kept
        state.event(table, "altered", f"dropped foreign key {name}")


def _drop_primary_key(state: ReplayState, table: Table) -> None:
    """DROP PRIMARY KEY (its columns stay NOT NULL)."""
    primary = [u for u in table.uniques if u.is_primary]
    if not primary:
        state.conflict(f"DROP PRIMARY KEY of {table.name}, which has none", table.name)
        return
    table.uniques = [u for u in table.uniques if not u.is_primary]
    state.event(table, "altered", f"dropped primary key ({', '.join(primary[0].columns)})")


def _alter_column(state: ReplayState, table: Table, action: exp.AlterColumn) -> None:
    """ALTER COLUMN: SET / DROP NOT NULL, a new type, T-SQL's ``ALTER COLUMN c INT [NOT] NULL``."""
    name = _column(state, table, action.this, "ALTER")
    if name is None:
        return
    dtype = action.args.get("dtype")
    if dtype is not None:
        table.columns = [replace(c, type=dtype.sql(dialect=state.dialect)) if c.name == name else c
                         for c in table.columns]
        state.event(table, "altered", f"changed type of {name}")
    allow_null = action.args.get("allow_null")
    if allow_null is not None:
        set_nullable(table, (name,), bool(allow_null))
        state.event(table, "altered", f"{name} {'DROP' if allow_null else 'SET'} NOT NULL")


def _modify_column(state: ReplayState, table: Table, action: exp.ModifyColumn) -> None:
    """MySQL MODIFY / CHANGE: the column is redefined (and renamed by CHANGE)."""
    coldef = action.this
    if not isinstance(coldef, exp.ColumnDef):
        return
    spec = column_spec(coldef, state.dialect)
    old = action.args.get("rename_from")
    current = _column(state, table, old if old is not None else coldef.this, "MODIFY")
    if current is None or (current != spec.name and not _renamed(state, table, current, spec.name)):
        return
    primary = any(u.is_primary and spec.name in u.columns for u in table.uniques)
    nullable = spec.nullable is not False and not primary
    table.columns = [replace(c, type=spec.type, nullable=nullable) if c.name == spec.name else c
                     for c in table.columns]
    add_constraints(state, table, spec.constraints)
    state.event(table, "altered", f"redefined column {spec.name}")


def _rename_column(state: ReplayState, table: Table, source: exp.Expression, target: exp.Expression) -> None:
    """RENAME COLUMN old TO new."""
    old = _column(state, table, source, "RENAME")
    if old is not None:
        _renamed(state, table, old, fold_column(target.this if isinstance(target, exp.Column) else target,
                                                state.dialect))


def _renamed(state: ReplayState, table: Table, old: str, new: str) -> bool:
    """Rename column ``old`` to ``new`` unless ``new`` is taken (a conflict); True when renamed."""
    if table.column(new) is not None:
        state.conflict(f"renaming column {old} to {new}: {table.name} already has {new}", table.name)
        return False
    rename_column(state, table, old, new)
    state.event(table, "altered", f"renamed column {old} to {new}")
    return True


def _rename_table(state: ReplayState, table: Table, action: exp.AlterRename) -> None:
    """RENAME TO: an unqualified new name stays in the table's schema."""
    target = action.this
    if not isinstance(target, exp.Table):
        return
    new = table_name(target, state.dialect)
    schema = schema_of(table.name)
    if schema and not schema_of(new):
        new = f"{schema}.{new}"
    if state.table(new) is not None:
        state.conflict(f"RENAME TO {new}: a table {new} already exists", table.name)
        return
    rename_table(state, table, new)
