"""A recorded split in the terms of the theory: the original's dependencies, the pieces as column sets.

>>> from linter.model import Span, Split, SplitPiece
>>> at = Span("db/002_riders.sql", 9, 1, 9, 22)
>>> split = Split(
...     "deliveries", ("delivery_id", "rider_id", "rider_name"), (("delivery_id",),), (),
...     (SplitPiece("drops", ("delivery_id", "rider"), {"delivery_id": "delivery_id",
...                                                     "rider": "rider_id"}, at),
...      SplitPiece("riders", ("rider_id", "name"), {"rider_id": "rider_id", "name": None}, at)),
...     at, "data")
>>> analysis = split_analysis(split)
>>> [analysis.attrs.format(bits) for bits in analysis.pieces]
['delivery_id, rider_id', 'rider_id']
>>> analysis.attrs.format(analysis.relation), analysis.chase.lossless
('delivery_id, rider_id', True)
>>> [(u.piece, u.column) for u in analysis.untraced]
[('riders', 'name')]

Attributes are the original's columns. F comes from the original's keys and declared dependencies
at the moment of the split. A piece is the set of original columns its lineage traces back to, so a
renamed column counts under its original name; a column fed by an expression counts for nothing and
is kept in ``untraced``. Original columns that no piece carries leave the check: the pieces are
tested against the original restricted to what they carry (F projected onto it).
"""
from __future__ import annotations

from dataclasses import dataclass, field
from functools import lru_cache

from linter.dependencies import (
    FD,
    Attributes,
    ChaseResult,
    Projection,
    chase_is_lossless,
    minimal_cover,
    preserves_dependencies,
    project,
)
from linter.given_dependencies import GivenDependency, given_dependencies
from linter.model import Column, Dependency, Split, Table


@dataclass(frozen=True)
class Untraced:
    """A piece column whose value the reader could not trace to one column of the original."""

    piece: str
    column: str
    reason: str  # why it carries no original column, worded to follow "<piece>.<column> "


@dataclass(frozen=True)
class SplitAnalysis:
    """The theory's view of one split: pieces as bitsets over the original's columns, and verdicts."""

    split: Split
    attrs: Attributes
    given: tuple[GivenDependency, ...]
    relation: int  # the original columns some piece carries
    fds: tuple[FD, ...]  # F projected onto ``relation``
    pieces: tuple[int, ...]  # per piece of ``split.pieces``, the original columns it carries
    untraced: tuple[Untraced, ...]
    undecided: str  # why no verdict is given (nothing traced, F projected in part), else ""
    chase: ChaseResult
    cover: tuple[FD, ...]  # a minimal cover of ``fds``
    lost: tuple[FD, ...]  # the dependencies of ``cover`` the pieces do not preserve

    @property
    def dropped(self) -> int:
        """Original columns that no piece carries."""
        return self.attrs.full & ~self.relation

    @property
    def carrying(self) -> tuple[int, ...]:
        """Positions in ``split.pieces`` of the pieces that carry at least one original column."""
        return tuple(i for i, bits in enumerate(self.pieces) if bits)

    def holding(self, bits: int) -> tuple[str, ...]:
        """The pieces that carry any of the original columns in ``bits``."""
        return tuple(p.table for p, held in zip(self.split.pieces, self.pieces) if held & bits)


def split_analysis(split: Split) -> SplitAnalysis:
    """The analysis of ``split``, computed once per distinct split (rules and explain share it)."""
    return _cached(_Keyed(_identity(split), split))


@dataclass(frozen=True)
class _Keyed:
    """A split with a hashable identity, so the cache can hold it."""

    key: tuple
    split: Split = field(compare=False, hash=False)


def _identity(split: Split) -> tuple:
    """Everything a split's analysis depends on, as nested tuples."""
    pieces = tuple((p.table, p.columns, tuple(sorted(p.lineage.items(), key=str))) for p in split.pieces)
    return (split.original, split.original_columns, split.original_keys,
            split.original_dependencies, pieces, split.span, split.how)


@lru_cache(maxsize=256)
def _cached(keyed: _Keyed) -> SplitAnalysis:
    """``_analyze`` behind the cache."""
    return _analyze(keyed.split)


def _analyze(split: Split) -> SplitAnalysis:
    """Trace the pieces, project F onto what they carry, then run the chase and the preservation test."""
    keys = [(key, "key", split.span) for key in split.original_keys]
    attrs, given = given_dependencies(split.original_columns, keys, split.original_dependencies)
    pieces, untraced = _trace(split, attrs)
    relation = 0
    for bits in pieces:
        relation |= bits
    everything = [g.fd for g in given]
    projection = project(everything, relation) if relation != attrs.full else None
    fds = tuple(projection.fds) if projection else tuple(everything)
    carried = [bits for bits in pieces if bits]
    cover = tuple(minimal_cover(fds))
    return SplitAnalysis(
        split=split,
        attrs=attrs,
        given=tuple(given),
        relation=relation,
        fds=fds,
        pieces=pieces,
        untraced=untraced,
        undecided=_undecided(split, relation, projection),
        chase=chase_is_lossless(relation, fds, carried),
        cover=cover,
        lost=tuple(preserves_dependencies(cover, carried)),
    )


def _undecided(split: Split, relation: int, projection: Projection | None) -> str:
    """Why the verdicts would be guesses, or "" when they are not."""
    if not relation:
        return f"no piece column could be traced to a column of {split.original}"
    if projection is not None and not projection.complete:
        return "the dependencies of the carried columns could only be projected in part"
    return ""


def _trace(split: Split, attrs: Attributes) -> tuple[tuple[int, ...], tuple[Untraced, ...]]:
    """Each piece's original columns by lineage, and the piece columns that lead to none."""
    pieces: list[int] = []
    untraced: list[Untraced] = []
    for piece in split.pieces:
        bits = 0
        for column in piece.columns:
            source = piece.lineage.get(column, "")
            if source and source in attrs.names:
                bits |= attrs.bits([source])
            else:
                untraced.append(Untraced(piece.table, column, _reason(split, source)))
        pieces.append(bits)
    return tuple(pieces), tuple(untraced)


def _reason(split: Split, source: str | None) -> str:
    """Why a piece column counts for no original column: an expression, a new column, a lost name."""
    if source is None:
        return f"comes from an expression normguard cannot trace to one column of {split.original}"
    if source:
        return f"comes from {source}, which is not a column of {split.original} at the split"
    if split.how == "declared":
        return f"has no column of the same name in {split.original}"
    return f"is not filled from {split.original}"


def carried_table(analysis: SplitAnalysis) -> Table:
    """The original cut down to the columns the pieces carry, F projected: what an alternative splits."""
    split, attrs, span = analysis.split, analysis.attrs, analysis.split.span
    columns = [Column(name, "", False, span) for name in attrs.to_names(analysis.relation)]
    declared = [Dependency(attrs.to_names(fd.lhs), attrs.to_names(fd.rhs), span, "split")
                for fd in analysis.fds]
    return Table(split.original, span, columns, dependencies=declared)
