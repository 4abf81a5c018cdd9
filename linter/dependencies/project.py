"""The dependencies of F+ that hold on a subset S of the attributes: a cover of the projection.

>>> # courier -> depot -> city: dropping depot keeps courier -> city
>>> project([FD(0b001, 0b010), FD(0b010, 0b100)], 0b101)
Projection(fds=(FD(lhs=1, rhs=4),), complete=True)

Only an attribute A of S with A in (S - A)+ can be a right side (any other is never derived from
the rest of S); with none, the projection is empty. Then one of two ways, both exact. Only
dependencies with left side in S+ act on closures of subsets of S, and only those that can lead
to such an A matter; the attributes of S+ - S are eliminated from them by resolution
(``eliminate``), which takes |S+ - S| steps and is fast unless resolvents multiply. Or the
closures of the subsets of S are taken, level by level, skipping each subset that holds a superkey
of S and each Y with an attribute B in (Y - B)+ (such a Y says nothing its subsets do not), up to
2^|S| closures. The subsets go first when 2^|S| <= |S+ - S|, and also when the resolution makes
more than ``max_subsets`` resolvents; ``max_subsets`` bounds the subsets visited too, and when that
is reached the result holds on S but may not imply all that does: ``complete`` is False. The
result is a minimal cover, in ``minimal_cover`` order.
"""
from __future__ import annotations

from collections.abc import Sequence
from typing import NamedTuple

from .closure import ClosureIndex
from .fd import FD, members, split_rhs
from .minimal_cover import minimal_cover
from .resolution import eliminate


class Projection(NamedTuple):
    """A minimal cover of the dependencies holding on S, and whether it implies all of them."""

    fds: tuple[FD, ...]
    complete: bool


def project(
    fds: Sequence[tuple[int, int]], s: int, *, max_subsets: int = 1 << 16
) -> Projection:
    """A minimal cover of the dependencies of F+ with both sides in ``s``."""
    return project_with(ClosureIndex(fds), s, max_subsets=max_subsets)


def project_with(index: ClosureIndex, s: int, *, max_subsets: int = 1 << 16) -> Projection:
    """``project`` over dependencies already indexed, for many projections of one set."""
    derivable = 0  # the attributes of s that others of s determine: the only right sides
    for a in members(s):
        if index.implies(s & ~a, a):
            derivable |= a
    if not derivable:
        return Projection((), True)
    reach = index.closure(s)
    gone = reach & ~s
    if 1 << s.bit_count() > gone.bit_count():
        relevant = split_rhs((lhs, rhs) for lhs, rhs in index.fds if not lhs & ~reach)
        eliminated = eliminate(_leading_to(relevant, derivable, s), gone, max_subsets)
        if eliminated is not None:
            return Projection(tuple(minimal_cover(eliminated)), True)
    return project_by_subsets(index, s, max_subsets=max_subsets)


def _leading_to(fds: list[FD], derivable: int, s: int) -> list[FD]:
    """The dependencies that can take part in deriving an attribute of ``derivable``: those with
    the right side in it, or on the left of one of those (outside s - derivable, whose attributes
    are never derived), and so on."""
    needed = derivable
    grew = True
    while grew:
        grew = False
        for fd in fds:
            if fd.rhs & needed and fd.lhs & ~needed & ~s:
                needed |= fd.lhs & ~s
                grew = True
    return [fd for fd in fds if fd.rhs & needed]


def project_by_subsets(
    index: ClosureIndex, s: int, *, max_subsets: int = 1 << 16
) -> Projection:
    """The projection from closures of the subsets of s, smallest first, pruned as above."""
    empty_closure = index.closure(0) & s
    found = [FD(0, empty_closure)] if empty_closure else []
    level = {0: empty_closure} if empty_closure != s else {}
    visited = 1
    while level:
        next_level: dict[int, int] = {}
        for y in _next_candidates(level, s):
            visited += 1
            if visited > max_subsets:
                return Projection(tuple(minimal_cover(found)), False)
            y_closure = index.closure(y) & s
            known = y
            for a in members(y):
                known |= level[y & ~a]
            if y_closure & ~known:
                found.append(FD(y, y_closure & ~known))
            if y_closure != s:
                next_level[y] = y_closure
        level = next_level
    return Projection(tuple(minimal_cover(found)), True)


def _next_candidates(level: dict[int, int], s: int) -> list[int]:
    """Sets one larger whose every subset one smaller is on the level and misses its attribute."""
    candidates = []
    for x, x_closure in level.items():
        above = s & ~x_closure & -(1 << x.bit_length())
        for b in members(above):
            y = x | b
            if all(_extends(level, y, a) for a in members(x)):
                candidates.append(y)
    return candidates


def _extends(level: dict[int, int], y: int, a: int) -> bool:
    """Whether Y - a is on the level and a is not in its closure."""
    rest = level.get(y & ~a)
    return rest is not None and not rest & a
