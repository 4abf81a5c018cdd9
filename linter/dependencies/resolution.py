"""Eliminating attributes from a set of dependencies by resolution (Gottlob 1987).

>>> # courier -> depot, depot -> city, depot, shift -> van: eliminate depot
>>> eliminate([FD(0b0001, 0b0010), FD(0b0010, 0b0100), FD(0b1010, 0b10000)], 0b0010, 100)
[FD(lhs=1, rhs=4), FD(lhs=9, rhs=16)]

For an attribute B, every X -> B and W -> A with B in W give the resolvent X u (W - B) -> A, and
the dependencies that mention B go: on the remaining attributes the result implies exactly what
the input did. Attributes that nothing determines or nothing uses go first, all at once (they make
no resolvent); then the one with the fewest resolvents (in x out). A dependency whose left side
holds that of another with the same right side is dropped as it comes, so is a trivial one.
"""
from __future__ import annotations

from collections.abc import Iterable

from .fd import FD, fd_order, members


def eliminate(fds: Iterable[FD], gone: int, budget: int) -> list[FD] | None:
    """The dependencies (one-attribute right sides) with the attributes of ``gone`` resolved
    away, sorted by ``fd_order``; None once more than ``budget`` resolvents were made."""
    resolution = _Resolution(fds)
    made = 0
    while gone:
        costs = {a: resolution.cost(a) for a in members(gone)}
        cheapest = min(costs, key=lambda a: (costs[a], a))
        free = [a for a, cost in costs.items() if cost == 0]  # resolving them makes nothing
        for b in free or [cheapest]:
            gone &= ~b
            made += resolution.eliminate(b)
        if made > budget:
            return None
    return sorted(resolution.fds(), key=fd_order)


class _Resolution:
    """Dependencies indexed by right side and by left-side attribute, kept free of subsumption."""

    def __init__(self, fds: Iterable[FD]) -> None:
        self._lefts: dict[int, set[int]] = {}  # right side -> left sides
        self._users: dict[int, set[FD]] = {}  # attribute -> dependencies with it on the left
        for fd in fds:
            self._add(fd)

    def cost(self, b: int) -> int:
        """How many resolvents eliminating b makes."""
        return len(self._lefts.get(b, ())) * len(self._users.get(b, ()))

    def eliminate(self, b: int) -> int:
        """Resolve b away; the number of resolvents made."""
        into = sorted(self._lefts.get(b, ()))
        out = sorted(self._users.get(b, ()))
        for x in into:
            self._remove(FD(x, b))
        for fd in out:
            self._remove(fd)
        for x in into:
            for fd in out:
                self._add(FD(x | (fd.lhs & ~b), fd.rhs))
        return len(into) * len(out)

    def fds(self) -> list[FD]:
        """The dependencies held."""
        return [FD(lhs, rhs) for rhs, lefts in self._lefts.items() for lhs in lefts]

    def _add(self, fd: FD) -> None:
        """Hold ``fd`` unless trivial or subsumed; drop those it subsumes."""
        lefts = self._lefts.setdefault(fd.rhs, set())
        if fd.rhs & fd.lhs or any(not lhs & ~fd.lhs for lhs in lefts):
            return
        for lhs in [lhs for lhs in lefts if not fd.lhs & ~lhs]:
            self._remove(FD(lhs, fd.rhs))
        lefts.add(fd.lhs)
        for a in members(fd.lhs):
            self._users.setdefault(a, set()).add(fd)

    def _remove(self, fd: FD) -> None:
        """Stop holding ``fd``."""
        self._lefts[fd.rhs].discard(fd.lhs)
        for a in members(fd.lhs):
            self._users[a].discard(fd)
