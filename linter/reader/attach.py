"""Annotation comments and config dependencies attached to the tables they speak about.

An annotation in a comment directly above a CREATE TABLE, or inside its parentheses, belongs to
that table; anywhere else it must name its table (``normguard: fd couriers: depot -> city``). An
annotation naming a table or column that does not exist at that point of the replay is an
``annotation-error`` at the annotation's own line: nothing is silently ignored.

>>> from linter.model import Catalog, Column, Span, Table
>>> span = Span("normguard.yaml", 4, 3, 4, 20)
>>> state = ReplayState(Catalog())
>>> state.catalog.tables["couriers"] = Table("couriers", span, [Column("depot", "TEXT", True, span)])
>>> attach_config(state, {"couriers": [Dependency(("depot",), ("city",), span, "config")]}, "postgres")
>>> [f.message for f in state.catalog.findings]
['dependency on couriers names missing column(s) city']
"""
from __future__ import annotations

from collections.abc import Iterable, Mapping, Sequence

from linter.model import Allow, Dependency, Finding, Span, Table
from linter.reader.annotations import (
    FdAnnotation,
    SplitFromAnnotation,
    parse_annotations,
)
from linter.reader.names import parse_column_name, parse_table_name
from linter.reader.script import Comment
from linter.reader.splits import declare
from linter.reader.state import ReplayState


def _error(state: ReplayState, span: Span, message: str, table: str | None = None) -> None:
    """Report an annotation that cannot be applied, at its own span."""
    state.report("annotation-error", "error", message, span, table)


def attach_comments(state: ReplayState, comments: Iterable[Comment], host: str | None) -> None:
    """Apply every annotation among ``comments``; ``host`` is the table a CREATE TABLE declares."""
    for comment in comments:
        for found in parse_annotations(comment, state.dialect):
            if isinstance(found, Finding):
                state.catalog.findings.append(found)
            elif isinstance(found, SplitFromAnnotation):
                _split_from(state, found, host)
            elif isinstance(found, FdAnnotation):
                table = _target(state, "fd", found.table or host, found.span)
                if table is not None:
                    _add_dependency(state, table, Dependency(found.lhs, found.rhs, found.span, "annotation"))
            elif isinstance(found, Allow):
                table = _target(state, "allow", host, found.span)
                if table is not None:
                    table.allows.append(found)


def _target(state: ReplayState, kind: str, name: str | None, span: Span) -> Table | None:
    """The table an annotation speaks about: the one it names, else the CREATE TABLE it sits on."""
    if name is None:
        message = ("this fd annotation is not above or inside a CREATE TABLE, so it must name its table: "
                   "normguard: fd <table>: a -> b") if kind == "fd" else \
            "an allow annotation belongs above or inside the CREATE TABLE of the table it is about"
        _error(state, span, message)
        return None
    table = state.table(name)
    if table is None:
        _error(state, span, f"{kind} annotation names table {name}, which does not exist at this point", name)
    return table


def _add_dependency(state: ReplayState, table: Table, dependency: Dependency) -> None:
    """Store a declared dependency after checking that its columns exist."""
    missing = state.missing(table, dependency.lhs + dependency.rhs)
    if missing:
        _error(state, dependency.span,
               f"dependency on {table.name} names missing column(s) {', '.join(missing)}", table.name)
        return
    table.dependencies.append(dependency)


def _split_from(state: ReplayState, annotation: SplitFromAnnotation, host: str | None) -> None:
    """``split-from T`` on a CREATE TABLE: record the declared split."""
    piece = state.table(host) if host is not None else None
    if piece is None:
        _error(state, annotation.span, "a split-from annotation belongs above or inside a CREATE TABLE")
    elif not declare(state, piece, annotation.table, state.span):
        _error(state, annotation.span,
               f"split-from names table {annotation.table}, which does not exist at this point", host)


def attach_config(state: ReplayState, dependencies: Mapping[str, Sequence[Dependency]], dialect: str) -> None:
    """Attach config-declared dependencies to the final tables (errors point into the config file)."""
    for name, declared in dependencies.items():
        key = parse_table_name(name, dialect)
        table = state.table(key)
        for dependency in declared:
            if table is None:
                message = f"configured dependency names table {key}, which does not exist"
                _error(state, dependency.span, message, key)
                continue
            lhs = tuple(parse_column_name(c, dialect) for c in dependency.lhs)
            rhs = tuple(parse_column_name(c, dialect) for c in dependency.rhs)
            _add_dependency(state, table, Dependency(lhs, rhs, dependency.span, "config"))
