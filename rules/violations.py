"""Findings for dependencies that break a normal form, shared by the three normal-form rules.

>>> from linter.analysis import analyse
>>> from linter.model import Catalog, Column, Dependency, Span, Table, Unique
>>> at, note = Span("db/001.sql", 1, 14, 1, 22), Span("db/001.sql", 5, 8, 5, 21)
>>> columns = [Column(name, "TEXT", False, at) for name in ("courier_id", "depot", "city")]
>>> table = Table("couriers", at, columns, [Unique(("courier_id",), "primary key", at)],
...               dependencies=[Dependency(("depot",), ("city",), note, "annotation")])
>>> context = Context(Catalog({"couriers": table}), {"couriers": analyse(table, "bcnf")})
>>> [finding] = violation_check("transitive-dependency", "transitive", "warning")(context)
>>> finding.span.line, finding.dependency
(5, (('depot',), ('city',)))
>>> print(finding.message)
depot -> city: depot is not a key of couriers (keys: courier_id), so rows with the same depot store the same city again (breaks 3NF)

One finding per violating left side and source line: the cover dependencies X -> A of one kind
whose origin (``TableAnalysis.origin``) is the same annotation, config entry or constraint are
merged into X -> A1, A2 ..., so ``depot -> city, region`` written once is reported once, and two
annotations on two lines are reported at each line. A violation beyond the table's target form
(BCNF with target 3nf; 3NF and BCNF with target 2nf) is reported as a note.
"""
from __future__ import annotations

from collections.abc import Callable, Iterator

from linter.analysis import KIND_FORM, TARGET_FORM, TableAnalysis
from linter.dependencies import FD
from linter.model import Finding, Span
from linter.rule import Context


def violation_check(rule_id: str, kind: str, severity: str) -> Callable[[Context], Iterator[Finding]]:
    """The check of the rule reporting violations of ``kind`` (partial, transitive or bcnf)."""

    def check(context: Context) -> Iterator[Finding]:
        for analysis in context.analyses.values():
            for (lhs, span), (rhs, key) in _groups(analysis, kind).items():
                yield _finding(rule_id, kind, severity, analysis, FD(lhs, rhs), key, span)

    return check


def _groups(analysis: TableAnalysis, kind: str) -> dict[tuple[int, Span], tuple[int, int]]:
    """Violations of ``kind`` merged by left side and origin span: (rhs, key reported against)."""
    groups: dict[tuple[int, Span], tuple[int, int]] = {}
    for violation in analysis.report.violations:
        if violation.kind != kind:
            continue
        origin = analysis.origin(violation.fd)
        span = origin.span if origin else analysis.table.span
        rhs, key = groups.get((violation.fd.lhs, span), (0, violation.key))
        groups[(violation.fd.lhs, span)] = (rhs | violation.fd.rhs, key)
    return groups


def _finding(
    rule_id: str, kind: str, severity: str, analysis: TableAnalysis, fd: FD, key: int, span: Span
) -> Finding:
    """One finding: the message says what breaks and why; the explanation gives the split."""
    names = analysis.attributes
    lhs, rhs = names.format(fd.lhs), names.format(fd.rhs)
    return Finding(
        rule_id,
        severity if analysis.demands(kind) else "note",
        span,
        f"{names.format_fd(fd)}: {_why(kind, analysis, fd, key)}, so rows with the same {lhs}"
        f" store the same {rhs} again{_bcnf_aside(kind, rhs)} (breaks {KIND_FORM[kind]})",
        analysis.table.name,
        (names.to_names(fd.lhs), names.to_names(fd.rhs)),
        _explanation(kind, analysis, fd),
    )


def _why(kind: str, analysis: TableAnalysis, fd: FD, key: int) -> str:
    """Why the left side may repeat: it is not a key (or only part of one)."""
    lhs, table = analysis.attributes.format(fd.lhs), analysis.table.name
    if kind != "partial":
        return f"{lhs} is not a key of {table} (keys: {analysis.format_keys(analysis.keys.keys)})"
    if not fd.lhs & ~key:
        return f"{lhs} is only part of the key {analysis.format_key(key)} of {table}"
    return f"{lhs} is not a key of {table} but follows from part of its key {analysis.format_key(key)}"


def _bcnf_aside(kind: str, rhs: str) -> str:
    """For BCNF: why 3NF still holds."""
    return f"; 3NF holds only because {rhs} belongs to a key" if kind == "bcnf" else ""


def _explanation(kind: str, analysis: TableAnalysis, fd: FD) -> list[str]:
    """Key-search caveat, derivation, the lossless split, what it loses, and the target note."""
    names, table = analysis.attributes, analysis.table.name
    lines = []
    if not analysis.keys.complete:
        lines.append("the key search stopped at its bound: there may be more candidate keys,"
                     " so the form reported may be lower than the real one")
    steps = analysis.derivation(fd)
    if len(steps) > 1:
        used = "; ".join(f"{names.format_fd(s.fd)} ({s.origin}, {s.span.gnu()})" for s in steps)
        lines.append(f"follows from {used}")
    lines.extend(_split_lines(analysis, fd, analysis.bcnf.lost if kind == "bcnf" else ()))
    if kind == "bcnf" and analysis.bcnf.lost:
        lost = "; ".join(names.format_fd(lost) for lost in analysis.bcnf.lost)
        advice = f" (set target: 3nf for {table} under tables)" if analysis.target == "bcnf" else ""
        lines.append(f"no BCNF decomposition normguard finds keeps {lost} inside one table:"
                     f" checking it would need a join, and 3NF is the usual target then{advice}")
    if not analysis.demands(kind):
        lines.append(f"reported as a note: the target of {table} is {TARGET_FORM[analysis.target]}")
    return lines


def _split_lines(analysis: TableAnalysis, fd: FD, said: tuple[FD, ...]) -> list[str]:
    """The split on X -> X+ that removes the violation, checked by the chase (``said``: told elsewhere)."""
    names = analysis.attributes
    split = analysis.split_on(fd.lhs)
    determined = split.pieces[1].attrs & ~fd.lhs  # the second piece is X+
    chase = analysis.chase(split)
    verdict = (
        f"lossless: the chase confirms that joining them on {names.format(fd.lhs)} gives back exactly"
        f" the rows of {analysis.table.name}"
        if chase.lossless
        else "the chase finds this split lossy: do not apply it"
    )
    lines = [f"to remove it, split {analysis.table.name} on {names.format_fd(FD(fd.lhs, determined))}:"]
    lines.extend(f"  {line}" for line in analysis.describe_decomposition(split))
    lines.append(verdict)
    for lost in (lost for lost in split.lost if lost not in said):
        lines.append(f"after the split, {names.format_fd(lost)} spans two tables and is no longer"
                     " enforced by a key of either")
    return lines
