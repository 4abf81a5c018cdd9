"""Fixtures every test folder shares."""
from __future__ import annotations

from pathlib import Path

import pytest
from click.testing import CliRunner

from .locations import shared_path


@pytest.fixture
def runner() -> CliRunner:
    """click's in-process runner."""
    return CliRunner()


@pytest.fixture
def shared() -> Path:
    """``../shared`` beside the checkout; the test skips with a message when it is absent."""
    return shared_path()
