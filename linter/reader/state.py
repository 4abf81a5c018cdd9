"""What the replay carries from statement to statement: the catalog, the statement at hand, data moves.

Each handler receives the one ``ReplayState`` and reads the current statement, dialect and file from
it, so a finding or an event always gets the span of the statement being replayed.

>>> state = ReplayState(Catalog())
>>> state.begin_file("db/001.sql", "postgres")
>>> state.dialect, state.path
('postgres', 'db/001.sql')
"""
from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass, field, replace
from typing import Any

from sqlglot import exp

from linter.model import Catalog, Column, Event, Finding, Span, Table


@dataclass
class Feed:
    """Rows copied from ``source`` into ``target`` by one statement, column by column."""

    source: Table
    target: Table
    lineage: dict[str, str | None]
    span: Span
    order: int


@dataclass
class Shrink:
    """A table dropped, or some of its columns dropped, with its state just before."""

    table: Table
    before: Table
    span: Span
    order: int


@dataclass
class Declaration:
    """A ``split-from`` annotation: the piece, and the original's state when the piece appeared."""

    piece: Table
    original: Table
    span: Span


@dataclass
class ReplayState:
    """The catalog being built and the context of the statement being replayed."""

    catalog: Catalog
    dialect: str = "postgres"
    path: str = ""
    statement: Any = None
    order: int = 0
    feeds: list[Feed] = field(default_factory=list)
    shrinks: list[Shrink] = field(default_factory=list)
    declarations: dict[str, list[Declaration]] = field(default_factory=dict)
    views: dict[str, Table | None] = field(default_factory=dict)  # views by name, None: columns unknown
    open_tables: list[Table] = field(default_factory=list)  # columns came from an untraceable SELECT *

    def begin_file(self, path: str, dialect: str) -> None:
        """Start replaying the statements of one file."""
        self.path, self.dialect, self.shrinks, self.statement = path, dialect, [], None
        self.catalog.files.append(path)

    def begin_statement(self, statement: Any) -> None:
        """Make ``statement`` the one findings and events point at."""
        self.statement = statement
        self.order += 1

    @property
    def span(self) -> Span:
        """The span of the statement being replayed (the file's first line before any statement)."""
        return self.statement.span if self.statement is not None else Span(self.path, 1, 1, 1, 1)

    def span_of(self, node: exp.Expression | None) -> Span:
        """The file span of a node of the current statement, the statement's own when unknown."""
        if node is None or self.statement is None:
            return self.span
        found = self.statement.span_of(node)
        return found if found is not None else self.span

    def text_span(self, start: int, end: int) -> Span:
        """The file span of ``text[start:end]`` of the current statement (its tokens read again)."""
        statement = self.statement
        if statement is None or statement.lines is None:
            return self.span
        return statement.lines.span(statement.offset + start, statement.offset + end)

    def report(self, rule: str, severity: str, message: str, span: Span | None = None,
               table: str | None = None) -> None:
        """Add a reader finding (at the current statement unless a span is given)."""
        self.catalog.findings.append(Finding(rule, severity, span or self.span, message, table))

    def conflict(self, message: str, table: str | None = None) -> None:
        """Report a statement that does not fit the schema replayed so far."""
        self.report("schema-conflict", "warning", message, table=table)

    def event(self, table: Table, action: str, detail: str) -> None:
        """Append a step to a table's history at the current statement."""
        table.history.append(Event(action, detail, self.span))

    def table(self, name: str) -> Table | None:
        """The live table called ``name``, or None."""
        return self.catalog.tables.get(name)

    def missing(self, table: Table, columns: Iterable[str | None]) -> list[str]:
        """The named columns ``table`` lacks; a table of unknown columns (``open_tables``) learns them."""
        absent = [c for c in dict.fromkeys(columns) if c is not None and table.column(c) is None]
        if absent and any(table is t for t in self.open_tables):
            table.columns += [Column(c, "", True, self.span) for c in absent]
            return []
        return absent

    def shrink(self, table: Table) -> None:
        """Note that ``table`` is about to be dropped or to lose columns, keeping its state now."""
        self.shrinks.append(Shrink(table, snapshot(table), self.span, self.order))

    def relation(self, name: str) -> Table | None:
        """The live table or the view called ``name``, or None."""
        return self.table(name) or self.views.get(name)

    def last_state(self, name: str) -> Table | None:
        """The live table called ``name``, else the last state of a dropped one."""
        live = self.table(name)
        if live is not None:
            return live
        return next((t for t in reversed(self.catalog.dropped) if t.name == name), None)


def snapshot(table: Table) -> Table:
    """A copy of a table that later statements cannot change."""
    lists = ("columns", "uniques", "foreign_keys", "checks", "dependencies", "allows", "history")
    return replace(table, **{name: list(getattr(table, name)) for name in lists})
