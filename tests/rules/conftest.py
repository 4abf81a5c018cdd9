"""Running the engine over the rule fixtures from the repository root, so finding paths are stable."""
from __future__ import annotations

from collections.abc import Callable

import pytest

from linter.config import Config
from linter.engine import Result, run

from ..locations import ROOT

FIXTURES = "fixtures/rules"

Check = Callable[..., Result]


@pytest.fixture
def check(monkeypatch: pytest.MonkeyPatch) -> Check:
    """``check("missing-key/postgres_fires.sql", dialect="postgres", **settings)`` -> engine result."""
    monkeypatch.chdir(ROOT)

    def _check(*fixtures: str, **settings: object) -> Result:
        paths = tuple(f"{FIXTURES}/{name}" for name in fixtures)
        return run(Config(paths=paths, **settings))  # type: ignore[arg-type]

    return _check

