"""Implication and equivalence of sets of dependencies, by closure.

>>> f = [FD(0b01, 0b10), FD(0b10, 0b100)]
>>> implies(f, FD(0b01, 0b100)), implies(f, FD(0b100, 0b01))
(True, False)
>>> equivalent(f, [FD(0b01, 0b110), FD(0b10, 0b100)])
True
"""
from __future__ import annotations

from collections.abc import Sequence

from .closure import ClosureIndex
from .fd import FD


def implies(fds: Sequence[tuple[int, int]], fd: FD | tuple[int, int]) -> bool:
    """F |= X -> Y, that is Y is in X+ under F."""
    lhs, rhs = fd
    return ClosureIndex(fds).implies(lhs, rhs)


def equivalent(f: Sequence[tuple[int, int]], g: Sequence[tuple[int, int]]) -> bool:
    """F+ = G+: each set implies every dependency of the other."""
    return _implies_all(ClosureIndex(f), g) and _implies_all(ClosureIndex(g), f)


def _implies_all(index: ClosureIndex, fds: Sequence[tuple[int, int]]) -> bool:
    """Whether the indexed dependencies imply each of ``fds``."""
    return all(index.implies(lhs, rhs) for lhs, rhs in fds)
