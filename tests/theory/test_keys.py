"""Candidate keys against subset enumeration, and the bounds on the search."""
from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from linter.dependencies import (
    FD,
    candidate_keys,
    is_superkey,
    prime_attributes,
    set_order,
)

from .generated import independent_pairs
from .oracle import naive_closure, oracle_keys
from .strategies import THEORY, relations


@THEORY
@given(relations(), st.data())
def test_all_candidate_keys_are_found(relation: tuple[int, list[FD]], data: st.DataObject) -> None:
    r, fds = relation
    expected = oracle_keys(r, fds)
    search = candidate_keys(r, fds)
    assert search.complete
    assert set(search.keys) == expected
    assert list(search.keys) == sorted(expected, key=set_order)
    prime = 0
    for key in expected:
        prime |= key
    assert prime_attributes(r, fds) == prime
    assert prime_attributes(r, fds, search) == prime
    x = data.draw(st.integers(0, r))
    assert is_superkey(x, r, fds) == (naive_closure(x, fds) & r == r)


@THEORY
@given(relations(min_attrs=2), st.integers(1, 3))
def test_bounded_search_returns_keys_and_says_so(relation: tuple[int, list[FD]], bound: int) -> None:
    r, fds = relation
    expected = oracle_keys(r, fds)
    search = candidate_keys(r, fds, max_keys=bound)
    assert len(search.keys) <= bound
    assert set(search.keys) <= expected
    assert search.complete == (len(expected) <= bound)


def test_independent_pairs_have_two_to_the_n_keys() -> None:
    search = candidate_keys((1 << 16) - 1, independent_pairs(8))
    assert search.complete and len(search.keys) == 2**8
    assert all(key.bit_count() == 8 for key in search.keys)


def test_key_bound_stops_the_search_on_twentyindependent_pairs() -> None:
    r = (1 << 40) - 1
    search = candidate_keys(r, independent_pairs(20), max_keys=500, time_limit=None)
    assert not search.complete
    assert len(search.keys) == 500
    assert all(naive_closure(key, independent_pairs(20)) == r for key in search.keys)


def test_default_bounds_hold_on_twentyindependent_pairs() -> None:
    search = candidate_keys((1 << 40) - 1, independent_pairs(20))
    assert not search.complete and 0 < len(search.keys) <= 1000


def test_time_limit_stops_the_search_on_twentyindependent_pairs() -> None:
    search = candidate_keys((1 << 40) - 1, independent_pairs(20), max_keys=10**9, time_limit=0.05)
    assert not search.complete
    assert 0 < len(search.keys) < 2**20


def test_dependencies_outside_the_relation_are_refused() -> None:
    with pytest.raises(ValueError, match="outside the relation"):
        candidate_keys(0b011, [FD(0b001, 0b100)])
