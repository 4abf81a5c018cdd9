"""Where the tests find the checkout and ``../shared``, and how they read a failed run."""
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


def one_line_error(outcome) -> str:
    """The single ``normguard: ...`` stderr line of a run that failed with status 2 (no traceback)."""
    assert outcome.exit_code == 2, outcome.output
    lines = outcome.stderr.splitlines()
    assert len(lines) == 1 and lines[0].startswith("normguard: "), outcome.stderr
    return lines[0]
