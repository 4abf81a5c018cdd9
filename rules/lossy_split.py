"""``lossy-split``: the tables a migration split a table into cannot be joined back into its rows.

>>> from linter.model import Catalog, Span, Split, SplitPiece
>>> at = Span("db/003_lots.sql", 12, 1, 12, 22)
>>> def piece(name, columns): return SplitPiece(name, columns, {c: c for c in columns}, at)
>>> split = Split("seed_lots", ("lot_id", "species", "collector"), (("lot_id",),), (),
...               (piece("lots", ("lot_id", "species")), piece("collectors", ("species", "collector"))),
...               at, "data")
>>> [f.message for f in check(Context(Catalog(splits=[split]), {}))]
['split of seed_lots into lots and collectors is lossy: joining them back on their common column species gives rows seed_lots never held']
"""
from __future__ import annotations

from collections.abc import Iterator, Sequence
from itertools import combinations

from linter.dependencies import candidate_keys, closure
from linter.explain_split import caveats, common_columns, counterexample_lines, listing
from linter.model import Finding
from linter.rule import Context, Rule
from linter.split_analysis import SplitAnalysis, split_analysis
from rules import read_page

ID = "lossy-split"


def check(context: Context) -> Iterator[Finding]:
    """One finding per recorded split whose pieces do not join back losslessly, at the split."""
    for split in context.catalog.splits:
        analysis = split_analysis(split)
        if not analysis.undecided and not analysis.chase.lossless:
            pieces = listing(split.pieces[i].table for i in analysis.carrying)
            yield Finding(
                ID,
                RULE.severity,
                split.span,
                f"split of {split.original} into {pieces} is lossy: {_joined(analysis)}"
                f" gives rows {split.original} never held",
                split.original,
                explanation=_explanation(analysis),
            )


def _joined(analysis: SplitAnalysis) -> str:
    """How the pieces join back, naming the columns they share."""
    shared = _shared(analysis)
    if not shared:
        return "they share no column, so joining them back pairs every row with every other and"
    return f"joining them back on their {common_columns(analysis, shared)}"


def _shared(analysis: SplitAnalysis) -> int:
    """The original columns carried by two pieces or more."""
    shared = 0
    for first, second in combinations(analysis.carrying, 2):
        shared |= analysis.pieces[first] & analysis.pieces[second]
    return shared


def _explanation(analysis: SplitAnalysis) -> list[str]:
    """Which side the common columns would need to be a key of, the chase's example, the fix."""
    lines = [_pair_line(analysis, first, second) for first, second in combinations(analysis.carrying, 2)]
    lines += caveats(analysis)
    lines += counterexample_lines(analysis)
    lines.append(_fix(analysis))
    return lines


def _pair_line(analysis: SplitAnalysis, first: int, second: int) -> str:
    """What the columns two pieces share would need to determine for that pair to join losslessly."""
    names = analysis.split.pieces
    shared = analysis.pieces[first] & analysis.pieces[second]
    if not shared:
        return f"{names[first].table} and {names[second].table} share no column"
    reach = closure(shared, analysis.fds)
    sides = []
    for i in (first, second):
        missing = analysis.pieces[i] & ~reach
        if not missing:
            return f"{analysis.attrs.format(shared)} is a key of {names[i].table}"
        sides.append(f"of {names[i].table} (it does not determine {analysis.attrs.format(missing)})")
    return f"{analysis.attrs.format(shared)} would need to be a key {sides[0]} or {sides[1]}"


def _fix(analysis: SplitAnalysis) -> str:
    """Carry a key of the original into every piece that lacks one: then every join is on a key."""
    key = candidate_keys(analysis.relation, analysis.fds, max_keys=1).keys[0]
    lacking = _lacking(analysis, key)
    return (f"fix: carry a key of {analysis.split.original} ({analysis.attrs.format(key)}) into"
            f" {listing(lacking)}, or make the common columns a key of one side")


def _lacking(analysis: SplitAnalysis, key: int) -> Sequence[str]:
    """The carrying pieces that do not hold all of ``key``."""
    return [analysis.split.pieces[i].table for i in analysis.carrying if key & ~analysis.pieces[i]]


RULE = Rule(ID, "error", "A split's pieces cannot be joined back into the original rows.",
            read_page(ID), check)
