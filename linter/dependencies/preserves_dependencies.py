"""Which dependencies a decomposition fails to preserve, without projecting (Beeri & Honeyman 1981).

>>> # (courier, depot, city) split into (courier, depot) and (courier, city) loses depot -> city
>>> f = [FD(0b001, 0b010), FD(0b010, 0b100)]
>>> preserves_dependencies(f, [0b011, 0b101])
(FD(lhs=2, rhs=4),)
>>> preserves_dependencies(f, [0b011, 0b110])
()

X -> A of the minimal cover is preserved when A enters Z, grown from Z := X by
Z := Z u ((Z n Ri)+ n Ri) over the pieces Ri until it stops growing. That is the closure of X
under the union of the projections, computed without computing them, in polynomial time.
"""
from __future__ import annotations

from collections.abc import Callable, Sequence

from .closure import ClosureIndex
from .fd import FD
from .minimal_cover import minimal_cover


def preserves_dependencies(
    fds: Sequence[tuple[int, int]], pieces: Sequence[int]
) -> tuple[FD, ...]:
    """The dependencies of the minimal cover of ``fds`` that the pieces do not preserve."""
    cover = minimal_cover(fds)
    return not_preserved(cover, ClosureIndex(cover).closure, pieces)


def not_preserved(
    fds: Sequence[FD], closure_of: Callable[[int], int], pieces: Sequence[int]
) -> tuple[FD, ...]:
    """The dependencies of ``fds`` not preserved; ``closure_of`` gives closures under them."""
    return tuple(fd for fd in fds if not _preserved(fd, closure_of, pieces))


def _preserved(fd: FD, closure_of: Callable[[int], int], pieces: Sequence[int]) -> bool:
    """Whether the projections onto the pieces together imply ``fd``."""
    if any(not (fd.lhs | fd.rhs) & ~piece for piece in pieces):
        return True  # it holds within one piece
    z = fd.lhs
    seen = [-1] * len(pieces)  # Z n Ri at the last visit: no need to look again until it grows
    grew = True
    while grew:
        grew = False
        for i, piece in enumerate(pieces):
            if z & piece == seen[i]:
                continue
            seen[i] = z & piece
            gained = closure_of(z & piece) & piece & ~z
            if gained:
                z |= gained
                grew = True
    return not fd.rhs & ~z
