"""``check --baseline --format sarif``: every result says its ``baselineState``; the log is valid SARIF.

Checked against the official OASIS SARIF 2.1.0 Errata 01 JSON schema (draft-04) kept in
``../shared/standards/sarif-schema-2.1.0.json`` (source: oasis-tcs/sarif-spec, see FORMATS.md there),
and against the rules the schema cannot express, from the SARIF 2.1.0 text: §3.27.24 (if one result
has ``baselineState`` every result has it; ``absent`` marks a baseline result no longer found) and
§3.27 ``suppressions`` (null on all results of a run or on none).
"""
from __future__ import annotations

import json

import pytest
from jsonschema import Draft4Validator

from linter.cli.main import main


@pytest.fixture
def sarif_schema(shared) -> dict:
    """The OASIS schema from ../shared, or a skip naming what is missing."""
    path = shared / "standards" / "sarif-schema-2.1.0.json"
    if not path.is_file():
        pytest.skip("../shared/standards/sarif-schema-2.1.0.json is not there: cannot validate SARIF")
    return json.loads(path.read_text(encoding="utf-8"))


def _states_log(library, runner) -> dict:
    """A SARIF log after one fix and one new violation since the baseline."""
    assert runner.invoke(main, ["baseline", "migrations"]).exit_code == 0
    loans = library / "003_loans.sql"
    loans.write_text(loans.read_text(encoding="utf-8").replace(
        "due_on    date", "due_on    date,\n    PRIMARY KEY (tag_no, lent_on)"), encoding="utf-8")
    (library / "004_workshops.sql").write_text("CREATE TABLE workshop_slot (room text);\n", encoding="utf-8")
    arguments = ["check", "--baseline", ".normguard-baseline.yaml", "--format", "sarif", "migrations"]
    outcome = runner.invoke(main, arguments)
    assert outcome.exit_code == 1, outcome.output
    return json.loads(outcome.stdout)


def test_baseline_states_validate_against_the_schema(library, runner, sarif_schema):
    log = _states_log(library, runner)
    errors = sorted(Draft4Validator(sarif_schema).iter_errors(log), key=str)
    assert errors == []


def test_each_state_where_it_belongs(library, runner):
    results = _states_log(library, runner)["runs"][0]["results"]
    by_state = {}
    for result in results:
        by_state.setdefault(result["baselineState"], []).append(result)
    assert sorted(by_state) == ["absent", "new", "unchanged"]
    assert [r["properties"]["table"] for r in by_state["new"]] == ["workshop_slot"]
    assert sorted(r["properties"]["table"] for r in by_state["unchanged"]) == ["member", "tool"]
    [absent] = by_state["absent"]
    assert absent["ruleId"] == "missing-key" and absent["properties"]["table"] == "loan"
    assert absent["kind"] == "pass" and absent["level"] == "none"
    assert absent["locations"][0]["physicalLocation"]["artifactLocation"]["uri"] == "migrations/003_loans.sql"
    assert all(r["suppressions"] == [] for r in by_state["new"] + by_state["absent"])
    assert all(r["suppressions"][0]["kind"] == "external" for r in by_state["unchanged"])
    fingerprints = [r["partialFingerprints"]["normguardFinding/v1"] for r in results]
    assert len(set(fingerprints)) == len(results)


def test_without_baseline_no_state_is_set(library, runner):
    outcome = runner.invoke(main, ["check", "--format", "sarif", "migrations"])
    results = json.loads(outcome.stdout)["runs"][0]["results"]
    assert len(results) == 3 and not any("baselineState" in r or "suppressions" in r for r in results)
