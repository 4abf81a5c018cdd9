"""The audit data: one JSON-ready dict that both the HTML page and ``audit --json`` are made from.

>>> import os, tempfile
>>> from linter.config import Config
>>> from linter.engine import run
>>> folder = tempfile.mkdtemp()
>>> with open(os.path.join(folder, "001_hives.sql"), "w") as handle:
...     _ = handle.write("CREATE TABLE hive (hive_no INT PRIMARY KEY, apiary TEXT NOT NULL,"
...                      " apiary_town TEXT -- normguard: fd apiary -> apiary_town\\n);\\n")
>>> data = audit_data(run(Config(paths=(folder,))), [folder])
>>> [(t["name"], t["normal_form"], t["meets_target"]) for t in data["tables"]]
[('hive', '2NF', False)]
>>> [(d["lhs"], d["kind"]) for d in data["tables"][0]["dependencies"]]
[(['hive_no'], 'key'), (['apiary'], 'violation')]

The structure (``format`` ``normguard-audit``, ``version`` 1) is documented in ``linter/audit/FORMAT.md``.
"""
from __future__ import annotations

from collections import Counter
from collections.abc import Sequence
from typing import TYPE_CHECKING, Any

from linter import __version__
from linter.analysis import FORM_RANK, TARGET_FORM, TableAnalysis
from linter.dependencies import closure
from linter.model import Finding, Span
from linter.reporters.ordering import RANK, ordered

if TYPE_CHECKING:
    from linter.engine import Result

FORMAT = "normguard-audit"
VERSION = 1
WORST = 10
CAUTION = (
    "normguard proposes these tables but never writes or applies a migration. A migration that moves "
    "data into new tables can lose or duplicate rows: review it, back up the data and test it on a copy "
    "before applying it."
)
Data = dict[str, Any]


def audit_data(result: Result, paths: Sequence[str]) -> Data:
    """Summary and per-table records for the tables of ``result``, sorted by name."""
    by_table: dict[str, list[Finding]] = {}
    others: list[Finding] = []
    for finding in ordered(result.findings):
        if finding.table in result.analyses:
            by_table.setdefault(str(finding.table), []).append(finding)
        else:
            others.append(finding)
    tables = [_table(result.analyses[name], by_table.get(name, [])) for name in sorted(result.analyses)]
    targets = {analysis.target for analysis in result.analyses.values()} or {"bcnf"}
    return {
        "format": FORMAT,
        "version": VERSION,
        "tool": {"name": "normguard", "version": __version__},
        "paths": list(paths),
        "target": " / ".join(sorted(TARGET_FORM[t] for t in targets)),
        "summary": _summary(result, tables),
        "tables": tables,
        "other_findings": [_finding(f) for f in others],
    }


def _summary(result: Result, tables: list[Data]) -> Data:
    """Counts by normal form and by rule, and the tables furthest from their target."""
    severity = {rule.id: rule.severity for rule in result.rules}
    per_rule = Counter(f.rule for f in result.findings)
    worst = sorted(
        (t for t in tables if t["findings"] or not t["meets_target"]),
        key=lambda t: (FORM_RANK[t["normal_form"]], -_weight(t["findings"]), t["name"]),
    )[:WORST]
    return {
        "files": len(result.catalog.files),
        "tables": len(tables),
        "findings": len(result.findings),
        "suppressed": len(result.suppressed),
        "at_target": sum(t["meets_target"] for t in tables),
        "normal_forms": {form: sum(t["normal_form"] == form for t in tables) for form in FORM_RANK},
        "findings_by_rule": [
            {"rule": rule, "severity": severity.get(rule, "warning"), "count": count}
            for rule, count in sorted(per_rule.items(), key=lambda item: (-item[1], item[0]))
        ],
        "worst_tables": [
            {"name": t["name"], "normal_form": t["normal_form"], "findings": len(t["findings"])} for t in worst
        ],
    }


def _weight(findings: list[Data]) -> int:
    """Errors count more than warnings, warnings more than notes."""
    return sum(10 ** RANK[f["severity"]] for f in findings)


def _table(analysis: TableAnalysis, findings: list[Finding]) -> Data:
    """The record of one table."""
    table, names = analysis.table, analysis.attributes
    prime = 0
    for key in analysis.keys.keys:
        prime |= key
    primary = next((u.columns for u in table.keys if u.is_primary), ())
    meets = FORM_RANK[analysis.report.form] >= FORM_RANK[TARGET_FORM[analysis.target]]
    return {
        "name": table.name,
        **_at(table.span),
        "normal_form": analysis.report.form,
        "target": TARGET_FORM[analysis.target],
        "meets_target": meets,
        "columns": [
            {"name": c.name, "type": c.type, "nullable": c.nullable, "primary": c.name in primary,
             "prime": c.name in names.to_names(prime), **_at(c.span)}
            for c in table.columns
        ],
        "keys": [_key(analysis, key) for key in analysis.keys.keys],
        "keys_complete": analysis.keys.complete,
        "has_declared_key": bool(table.keys),
        "dependencies": _dependencies(analysis),
        "findings": [_finding(f) for f in findings],
        "decomposition": None if meets else _decomposition(analysis),
        "history": [{"action": e.action, "detail": e.detail, **_at(e.span)} for e in table.history],
    }


def _at(span: Span) -> Data:
    """``path`` and ``line`` of a span."""
    return {"path": span.path, "line": span.line}


def _key(analysis: TableAnalysis, key: int) -> Data:
    """A candidate key with the constraints that declare exactly it."""
    columns = analysis.attributes.to_names(key)
    declared = [
        {"source": u.source, "name": u.name, **_at(u.span)}
        for u in analysis.table.keys
        if set(u.columns) == set(columns)
    ]
    return {"columns": list(columns), "declared": declared}


def _dependencies(analysis: TableAnalysis) -> list[Data]:
    """The given dependencies; ``kind`` says whether the left side is a key or breaks the target."""
    names, full = analysis.attributes, analysis.attributes.full
    breaking = {
        id(origin)
        for violation in analysis.report.violations
        if analysis.demands(violation.kind) and (origin := analysis.origin(violation.fd)) is not None
    }
    records = []
    for given in analysis.given:
        superkey = closure(given.fd.lhs, analysis.cover) & full == full
        kind = "key" if superkey else "violation" if id(given) in breaking else "other"
        records.append({
            "lhs": list(names.to_names(given.fd.lhs)), "rhs": list(names.to_names(given.fd.rhs)),
            "kind": kind, "source": given.origin, **_at(given.span),
        })
    return records


def _decomposition(analysis: TableAnalysis) -> Data:
    """The split that reaches the target: BCNF decomposition, or 3NF synthesis for lower targets."""
    bcnf = analysis.target == "bcnf"
    decomposition = analysis.bcnf if bcnf else analysis.synthesis
    names = analysis.attributes
    method = (
        "lossless BCNF decomposition" if bcnf else "lossless 3NF synthesis that keeps every dependency"
    )
    return {
        "method": method,
        "pieces": [
            {"name": name, "columns": list(names.to_names(piece.attrs)),
             "keys": [list(names.to_names(key)) for key in piece.keys]}
            for name, piece in zip(analysis.piece_names(decomposition), decomposition.pieces)
        ],
        "lost": [
            {"lhs": list(names.to_names(fd.lhs)), "rhs": list(names.to_names(fd.rhs))} for fd in decomposition.lost
        ],
        "caution": CAUTION,
    }


def _finding(finding: Finding) -> Data:
    """A finding with its place and explanation."""
    return {
        "rule": finding.rule, "severity": finding.severity, **_at(finding.span), "column": finding.span.column,
        "message": finding.message, "explanation": list(finding.explanation), "fingerprint": finding.fingerprint,
    }
