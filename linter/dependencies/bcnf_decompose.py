"""Lossless decomposition into BCNF by splitting on violations.

>>> # (street, city, zip): street, city -> zip and zip -> city; 3NF, not BCNF
>>> result = bcnf_decompose(0b111, [FD(0b011, 0b100), FD(0b100, 0b010)])
>>> [piece.attrs for piece in result.pieces], result.lost
([6, 5], (FD(lhs=3, rhs=4),))

A piece P with a cover G of its projected dependencies is split on a violating X -> A of G (X not
a superkey of P) into X+ n P and X u (P - X+), both lossless since X determines the first; each
part gets the projection of G onto it (``project``). Of the violating left sides of G (a minimal
cover, in ``fd_order``) the one whose closure takes the most of P goes first, the earliest on
ties: it splits off the largest part at once. The pieces come in the order of that recursion,
first part first; a piece contained in another is dropped. ``lost`` lists the dependencies of the
input's minimal cover that the pieces do not preserve. The dependencies must mention only
attributes of r. A projection stopped by its bound leaves a sound but partial cover, and the
piece may then hide a violation.
"""
from __future__ import annotations

from collections.abc import Sequence

from .closure import ClosureIndex
from .decomposition import Decomposition, Piece, drop_contained, make_piece
from .fd import FD, require_within
from .minimal_cover import minimal_cover
from .preserves_dependencies import preserves_dependencies
from .project import project


def bcnf_decompose(r: int, fds: Sequence[tuple[int, int]]) -> Decomposition:
    """A lossless decomposition of r into pieces in BCNF, and the dependencies it loses."""
    require_within(r, fds)
    cover = minimal_cover(fds)
    pieces: list[Piece] = []
    work: list[tuple[int, list[FD] | tuple[FD, ...]]] = [(r, cover)]
    while work:
        attrs, piece_fds = work.pop()
        index = ClosureIndex(piece_fds)
        lhs = _chosen_violation(attrs, piece_fds, index)
        if lhs is None:
            pieces.append(make_piece(attrs, piece_fds))
            continue
        determined = index.closure(lhs) & attrs
        rest = lhs | (attrs & ~determined)
        work.append((rest, project(piece_fds, rest).fds))
        work.append((determined, project(piece_fds, determined).fds))
    kept = drop_contained([piece.attrs for piece in pieces])
    chosen = tuple(piece for piece in pieces if piece.attrs in kept)
    return Decomposition(chosen, preserves_dependencies(cover, kept))


def _chosen_violation(
    attrs: int, fds: Sequence[FD], index: ClosureIndex
) -> int | None:
    """The violating left side whose closure covers most of the piece; None when in BCNF."""
    best = None
    best_size = -1
    for fd in fds:
        determined = index.closure(fd.lhs) & attrs
        if determined != attrs and determined.bit_count() > best_size:
            best, best_size = fd.lhs, determined.bit_count()
    return best
