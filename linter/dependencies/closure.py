"""Attribute closure X+ in linear time (Beeri & Bernstein 1979).

>>> from linter.dependencies import FD
>>> fds = [FD(0b001, 0b010), FD(0b010, 0b100)]
>>> closure(0b001, fds)
7
>>> index = ClosureIndex(fds)
>>> index.closure(0b010), index.implies(0b001, 0b100), index.closure(0b001, skip=[1])
(6, True, 3)

Each dependency keeps a counter of the attributes of its left side not yet in the closure, and
each attribute the list of dependencies whose left side holds it. An attribute entering the
closure decrements the counters of its dependencies; a counter reaching zero adds the right side.
A dependency with an empty left side waits on a virtual attribute 0 that is known from the start.
Every left-side attribute is counted down at most once, so a query costs O(|X| + sum of |lhs|).
``ClosureIndex`` builds those lists once for many queries; ``closure`` is the one-shot form.
"""
from __future__ import annotations

from collections.abc import Iterable, Sequence


class ClosureIndex:
    """A set of dependencies prepared for many closure queries."""

    def __init__(self, fds: Iterable[tuple[int, int]]) -> None:
        self.fds: list[tuple[int, int]] = list(fds)
        unmet: list[int] = []
        rhs_of: list[int] = []
        users: dict[int, list[int]] = {0: []}
        all_rhs = 0
        for i, (lhs, rhs) in enumerate(self.fds):
            rhs_of.append(rhs)
            all_rhs |= rhs
            if not lhs:  # waits on the virtual attribute 0, known from the start
                unmet.append(1)
                users[0].append(i)
                continue
            unmet.append(lhs.bit_count())
            while lhs:
                a = lhs & -lhs
                lhs ^= a
                waiting = users.get(a)
                if waiting is None:
                    users[a] = [i]
                else:
                    waiting.append(i)
        self._unmet = unmet
        self._rhs = rhs_of
        self._users = users
        self._all_rhs = all_rhs

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
        rhs = self._rhs
        users = self._users
        result = x
        pending = x
        a = 0  # the virtual attribute first, then each attribute as it enters the closure
        while True:
            for i in users.get(a, ()):
                left = unmet[i] - 1
                unmet[i] = left
                if not left:
                    added = rhs[i] & ~result
                    if added:
                        result |= added
                        pending |= added
                        if fired is not None:
                            fired.append((i, added))
            if not pending or not goal & ~result:
                return result
            a = pending & -pending
            pending ^= a


def closure(x: int, fds: Sequence[tuple[int, int]]) -> int:
    """X+: every attribute that X determines under ``fds``."""
    return ClosureIndex(fds).closure(x)
