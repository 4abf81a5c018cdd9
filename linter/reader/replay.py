"""Replay parsed migration files, statement by statement, into the schema catalog.

Each statement is dispatched on its sqlglot node; anything not about tables, keys or data moves
(views, functions, grants, plain indexes ...) is counted in ``statements_skipped``. A statement the
front half could only keep as opaque text although it would change keys becomes an
``unsupported-statement`` finding, and so does any unexpected error while replaying one statement:
the replay goes on with the next one.

>>> from linter.reader.sources import Source
>>> from linter.reader.statements import split_file
>>> text = "CREATE TABLE depots (id INT PRIMARY KEY, city TEXT);\\nCREATE VIEW v AS SELECT 1;\\n"
>>> script = split_file(Source("db/001.sql", text), "postgres")
>>> catalog = replay([ScriptFile("db/001.sql", "postgres", script)])
>>> sorted(catalog.tables), catalog.statements_read, catalog.statements_skipped
(['depots'], 2, 1)
"""
from __future__ import annotations

from collections.abc import Callable, Iterable, Mapping, Sequence
from dataclasses import dataclass
from typing import Any

from sqlglot import exp

from linter.model import Catalog, Dependency
from linter.reader.alter import alter_table
from linter.reader.attach import attach_comments, attach_config
from linter.reader.ddl import create_index, create_table, drop
from linter.reader.lineage import create_from_query, create_view, insert_select
from linter.reader.names import table_name
from linter.reader.recover import recover
from linter.reader.splits import finish_declared, finish_file
from linter.reader.state import ReplayState


@dataclass(frozen=True)
class ScriptFile:
    """One file's statements, with its path and the dialect it is read in."""

    path: str
    dialect: str
    script: Any  # linter.reader.script.Script


def replay(
    files: Iterable[ScriptFile],
    *,
    config_dependencies: Mapping[str, Sequence[Dependency]] | None = None,
    config_dialect: str = "postgres",
) -> Catalog:
    """The catalog after replaying every file in order, with the findings met on the way."""
    state = ReplayState(Catalog())
    for file in files:
        state.begin_file(file.path, file.dialect)
        state.catalog.findings.extend(file.script.findings)
        replayed = {id(statement) for statement in file.script.statements}
        everything = [*file.script.statements, *file.script.skipped]
        for statement in sorted(everything, key=lambda s: s.offset):
            if id(statement) in replayed:
                _replay_statement(state, statement)
            else:
                _skip_statement(state, statement)
        _annotate(state, file.script.trailing_comments, None)
        _guarded(state, "unsupported-statement", "working out the splits of this file", finish_file, state)
    _guarded(state, "unsupported-statement", "recording declared splits", finish_declared, state)
    _guarded(state, "annotation-error", "attaching configured dependencies", attach_config,
             state, config_dependencies or {}, config_dialect)
    return state.catalog


def _guarded(state: ReplayState, rule: str, doing: str, step: Callable[..., Any], *args: Any) -> Any:
    """Run one step of the replay; an unexpected error becomes a finding at the current statement.

    A bug or an odd tree must not stop the replay of everything else, nor reach the user as a
    traceback. Returns the step's result, or None after an error.
    """
    try:
        return step(*args)
    except Exception as error:
        severity = "error" if rule == "annotation-error" else "warning"
        reason = f"{type(error).__name__}: {error}"
        state.report(rule, severity, f"could not analyse: internal error while {doing} ({reason})")
        return None


def _replay_statement(state: ReplayState, statement: Any) -> None:
    """Apply one statement and its annotations; no exception escapes."""
    state.begin_statement(statement)
    state.catalog.statements_read += 1
    if not _guarded(state, "unsupported-statement", "replaying this statement", _apply, state, statement):
        state.catalog.statements_skipped += 1
    _annotate(state, statement.comments, _host(state, statement.expression))


def _annotate(state: ReplayState, comments: Any, host: str | None) -> None:
    """Apply the annotations among a statement's comments; no exception escapes."""
    _guarded(state, "annotation-error", "applying the annotations here", attach_comments, state, comments, host)


def _skip_statement(state: ReplayState, statement: Any) -> None:
    """Count a statement the front half set aside (functions, triggers ...); its annotations still count."""
    state.begin_statement(statement)
    state.catalog.statements_read += 1
    state.catalog.statements_skipped += 1
    _annotate(state, statement.comments, None)


_HANDLERS: tuple[tuple[type[exp.Expression], Callable[[ReplayState, Any], bool]], ...] = (
    (exp.Alter, alter_table),
    (exp.Drop, drop),
    (exp.Insert, insert_select),
)


def _apply(state: ReplayState, statement: Any) -> bool:
    """Dispatch a statement to its handler; False when it is skipped."""
    if statement.opaque:
        if recover(state, statement.text):
            return True
        first_line = statement.text.strip().splitlines()[0][:80] if statement.text.strip() else ""
        state.report("unsupported-statement", "warning",
                     f"could not analyse: the parser kept this statement as plain text ({first_line}); "
                     "its columns and keys are missing from the catalog")
        return False
    expression = statement.expression
    if isinstance(expression, exp.Create):
        kind = (expression.args.get("kind") or "").upper()
        if kind == "TABLE":
            return create_from_query(state, expression) if isinstance(expression.expression, exp.Query) \
                else create_table(state, expression)
        if kind == "VIEW":
            return create_view(state, expression)
        return kind.endswith("INDEX") and create_index(state, expression)
    if isinstance(expression, exp.Select) and expression.args.get("into") is not None:
        return create_from_query(state, expression)
    for node_type, handler in _HANDLERS:
        if isinstance(expression, node_type):
            return handler(state, expression)
    return False


def _host(state: ReplayState, expression: exp.Expression | None) -> str | None:
    """The table a CREATE TABLE statement declares (annotations on it belong to it), else None."""
    if not isinstance(expression, exp.Create) or (expression.args.get("kind") or "").upper() != "TABLE":
        return None
    target = expression.this.this if isinstance(expression.this, exp.Schema) else expression.this
    return table_name(target, state.dialect) if isinstance(target, exp.Table) else None
