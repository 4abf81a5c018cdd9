"""Minimal and canonical covers of a set of dependencies.

>>> f = [FD(0b001, 0b110), FD(0b010, 0b100), FD(0b011, 0b100)]
>>> minimal_cover(f)
[FD(lhs=1, rhs=2), FD(lhs=2, rhs=4)]
>>> canonical_cover([FD(0b001, 0b010), FD(0b001, 0b100)])
[FD(lhs=1, rhs=6)]

A minimal cover has one attribute on each right side, no extraneous left-side attribute and no
redundant dependency; trivial dependencies are dropped. The steps run over the dependencies
sorted by ``fd_order`` (left side by size then attribute positions, then right side), so the
result depends only on the set of dependencies given, not on their order, and comes out sorted
the same way. The canonical cover merges the right sides of equal left sides.
"""
from __future__ import annotations

from collections.abc import Iterable

from .closure import ClosureIndex
from .fd import FD, fd_order, members, split_rhs


def minimal_cover(fds: Iterable[tuple[int, int]]) -> list[FD]:
    """A minimal cover of ``fds``, sorted by ``fd_order``."""
    single = split_rhs(fds)
    index = ClosureIndex(single)
    reduced = {FD(_reduce_lhs(fd, index), fd.rhs) for fd in single}
    return _drop_redundant(sorted(reduced, key=fd_order))


def canonical_cover(fds: Iterable[tuple[int, int]]) -> list[FD]:
    """The minimal cover with the right sides of equal left sides merged, sorted by left side."""
    return merge_equal_lhs(minimal_cover(fds))


def merge_equal_lhs(fds: Iterable[FD]) -> list[FD]:
    """One dependency per left side, with the right sides united, in first-seen order."""
    merged: dict[int, int] = {}
    for fd in fds:
        merged[fd.lhs] = merged.get(fd.lhs, 0) | fd.rhs
    return [FD(lhs, rhs) for lhs, rhs in merged.items()]


def _reduce_lhs(fd: FD, index: ClosureIndex) -> int:
    """The left side without extraneous attributes, tried in attribute order."""
    lhs = fd.lhs
    for a in members(fd.lhs):
        if index.implies(lhs & ~a, fd.rhs):
            lhs &= ~a
    return lhs


def _drop_redundant(fds: list[FD]) -> list[FD]:
    """``fds`` without each dependency that the ones kept so far and the later ones imply."""
    index = ClosureIndex(fds)
    dropped: list[int] = []
    kept: list[FD] = []
    for i, fd in enumerate(fds):
        if index.implies(fd.lhs, fd.rhs, skip=dropped + [i]):
            dropped.append(i)
        else:
            kept.append(fd)
    return kept
