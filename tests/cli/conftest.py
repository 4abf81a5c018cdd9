"""Fixtures for the command-line tests: a private copy of the bundled example, a runner, the script."""
from __future__ import annotations

import os
import shutil
import sys
from collections.abc import Callable, Iterator
from pathlib import Path

import pytest

from ..locations import ROOT

EXAMPLE = ROOT / "examples" / "courier"


@pytest.fixture
def example(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Iterator[Path]:
    """A copy of the courier example as the working directory, so tests may change it freely."""
    copy = tmp_path / "courier"
    shutil.copytree(EXAMPLE, copy)
    monkeypatch.chdir(copy)
    monkeypatch.delenv("NO_COLOR", raising=False)
    yield copy


@pytest.fixture
def script() -> str:
    """The installed ``normguard`` console script (beside this interpreter, else on PATH)."""
    beside = Path(sys.executable).with_name("normguard")
    found = str(beside) if beside.exists() else shutil.which("normguard")
    if found is None:
        pytest.skip("the normguard console script is not installed (pip install -e '.[test]')")
    return found


def _without_no_color(**extra: str) -> dict[str, str]:
    """The environment without NO_COLOR, plus ``extra``."""
    env = {k: v for k, v in os.environ.items() if k != "NO_COLOR"}
    env.update(extra)
    return env


@pytest.fixture
def clean_env() -> Callable[..., dict[str, str]]:
    """A function giving the environment without NO_COLOR, plus keyword overrides."""
    return _without_no_color
