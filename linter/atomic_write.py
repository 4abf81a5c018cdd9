"""Writes a text file all at once: a temporary file in the same folder, renamed into place.

An interrupted run (a crash, Ctrl-C, a full disk) leaves either the old file or the new one, never a
truncated mix, because ``os.replace`` is atomic within one file system.

>>> import pathlib, tempfile
>>> folder = pathlib.Path(tempfile.mkdtemp())
>>> atomic_write(folder / "report.txt", "two couriers late\\n")
>>> (folder / "report.txt").read_text(encoding="utf-8")
'two couriers late\\n'
>>> sorted(p.name for p in folder.iterdir())
['report.txt']
"""
from __future__ import annotations

import os
import tempfile
from pathlib import Path


def atomic_write(path: str | os.PathLike[str], text: str) -> None:
    """Write ``text`` (UTF-8) to ``path`` through a sibling temporary file renamed over it."""
    target = Path(path)
    handle, temporary = tempfile.mkstemp(prefix=f".{target.name}.", suffix=".tmp", dir=target.parent)
    try:
        with os.fdopen(handle, "w", encoding="utf-8", newline="") as stream:
            stream.write(text)
            stream.flush()
            os.fsync(stream.fileno())
        _keep_mode(target, temporary)
        os.replace(temporary, target)
    except BaseException:
        Path(temporary).unlink(missing_ok=True)
        raise


def _keep_mode(target: Path, temporary: str) -> None:
    """Give the new file the old file's permissions, or the usual ones for a new file."""
    try:
        mode = target.stat().st_mode & 0o7777
    except FileNotFoundError:
        umask = os.umask(0)
        os.umask(umask)
        mode = 0o666 & ~umask
    os.chmod(temporary, mode)
