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
>>> notes(comparison, "base.yaml")[0]
'db/001.sql: fixed since the baseline (parcel): no key [missing-key]'
"""
from __future__ import annotations

from collections import defaultdict, deque
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from pathlib import Path

import yaml

from linter.model import Finding
from linter.reader.sources import located_in

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
    """Current findings against a baseline: new and matched findings; entries that stay, and fixed ones."""

    new: tuple[Finding, ...]
    unchanged: tuple[Finding, ...]
    kept: tuple[Entry, ...]
    fixed: tuple[Entry, ...]


def baseline_of(findings: Iterable[Finding], keep: Iterable[Entry] = ()) -> Baseline:
    """A baseline of every finding plus the ``keep`` entries, sorted so regenerating gives small diffs."""
    entries = [*keep, *(Entry(f.fingerprint, f.rule, f.table, f.span.path, f.message) for f in findings)]
    return Baseline(tuple(sorted(entries, key=lambda e: (e.path, e.rule, e.table or "", e.fingerprint))))


def outside(baseline: Baseline, scope: Sequence[str]) -> tuple[Entry, ...]:
    """The entries for files outside ``scope`` (files and folders): a partial run says nothing of them."""
    return tuple(entry for entry in baseline.entries if not located_in(entry.path, scope))


def compare(baseline: Baseline, findings: Iterable[Finding], scope: Sequence[str] = (".",)) -> Comparison:
    """Match findings to entries by fingerprint, one entry per finding (the same print may recur).

    Entries for files outside ``scope`` are kept as they are: neither matched nor fixed.
    """
    waiting: dict[str, deque[Finding]] = defaultdict(deque)
    for finding in findings:
        waiting[finding.fingerprint].append(finding)
    unchanged: list[Finding] = []
    kept: list[Entry] = []
    fixed: list[Entry] = []
    for entry in baseline.entries:
        if not located_in(entry.path, scope):
            kept.append(entry)
        elif waiting[entry.fingerprint]:
            unchanged.append(waiting[entry.fingerprint].popleft())
            kept.append(entry)
        else:
            fixed.append(entry)
    new = [finding for queue in waiting.values() for finding in queue]
    return Comparison(tuple(new), tuple(unchanged), tuple(kept), tuple(fixed))


def notes(comparison: Comparison, path: str) -> list[str]:
    """Lines telling how many findings the baseline hid and which of its entries are fixed."""
    lines = []
    if comparison.unchanged:
        count = len(comparison.unchanged)
        lines.append(f"normguard: {count} {plural(count, 'finding')} recorded in {path} not shown")
    for entry in comparison.fixed:
        table = f" ({entry.table})" if entry.table else ""
        lines.append(f"{entry.path}: fixed since the baseline{table}: {entry.message} [{entry.rule}]")
    if comparison.fixed:
        count = len(comparison.fixed)
        option = "" if path == DEFAULT_PATH else f" --output {path}"
        lines.append(
            f"normguard: {count} baseline {plural(count, 'entry')} fixed;"
            f" `normguard baseline --prune{option}` drops {'it' if count == 1 else 'them'}"
        )
    return lines


def plural(count: int, word: str) -> str:
    """``finding``/``findings``, ``entry``/``entries``: the noun for ``count`` of them."""
    if count == 1:
        return word
    return word[:-1] + "ies" if word.endswith("y") else word + "s"


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
