"""Which SQL files to read, in which order, and their text: ``discover_files`` and ``read_source``.

A folder is a migrations folder: its files are replayed in natural order of their relative paths
(numbers compare as numbers, so ``V10`` comes after ``V9`` and ``delta/9`` before ``delta/10``).
Files named as down migrations are skipped unless ``skip_down=False``.

>>> natural_key("V10__b.sql") > natural_key("V9__a.sql")
True
>>> sorted(["0001_x.sql", "2_y.sql", "10_z.sql"], key=natural_key)
['0001_x.sql', '2_y.sql', '10_z.sql']
>>> is_down_migration("2024-01-01_add_depot/down.sql"), is_down_migration("V3.rename.up.sql")
(True, False)

Include and exclude patterns are globs over the path relative to the folder given: ``*`` stays
inside one folder, ``**`` crosses folders, and a pattern without ``/`` matches the file name at any
depth. SQL files with a dialect suffix after ``.sql`` (Synapse's ``.sql.postgres`` and
``.sql.sqlite``) are read when an include pattern names them, e.g.
``include=("*.sql", "*.sql.postgres")``.

>>> glob_match("**/*.sql", "delta/54/account_validity.sql"), glob_match("*.sql", "a/b.sql")
(True, True)
>>> glob_match("delta/*.sql", "delta/54/x.sql")
False

Folders whose name starts with a dot are not entered. Synapse keeps a base schema in
``full_schemas/<N>/`` and later changes in ``delta/<N>/``: give the two folders in that order.
"""
from __future__ import annotations

import os
import re
import stat
from collections.abc import Iterable, Sequence
from dataclasses import dataclass, field
from functools import lru_cache
from pathlib import Path

from linter.model import Finding, Span

DEFAULT_INCLUDE: tuple[str, ...] = ("**/*.sql",)
MAX_FILE_BYTES = 20 * 1024 * 1024
"""Files larger than this are reported and skipped: a schema migration is never this big."""

_DOWN_NAME = re.compile(r"(?:^|[._-])down\.sql(?:\.[A-Za-z0-9]+)?$", re.IGNORECASE)
_NUMBER_RUNS = re.compile(r"(\d+)")


@dataclass
class Source:
    """One file's text, with the problems met while reading it (``skipped`` when nothing was read)."""

    path: str
    text: str
    problems: list[Finding] = field(default_factory=list)
    skipped: bool = False


def natural_key(path: str) -> tuple:
    """Sort key comparing digit runs as numbers, folder by folder, then the plain text as tie-break."""
    parts = []
    for part in path.replace("\\", "/").split("/"):
        runs = _NUMBER_RUNS.split(part)
        parts.append(
            tuple((0, int(run), "") if run.isdigit() else (1, 0, run.casefold()) for run in runs if run)
        )
    return (tuple(parts), path)


def is_down_migration(path: str) -> bool:
    """True for ``down.sql``, ``*.down.sql``, ``*_down.sql`` and ``*-down.sql`` (any case)."""
    return bool(_DOWN_NAME.search(path.replace("\\", "/").rsplit("/", 1)[-1]))


@lru_cache(maxsize=256)
def _glob_regex(pattern: str) -> re.Pattern[str]:
    """Compile a glob where ``*`` stays in one folder and ``**`` spans folders."""
    out, i = [], 0
    while i < len(pattern):
        c = pattern[i]
        if pattern.startswith("**/", i):
            out.append("(?:.*/)?")
            i += 3
        elif pattern.startswith("**", i):
            out.append(".*")
            i += 2
        elif c == "*":
            out.append("[^/]*")
            i += 1
        elif c == "?":
            out.append("[^/]")
            i += 1
        elif c == "[" and "]" in pattern[i + 1 :]:
            end = pattern.index("]", i + 1)
            body = pattern[i + 1 : end]
            if body.startswith("!"):
                body = "^" + body[1:]
            out.append(f"[{body}]")
            i = end + 1
        else:
            out.append(re.escape(c))
            i += 1
    return re.compile("".join(out) + r"\Z")


def glob_match(pattern: str, relative: str) -> bool:
    """Whether ``relative`` (posix) matches ``pattern``; a pattern without ``/`` matches the name."""
    target = relative if "/" in pattern else relative.rsplit("/", 1)[-1]
    return bool(_glob_regex(pattern).match(target))


def _folder_files(
    folder: Path, include: Sequence[str], exclude: Sequence[str], skip_down: bool
) -> list[Path]:
    """The files of one migrations folder that pass the filters, in natural order."""
    found: list[tuple[tuple, Path]] = []
    for dirpath, dirnames, filenames in os.walk(folder, onerror=None):
        dirnames[:] = [d for d in dirnames if not d.startswith(".")]
        for name in filenames:
            path = Path(dirpath, name)
            relative = path.relative_to(folder).as_posix()
            if not any(glob_match(p, relative) for p in include):
                continue
            if any(glob_match(p, relative) for p in exclude):
                continue
            if skip_down and is_down_migration(relative):
                continue
            found.append((natural_key(relative), path))
    return [path for _, path in sorted(found, key=lambda item: item[0])]


def discover_files(
    paths: Iterable[str],
    *,
    include: Sequence[str] = DEFAULT_INCLUDE,
    exclude: Sequence[str] = (),
    skip_down: bool = True,
) -> list[str]:
    """The files to read, in replay order: explicit files as given, folders in natural order.

    A path that does not exist is kept, so ``read_source`` reports it where it belongs in the order.
    Each file appears once, at its first position.
    """
    result: list[str] = []
    seen: set[str] = set()
    for given in paths:
        path = Path(given)
        candidates = (
            [display_path(p) for p in _folder_files(path, include, exclude, skip_down)]
            if path.is_dir()
            else [display_path(path)]
        )
        for candidate in candidates:
            key = os.path.normcase(os.path.abspath(candidate))
            if key not in seen:
                seen.add(key)
                result.append(candidate)
    return result


def display_path(path: str | os.PathLike[str]) -> str:
    """The path relative to the working directory, with forward slashes, as findings show paths."""
    try:
        return Path(os.path.relpath(path)).as_posix()
    except ValueError:  # another drive on Windows
        return Path(path).as_posix()


def located_in(path: str, wanted: Sequence[str]) -> bool:
    """True when ``path`` (as ``display_path`` writes it) is one of ``wanted`` or lies in one as a folder."""
    return any(w in (".", "", path) or path.startswith(w.rstrip("/") + "/") for w in wanted)


def _file_problem(path: str, message: str, severity: str = "warning") -> Finding:
    """A ``file-error`` finding about the whole file, placed at its first line."""
    return Finding("file-error", severity, Span(path, 1, 1, 1, 1), message)


def read_source(path: str) -> Source:
    """Read one SQL file as text; every problem becomes a ``file-error`` finding, never an exception.

    The byte-order mark is dropped (columns do not count it) and line ends are kept as they are.
    Binary files (NUL bytes), files over ``MAX_FILE_BYTES`` and unreadable paths are skipped;
    text that is not UTF-8 is reported at the line of its first bad byte and read with
    replacement characters.
    """
    shown = display_path(path)
    try:
        status = os.stat(path)
        if stat.S_ISDIR(status.st_mode):
            return Source(shown, "", [_file_problem(shown, "is a folder, not a file", "error")], True)
        if not stat.S_ISREG(status.st_mode):
            return Source(shown, "", [_file_problem(shown, "is not a regular file; not read", "error")], True)
        if status.st_size > MAX_FILE_BYTES:
            message = (
                f"file is {status.st_size / 1048576:.1f} MB, over the {MAX_FILE_BYTES // 1048576} MB limit "
                "for a schema file; not read"
            )
            return Source(shown, "", [_file_problem(shown, message)], True)
        with open(path, "rb") as handle:
            data = handle.read()
    except OSError as error:
        reason = error.strerror or type(error).__name__
        return Source(shown, "", [_file_problem(shown, f"cannot read file: {reason}", "error")], True)
    if b"\0" in data:
        line = data.count(b"\n", 0, data.index(b"\0")) + 1
        message = f"binary file (NUL byte on line {line}); not read as SQL"
        return Source(shown, "", [_file_problem(shown, message)], True)
    if data.startswith(b"\xef\xbb\xbf"):
        data = data[3:]
    problems: list[Finding] = []
    try:
        text = data.decode("utf-8")
    except UnicodeDecodeError as error:
        line = data.count(b"\n", 0, error.start) + 1
        bad = data[error.start : error.start + 1].hex()
        message = (
            f"not valid UTF-8: byte 0x{bad} on line {line}; "
            "read with replacement characters, save the file as UTF-8"
        )
        problems.append(_file_problem(shown, message))
        text = data.decode("utf-8", errors="replace")
    return Source(shown, text, problems)
