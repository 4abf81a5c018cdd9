"""Fixtures for the audit tests: a seed-bank schema as the working directory, a runner, ../shared."""
from __future__ import annotations

from collections.abc import Iterator
from pathlib import Path

import pytest

from ..locations import SHARED

SEED_BANK = {
    "001_seed_lots.sql": """-- Seed lots kept by a community seed bank (an invented scenario).
CREATE TABLE seed_lot (
    lot_code        text NOT NULL,
    harvest_year    integer NOT NULL,
    variety         text NOT NULL,
    variety_family  text NOT NULL,
    grower_id       integer NOT NULL,
    grower_village  text NOT NULL,
    village_region  text NOT NULL,
    grams           integer,
    PRIMARY KEY (lot_code, harvest_year)
    -- normguard: fd lot_code -> variety, grower_id
    -- normguard: fd variety -> variety_family
    -- normguard: fd grower_id -> grower_village
    -- normguard: fd grower_village -> village_region
);
CREATE TABLE grower (grower_id integer PRIMARY KEY, display_name text NOT NULL UNIQUE);
""",
    "002_vault.sql": """CREATE TABLE vault_slot (
    shelf   text NOT NULL,
    room    text NOT NULL,
    variety text NOT NULL,
    UNIQUE (variety, room)
    -- normguard: fd shelf -> room
);
ALTER TABLE vault_slot ADD COLUMN checked_on date;
CREATE TABLE "<img src=x onerror=alert(1)>" ("a&b" integer PRIMARY KEY, "</svg><script>" text);
""",
}


@pytest.fixture
def seed_bank(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Iterator[Path]:
    """The seed-bank migrations in ``migrations/``, the working directory their parent."""
    folder = tmp_path / "migrations"
    folder.mkdir()
    for name, text in SEED_BANK.items():
        (folder / name).write_text(text, encoding="utf-8")
    monkeypatch.chdir(tmp_path)
    yield folder


@pytest.fixture
def lemmy() -> Path:
    """The lemmy migrations in ../shared (AGPL: read in place, never copied); skipped when absent."""
    folder = SHARED / "corpus" / "lemmy" / "migrations"
    if not folder.is_dir():
        pytest.skip("../shared/corpus/lemmy/migrations is not there: the corpus audit needs it")
    return folder
