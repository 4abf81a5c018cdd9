"""The dependencies of F+ that hold on a subset S of the attributes: a cover of the projection.

>>> # courier -> depot -> city: dropping depot keeps courier -> city
>>> project([FD(0b001, 0b010), FD(0b010, 0b100)], 0b101)
Projection(fds=(FD(lhs=1, rhs=4),), complete=True)

Only dependencies whose left side lies in S+ can act on a closure of a subset of S, so the others
are left out first. Then each attribute of S+ - S is eliminated by resolution (Gottlob 1987): the
dependencies X -> B and W -> A with B in W give X u (W - B) -> A, and those that mention B go.
That is fast when few attributes go, but can grow; past ``max_subsets`` dependencies (counted as
the left sides made), the projection falls back to the closures of subsets of S, level by level,
skipping any subset that holds a superkey of S and any subset Y with an attribute B in
(Y - B)+ (such a Y adds nothing its subsets do not). ``max_subsets`` also bounds the closures
taken there; when it is reached the result holds on S but may not imply every dependency that
does, and ``complete`` is False. The result is a minimal cover (``minimal_cover`` order).
"""
from __future__ import annotations

from collections.abc import Sequence
from typing import NamedTuple

from .closure import ClosureIndex
from .fd import FD, members, split_rhs
from .minimal_cover import minimal_cover


class Projection(NamedTuple):
    """A minimal cover of the dependencies holding on S, and whether it implies all of them."""

    fds: tuple[FD, ...]
    complete: bool


def project(
    fds: Sequence[tuple[int, int]], s: int, *, max_subsets: int = 1 << 16
) -> Projection:
    """A minimal cover of the dependencies of F+ with both sides in ``s``."""
    index = ClosureIndex(fds)
    reach = index.closure(s)
    relevant = split_rhs((lhs, rhs) for lhs, rhs in fds if not lhs & ~reach)
    eliminated = _eliminate(relevant, reach & ~s, max_subsets)
    if eliminated is not None:
        return Projection(tuple(minimal_cover(eliminated)), True)
    return _project_by_subsets(index, s, max_subsets)


def _eliminate(fds: list[FD], gone: int, budget: int) -> list[FD] | None:
    """Resolve away the attributes of ``gone``, cheapest first; None past ``budget`` made."""
    made = 0
    while gone:
        b = _cheapest(fds, gone)
        gone &= ~b
        fds, count = _resolve(fds, b)
        made += count
        if made > budget:
            return None
    return fds


def _cheapest(fds: list[FD], gone: int) -> int:
    """The attribute of ``gone`` with the fewest resolvents (into x out); lowest on ties."""
    into: dict[int, int] = {}
    out: dict[int, int] = {}
    for fd in fds:
        if fd.rhs & gone:
            into[fd.rhs] = into.get(fd.rhs, 0) + 1
        for a in members(fd.lhs & gone):
            out[a] = out.get(a, 0) + 1
    return min(members(gone), key=lambda a: (into.get(a, 0) * out.get(a, 0), a))


def _resolve(fds: list[FD], b: int) -> tuple[list[FD], int]:
    """The dependencies without b: the ones not mentioning it, and the resolvents through it."""
    into = [fd.lhs for fd in fds if fd.rhs == b]
    out = [fd for fd in fds if fd.lhs & b]
    kept = [fd for fd in fds if fd.rhs != b and not fd.lhs & b]
    made = [FD(x | (fd.lhs & ~b), fd.rhs) for x in into for fd in out]
    return _drop_subsumed(kept + made), len(made)


def _drop_subsumed(fds: list[FD]) -> list[FD]:
    """Drop trivial ones and those whose left side holds another's with the same right side."""
    by_rhs: dict[int, list[int]] = {}
    for fd in sorted(set(fds), key=lambda fd: fd.lhs.bit_count()):
        if fd.rhs & fd.lhs:
            continue
        kept = by_rhs.setdefault(fd.rhs, [])
        if not any(not lhs & ~fd.lhs for lhs in kept):
            kept.append(fd.lhs)
    return [FD(lhs, rhs) for rhs, lefts in by_rhs.items() for lhs in lefts]


def _project_by_subsets(index: ClosureIndex, s: int, max_subsets: int) -> Projection:
    """Closures of the subsets of s, smallest first, with the pruning described above."""
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
