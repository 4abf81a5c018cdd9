"""The functional dependency X -> Y over attribute bitsets, and the orders normguard prints in.

>>> fd = FD(0b001, 0b110)
>>> fd.lhs, fd.rhs
(1, 6)
>>> positions(0b1010)
(1, 3)
>>> sorted([0b11, 0b100, 0b1], key=set_order)
[1, 4, 3]
>>> sorted(split_rhs([FD(0b1, 0b111), FD(0b1, 0b10)]))
[FD(lhs=1, rhs=2), FD(lhs=1, rhs=4)]

Attribute sets are plain ints: bit i stands for the i-th attribute of the relation. Sets are
ordered by size, then lexicographically by attribute positions (``set_order``); dependencies by
left side, then right side (``fd_order``).
"""
from __future__ import annotations

from collections.abc import Iterable, Iterator
from typing import NamedTuple


class FD(NamedTuple):
    """X -> Y: any two rows that agree on ``lhs`` agree on ``rhs``."""

    lhs: int
    rhs: int


def members(bits: int) -> Iterator[int]:
    """The one-attribute sets of ``bits``, lowest position first."""
    while bits:
        low = bits & -bits
        yield low
        bits ^= low


def positions(bits: int) -> tuple[int, ...]:
    """The attribute positions of ``bits``, ascending."""
    return tuple(low.bit_length() - 1 for low in members(bits))


def set_order(bits: int) -> tuple[int, tuple[int, ...]]:
    """Sort key of an attribute set: size first, then attribute positions."""
    return bits.bit_count(), positions(bits)


def fd_order(fd: FD) -> tuple[tuple[int, tuple[int, ...]], tuple[int, ...]]:
    """Sort key of a dependency: its left side by ``set_order``, then its right side."""
    return set_order(fd.lhs), positions(fd.rhs)


def split_rhs(fds: Iterable[tuple[int, int]]) -> list[FD]:
    """Dependencies with one attribute on the right, trivial ones dropped, no repeats."""
    return list({FD(lhs, a) for lhs, rhs in fds for a in members(rhs & ~lhs)})


def attributes_of(fds: Iterable[tuple[int, int]]) -> int:
    """Every attribute mentioned by ``fds``."""
    mentioned = 0
    for lhs, rhs in fds:
        mentioned |= lhs | rhs
    return mentioned


def require_within(r: int, fds: Iterable[tuple[int, int]]) -> None:
    """Raise ValueError when ``fds`` mention an attribute outside the relation ``r``."""
    outside = attributes_of(fds) & ~r
    if outside:
        raise ValueError(
            f"dependencies mention attributes {positions(outside)} outside the relation; "
            "project them onto it first"
        )
