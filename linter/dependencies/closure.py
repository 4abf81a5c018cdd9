"""Attribute closure X+ in linear time (Beeri & Bernstein 1979).

>>> fds = [FD(0b001, 0b010), FD(0b010, 0b100)]
>>> closure(0b001, fds)
7
>>> index = ClosureIndex(fds)
>>> index.closure(0b010), index.implies(0b001, 0b100), index.closure(0b001, skip=[1])
(6, True, 3)

Each dependency keeps a counter of the attributes of its left side not yet in the closure, and
each attribute the list of dependencies whose left side holds it. An attribute entering the
closure decrements the counters of its dependencies; a counter reaching zero adds the right side.
Every left-side attribute is counted down at most once, so a query costs O(|X| + sum of |lhs|).
``ClosureIndex`` builds those lists once for many queries; ``closure`` is the one-shot form.
"""
from __future__ import annotations

from collections.abc import Iterable, Sequence

from .fd import FD, members


class ClosureIndex:
    """A set of dependencies prepared for many closure queries."""

    def __init__(self, fds: Iterable[tuple[int, int]]) -> None:
        self.fds: list[tuple[int, int]] = list(fds)
        self._unmet: list[int] = []
        self._rhs: list[int] = []
        self._empty_lhs: list[int] = []
        self._users: dict[int, list[int]] = {}
        self._all_rhs = 0
        for i, (lhs, rhs) in enumerate(self.fds):
            self._unmet.append(lhs.bit_count())
            self._rhs.append(rhs)
            self._all_rhs |= rhs
            if not lhs:
                self._empty_lhs.append(i)
            for a in members(lhs):
                self._users.setdefault(a, []).append(i)

    def closure(self, x: int, skip: Iterable[int] = ()) -> int:
        """X+ under the dependencies, leaving out those at the positions in ``skip``."""
        return self._run(x, skip, self._all_rhs, None)

    def implies(self, lhs: int, rhs: int, skip: Iterable[int] = ()) -> bool:
        """Whether lhs -> rhs follows; stops as soon as ``rhs`` is reached."""
        return not rhs & ~self._run(lhs, skip, rhs, None)

    def derivation(self, x: int, goal: int) -> tuple[int, list[tuple[int, int]]]:
        """The closure (up to ``goal``) and, in firing order, (position, attributes it added)."""
        fired: list[tuple[int, int]] = []
        return self._run(x, (), goal, fired), fired

    def _run(
        self, x: int, skip: Iterable[int], goal: int, fired: list[tuple[int, int]] | None
    ) -> int:
        """The counter algorithm; stops at the fixpoint or once the closure holds ``goal``."""
        unmet = self._unmet.copy()
        for i in skip:
            unmet[i] = -1  # counts down past zero, never fires
        result = x
        for i in self._empty_lhs:
            if unmet[i] == 0:
                result = self._add(i, result, fired)
        pending = result
        users = self._users
        while pending and goal & ~result:
            a = pending & -pending
            pending ^= a
            for i in users.get(a, ()):
                unmet[i] -= 1
                if unmet[i] == 0:
                    grown = self._add(i, result, fired)
                    pending |= grown & ~result
                    result = grown
        return result

    def _add(self, i: int, result: int, fired: list[tuple[int, int]] | None) -> int:
        """Add the right side of dependency i, recording what it added when asked to."""
        added = self._rhs[i] & ~result
        if fired is not None and added:
            fired.append((i, added))
        return result | added


def closure(x: int, fds: Sequence[tuple[int, int]]) -> int:
    """X+: every attribute that X determines under ``fds``."""
    return ClosureIndex(fds).closure(x)
