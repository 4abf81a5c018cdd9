"""Lossless decomposition into BCNF by splitting on violations.

>>> # (street, city, zip): street, city -> zip and zip -> city; 3NF, not BCNF
>>> result = bcnf_decompose(0b111, [FD(0b011, 0b100), FD(0b100, 0b010)])
>>> [piece.attrs for piece in result.pieces], result.lost
([6, 5], (FD(lhs=3, rhs=4),))

A piece P is split on a violating X (X+ n P holds more than X, but not all of P) into X+ n P and
X u (P - X+): lossless, since X determines the first. Closures in a piece are closures under F
cut to the piece, so they are taken once under F and remembered. Violations are looked for first
among the left sides of the minimal cover of F that lie in P (each X -> X+ n P holds on P); only
when none is left is the projection of F onto P computed (``project``; for a piece closed under F
it is the part of the cover inside it), and its left sides looked at. Without violation, P is a
piece, with its keys and that projection.

Of the violating left sides the one whose closure takes the most of P goes first (the earliest
in ``minimal_cover`` order on ties), with attributes dropped from it while its closure in P stays
the same: it splits off the largest part at once. Pieces come in the order of that recursion,
first part first; a piece contained in another is dropped. ``lost`` lists the dependencies of the
input's minimal cover that the pieces do not preserve. The dependencies must mention only
attributes of r. A projection stopped by the bound of ``project`` is sound but partial, and the
piece may then hide a violation.
"""
from __future__ import annotations

from collections.abc import Callable, Sequence
from functools import cache

from .closure import ClosureIndex
from .decomposition import Decomposition, Piece, drop_contained, make_piece
from .fd import FD, members, require_within
from .minimal_cover import minimal_cover
from .preserves_dependencies import not_preserved
from .project import project_with


def bcnf_decompose(r: int, fds: Sequence[tuple[int, int]]) -> Decomposition:
    """A lossless decomposition of r into pieces in BCNF, and the dependencies it loses."""
    require_within(r, fds)
    cover = minimal_cover(fds)
    index = ClosureIndex(cover)
    closure_of = cache(index.closure)  # many pieces ask for the same left sides
    pieces: list[Piece] = []
    work = [r]
    while work:
        attrs = work.pop()
        lhs = _violation(attrs, cover, closure_of)
        piece_fds: Sequence[FD] = ()
        if lhs is None:
            piece_fds = _projection(attrs, cover, index, closure_of)
            lhs = _violation(attrs, piece_fds, closure_of)
        if lhs is None:
            pieces.append(make_piece(attrs, piece_fds))
            continue
        determined = closure_of(lhs) & attrs
        work.append(lhs | (attrs & ~determined))
        work.append(determined)
    kept = drop_contained([piece.attrs for piece in pieces])
    chosen = tuple(piece for piece in pieces if piece.attrs in kept)
    return Decomposition(chosen, not_preserved(cover, closure_of, kept))


def _projection(
    attrs: int, cover: list[FD], index: ClosureIndex, closure_of: Callable[[int], int]
) -> tuple[FD, ...]:
    """A minimal cover of the dependencies on the piece."""
    if closure_of(attrs) == attrs:
        return tuple(fd for fd in cover if not fd.lhs & ~attrs)
    return project_with(index, attrs).fds


def _violation(attrs: int, fds: Sequence[FD], closure_of: Callable[[int], int]) -> int | None:
    """The violating left side in the piece whose closure takes the most of it, reduced."""
    best = None
    best_size = 0
    for fd in fds:
        if fd.lhs & ~attrs:
            continue
        determined = closure_of(fd.lhs) & attrs
        size = determined.bit_count()
        if determined != fd.lhs and determined != attrs and size > best_size:
            best, best_size = fd.lhs, size
    if best is None:
        return None
    target = closure_of(best) & attrs
    for a in members(best):
        if closure_of(best & ~a) & attrs == target:
            best &= ~a
    return best
