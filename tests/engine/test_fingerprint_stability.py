"""Fingerprints survive moved and reformatted SQL, and tell different findings apart."""
from __future__ import annotations

from pathlib import Path

import pytest

from linter.config import Config
from linter.engine import run
from linter.fingerprint import fingerprint
from linter.model import Finding, Span

ORIGINAL = """\
CREATE TABLE couriers (
    courier_id integer PRIMARY KEY,
    depot text NOT NULL,
    city text NOT NULL,
    badge text UNIQUE
    -- normguard: fd depot -> city
);
CREATE TABLE pings (courier_id integer, seen_at timestamp);
CREATE TABLE drawers (drawer_id integer PRIMARY KEY, code text NOT NULL, UNIQUE (drawer_id, code));
CREATE TABLE cargo (crate SERIAL PRIMARY KEY, oops integer PRIMARY KEY, tag text UNIQUE);
"""

REFORMATTED = """\
-- moved down by a new header comment
-- and a blank line

create table PINGS ( courier_id INTEGER , seen_at TIMESTAMP ) ;

CREATE TABLE Couriers (courier_id integer PRIMARY KEY,
  -- normguard: fd depot -> city
  depot text NOT NULL, city text NOT NULL, badge text UNIQUE);


CREATE TABLE drawers (
  drawer_id integer PRIMARY KEY,
  code text NOT NULL,
  UNIQUE (drawer_id, code)
);
CREATE TABLE cargo (
  crate SERIAL PRIMARY KEY,
  oops integer PRIMARY KEY,
  tag text UNIQUE
);
"""


def _run_on(folder: Path, text: str, monkeypatch: pytest.MonkeyPatch) -> list[Finding]:
    """Findings for ``text`` saved as db/schema.sql under ``folder``."""
    (folder / "db").mkdir(parents=True)
    (folder / "db/schema.sql").write_text(text, encoding="utf-8")
    monkeypatch.chdir(folder)
    return run(Config(paths=("db",))).findings


def test_same_fingerprints_after_moving_and_reformatting(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    before = _run_on(tmp_path / "a", ORIGINAL, monkeypatch)
    after = _run_on(tmp_path / "b", REFORMATTED, monkeypatch)
    assert {f.rule for f in before} >= {"missing-key", "nullable-unique", "redundant-unique",
                                        "transitive-dependency", "schema-conflict"}
    assert [f.span.line for f in before] != [f.span.line for f in after]
    assert sorted((f.rule, f.fingerprint) for f in before) == sorted((f.rule, f.fingerprint) for f in after)
    assert len({f.fingerprint for f in before}) == len(before)


def _finding(**changes: object) -> Finding:
    """A transitive-dependency finding, with some fields changed."""
    fields: dict[str, object] = {
        "rule": "transitive-dependency", "severity": "warning", "span": Span("db/1.sql", 4, 8, 4, 30),
        "message": "depot -> city ...", "table": "couriers", "dependency": (("depot", "shift"), ("city",)),
    }
    fields.update(changes)
    return Finding(**fields)  # type: ignore[arg-type]


def test_fingerprint_ignores_position_message_severity_and_name_order() -> None:
    base = fingerprint(_finding())
    assert fingerprint(_finding(span=Span("db/1.sql", 40, 1, 41, 3))) == base
    assert fingerprint(_finding(message="reworded", severity="note", explanation=["more"])) == base
    assert fingerprint(_finding(dependency=(("shift", "depot"), ("city",)))) == base


@pytest.mark.parametrize("changes", [
    {"rule": "partial-dependency"},
    {"table": "riders"},
    {"span": Span("db/2.sql", 4, 8, 4, 30)},
    {"dependency": (("depot",), ("city",))},
    {"dependency": (("depot", "shift"), ("region",))},
])
def test_fingerprint_changes_with_what_the_finding_is_about(changes: dict[str, object]) -> None:
    assert fingerprint(_finding(**changes)) != fingerprint(_finding())


def test_without_dependency_the_subject_or_the_digit_free_message_counts() -> None:
    one = _finding(rule="nullable-unique", dependency=None, subject="badge")
    assert fingerprint(one) != fingerprint(_finding(rule="nullable-unique", dependency=None, subject="phone"))
    syntax = _finding(rule="syntax-error", dependency=None, message="cannot parse (statement starts on line 3)")
    moved = _finding(rule="syntax-error", dependency=None, message="cannot parse  (statement starts on line 12)")
    assert fingerprint(syntax) == fingerprint(moved)
