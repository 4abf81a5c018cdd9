"""The text of ``normguard explain``: a table's columns, keys, dependencies, form and decompositions.

>>> from linter.analysis import analyse
>>> from linter.model import Column, Dependency, Span, Table, Unique
>>> at = Span("db/001.sql", 2, 14, 2, 22)
>>> table = Table("couriers", at, [Column(n, "TEXT", False, at) for n in ("courier_id", "depot", "city")],
...               [Unique(("courier_id",), "primary key", Span("db/001.sql", 3, 5, 3, 36))],
...               dependencies=[Dependency(("depot",), ("city",), Span("db/001.sql", 1, 4, 1, 30), "annotation")])
>>> lines = explain_lines(analysis := analyse(table, "bcnf"))
>>> lines[0]
'table couriers (db/001.sql:2:14): 2NF, target BCNF'
>>> [line for line in lines if "derived from" in line]
['    derived from depot -> city (annotation, db/001.sql:1:4)']
"""
from __future__ import annotations

from linter.analysis import KIND_FORM, TARGET_FORM, TableAnalysis
from linter.dependencies import Decomposition

_KIND = {"partial": "partial dependency", "transitive": "transitive dependency", "bcnf": "BCNF violation"}


def _columns(analysis: TableAnalysis) -> list[str]:
    """One line per column: name, type, nullability."""
    width = max((len(c.name) for c in analysis.table.columns), default=0)
    return [
        f"  {c.name:<{width}}  {c.type or '?'}{'' if c.nullable else ' NOT NULL'}"
        for c in analysis.table.columns
    ]


def _uniques(analysis: TableAnalysis) -> list[str]:
    """Each primary key, unique constraint and unique index, where it is declared, and whether it is a key."""
    table, keys = analysis.table, analysis.table.keys
    lines = []
    for unique in table.uniques:
        columns = f"{unique.source} ({', '.join(unique.columns)})"
        if unique in keys:
            verdict = "a key"
        elif unique.partial or unique.expression:
            verdict = "not a key: partial or over an expression"
        else:
            verdict = "not a key: a column allows NULL"
        lines.append(f"  {columns}: {verdict}, {unique.span.gnu()}")
    return lines or ["  none declared"]


def _given(analysis: TableAnalysis) -> list[str]:
    """The dependencies normguard was given, each with its origin and location."""
    names = analysis.attributes
    return [f"  {names.format_fd(g.fd)}  ({g.origin}, {g.span.gnu()})" for g in analysis.given] or ["  none"]


def _violations(analysis: TableAnalysis) -> list[str]:
    """Each violation of the minimal cover, with the given dependencies that imply it."""
    names = analysis.attributes
    lines = []
    for violation in analysis.report.violations:
        kind = f"{_KIND[violation.kind]} (breaks {KIND_FORM[violation.kind]})"
        key = analysis.format_key(violation.key)
        lines.append(f"  {names.format_fd(violation.fd)}: {kind}, against key {key}")
        steps = [f"{names.format_fd(s.fd)} ({s.origin}, {s.span.gnu()})" for s in analysis.derivation(violation.fd)]
        lines.append(f"    derived from {'; '.join(steps)}")
    return lines or ["  none"]


def _decomposition(analysis: TableAnalysis, title: str, decomposition: Decomposition) -> list[str]:
    """A decomposition's pieces, the chase's lossless verdict and what it fails to preserve."""
    names = analysis.attributes
    chase = analysis.chase(decomposition)
    verdict = "lossless (checked by the chase)" if chase.lossless else "LOSSY according to the chase"
    lines = [f"{title}: {len(decomposition.pieces)} table(s), {verdict}"]
    lines += [f"  {line}" for line in analysis.describe_decomposition(decomposition)]
    if decomposition.lost:
        lost = "; ".join(names.format_fd(fd) for fd in decomposition.lost)
        lines.append(f"  does not preserve {lost}: no single piece can enforce it with a key")
    else:
        lines.append("  preserves every dependency")
    return lines


def explain_lines(analysis: TableAnalysis) -> list[str]:
    """The whole explanation, section by section."""
    table, names, keys = analysis.table, analysis.attributes, analysis.keys
    form, target = analysis.report.form, TARGET_FORM[analysis.target]
    search = "complete search" if keys.complete else "search stopped at its bound: there may be more"
    lines = [f"table {table.name} ({table.span.gnu()}): {form}, target {target}", "", "columns:"]
    lines += _columns(analysis)
    lines += ["", "keys and unique rules:", *_uniques(analysis)]
    lines += ["", "given dependencies:", *_given(analysis)]
    lines += ["", "minimal cover:", *(f"  {names.format_fd(fd)}" for fd in analysis.cover)]
    lines += ["", f"candidate keys ({search}): {analysis.format_keys(keys.keys)}"]
    lines += ["", f"normal form: {form}", "violations:", *_violations(analysis)]
    if form == "BCNF":
        return [*lines, "", "already in BCNF: no decomposition to propose"]
    lines += ["", *_decomposition(analysis, "BCNF decomposition", analysis.bcnf)]
    lines += ["", *_decomposition(analysis, "3NF synthesis", analysis.synthesis)]
    return lines
