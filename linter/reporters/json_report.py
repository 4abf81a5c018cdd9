"""Machine-readable report: the findings and the final tables with their keys and normal form.

Keys are fixed (external checks read them): ``tool``, ``findings`` and ``tables``. Every list is
sorted, so two runs on the same input give the same bytes.

>>> from linter.model import Finding, Span
>>> found = Finding("transitive-dependency", "warning", Span("db/001.sql", 5, 4, 5, 30), "breaks 3NF",
...                 "couriers", (("depot_id",), ("depot_city", "depot_area")), fingerprint="9f")
>>> record = finding_record(found)
>>> record["dependency"], record["end_column"]
({'lhs': ['depot_id'], 'rhs': ['depot_area', 'depot_city']}, 30)
"""
from __future__ import annotations

import json
from typing import TYPE_CHECKING, Any

from linter import __version__
from linter.model import Finding
from linter.reporters.ordering import ordered

if TYPE_CHECKING:
    from linter.analysis import TableAnalysis
    from linter.engine import Result


def finding_record(finding: Finding) -> dict[str, Any]:
    """One finding as a JSON object."""
    span = finding.span
    dependency = None
    if finding.dependency is not None:
        lhs, rhs = finding.dependency
        dependency = {"lhs": sorted(lhs), "rhs": sorted(rhs)}
    return {
        "rule": finding.rule,
        "severity": finding.severity,
        "path": span.path,
        "line": span.line,
        "column": span.column,
        "end_line": span.end_line,
        "end_column": span.end_column,
        "table": finding.table,
        "message": finding.message,
        "dependency": dependency,
        "fingerprint": finding.fingerprint,
    }


def table_record(analysis: TableAnalysis) -> dict[str, Any]:
    """One table of the final schema: columns, given dependencies, candidate keys, normal form."""
    table, attrs = analysis.table, analysis.attributes
    dependencies = sorted(
        (sorted(attrs.to_names(given.fd.lhs)), sorted(attrs.to_names(given.fd.rhs)), given.origin)
        for given in analysis.given
    )
    return {
        "name": table.name,
        "path": table.span.path,
        "line": table.span.line,
        "columns": sorted(table.column_names),
        "dependencies": [{"lhs": lhs, "rhs": rhs, "source": src} for lhs, rhs, src in dependencies],
        "candidate_keys": sorted(sorted(attrs.to_names(key)) for key in analysis.keys.keys),
        "keys_complete": analysis.keys.complete,
        "normal_form": str(analysis.report.form),
    }


def json_document(result: Result) -> dict[str, Any]:
    """The report as a dict with exactly the documented keys."""
    return {
        "tool": {"name": "normguard", "version": __version__},
        "findings": [finding_record(finding) for finding in ordered(result.findings)],
        "tables": [table_record(result.analyses[name]) for name in sorted(result.analyses)],
    }


def render_json(result: Result) -> str:
    """The report as indented JSON text."""
    return json.dumps(json_document(result), indent=2, ensure_ascii=False) + "\n"
