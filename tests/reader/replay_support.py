"""Helpers for the replay tests: read a fixture folder, replay SQL text, look at keys and findings."""
from __future__ import annotations

from collections.abc import Sequence
from pathlib import Path

from linter.model import Catalog, Finding, Table
from linter.reader import read_catalog
from linter.reader.replay import ScriptFile, replay
from linter.reader.sources import Source
from linter.reader.statements import split_file

from ..locations import ROOT

FIXTURES = ROOT / "fixtures" / "reader"


def read_fixture(dialect: str, scenario: str) -> Catalog:
    """The catalog of one fixture folder, read in its dialect."""
    return read_catalog([str(FIXTURES / dialect / scenario)], dialect=dialect)


def replay_sql(dialect: str, *texts: str, config: dict | None = None) -> Catalog:
    """Replay SQL texts as consecutive files ``001.sql``, ``002.sql`` ... of one folder."""
    files = []
    for number, text in enumerate(texts, start=1):
        path = f"db/{number:03}.sql"
        files.append(ScriptFile(path, dialect, split_file(Source(path, text), dialect)))
    return replay(files, config_dependencies=config or {}, config_dialect=dialect)


def keys(table: Table) -> set[tuple[str, ...]]:
    """The key column tuples of a table."""
    return {unique.columns for unique in table.keys}


def uniques(table: Table) -> dict[str | None, tuple]:
    """Each unique rule by name: (columns, source, partial, expression, is a key)."""
    return {u.name: (u.columns, u.source, u.partial, u.expression, u in table.keys) for u in table.uniques}


def located(findings: Sequence[Finding], rule: str) -> list[tuple[str, int]]:
    """(file name, line) of each finding of one rule."""
    return [(Path(f.span.path).name, f.span.line) for f in findings if f.rule == rule]
