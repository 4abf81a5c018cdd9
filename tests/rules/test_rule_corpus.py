"""Rules on real schemas from the shared corpus (../shared/corpus), each verdict checked by reading
the source file named beside it. Skipped, with the missing path named, when the corpus is absent."""
from __future__ import annotations

from pathlib import Path

import pytest

from linter.config import Config
from linter.engine import Result, run

from ..locations import ROOT
from .rule_helpers import of_rule

CORPUS = ROOT.parent / "shared" / "corpus"


def _run(relative: str, dialect: str, monkeypatch: pytest.MonkeyPatch) -> Result:
    """The engine over one corpus path, from the repository root."""
    path = CORPUS / relative
    if not path.exists():
        pytest.skip(f"shared corpus not found: {path.relative_to(ROOT.parent)}")
    monkeypatch.chdir(ROOT)
    return run(Config(paths=(_relative(path),), dialect=dialect))


def _relative(path: Path) -> str:
    """``path`` relative to the repository root."""
    return str(Path("..") / path.relative_to(ROOT.parent))


def test_northwind_every_table_keyed_and_in_bcnf(monkeypatch: pytest.MonkeyPatch) -> None:
    # northwind/northwind.sql: 14 CREATE TABLE, each given a PRIMARY KEY by ALTER TABLE ... ADD
    # CONSTRAINT pk_<table> (lines 3698-3802), and no UNIQUE anywhere.
    result = _run("northwind/northwind.sql", "postgres", monkeypatch)
    assert len(result.catalog.tables) == 14
    for rule in ("missing-key", "nullable-unique", "redundant-unique"):
        assert of_rule(result, rule) == []
    assert {analysis.report.form for analysis in result.analyses.values()} == {"BCNF"}
    details = result.analyses["order_details"]
    assert details.format_keys(details.keys.keys) == "(order_id, product_id)"


def test_synapse_unique_repeating_the_primary_key(monkeypatch: pytest.MonkeyPatch) -> None:
    # synapse .../main/delta/32/openid.sql: "token TEXT NOT NULL PRIMARY KEY" (line 3) and
    # "UNIQUE (token)" (line 6) in the same CREATE TABLE.
    result = _run("synapse/synapse/storage/schema/main/delta/32/openid.sql", "postgres", monkeypatch)
    [found] = of_rule(result, "redundant-unique")
    assert (found.span.line, found.table) == (6, "open_id_tokens")
    assert "repeats the primary key (token)" in found.message


def test_vaultwarden_mysql_unique_repeating_the_primary_key(monkeypatch: pytest.MonkeyPatch) -> None:
    # vaultwarden migrations/mysql/2022-10-18-170602_add_events/up.sql: "uuid CHAR(36) NOT NULL
    # PRIMARY KEY" (line 2) and "UNIQUE (uuid)" (line 18).
    result = _run("vaultwarden/migrations/mysql/2022-10-18-170602_add_events/up.sql", "mysql", monkeypatch)
    [found] = of_rule(result, "redundant-unique")
    assert (found.span.line, found.table) == (18, "event")


def test_authelia_unique_index_over_a_nullable_column(monkeypatch: pytest.MonkeyPatch) -> None:
    # authelia internal/storage/migrations/postgres: V0001 declares "name VARCHAR(100)" (nullable)
    # and V0007 recreates "CREATE UNIQUE INDEX encryption_name_key ON encryption (name)" (line 34).
    result = _run("authelia/internal/storage/migrations/postgres", "postgres", monkeypatch)
    found = [f for f in of_rule(result, "nullable-unique") if f.table == "encryption"]
    assert [(Path(f.span.path).name, f.span.line) for f in found] == [("V0007.ConsistencyFixes.up.sql", 34)]
