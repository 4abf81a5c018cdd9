"""The baseline: findings a team has accepted for now, recorded by fingerprint in a YAML file.

``check --baseline`` reports only findings the file does not hold, and the entries whose finding is
gone as fixed. Fingerprints never hold line numbers, so moving or reformatting SQL keeps a match.

>>> from linter.model import Finding, Span
>>> old = Finding("missing-key", "warning", Span("db/001.sql", 4, 1, 4, 9), "no key", "parcel",
...               fingerprint="a1")
>>> text = dump_baseline(baseline_of([old]))
>>> text.splitlines()[2]
'normguard-baseline: 1'
>>> new = Finding("missing-key", "warning", Span("db/001.sql", 9, 1, 9, 9), "no key", "depot",
...               fingerprint="b2")
>>> comparison = compare(parse_baseline(text, "base.yaml"), [new])
>>> [f.table for f in comparison.new], [e.table for e in comparison.fixed]
(['depot'], ['parcel'])
"""
from __future__ import annotations

from collections import defaultdict, deque
from collections.abc import Iterable
from dataclasses import dataclass
from pathlib import Path

import yaml

from linter.model import Finding

HEADER = "normguard-baseline"
VERSION = 1
DEFAULT_PATH = ".normguard-baseline.yaml"
_FIELDS = ("fingerprint", "rule", "table", "path", "message")
_COMMENT = (
    "# Findings accepted for now: `normguard check --baseline` does not report them.\n"
    "# Regenerate with `normguard baseline`; drop fixed entries with `normguard baseline --prune`.\n"
)


class BaselineError(Exception):
    """A baseline file that is missing, unreadable, not YAML, or not a normguard baseline."""


@dataclass(frozen=True)
class Entry:
    """One accepted finding: its fingerprint, and rule, table, path and message for people."""

    fingerprint: str
    rule: str
    table: str | None
    path: str
    message: str


@dataclass(frozen=True)
class Baseline:
    """The entries of a baseline file, in file order."""

    entries: tuple[Entry, ...]


@dataclass(frozen=True)
class Comparison:
    """Current findings set against a baseline: new ones, matched ones, and entries now fixed."""

    new: tuple[Finding, ...]
    unchanged: tuple[Finding, ...]
    kept: tuple[Entry, ...]
    fixed: tuple[Entry, ...]


def baseline_of(findings: Iterable[Finding]) -> Baseline:
    """A baseline holding every finding, sorted so regenerating it gives a small diff."""
    entries = [Entry(f.fingerprint, f.rule, f.table, f.span.path, f.message) for f in findings]
    return Baseline(tuple(sorted(entries, key=lambda e: (e.path, e.rule, e.table or "", e.fingerprint))))


def compare(baseline: Baseline, findings: Iterable[Finding]) -> Comparison:
    """Match findings to entries by fingerprint, one entry per finding (the same print may recur)."""
    waiting: dict[str, deque[Finding]] = defaultdict(deque)
    for finding in findings:
        waiting[finding.fingerprint].append(finding)
    unchanged: list[Finding] = []
    kept: list[Entry] = []
    fixed: list[Entry] = []
    for entry in baseline.entries:
        if waiting[entry.fingerprint]:
            unchanged.append(waiting[entry.fingerprint].popleft())
            kept.append(entry)
        else:
            fixed.append(entry)
    new = [finding for queue in waiting.values() for finding in queue]
    return Comparison(tuple(new), tuple(unchanged), tuple(kept), tuple(fixed))


def dump_baseline(baseline: Baseline) -> str:
    """The YAML text of a baseline: a comment, the header key with the format version, the entries."""
    document = {HEADER: VERSION, "findings": [_entry_dict(entry) for entry in baseline.entries]}
    body = yaml.safe_dump(document, sort_keys=False, allow_unicode=True, width=1_000_000)
    return _COMMENT + body


def load_baseline(path: str | Path) -> Baseline:
    """Read a baseline file; anything but a readable normguard baseline raises ``BaselineError``."""
    try:
        text = Path(path).read_text(encoding="utf-8-sig")
    except FileNotFoundError:
        raise BaselineError(f"{path}: no such baseline file (create it with `normguard baseline`)")
    except (OSError, UnicodeDecodeError) as error:
        raise BaselineError(f"{path}: cannot read the baseline file: {_reason(error)}")
    return parse_baseline(text, str(path))


def parse_baseline(text: str, name: str) -> Baseline:
    """Parse baseline YAML with the safe loader, naming ``name`` and the line in every error."""
    try:
        document = yaml.safe_load(text)
    except yaml.YAMLError as error:
        mark = getattr(error, "problem_mark", None)
        where = f"{name}:{mark.line + 1}" if mark is not None else name
        problem = getattr(error, "problem", None) or "unreadable"
        raise BaselineError(f"{where}: not valid YAML ({problem})")
    if document is None:
        raise BaselineError(f"{name}: the baseline file is empty (not a normguard baseline)")
    if not isinstance(document, dict) or HEADER not in document:
        raise BaselineError(f"{name}: not a normguard baseline (no `{HEADER}` key at the top)")
    version = document[HEADER]
    if version != VERSION:
        raise BaselineError(
            f"{name}: baseline format version {version!r} is not one this normguard reads ({VERSION})"
        )
    findings = document.get("findings")
    if findings is None:
        return Baseline(())
    if not isinstance(findings, list):
        raise BaselineError(f"{name}: `findings` must be a list of entries")
    return Baseline(tuple(_entry(item, index, name) for index, item in enumerate(findings, 1)))


def _entry(item: object, index: int, name: str) -> Entry:
    """One entry of the ``findings`` list, checked field by field."""
    if not isinstance(item, dict):
        raise BaselineError(f"{name}: entry {index} of `findings` is not a mapping")
    values: dict[str, str | None] = {}
    for field in _FIELDS:
        value = item.get(field)
        if value is None and field in ("fingerprint", "rule", "path"):
            raise BaselineError(f"{name}: entry {index} of `findings` has no `{field}`")
        if value is not None and not isinstance(value, str):
            raise BaselineError(f"{name}: entry {index} of `findings`: `{field}` must be text")
        values[field] = value
    return Entry(
        fingerprint=str(values["fingerprint"]),
        rule=str(values["rule"]),
        table=values["table"],
        path=str(values["path"]),
        message=values["message"] or "",
    )


def _entry_dict(entry: Entry) -> dict[str, str | None]:
    """An entry as the mapping written to the file."""
    return {field: getattr(entry, field) for field in _FIELDS}


def _reason(error: Exception) -> str:
    """The short reason of an I/O or decoding error."""
    if isinstance(error, OSError) and error.strerror:
        return error.strerror
    return str(error)
