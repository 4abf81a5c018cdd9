"""Column lineage of data-moving statements: CREATE TABLE ... AS SELECT, INSERT INTO ... SELECT.

For each target column the lineage names the source column it was copied from (``SELECT old_x AS
x``, ``INSERT INTO p (x) SELECT old_x FROM t``, ``SELECT DISTINCT``, ``SELECT *`` expanded from the
catalog), or None when the value is an expression, an aggregate, or comes from a join, a union or a
subquery. Every catalog table the query reads is recorded as feeding the target (``state.feeds``),
which is what ``splits`` later looks at.

>>> from linter.model import Catalog
>>> from linter.reader.ddl import create_table
>>> from linter.reader.sources import Source
>>> from linter.reader.statements import split_file
>>> sql = ("CREATE TABLE couriers (id INT, depot_city TEXT);\\n"
...        "CREATE TABLE depots AS SELECT DISTINCT depot_city AS city, upper(depot_city) AS code FROM couriers;")
>>> create, move = split_file(Source("db/003.sql", sql), "postgres").statements
>>> state = ReplayState(Catalog())
>>> for statement, handler in ((create, create_table), (move, create_from_query)):
...     state.begin_statement(statement)
...     _ = handler(state, statement.expression)
>>> state.feeds[0].lineage
{'city': 'depot_city', 'code': None}
"""
from __future__ import annotations

from dataclasses import dataclass

from sqlglot import exp

from linter.model import Column, Table
from linter.reader.names import fold_column, table_name
from linter.reader.state import Feed, ReplayState

Projection = tuple[str, str | None]


@dataclass(frozen=True)
class QueryLineage:
    """The tables a query reads and, per output column, its name and the source column (or None)."""

    sources: list[Table]
    columns: list[Projection] | None  # None when the output columns cannot be known (``*`` of a join)
    origin: Table | None  # the one catalog table of a single-table query


def query_lineage(state: ReplayState, query: exp.Expression) -> QueryLineage:
    """Trace each output column of a SELECT back to a column of its single source table."""
    sources = _sources(state, query)
    origin = _single_source(state, query)
    if not isinstance(query, exp.Select):
        if any(_is_star(p) for p in query.selects):
            return QueryLineage(sources, None, None)
        return QueryLineage(sources, [(_output_name(state, p), None) for p in query.selects], None)
    table = origin[0] if origin is not None and state.table(origin[0].name) is origin[0] else None
    columns: list[Projection] = []
    for projection in query.expressions:
        if _is_star(projection):
            if origin is None:
                return QueryLineage(sources, None, None)
            columns += [(name, name if table else None) for name in origin[0].column_names]
        else:
            columns.append((_output_name(state, projection), _traced(state, projection, origin)))
    return QueryLineage(sources, columns, table)


def _sources(state: ReplayState, query: exp.Expression) -> list[Table]:
    """The catalog tables a query reads, once each, in order of appearance."""
    found: list[Table] = []
    for node in query.find_all(exp.Table):
        table = state.table(table_name(node, state.dialect))
        if table is not None and all(table is not seen for seen in found):
            found.append(table)
    return found


def _single_source(state: ReplayState, query: exp.Expression) -> tuple[Table, set[str]] | None:
    """The one catalog table a plain SELECT reads (no join, CTE or subquery) and the names it goes by."""
    if not isinstance(query, exp.Select) or query.args.get("joins") or query.args.get("with_"):
        return None
    source = query.args.get("from_")
    node = source.this if isinstance(source, exp.From) else None
    if not isinstance(node, exp.Table):
        return None
    table = state.relation(table_name(node, state.dialect))
    if table is None:
        return None
    names = {"", node.name, table.name, table.name.rpartition(".")[2]}
    if node.alias:
        names.add(node.alias)
    return table, names


def _is_star(projection: exp.Expression) -> bool:
    """True for ``*`` and ``t.*``."""
    inner = projection.this if isinstance(projection, exp.Column) else projection
    return isinstance(inner, exp.Star)


def _output_name(state: ReplayState, projection: exp.Expression) -> str:
    """The column name a projection produces, folded; unnamed ones as PostgreSQL names them."""
    node = projection.args.get("alias") if isinstance(projection, exp.Alias) else projection
    if isinstance(node, exp.Column):
        node = node.this
    if isinstance(node, exp.Identifier):
        return fold_column(node, state.dialect)
    if isinstance(node, exp.Anonymous):
        return node.name.lower()
    return node.sql_name().lower() if isinstance(node, exp.Func) else "?column?"


def _traced(state: ReplayState, projection: exp.Expression, origin: tuple[Table, set[str]] | None) -> str | None:
    """The source column a projection copies unchanged, or None."""
    inner = projection.this if isinstance(projection, exp.Alias) else projection
    if origin is None or not isinstance(inner, exp.Column) or not isinstance(inner.this, exp.Identifier):
        return None
    table, names = origin
    if inner.table not in names or state.table(table.name) is not table:
        return None  # another table, or a view: not a column of a catalog table
    name = fold_column(inner.this, state.dialect)
    return name if table.column(name) is not None else None


def _record(state: ReplayState, sources: list[Table], target: Table, lineage: dict[str, str | None]) -> None:
    """Remember that ``target`` was filled from each source table by the current statement."""
    for source in sources:
        if source is not target:
            traced = lineage if len(sources) == 1 else {column: None for column in lineage}
            state.feeds.append(Feed(source, target, traced, state.span, state.order))


def _target(state: ReplayState, node: exp.Expression) -> tuple[exp.Expression, list[str]]:
    """The table node of ``t`` or ``t (a, b)``, and the column names listed (folded)."""
    if not isinstance(node, exp.Schema):
        return node, []
    return node.this, [fold_column(i, state.dialect) for i in node.expressions if isinstance(i, exp.Identifier)]


def create_view(state: ReplayState, create: exp.Create) -> bool:
    """Remember a view's column names (None: unknown) for ``SELECT * FROM v``; the view itself is skipped."""
    target, listed = _target(state, create.this)
    query = create.expression
    if isinstance(target, exp.Table) and isinstance(query, exp.Query):
        name, span = table_name(target, state.dialect), state.span_of(target)
        names = listed or [output for output, _ in query_lineage(state, query).columns or []]
        state.views[name] = Table(name, span, [Column(n, "", True, span) for n in names]) if names else None
    return False


def insert_select(state: ReplayState, insert: exp.Insert) -> bool:
    """INSERT INTO t [(cols)] SELECT ...: record lineage (INSERT ... VALUES is skipped)."""
    query = insert.expression
    if not isinstance(query, exp.Query):
        return False
    table_node, listed = _target(state, insert.this)
    if not isinstance(table_node, exp.Table):
        return False
    target = state.table(table_name(table_node, state.dialect))
    if target is None:
        return True
    found = query_lineage(state, query)
    names = listed or list(target.column_names)
    if found.columns is None:
        lineage: dict[str, str | None] = {name: None for name in names}
    else:
        lineage = {name: source for name, (_, source) in zip(names, found.columns)}
    _record(state, found.sources, target, lineage)
    return True


def create_from_query(state: ReplayState, create: exp.Create | exp.Select) -> bool:
    """CREATE TABLE ... AS SELECT (and T-SQL SELECT ... INTO): a new table, columns traced."""
    if isinstance(create, exp.Select):
        target_node, listed = _target(state, create.args["into"].this)
        query = create.copy()
        query.set("into", None)
    else:
        target_node, listed = _target(state, create.this)
        query = create.expression
    if_not_exists = bool(create.args.get("exists"))
    if not isinstance(target_node, exp.Table) or not isinstance(query, exp.Query):
        return False
    name = table_name(target_node, state.dialect)
    if state.table(name) is not None:
        if not if_not_exists:
            state.conflict(f"table {name} already exists", name)
        return True
    found = query_lineage(state, query)
    projections = found.columns or []
    names = listed or [output for output, _ in projections]
    sources = [source for _, source in projections] + [None] * max(0, len(names) - len(projections))
    table = Table(name, state.span_of(target_node))
    for column, source in zip(names, sources):
        origin = found.origin.column(source) if found.origin is not None and source else None
        table.columns.append(Column(column, origin.type if origin else "", True, table.span))
    state.catalog.tables[name] = table
    if found.columns is None and not listed:
        state.open_tables.append(table)
    state.event(table, "created", f"created from a query with columns {', '.join(table.column_names)}")
    _record(state, found.sources, table, dict(zip(names, sources)))
    return True
