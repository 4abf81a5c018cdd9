"""The reader: SQL files and migration folders -> the schema catalog, with reader findings.

``read_catalog`` finds the files (natural migration order), reads and splits each into statements
in its dialect (``dialect_overrides`` maps a folder prefix to another dialect; the longest prefix
wins), replays them, and attaches config-declared dependencies to the final tables.

>>> import os, tempfile
>>> folder = tempfile.mkdtemp()
>>> with open(os.path.join(folder, "001_depots.sql"), "w") as handle:
...     _ = handle.write("CREATE TABLE depots (id INT PRIMARY KEY, city TEXT NOT NULL UNIQUE);\\n")
>>> catalog = read_catalog([folder])
>>> [u.columns for u in catalog.tables["depots"].keys]
[('id',), ('city',)]
"""
from __future__ import annotations

from collections.abc import Callable, Iterator, Mapping, Sequence

from linter.model import Catalog, Dependency
from linter.reader.replay import ScriptFile, replay
from linter.reader.sources import discover_files, display_path, located_in, read_source
from linter.reader.statements import split_file

__all__ = ["read_catalog", "replay", "ScriptFile"]


def read_catalog(
    paths: Sequence[str],
    *,
    dialect: str = "postgres",
    dialect_overrides: Mapping[str, str] | None = None,
    include: Sequence[str] = ("**/*.sql",),
    exclude: Sequence[str] = (),
    skip_down: bool = True,
    config_dependencies: Mapping[str, Sequence[Dependency]] | None = None,
    on_file: Callable[[int, int, str], None] | None = None,
) -> Catalog:
    """Read, split and replay every SQL file under ``paths`` into one catalog."""
    files = discover_files(paths, include=include, exclude=exclude, skip_down=skip_down)
    prefixes = _prefixes(dialect_overrides or {})
    return replay(_scripts(files, dialect, prefixes, on_file),
                  config_dependencies=config_dependencies, config_dialect=dialect)


def _scripts(files: list[str], dialect: str, prefixes: list[tuple[str, str]],
             on_file: Callable[[int, int, str], None] | None) -> Iterator[ScriptFile]:
    """Each file read and split in its dialect, reporting progress as it goes."""
    for index, path in enumerate(files):
        if on_file is not None:
            on_file(index, len(files), path)
        source = read_source(path)
        file_dialect = next((d for prefix, d in prefixes if located_in(source.path, [prefix])), dialect)
        yield ScriptFile(source.path, file_dialect, split_file(source, file_dialect))


def _prefixes(overrides: Mapping[str, str]) -> list[tuple[str, str]]:
    """Override prefixes as displayed paths (relative, forward slashes), longest first."""
    shown = [(display_path(prefix), dialect) for prefix, dialect in overrides.items()]
    return sorted(shown, key=lambda item: len(item[0]), reverse=True)

