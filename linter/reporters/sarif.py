"""SARIF 2.1.0: one run, every rule described in ``tool.driver.rules``, one result per finding.

Choices follow the OASIS SARIF 2.1.0 Errata 01 standard: relative, percent-encoded artifact URIs
under the ``%SRCROOT%`` base id (whose absolute location is left out), exclusive ``endColumn``,
``columnKind`` in code points, ``results`` always an array, and our own versioned
``partialFingerprints`` key, computed without line numbers so it survives edits above a finding.
Given a baseline comparison, every result carries ``baselineState`` (SARIF §3.27.24): ``new``,
``unchanged`` (also suppressed, kind ``external``: a baseline is a separate store, §3.35) or
``absent`` for a baseline entry whose finding is gone (kind ``pass``: the problem is no longer there).

>>> artifact_uri("db/my schema.sql")
'db/my%20schema.sql'
"""
from __future__ import annotations

import json
from typing import TYPE_CHECKING, Any
from urllib.parse import quote

from linter import __version__
from linter.baseline import Comparison, Entry
from linter.model import Finding
from linter.reporters.ordering import ordered
from linter.rule import Rule

if TYPE_CHECKING:
    from linter.engine import Result

SCHEMA_URI = "https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json"
BASE_ID = "%SRCROOT%"
FINGERPRINT_KEY = "normguardFinding/v1"


def artifact_uri(path: str) -> str:
    """A relative path as a URI reference: forward slashes kept, everything else percent-encoded."""
    return quote(path.replace("\\", "/"), safe="/")


def _camel(rule_id: str) -> str:
    """``bcnf-violation`` -> ``BcnfViolation``, the readable rule name SARIF asks for."""
    return "".join(part.capitalize() for part in rule_id.split("-"))


def _first_paragraph(page: str, fallback: str) -> str:
    """The first paragraph of a rule page that is not a heading, as plain text."""
    for block in page.split("\n\n"):
        text = " ".join(block.split())
        if text and not text.startswith("#"):
            return text
    return fallback


def _descriptor(rule: Rule) -> dict[str, Any]:
    """The ``reportingDescriptor`` of one rule, with its page as help."""
    return {
        "id": rule.id,
        "name": _camel(rule.id),
        "shortDescription": {"text": rule.summary},
        "fullDescription": {"text": _first_paragraph(rule.page, rule.summary)},
        "help": {"text": rule.page or rule.summary, "markdown": rule.page or rule.summary},
        "defaultConfiguration": {"level": rule.severity},
    }


def _result(finding: Finding, index: dict[str, int]) -> dict[str, Any]:
    """The SARIF ``result`` of one finding."""
    span = finding.span
    result: dict[str, Any] = {"ruleId": finding.rule}
    if finding.rule in index:
        result["ruleIndex"] = index[finding.rule]
    result["level"] = finding.severity
    result["message"] = {"text": "\n".join([finding.message, *finding.explanation])}
    region = {
        "startLine": span.line,
        "startColumn": span.column,
        "endLine": span.end_line,
        "endColumn": span.end_column,
    }
    location = {"artifactLocation": {"uri": artifact_uri(span.path), "uriBaseId": BASE_ID}}
    result["locations"] = [{"physicalLocation": {**location, "region": region}}]
    if finding.fingerprint:
        result["partialFingerprints"] = {FINGERPRINT_KEY: finding.fingerprint}
    if finding.table is not None:
        result["properties"] = {"table": finding.table}
    return result


def _absent(entry: Entry, index: dict[str, int]) -> dict[str, Any]:
    """The result of a baseline entry whose finding is gone."""
    result: dict[str, Any] = {"ruleId": entry.rule}
    if entry.rule in index:
        result["ruleIndex"] = index[entry.rule]
    result.update(kind="pass", level="none", message={"text": f"fixed since the baseline: {entry.message}"})
    location = {"artifactLocation": {"uri": artifact_uri(entry.path), "uriBaseId": BASE_ID}}
    result["locations"] = [{"physicalLocation": location}]
    result["partialFingerprints"] = {FINGERPRINT_KEY: entry.fingerprint}
    if entry.table is not None:
        result["properties"] = {"table": entry.table}
    return result


def _baseline_results(comparison: Comparison, index: dict[str, int]) -> list[dict[str, Any]]:
    """New, unchanged and absent results, each with ``baselineState`` and ``suppressions``."""
    accepted = {"kind": "external", "status": "accepted", "justification": "recorded in the normguard baseline"}
    results = [
        {**_result(finding, index), "baselineState": state, "suppressions": [accepted] if state == "unchanged" else []}
        for state, findings in (("new", comparison.new), ("unchanged", comparison.unchanged))
        for finding in ordered(findings)
    ]
    absent = [{**_absent(entry, index), "baselineState": "absent", "suppressions": []} for entry in comparison.fixed]
    return results + absent


def sarif_log(result: Result, *, exit_code: int = 0, baseline: Comparison | None = None) -> dict[str, Any]:
    """The SARIF log as a dict, ``version`` first; with ``baseline``, its results instead of the findings."""
    rules: list[Rule] = sorted(result.rules, key=lambda rule: rule.id)
    index = {rule.id: position for position, rule in enumerate(rules)}
    driver = {
        "name": "normguard",
        "version": __version__,
        "semanticVersion": __version__,
        "rules": [_descriptor(rule) for rule in rules],
    }
    run = {
        "tool": {"driver": driver},
        "originalUriBaseIds": {
            BASE_ID: {"description": {"text": "The working directory normguard ran in."}}
        },
        "columnKind": "unicodeCodePoints",
        "invocations": [{"executionSuccessful": True, "exitCode": exit_code}],
        "results": (
            [_result(finding, index) for finding in ordered(result.findings)]
            if baseline is None
            else _baseline_results(baseline, index)
        ),
    }
    return {"version": "2.1.0", "$schema": SCHEMA_URI, "runs": [run]}


def render_sarif(result: Result, *, exit_code: int = 0, baseline: Comparison | None = None) -> str:
    """The SARIF log as indented JSON text."""
    log = sarif_log(result, exit_code=exit_code, baseline=baseline)
    return json.dumps(log, indent=2, ensure_ascii=False) + "\n"
