"""Every format of ``normguard check`` on the courier example, each checked by an outside reference.

- SARIF: the official OASIS SARIF 2.1.0 Errata 01 schema, through ``validate_sarif.py`` beside it in
  ``../shared/standards`` (draft-04 validator, no network).
- JUnit: the Jenkins xUnit ``junit-10.xsd`` structure (FORMATS.md §5, JUNIT-JENKINS).
- text: the GNU Coding Standards §4.4 ``file:line:column: message`` form.
- github: the actions toolkit escaping rules (``packages/core/src/command.ts``, FORMATS.md §3).
- json: the documented keys, which external checks read.
"""
from __future__ import annotations

import json
import re
import subprocess
import sys
import xml.etree.ElementTree as ET

from linter.cli.main import main
from linter.reporters.junit import UNTIED

GNU_LINE = re.compile(r"^[^\s:][^:\n]*:[1-9][0-9]*:[1-9][0-9]*: (error|warning|note): .+ \[[a-z-]+\]$")
FINDING_KEYS = {
    "rule", "severity", "path", "line", "column", "end_line", "end_column", "table", "message",
    "dependency", "fingerprint",
}
TABLE_KEYS = {"name", "path", "line", "columns", "dependencies", "candidate_keys", "keys_complete", "normal_form"}


def _check(runner, fmt: str) -> str:
    outcome = runner.invoke(main, ["check", "--format", fmt])
    assert outcome.exit_code == 1, outcome.output
    return outcome.stdout


def test_sarif_passes_the_official_validator(example, runner, shared):
    (example / "report.sarif").write_text(_check(runner, "sarif"), encoding="utf-8")
    validator = shared / "standards" / "validate_sarif.py"
    checked = subprocess.run([sys.executable, str(validator), "report.sarif"], capture_output=True, text=True)
    assert checked.returncode == 0, checked.stderr
    log = json.loads((example / "report.sarif").read_text(encoding="utf-8"))
    run = log["runs"][0]
    assert run["invocations"] == [{"executionSuccessful": True, "exitCode": 1}]
    rules = [rule["id"] for rule in run["tool"]["driver"]["rules"]]
    assert all(rules[r["ruleIndex"]] == r["ruleId"] for r in run["results"])
    assert all(r["locations"][0]["physicalLocation"]["artifactLocation"]["uriBaseId"] == "%SRCROOT%"
               for r in run["results"])
    assert str(example) not in json.dumps(log)


def test_json_has_exactly_the_documented_keys(example, runner):
    document = json.loads(_check(runner, "json"))
    assert set(document) == {"tool", "findings", "tables"}
    assert document["tool"] == {"name": "normguard", "version": "0.1.0"}
    assert all(set(f) == FINDING_KEYS for f in document["findings"])
    assert all(set(t) == TABLE_KEYS for t in document["tables"])
    tables = {t["name"]: t for t in document["tables"]}
    assert "shifts" not in tables and {"shift_times", "courier_bikes"} <= set(tables)  # final state
    dispatch = tables["zone_dispatch"]
    assert dispatch["candidate_keys"] == [["courier_id", "dispatcher"], ["courier_id", "zone"]]
    assert dispatch["normal_form"] == "3NF" and dispatch["keys_complete"] is True
    assert {"lhs": ["dispatcher"], "rhs": ["zone"], "source": "annotation"} in dispatch["dependencies"]
    assert tables["couriers"]["normal_form"] == "2NF"
    config = {"lhs": ["bike_class", "zone"], "rhs": ["price_per_km"], "source": "config"}
    assert config in tables["tariffs"]["dependencies"]
    for table in document["tables"]:
        assert table["columns"] == sorted(table["columns"])
        assert table["candidate_keys"] == sorted(table["candidate_keys"])


def test_junit_structure(example, runner):
    root = ET.fromstring(_check(runner, "junit"))
    assert root.tag == "testsuites"
    (suite,) = list(root)
    assert {"name", "tests", "failures", "errors"} <= set(suite.attrib)  # required by junit-10.xsd
    cases = {case.get("name"): case for case in suite}
    assert len(cases) == int(suite.get("tests"))
    assert [f.get("type") for f in cases["zone_dispatch"]] == ["bcnf-violation"]
    assert [f.get("type") for f in cases["depots"]] == ["redundant-unique"]
    untied = {f.get("type") for f in cases[UNTIED]}
    assert {"syntax-error", "file-error"} <= untied
    assert sum(len(case) for case in suite) == 14


def test_text_lines_follow_the_gnu_form(example, runner):
    lines = _check(runner, "text").splitlines()
    heads = [line for line in lines if not line.startswith("    ")][:-1]
    assert len(heads) == 14
    assert all(GNU_LINE.match(line) for line in heads), heads


def test_github_annotations(example, runner):
    lines = _check(runner, "github").splitlines()
    commands = [line for line in lines if line.startswith("::")]
    assert len(commands) == 14
    first = commands[0]
    assert first.startswith("::error file=migrations/0004_delivery_log.sql,line=15,endLine=15,col=4,")
    assert all("%0A" not in line.split("::")[1] for line in commands)  # no raw or escaped LF in properties
    assert any("%0A" in line.split("::", 2)[2] for line in commands)  # explanations on new lines
