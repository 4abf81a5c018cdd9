"""The installed ``normguard`` console script run as a real process: exit codes, streams, colour.

NO_COLOR behaviour follows no-color.org (FORMATS.md §7, NOCOLOR): colour is off when NO_COLOR is
set and not empty, an empty NO_COLOR changes nothing, and an explicit flag wins over it. Colour
needs a terminal, so those runs get a pseudo-terminal as stdout.
"""
from __future__ import annotations

import json
import os
import pty
import subprocess
import sys

import pytest

ESC = "\x1b["


def _run(script: str, *args: str) -> subprocess.CompletedProcess[str]:
    env = {k: v for k, v in os.environ.items() if k != "NO_COLOR"}
    return subprocess.run([script, *args], capture_output=True, text=True, env=env, timeout=120)


def _on_terminal(script: str, *args: str, env: dict[str, str]) -> str:
    """Run with a pseudo-terminal as stdout and return what it printed there."""
    leader, follower = pty.openpty()
    try:
        process = subprocess.Popen([script, *args], stdout=follower, stderr=subprocess.DEVNULL, env=env)
        os.close(follower)
        chunks = []
        while True:
            try:
                chunk = os.read(leader, 65536)
            except OSError:  # the terminal closes when the process ends
                break
            if not chunk:
                break
            chunks.append(chunk)
        process.wait(timeout=120)
    finally:
        os.close(leader)
    return b"".join(chunks).decode("utf-8", errors="replace")


def test_findings_exit_1_and_go_to_stdout(example, script):
    done = _run(script, "check", "--format", "json")
    assert done.returncode == 1 and done.stderr == ""
    assert len(json.loads(done.stdout)["findings"]) == 14


def test_clean_selection_exits_0(example, script):
    done = _run(script, "check", "--select", "redundant-unique")
    assert done.returncode == 0
    assert done.stdout.splitlines()[-1].startswith("normguard: 0 errors, 0 warnings, 1 note")


def test_trouble_exits_2_with_one_line(example, script):
    done = _run(script, "check", "nowhere/")
    assert done.returncode == 2 and done.stdout == ""
    assert done.stderr == "normguard: nowhere/: no such file or directory (given on the command line)\n"


def test_version(script):
    done = _run(script, "--version")
    assert (done.returncode, done.stdout) == (0, "normguard 0.1.0\n")


@pytest.mark.skipif(sys.platform == "win32", reason="pseudo-terminals are POSIX")
@pytest.mark.parametrize(
    ("no_color", "flags", "coloured"),
    [
        (None, [], True),
        ("", [], True),  # empty NO_COLOR does not disable colour
        ("1", [], False),
        ("1", ["--color"], True),  # an explicit flag overrides NO_COLOR
        (None, ["--no-color"], False),
    ],
)
def test_colour_on_a_terminal(example, script, clean_env, no_color, flags, coloured):
    env = clean_env() if no_color is None else clean_env(NO_COLOR=no_color)
    shown = _on_terminal(script, "check", *flags, env=env)
    assert "normguard:" in shown
    assert (ESC in shown) is coloured


def test_no_colour_into_a_pipe_or_a_file(example, script):
    assert ESC not in _run(script, "check").stdout
    _run(script, "check", "--output", "report.txt")
    assert ESC not in (example / "report.txt").read_text(encoding="utf-8")
