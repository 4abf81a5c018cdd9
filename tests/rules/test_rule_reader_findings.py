"""The reader's findings pass through their rules: each id a rule with a page, at the reader's place."""
from __future__ import annotations

from pathlib import Path

from linter.config import Config
from linter.engine import run
from rules import get_rule

from .rule_helpers import places

READER_RULES = ("annotation-error", "file-error", "schema-conflict", "syntax-error", "unsupported-statement")


def test_each_reader_problem_is_reported_under_its_rule(check) -> None:
    result = check("reader/postgres_problems.sql")
    assert [(f.rule, f.span.line, f.span.column) for f in result.findings] == [
        ("annotation-error", 5, 8),
        ("schema-conflict", 8, 1),
        ("syntax-error", 10, 53),
        ("unsupported-statement", 12, 1),
    ]
    assert "humidity" in result.findings[0].message


def test_reader_rules_exist_with_their_default_severity() -> None:
    severities = {rule_id: get_rule(rule_id).severity for rule_id in READER_RULES}
    assert severities == {
        "annotation-error": "error",
        "file-error": "warning",
        "schema-conflict": "warning",
        "syntax-error": "error",
        "unsupported-statement": "warning",
    }


def test_ignoring_a_reader_rule_drops_its_findings(check) -> None:
    result = check("reader/postgres_problems.sql", ignore=("schema-conflict", "unsupported-statement"))
    assert [f.rule for f in result.findings] == ["annotation-error", "syntax-error"]
    assert "schema-conflict" not in {rule.id for rule in result.rules}


def test_file_error_for_text_that_is_not_utf8(tmp_path: Path, monkeypatch) -> None:
    monkeypatch.chdir(tmp_path)
    Path("latin1.sql").write_bytes("-- caf\xe9\nCREATE TABLE t (a int PRIMARY KEY);\n".encode("latin-1"))
    result = run(Config(paths=("latin1.sql",)))
    assert [(f.rule, f.span.path) for f in result.findings] == [("file-error", "latin1.sql")]
    assert places(result.findings) == [(1, 1)]


def test_configured_level_applies_to_reader_findings_without_touching_the_catalog(check) -> None:
    result = check("reader/postgres_problems.sql", severity={"schema-conflict": "error"})
    [conflict] = [f for f in result.findings if f.rule == "schema-conflict"]
    assert conflict.severity == "error"
    [original] = [f for f in result.catalog.findings if f.rule == "schema-conflict"]
    assert original.severity == "warning"
