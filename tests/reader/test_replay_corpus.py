"""The replay against real migration histories from the shared corpus (../shared/corpus).

Source of truth outside the project: two open-source projects keep one schema history per database
in step (see ../shared/corpus/MANIFEST.md for repositories and commits). Replaying each dialect's
folder must give the same tables with the same keys and columns; a difference means the replay
misread one dialect, unless the projects' own files differ, which is listed below with the reason.
"""
from __future__ import annotations

import json
import re
from collections import defaultdict
from pathlib import Path

import pytest

from linter.model import Catalog
from linter.reader import read_catalog
from linter.reader.replay import ScriptFile, replay
from linter.reader.sources import discover_files, read_source
from linter.reader.statements import split_file

from ..locations import SHARED

CORPUS = SHARED / "corpus"
AUTHELIA = CORPUS / "authelia" / "internal" / "storage" / "migrations"  # V0001.Name.up.sql per dialect
VAULTWARDEN = CORPUS / "vaultwarden" / "migrations"  # Diesel: <date>_<name>/up.sql per dialect

# Differences that are in the projects' own files, not in the replay (source: the corpus files named).
KNOWN_DIFFERENCES: dict[str, dict[str, str]] = {
    "authelia": {
        # postgres/V0007.ConsistencyFixes.up.sql drops totp_configurations_pkey (the primary key the
        # table was created with in V0002) and never adds it back; the mysql and sqlite histories keep
        # the primary key on id.
        "totp_configurations": "postgres has no primary key on id",
    },
    "vaultwarden": {},
}


def _need(path: Path) -> None:
    """Skip when the shared corpus is not next to the repository."""
    if not path.is_dir():
        pytest.skip(f"{path} is missing: these checks read the shared corpus (../shared/corpus next to the repository)")


def _shape(catalog: Catalog) -> dict[str, tuple[frozenset, frozenset]]:
    """Per table (lower case): its keys as column tuples and its column names, all lower case."""
    return {
        name.lower(): (
            frozenset(tuple(c.lower() for c in unique.columns) for unique in table.keys),
            frozenset(c.lower() for c in table.column_names),
        )
        for name, table in catalog.tables.items()
    }


@pytest.mark.parametrize(
    ("source", "root", "folders"),
    [
        ("authelia", AUTHELIA, {"postgres": "postgres", "mysql": "mysql", "sqlite": "sqlite"}),
        ("vaultwarden", VAULTWARDEN, {"postgresql": "postgres", "mysql": "mysql", "sqlite": "sqlite"}),
    ],
)
def test_dialects_of_one_history_end_in_the_same_schema(source: str, root: Path, folders: dict[str, str]) -> None:
    _need(root)
    shapes = {folder: _shape(read_catalog([str(root / folder)], dialect=dialect)) for folder, dialect in folders.items()}
    reference_folder, *others = folders
    reference = shapes[reference_folder]
    known = KNOWN_DIFFERENCES[source]
    assert len(reference) > 20, f"{source}: only {len(reference)} tables read from {reference_folder}"
    for folder in others:
        shape = shapes[folder]
        assert set(shape) == set(reference), f"{source}: tables of {folder} differ from {reference_folder}"
        for table in reference:
            assert shape[table][1] == reference[table][1], f"{source}: columns of {table} in {folder}"
            if table not in known:
                assert shape[table][0] == reference[table][0], f"{source}: keys of {table} in {folder}"
    for table in known:
        keys_seen = {folder: shape[table][0] for folder, shape in shapes.items()}
        assert len(set(keys_seen.values())) > 1, f"{source}: {table} is listed as differing but agrees now"


def test_authelia_totp_configurations_keys_per_dialect() -> None:
    _need(AUTHELIA)
    keys = {
        dialect: {u.columns for u in read_catalog([str(AUTHELIA / dialect)], dialect=dialect).tables["totp_configurations"].keys}
        for dialect in ("postgres", "mysql", "sqlite")
    }
    assert keys == {"postgres": {("username",)}, "mysql": {("id",), ("username",)}, "sqlite": {("id",), ("username",)}}


def _groups(source: str, spec: dict) -> dict[tuple[str, str], list[str]]:
    """The source's migration files grouped by the dialect SOURCES.json assigns them, in replay order."""
    root = CORPUS / source
    files = discover_files([str(root)], include=("**/*.sql", "**/*.sql.postgres", "**/*.sql.sqlite"))
    groups: dict[tuple[str, str], list[str]] = defaultdict(list)
    for path in files:
        relative = Path(path).resolve().relative_to(root.resolve()).as_posix()
        if not re.search(spec["include"], relative):
            continue
        for pattern, dialect, *label in spec["dialects"]:
            if re.search(pattern, relative):
                groups[(label[0] if label else dialect, dialect)].append(path)
                break
    return groups


def test_every_corpus_migrations_folder_replays_without_an_internal_error() -> None:
    _need(CORPUS)
    sources = json.loads((CORPUS / "SOURCES.json").read_text(encoding="utf-8"))["sources"]
    seen = 0
    for source, spec in sources.items():
        if spec["kind"] != "migrations":
            continue
        for (label, dialect), paths in _groups(source, spec).items():
            catalog = replay(ScriptFile(p, dialect, split_file(read_source(p), dialect or None)) for p in paths)
            internal = [f for f in catalog.findings if "internal error" in f.message]
            print(f"{source:12} {label:46} files {len(paths):4}  tables {len(catalog.tables):4}  "
                  f"dropped {len(catalog.dropped):3}  splits {len(catalog.splits):3}  "
                  f"statements {catalog.statements_read:5} (skipped {catalog.statements_skipped})")
            assert internal == [], f"{source} ({label}): {internal[0].span.gnu()}: {internal[0].message}"
            assert catalog.tables, f"{source} ({label}): no table understood"
            seen += 1
    assert seen >= 10
