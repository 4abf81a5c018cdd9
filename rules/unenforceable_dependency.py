"""``unenforceable-dependency``: after a split, a dependency of the original spans tables.

>>> from linter.model import Catalog, Dependency, Span, Split, SplitPiece
>>> at = Span("db/002_terminals.sql", 9, 1, 9, 25)
>>> def piece(name, columns): return SplitPiece(name, columns, {c: c for c in columns}, at)
>>> split = Split("berths", ("port", "pier", "terminal"), (("port", "pier"),),
...               (Dependency(("terminal",), ("port",), at, "annotation"),),
...               (piece("terminals", ("terminal", "port")), piece("terminal_piers", ("terminal", "pier"))),
...               at, "data")
>>> [f.message for f in check(Context(Catalog(splits=[split]), {}))]
['after the split of berths, no single table holds port, pier -> terminal: its columns went to terminals and terminal_piers, so checking it needs a join on every write']
"""
from __future__ import annotations

from collections.abc import Iterator

from linter.analysis import analyse
from linter.dependencies import FD
from linter.dependencies.fd import members
from linter.explain_split import caveats, listing
from linter.model import Finding
from linter.rule import Context, Rule
from linter.split_analysis import SplitAnalysis, carried_table, split_analysis
from rules import read_page

ID = "unenforceable-dependency"


def check(context: Context) -> Iterator[Finding]:
    """One finding per left side of the cover dependencies a recorded split does not preserve."""
    for split in context.catalog.splits:
        analysis = split_analysis(split)
        if analysis.undecided or not analysis.lost:
            continue
        proposal = _proposal(analysis)
        for fd in _merged(analysis.lost):
            names = analysis.attrs
            yield Finding(
                ID,
                RULE.severity,
                split.span,
                f"after the split of {split.original}, no single table holds {names.format_fd(fd)}:"
                f" its columns went to {listing(analysis.holding(fd.lhs | fd.rhs))},"
                " so checking it needs a join on every write",
                split.original,
                (names.to_names(fd.lhs), names.to_names(fd.rhs)),
                _explanation(analysis, fd) + proposal + caveats(analysis),
            )


def _merged(lost: tuple[FD, ...]) -> list[FD]:
    """The lost dependencies with the right sides of equal left sides merged, in cover order."""
    merged: dict[int, int] = {}
    for fd in lost:
        merged[fd.lhs] = merged.get(fd.lhs, 0) | fd.rhs
    return [FD(lhs, rhs) for lhs, rhs in merged.items()]


def _explanation(analysis: SplitAnalysis, fd: FD) -> list[str]:
    """Where each column of the dependency went, and how to enforce it still."""
    names, pieces = analysis.attrs, listing(analysis.holding(fd.lhs | fd.rhs))
    placed = [f"{names.format(a)} went to {listing(analysis.holding(a))}" for a in members(fd.lhs | fd.rhs)]
    return [
        "; ".join(placed),
        "the dependencies the pieces enforce on their own do not imply it either",
        f"enforce it with a trigger or an assertion that joins {pieces},"
        f" or keep {names.format(fd.lhs | fd.rhs)} together in one table",
    ]


def _proposal(analysis: SplitAnalysis) -> list[str]:
    """A lossless 3NF synthesis of the columns the pieces carry: it keeps every dependency in a table."""
    proposal = analyse(carried_table(analysis), "3nf")
    return ["a lossless, dependency-preserving 3NF design of the same columns:",
            *(f"  {line}" for line in proposal.describe_decomposition(proposal.synthesis))]


RULE = Rule(ID, "warning",
            "After a split, a dependency of the original spans tables and needs a join to check.",
            read_page(ID), check)
