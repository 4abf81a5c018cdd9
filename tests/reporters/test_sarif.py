"""The SARIF report against the OASIS SARIF 2.1.0 Errata 01 schema and the spec's cross-field rules.

Schema: ``../shared/standards/sarif-schema-2.1.0.json`` (draft-04), the official OASIS file. The
facts checked beside it come from ``../shared/standards/FORMATS.md`` section 1, which cites the
spec sections (§3.13 version first, §3.14 columnKind and results, §3.27 ruleIndex and
partialFingerprints, §3.30 exclusive endColumn, §3.4 relative percent-encoded URIs).
"""
from __future__ import annotations

import json
import os

import pytest
from jsonschema.validators import validator_for

from linter.reporters.sarif import FINGERPRINT_KEY, render_sarif


@pytest.fixture
def sarif_errors(shared):
    """A function giving the schema errors of a log; skips when ../shared is absent."""
    return lambda log: schema_errors(shared, log)


def schema_errors(shared, log: dict) -> list[str]:
    """Schema errors of ``log`` against the official schema; skips when ../shared is absent."""
    path = shared / "standards" / "sarif-schema-2.1.0.json"
    if not path.exists():
        pytest.skip(f"the SARIF schema is not there ({path.name} under ../shared/standards)")
    schema = json.loads(path.read_text(encoding="utf-8"))
    validator = validator_for(schema)(schema)
    return [f"{list(e.absolute_path)}: {e.message}" for e in validator.iter_errors(log)]


def test_valid_against_the_official_schema(result, sarif_errors):
    log = json.loads(render_sarif(result, exit_code=1))
    assert sarif_errors(log) == []
    assert next(iter(log)) == "version" and log["version"] == "2.1.0"  # §3.13: version first


def test_empty_results_are_an_empty_array(empty_result, sarif_errors):
    log = json.loads(render_sarif(empty_result))
    assert sarif_errors(log) == []
    assert log["runs"][0]["results"] == []  # §3.14: [] when no findings, never null
    assert log["runs"][0]["invocations"] == [{"executionSuccessful": True, "exitCode": 0}]


def test_results_point_at_their_rule_and_region(result):
    run = json.loads(render_sarif(result))["runs"][0]
    rules = run["tool"]["driver"]["rules"]
    assert run["columnKind"] == "unicodeCodePoints"
    for res in run["results"]:
        assert rules[res["ruleIndex"]]["id"] == res["ruleId"]  # §3.27 ruleIndex
        assert res["level"] in ("error", "warning", "note")
        assert set(res["partialFingerprints"]) == {FINGERPRINT_KEY}  # our own key, not GitHub's
    riders = next(r for r in run["results"] if r["ruleId"] == "transitive-dependency")
    location = riders["locations"][0]["physicalLocation"]
    assert location["artifactLocation"] == {"uri": "db/002%20riders.sql", "uriBaseId": "%SRCROOT%"}
    # the span covers columns 5..24; §3.30: endColumn is one past the last character
    assert location["region"] == {"startLine": 7, "startColumn": 5, "endLine": 7, "endColumn": 25}
    assert riders["partialFingerprints"][FINGERPRINT_KEY] == "3f2a9c0d11b2e4f5"


def test_rules_carry_descriptions_help_and_default_level(result):
    rules = json.loads(render_sarif(result))["runs"][0]["tool"]["driver"]["rules"]
    assert [r["id"] for r in rules] == sorted(r["id"] for r in rules)
    transitive = next(r for r in rules if r["id"] == "transitive-dependency")
    assert transitive["name"] == "TransitiveDependency"
    assert transitive["shortDescription"]["text"].startswith("A non-key column")
    assert transitive["fullDescription"]["text"].endswith("More words on why.")
    assert transitive["help"]["markdown"].startswith("# transitive-dependency")
    assert transitive["defaultConfiguration"] == {"level": "warning"}


def test_no_absolute_path_leaks(result):
    text = render_sarif(result)
    assert os.getcwd() not in text and "file:" not in text
    base = json.loads(text)["runs"][0]["originalUriBaseIds"]["%SRCROOT%"]
    assert "uri" not in base
