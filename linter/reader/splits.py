"""Recorded splits: a table whose data moved into new tables, found by data moves or declared.

A *data* split of table T is recorded at the end of a migration file in which T is dropped or
loses columns, when T fed other tables by INSERT ... SELECT or CREATE TABLE ... AS SELECT in that
same file, or in an earlier file since T last lost columns or was last split (a split may spread
over two files: data copied in one, the original dropped in a later one). Copying data without
dropping or shrinking the original is never a split, so no single file yields a false one. The
pieces are the fed tables still alive at the end of the file, plus the shrunk original itself with
its remaining columns; the original is described as it was just before its first drop or column
drop in the file. The split's span is that DROP / ALTER, or the last data move when it came later.
A table counts as a piece only if it took at least one column of the original unchanged: a table
filled from a join, or with counts and other expressions only, holds none of the original's columns
and says nothing about how the original was decomposed.

A *declared* split gathers every table carrying ``normguard: split-from T`` over the whole replay,
with T as it was when the last of them was created (its last state if it was dropped already);
lineage is the identity on column names the piece shares with T.

>>> from linter.model import Span, Table, Column
>>> span = Span("db/004.sql", 1, 1, 1, 2)
>>> original = Table("couriers", span, [Column("id", "INT", False, span), Column("city", "TEXT", True, span)])
>>> piece = Table("depots", span, [Column("city", "TEXT", True, span)])
>>> identity_piece(piece, original, span).lineage
{'city': 'city'}
"""
from __future__ import annotations

from linter.model import Span, Split, SplitPiece, Table
from linter.reader.state import Declaration, Feed, ReplayState, Shrink, snapshot


def identity_piece(piece: Table, original: Table, span: Span) -> SplitPiece:
    """A piece whose columns keep the names of the original columns they came from."""
    shared = {name: name for name in piece.column_names if original.column(name) is not None}
    return SplitPiece(piece.name, piece.column_names, shared, span)


def _alive(state: ReplayState, table: Table) -> bool:
    """True when ``table`` (this very object) is still in the catalog."""
    return state.catalog.tables.get(table.name) is table


def _fed_piece(target: Table, feeds: list[Feed]) -> SplitPiece:
    """A piece filled by data moves, with their lineage merged over the piece's present columns."""
    lineage: dict[str, str | None] = {}
    for feed in feeds:
        for column, source in feed.lineage.items():
            if target.column(column) is not None and lineage.get(column) is None:
                lineage[column] = source
    return SplitPiece(target.name, target.column_names, lineage, feeds[-1].span)


def _split_of(state: ReplayState, first: Shrink, last: Shrink, feeds: list[Feed]) -> Split | None:
    """The data split of one original, or None when none of the tables it fed is left."""
    feeds = [feed for feed in feeds if any(source is not None for source in feed.lineage.values())]
    targets: list[Table] = []
    for feed in feeds:
        if _alive(state, feed.target) and all(feed.target is not t for t in targets):
            targets.append(feed.target)
    if not targets:
        return None
    pieces = [_fed_piece(t, [f for f in feeds if f.target is t]) for t in targets]
    if _alive(state, first.table):
        pieces.append(identity_piece(first.table, first.before, last.span))
    latest = max([last.order, *(f.order for f in feeds)])
    span = last.span if latest == last.order else next(f.span for f in feeds if f.order == latest)
    before = first.before
    keys = tuple(unique.columns for unique in before.keys)
    return Split(before.name, before.column_names, keys, tuple(before.dependencies), tuple(pieces), span, "data")


def finish_file(state: ReplayState) -> None:
    """Record the data splits the file just replayed completes, and consume their data moves."""
    originals: list[Table] = []
    for shrink in state.shrinks:
        if all(shrink.table is not seen for seen in originals):
            originals.append(shrink.table)
    for original in originals:
        mine = [s for s in state.shrinks if s.table is original]
        feeds = [f for f in state.feeds if f.source is original]
        split = _split_of(state, mine[0], mine[-1], feeds)
        if split is not None:
            state.catalog.splits.append(split)
        state.feeds = [f for f in state.feeds if f.source is not original]


def declare(state: ReplayState, piece: Table, original_name: str, span: Span) -> bool:
    """Note a ``split-from`` annotation; False when the original never existed."""
    original = state.last_state(original_name)
    if original is None:
        return False
    piece.split_from = original_name
    state.declarations.setdefault(original_name, []).append(Declaration(piece, snapshot(original), span))
    return True


def finish_declared(state: ReplayState) -> None:
    """Record one declared split per original, with every live piece that names it."""
    for name, declarations in state.declarations.items():
        live = [d for d in declarations if _alive(state, d.piece)]
        if not live:
            continue
        original = declarations[-1].original
        pieces = tuple(identity_piece(d.piece, original, d.span) for d in live)
        keys = tuple(unique.columns for unique in original.keys)
        state.catalog.splits.append(Split(name, original.column_names, keys, tuple(original.dependencies),
                                          pieces, declarations[-1].span, "declared"))
