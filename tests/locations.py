"""Where the tests find the checkout and the read-only ``../shared`` folder beside it."""
from __future__ import annotations

from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
SHARED = ROOT.parent / "shared"


def shared_path(*parts: str) -> Path:
    """A path under ``../shared``; skips the calling test, naming what is missing, when it is absent."""
    path = SHARED.joinpath(*parts)
    if not path.exists():
        pytest.skip(f"../shared/{'/'.join(parts)} is not there beside the checkout: this test reads it")
    return path
