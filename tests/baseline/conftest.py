"""Fixtures for the baseline tests: the tool-library migrations as the working directory, a runner."""
from __future__ import annotations

import shutil
from collections.abc import Iterator
from pathlib import Path

import pytest
from click.testing import CliRunner

ROOT = Path(__file__).resolve().parents[2]
LIBRARY = ROOT / "fixtures" / "baseline" / "tool_library"
SHARED = ROOT.parent / "shared"


@pytest.fixture
def library(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Iterator[Path]:
    """A private copy of the tool-library migrations in ``migrations/``, the working directory its parent."""
    shutil.copytree(LIBRARY, tmp_path / "migrations")
    monkeypatch.chdir(tmp_path)
    yield tmp_path / "migrations"


@pytest.fixture
def runner() -> CliRunner:
    """click's in-process runner."""
    return CliRunner()


@pytest.fixture
def shared() -> Path:
    """../shared beside the checkout; tests that need it skip with a message when it is absent."""
    if not SHARED.is_dir():
        pytest.skip(f"../shared is not there (looked for {SHARED.name}/ beside the checkout)")
    return SHARED
