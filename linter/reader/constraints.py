"""Keys, foreign keys and checks out of sqlglot's constraint nodes, whatever shape the dialect gives.

The same constraint comes out of sqlglot in several shapes: ``PrimaryKey(expressions)`` (postgres),
``UniqueColumnConstraint(this=Schema(this=name, expressions=[Column]))`` (MySQL ``UNIQUE KEY``),
and in T-SQL a ``Constraint`` holding a bare ``PrimaryKeyColumnConstraint`` beside a
``ClusteredColumnConstraint(this=[Ordered(Column)])``. This module turns every shape into one
plain description; ``ddl`` checks it against the table and records it.

>>> import sqlglot
>>> create = sqlglot.parse_one("CREATE TABLE t (a INT, b INT, CONSTRAINT k UNIQUE (a, b))")
>>> [(spec.source, spec.name, spec.columns) for spec in table_constraints(create.this.expressions[2], "postgres")]
[('unique constraint', 'k', ('a', 'b'))]
"""
from __future__ import annotations

from dataclasses import dataclass

from sqlglot import exp

from linter.reader.names import column_name, fold_column, table_name


@dataclass(frozen=True)
class KeySpec:
    """A PRIMARY KEY or UNIQUE as written; a None column is an expression item."""

    columns: tuple[str | None, ...]
    source: str  # "primary key" or "unique constraint"
    name: str | None
    node: exp.Expression


@dataclass(frozen=True)
class ForeignKeySpec:
    """A FOREIGN KEY / REFERENCES as written (``ref_columns`` empty when the DDL names none)."""

    columns: tuple[str, ...]
    ref_table: str
    ref_columns: tuple[str, ...]
    name: str | None
    node: exp.Expression


@dataclass(frozen=True)
class CheckSpec:
    """A CHECK constraint, kept as its SQL text."""

    text: str


Spec = KeySpec | ForeignKeySpec | CheckSpec
_SIDE_LISTS = (exp.ClusteredColumnConstraint, exp.NonClusteredColumnConstraint)


def _items(node: exp.Expression | list | None) -> list[exp.Expression]:
    """The column-list items held by a Schema, a (Non)Clustered constraint or a plain list."""
    if isinstance(node, list):
        return node
    if isinstance(node, exp.Schema):
        return list(node.expressions)
    if isinstance(node, _SIDE_LISTS):
        return _items(node.this)
    return []


def _columns(items: list[exp.Expression], dialect: str) -> tuple[str | None, ...]:
    """Column names of a list, None for each expression item."""
    return tuple(column_name(item, dialect) for item in items)


def _name(node: exp.Expression | None, dialect: str) -> str | None:
    """A constraint or index name, folded."""
    return fold_column(node, dialect) if isinstance(node, exp.Identifier) else None


def reference(ref: exp.Reference, dialect: str) -> tuple[str, tuple[str, ...]]:
    """The referenced table and columns of a REFERENCES clause."""
    target = ref.this
    if isinstance(target, exp.Schema):
        columns = tuple(c for c in _columns(_items(target), dialect) if c is not None)
        return table_name(target.this, dialect), columns
    return table_name(target, dialect), ()


def _key(node: exp.Expression, outer: exp.Expression, name: str | None, dialect: str) -> KeySpec | None:
    """A key from a PrimaryKey / PrimaryKeyColumnConstraint / UniqueColumnConstraint inside ``outer``.

    ``outer`` is the table-level item (a named ``Constraint`` or the node itself): its span is the
    key's, and T-SQL keeps the column list in a (Non)Clustered sibling inside it.
    """
    if isinstance(node, exp.PrimaryKey):
        return KeySpec(_columns(list(node.expressions), dialect), "primary key", name, outer)
    source = "primary key" if isinstance(node, exp.PrimaryKeyColumnConstraint) else "unique constraint"
    inner = node.this if isinstance(node, exp.UniqueColumnConstraint) else None
    items = _items(inner)
    if isinstance(inner, exp.Schema) and inner.this is not None:
        name = name or _name(inner.this, dialect)
    if not items and isinstance(outer, exp.Constraint):
        side = next((s for s in outer.expressions if isinstance(s, _SIDE_LISTS)), None)
        items = _items(side)
    if not items:
        return None
    return KeySpec(_columns(items, dialect), source, name, outer)


def table_constraints(node: exp.Expression, dialect: str) -> list[Spec]:
    """The constraints a table-level item (or an ALTER TABLE ADD item) declares."""
    name: str | None = None
    parts: list[exp.Expression] = [node]
    if isinstance(node, exp.Constraint):
        name = _name(node.this, dialect)
        parts = list(node.expressions)
    specs: list[Spec] = []
    for part in parts:
        if isinstance(part, (exp.PrimaryKey, exp.PrimaryKeyColumnConstraint, exp.UniqueColumnConstraint)):
            key = _key(part, node, name, dialect)
            if key is not None:
                specs.append(key)
        elif isinstance(part, exp.ForeignKey):
            columns = tuple(c for c in _columns(list(part.expressions), dialect) if c is not None)
            ref = part.args.get("reference")
            ref_table, ref_columns = reference(ref, dialect) if ref is not None else ("", ())
            specs.append(ForeignKeySpec(columns, ref_table, ref_columns, name, node))
        elif isinstance(part, exp.CheckColumnConstraint):
            specs.append(CheckSpec(node.sql(dialect=dialect)))
    return specs


@dataclass(frozen=True)
class ColumnSpec:
    """A column definition: name, type text, nullability and its inline constraints."""

    name: str
    type: str
    nullable: bool | None  # None when the definition says neither NULL nor NOT NULL
    constraints: tuple[Spec, ...]
    node: exp.ColumnDef


def column_spec(coldef: exp.ColumnDef, dialect: str) -> ColumnSpec:
    """Read one column definition with its inline PRIMARY KEY / UNIQUE / REFERENCES / CHECK."""
    name = fold_column(coldef.this, dialect)
    kind = coldef.args.get("kind")
    nullable: bool | None = None
    specs: list[Spec] = []
    for constraint in coldef.constraints:
        kind_node = constraint.args.get("kind")
        cname = _name(constraint.this, dialect)
        if isinstance(kind_node, exp.NotNullColumnConstraint):
            nullable = bool(kind_node.args.get("allow_null"))
        elif isinstance(kind_node, exp.PrimaryKeyColumnConstraint):
            specs.append(KeySpec((name,), "primary key", cname, coldef.this))
            nullable = False
        elif isinstance(kind_node, exp.UniqueColumnConstraint):
            specs.append(KeySpec((name,), "unique constraint", cname, coldef.this))
        elif isinstance(kind_node, exp.Reference):
            ref_table, ref_columns = reference(kind_node, dialect)
            specs.append(ForeignKeySpec((name,), ref_table, ref_columns, cname, coldef.this))
        elif isinstance(kind_node, exp.CheckColumnConstraint):
            specs.append(CheckSpec(constraint.sql(dialect=dialect)))
    type_text = kind.sql(dialect=dialect) if kind is not None else ""
    return ColumnSpec(name, type_text, nullable, tuple(specs), coldef)
