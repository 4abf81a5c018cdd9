"""Why a dependency holds: the given dependencies the closure applied, in order.

>>> given = [FD(0b0001, 0b0010), FD(0b0100, 0b1000), FD(0b0010, 0b0100)]
>>> derive(given, FD(0b0001, 0b0100))
(FD(lhs=1, rhs=2), FD(lhs=2, rhs=4))
>>> derive(given, FD(0b0100, 0b0001)) is None
True

The closure of X runs until Y is reached, recording each dependency that added attributes. Going
back from Y, only the ones that added an attribute still needed are kept, and their left sides
become needed in turn (unless in X). A trivial X -> Y has the empty derivation. The dependencies
come back as given (not split), in the order they were applied.
"""
from __future__ import annotations

from collections.abc import Sequence

from .closure import ClosureIndex
from .fd import FD


def derive(fds: Sequence[tuple[int, int]], fd: FD | tuple[int, int]) -> tuple[FD, ...] | None:
    """The given dependencies that derive ``fd``, in order of use; None when it does not follow."""
    given = list(fds)
    lhs, rhs = fd
    reached, fired = ClosureIndex(given).derivation(lhs, rhs)
    if rhs & ~reached:
        return None
    needed = rhs & ~lhs
    chain = []
    for i, added in reversed(fired):
        if added & needed:
            chain.append(FD(*given[i]))
            needed = (needed & ~added) | (given[i][0] & ~lhs)
    return tuple(reversed(chain))
