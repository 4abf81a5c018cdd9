"""Text about a recorded split: its pieces, the join verdict and why, and what it preserves.

>>> from linter.model import Dependency, Span, Split, SplitPiece
>>> at = Span("db/002_riders.sql", 9, 1, 9, 22)
>>> split = Split(
...     "deliveries", ("delivery_id", "rider_id", "rider_name"), (("delivery_id",),),
...     (Dependency(("rider_id",), ("rider_name",), at, "annotation"),),
...     (SplitPiece("riders", ("rider_id", "name"), {"rider_id": "rider_id", "name": "rider_name"}, at),
...      SplitPiece("deliveries", ("delivery_id", "rider_id"), {"delivery_id": "delivery_id",
...                                                           "rider_id": "rider_id"}, at)),
...     at, "data")
>>> for line in split_lines(split):
...     print(line)
split of deliveries into riders and deliveries (data moved, db/002_riders.sql:9:1)
  riders: rider_id, name (from rider_name)
  deliveries: delivery_id, rider_id
  dependencies of deliveries then: delivery_id -> rider_id, rider_name (key); rider_id -> rider_name (annotation)
  lossless: the common column rider_id is a key of riders (rider_id -> rider_name)
  every dependency is preserved:
    delivery_id -> rider_id: held by deliveries
    rider_id -> rider_name: held by riders
"""
from __future__ import annotations

from collections.abc import Iterable, Sequence

from linter.dependencies import FD, closure
from linter.model import Catalog, Split
from linter.split_analysis import SplitAnalysis, split_analysis

_HOW = {"data": "data moved", "declared": "declared by split-from"}


def splits_of(catalog: Catalog, table: str) -> list[Split]:
    """The recorded splits in which ``table`` is the original or one of the pieces."""
    return [s for s in catalog.splits if s.original == table or any(p.table == table for p in s.pieces)]


def split_section(catalog: Catalog, table: str) -> list[str]:
    """For ``explain``: a blank line, then each split ``table`` takes part in, or nothing."""
    lines = []
    for split in splits_of(catalog, table):
        lines += ["", *split_lines(split)]
    return lines


def split_lines(split: Split) -> list[str]:
    """Everything about one split, as the ``explain`` command prints it."""
    analysis = split_analysis(split)
    pieces = listing(piece.table for piece in split.pieces)
    lines = [f"split of {split.original} into {pieces} ({_HOW[split.how]}, {split.span.gnu()})"]
    lines += [f"  {_piece_line(split, i)}" for i in range(len(split.pieces))]
    given = "; ".join(f"{analysis.attrs.format_fd(g.fd)} ({g.origin})" for g in analysis.given) or "none"
    lines.append(f"  dependencies of {split.original} then: {given}")
    lines += [f"  {line}" for line in caveats(analysis)]
    if analysis.undecided:
        return [*lines, f"  no verdict: {analysis.undecided}"]
    lines += [f"  {line}" for line in _join_lines(analysis)]
    lines += [f"  {line}" for line in _preservation_lines(analysis)]
    return lines


def _piece_line(split: Split, index: int) -> str:
    """A piece's columns, each renamed one with the original column it came from."""
    piece = split.pieces[index]
    shown = []
    for column in piece.columns:
        source = piece.lineage.get(column)
        shown.append(column if source in (column, None) else f"{column} (from {source})")
    return f"{piece.table}: {', '.join(shown)}"


def _join_lines(analysis: SplitAnalysis) -> list[str]:
    """Why the pieces join back losslessly (a key, or the chased tableau), or the counterexample."""
    chase, names = analysis.chase, analysis.attrs
    if not chase.lossless:
        return ["lossy: the pieces do not join back into the original rows (lossy-split)",
                *counterexample_lines(analysis)]
    if chase.method == "binary":
        reach = closure(chase.common, analysis.fds)
        side = next(i for i in analysis.carrying if not analysis.pieces[i] & ~reach)
        fd = FD(chase.common, analysis.pieces[side] & ~chase.common)
        return [f"lossless: the {common_columns(analysis, chase.common)} is a key of"
                f" {analysis.split.pieces[side].table} ({names.format_fd(fd)})"]
    header = ("piece", *names.to_names(analysis.relation))
    rows = [(analysis.split.pieces[i].table, *row) for i, row in zip(analysis.carrying, chase.tableau)]
    full = next(row[0] for row in rows if all(symbol.startswith("a") for symbol in row[1:]))
    return [f"lossless by the chase: in the final tableau the row of {full} holds only distinguished"
            " symbols (a1, a2 ...), so every row the pieces join into is an original row:",
            *text_table(header, rows)]


def _preservation_lines(analysis: SplitAnalysis) -> list[str]:
    """Each dependency of the minimal cover: the piece that holds it, or that it is not preserved."""
    names = analysis.attrs
    lines = ["not every dependency is preserved:" if analysis.lost else "every dependency is preserved:"]
    for fd in analysis.cover:
        needed = fd.lhs | fd.rhs
        whole = [p.table for p, bits in zip(analysis.split.pieces, analysis.pieces) if not needed & ~bits]
        if fd in analysis.lost:
            where = "not preserved: it needs a join to check (unenforceable-dependency)"
        elif whole:
            where = f"held by {listing(whole)}"
        else:
            where = "follows from the dependencies the pieces enforce on their own"
        lines.append(f"  {names.format_fd(fd)}: {where}")
    return lines


def common_columns(analysis: SplitAnalysis, bits: int) -> str:
    """``common column a`` or ``common columns a, b``: columns that pieces share."""
    noun = "column" if bits.bit_count() == 1 else "columns"
    return f"common {noun} {analysis.attrs.format(bits)}"


def counterexample_lines(analysis: SplitAnalysis) -> list[str]:
    """The chase's counterexample: original rows that satisfy F, and the row their join invents."""
    chase = analysis.chase
    header = analysis.attrs.to_names(analysis.relation)
    count = "two rows" if len(chase.rows) == 2 else f"{len(chase.rows)} rows"
    lines = [f"for example, these {count} of {analysis.split.original} satisfy its dependencies:"]
    lines += text_table(header, chase.rows)
    lines.append("yet joining their projections also gives this row, which is not one of them:")
    lines += text_table(header, [chase.spurious] if chase.spurious else [])
    return lines


def caveats(analysis: SplitAnalysis) -> list[str]:
    """What the check could not follow: untraced piece columns, original columns no piece carries."""
    lines = [f"{u.piece}.{u.column} {u.reason}; it is not counted as carrying any column"
             for u in analysis.untraced]
    if analysis.dropped:
        lines.append(f"no piece carries {analysis.attrs.format(analysis.dropped)}: the check covers"
                     f" the other columns of {analysis.split.original}")
    return lines


def listing(names: Iterable[str]) -> str:
    """Names as a sentence lists them: ``a``, ``a and b``, ``a, b and c``."""
    items = list(names)
    return " and ".join(filter(None, [", ".join(items[:-1]), items[-1] if items else ""]))


def text_table(header: Sequence[str], rows: Iterable[Sequence[str]], indent: str = "  ") -> list[str]:
    """A small table as aligned text lines: the header, then one line per row."""
    grid = [list(header), *(list(row) for row in rows)]
    widths = [max(len(line[i]) for line in grid) for i in range(len(header))]
    return [indent + "  ".join(cell.ljust(width) for cell, width in zip(line, widths)).rstrip()
            for line in grid]
