"""Running the engine over the split fixtures from the repository root, so finding paths are stable."""
from __future__ import annotations

from collections.abc import Callable

import pytest

from linter.config import Config
from linter.engine import Result, run

from ..locations import ROOT
from .split_support import FIXTURES, dialect_of

Check = Callable[..., Result]


@pytest.fixture
def check(monkeypatch: pytest.MonkeyPatch) -> Check:
    """``check("mysql_lossy_seed_lots")`` or ``check("case/002.sql", "case/003.sql")`` -> engine result."""
    monkeypatch.chdir(ROOT)

    def _check(*paths: str) -> Result:
        return run(Config(paths=tuple(f"{FIXTURES}/{path}" for path in paths), dialect=dialect_of(paths[0])))

    return _check
