"""Headless Chromium for the audit tests: load a page, dump its DOM, take a screenshot, read its console.

No driver library: Chromium's own switches do it (``--dump-dom``, ``--screenshot``), and with
``--enable-logging=stderr --v=0`` it writes every console message to stderr as ``...:CONSOLE...``.
"""
from __future__ import annotations

import shutil
import struct
import subprocess
from pathlib import Path

import pytest

_QUIET = (
    "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
    "--disable-background-networking", "--disable-component-update", "--disable-sync",
    "--enable-logging=stderr", "--v=0",
)
_WAIT = 300  # seconds; only a guard against a hung browser, never a speed goal


def chromium() -> str:
    """The Chromium executable, or a skip saying how CI installs it."""
    for name in ("chromium", "chromium-browser"):
        found = shutil.which(name)
        if found:
            return found
    pytest.skip("chromium is not installed (.ci/run installs Debian's: apt-get install -y chromium)")


def load(page: Path, profile: Path, *action: str) -> tuple[str, list[str]]:
    """Open ``page`` with one action (``--dump-dom`` or ``--screenshot=...``): stdout and console lines."""
    command = [chromium(), *_QUIET, f"--user-data-dir={profile}", *action, page.resolve().as_uri()]
    done = subprocess.run(command, capture_output=True, text=True, timeout=_WAIT, check=False)
    assert done.returncode == 0, done.stderr[-2000:]
    return done.stdout, console_messages(done.stderr)


def console_messages(log: str) -> list[str]:
    """The console messages (and uncaught errors) in Chromium's stderr log."""
    return [line for line in log.splitlines() if ":CONSOLE" in line or "Uncaught" in line]


def png_size(path: Path) -> tuple[int, int]:
    """Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948 §11.2.2)."""
    head = path.read_bytes()[:24]
    assert head[:8] == b"\x89PNG\r\n\x1a\n" and head[12:16] == b"IHDR", "not a PNG file"
    width, height = struct.unpack(">II", head[16:24])
    return width, height
