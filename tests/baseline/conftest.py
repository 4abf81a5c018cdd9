"""Fixtures for the baseline tests: the tool-library migrations as the working directory."""
from __future__ import annotations

import shutil
from collections.abc import Iterator
from pathlib import Path

import pytest

from ..locations import ROOT

LIBRARY = ROOT / "fixtures" / "baseline" / "tool_library"


@pytest.fixture
def library(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Iterator[Path]:
    """A private copy of the tool-library migrations in ``migrations/``, the working directory its parent."""
    shutil.copytree(LIBRARY, tmp_path / "migrations")
    monkeypatch.chdir(tmp_path)
    yield tmp_path / "migrations"

