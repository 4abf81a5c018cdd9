"""Hand-made results for the reporter tests: tricky paths, messages and spans, no SQL involved."""
from __future__ import annotations

from types import SimpleNamespace

import pytest

from linter.model import Catalog, Finding, Span, Table
from linter.rule import Rule


def _rule(rule_id: str, severity: str, summary: str) -> Rule:
    """A rule with a small Markdown page."""
    page = f"# {rule_id}\n\n{summary} More words on why.\n\n## Fix\n\nSplit the table.\n"
    return Rule(rule_id, severity, summary, page, lambda context: [])


RULES = [
    _rule("transitive-dependency", "warning", "A non-key column depends on another non-key column."),
    _rule("missing-key", "warning", "A table has no key."),
    _rule("syntax-error", "error", "A statement could not be parsed."),
]


def _findings() -> list[Finding]:
    """Four findings: a one-line span, a multi-line span, odd characters, and one tied to no table."""
    return [
        Finding(
            "transitive-dependency", "warning", Span("db/002 riders.sql", 7, 5, 7, 25),
            "riders: depot_id -> depot_city breaks 3NF", "riders", (("depot_id",), ("depot_city",)),
            ["depot_id is not a key of riders", "split off depots(depot_id, depot_city)"],
            fingerprint="3f2a9c0d11b2e4f5",
        ),
        Finding(
            "missing-key", "note", Span("db/001_base.sql", 2, 1, 5, 3),
            "parcels has no key", "parcels", None, [], fingerprint="0011223344556677",
        ),
        Finding(
            "missing-key", "warning", Span("db/a,b:c.sql", 1, 1, 1, 2),
            "100% odd: text,with:colons\nand a second line\x07", "odd", None,
            ["explained"], fingerprint="8899aabbccddeeff",
        ),
        Finding(
            "syntax-error", "error", Span("db/003_typo.sql", 4, 8, 4, 13),
            "unexpected 'TABEL'", None, None, [], fingerprint="fedcba9876543210",
        ),
    ]


def make_result(findings: list[Finding] | None = None) -> SimpleNamespace:
    """A result shaped like the engine's, with two tables and the rules above."""
    span = Span("db/001_base.sql", 1, 14, 1, 21)
    tables = {"parcels": Table("parcels", span), "riders": Table("riders", span)}
    files = ["db/001_base.sql", "db/002 riders.sql", "db/003_typo.sql", "db/a,b:c.sql"]
    return SimpleNamespace(
        findings=_findings() if findings is None else findings,
        suppressed=[],
        catalog=Catalog(tables=tables, files=files),
        analyses={},
        rules=RULES,
    )


@pytest.fixture
def result() -> SimpleNamespace:
    """The four-finding result."""
    return make_result()


@pytest.fixture
def empty_result() -> SimpleNamespace:
    """A result with no findings."""
    return make_result([])
