"""All candidate keys of a relation (Lucchesi & Osborn 1978), superkeys and prime attributes.

>>> pairs = [FD(0b0001, 0b0010), FD(0b0010, 0b0001), FD(0b0100, 0b1000), FD(0b1000, 0b0100)]
>>> candidate_keys(0b1111, pairs)
KeySearch(keys=(5, 9, 6, 10), complete=True)
>>> candidate_keys(0b1111, pairs, max_keys=2).complete
False
>>> is_superkey(0b0101, 0b1111, pairs), prime_attributes(0b1111, pairs)
(True, 15)

Start from one key, found by dropping attributes from R while the rest stays a superkey. For every
key K found and every X -> Y, the set X u (K - Y) is a superkey; unless it contains a key already
found, it is reduced to a new key. Every key is reached this way, and the work grows with the
number of keys times |F|, not with 2^|R| (n independent pairs a <-> b have 2^n keys, so the search
is bounded by ``max_keys`` and ``time_limit`` seconds, or None for no limit, and then says
``complete=False``; the keys found so far are returned).

The dependencies must mention only attributes of r (ValueError otherwise; use ``project``);
``is_superkey`` takes dependencies over any attributes.
Keys come sorted by size, then by attribute positions. Reduction drops attributes from the last
column backwards, so the first key found keeps the leading columns where it can.
"""
from __future__ import annotations

from collections.abc import Sequence
from time import perf_counter
from typing import NamedTuple

from .closure import ClosureIndex, closure
from .fd import FD, members, require_within, set_order


class KeySearch(NamedTuple):
    """The candidate keys found, and whether they are all of them."""

    keys: tuple[int, ...]
    complete: bool


def candidate_keys(
    r: int,
    fds: Sequence[tuple[int, int]],
    *,
    max_keys: int = 1000,
    time_limit: float | None = 2.0,
) -> KeySearch:
    """Every candidate key of r under ``fds``, at most ``max_keys`` of them."""
    require_within(r, fds)
    nontrivial = [FD(lhs, rhs & ~lhs) for lhs, rhs in fds if rhs & ~lhs]
    reducer = _KeyReducer(r, nontrivial)
    deadline = None if time_limit is None else perf_counter() + time_limit
    keys = [reducer.reduce(r)]
    done = 0
    while done < len(keys):
        if _past(deadline):
            return KeySearch(_sorted(keys), False)
        key = keys[done]
        done += 1
        for lhs, rhs in nontrivial:
            if not rhs & key:
                continue
            superkey = lhs | (key & ~rhs)
            if _contains_one(superkey, keys):
                continue
            if len(keys) >= max_keys or _past(deadline):
                return KeySearch(_sorted(keys), False)
            keys.append(reducer.reduce(superkey))
    return KeySearch(_sorted(keys), True)


def is_superkey(x: int, r: int, fds: Sequence[tuple[int, int]]) -> bool:
    """Whether X determines every attribute of r."""
    return not r & ~closure(x, fds)


def prime_attributes(
    r: int, fds: Sequence[tuple[int, int]], keys: KeySearch | None = None
) -> int:
    """The attributes that belong to some candidate key (of those found, if the search stopped)."""
    if keys is None:
        keys = candidate_keys(r, fds)
    prime = 0
    for key in keys.keys:
        prime |= key
    return prime


class _KeyReducer:
    """Reduces a superkey of r to a candidate key inside it."""

    def __init__(self, r: int, fds: Sequence[FD]) -> None:
        self._r = r
        self._index = ClosureIndex(fds)
        lhs_attrs = 0
        rhs_attrs = 0
        for fd in fds:
            lhs_attrs |= fd.lhs
            rhs_attrs |= fd.rhs
        self._in_no_key = rhs_attrs & ~lhs_attrs  # determined, and determining nothing
        self._removable = rhs_attrs & ~self._in_no_key  # the others are in every key

    def reduce(self, superkey: int) -> int:
        """Drop attributes, last column first, while what is left determines r."""
        key = superkey & ~self._in_no_key
        for a in reversed(list(members(key & self._removable))):
            if self._index.implies(key & ~a, self._r):
                key &= ~a
        return key


def _contains_one(superkey: int, keys: list[int]) -> bool:
    """Whether some key of ``keys`` is a subset of ``superkey``."""
    return any(not key & ~superkey for key in keys)


def _past(deadline: float | None) -> bool:
    """Whether the time limit has run out."""
    return deadline is not None and perf_counter() > deadline


def _sorted(keys: list[int]) -> tuple[int, ...]:
    """Keys by size, then attribute positions."""
    return tuple(sorted(keys, key=set_order))
