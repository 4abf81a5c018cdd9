"""Closure, implication and derivations against the fixpoint definition."""
from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st

from linter.dependencies import FD, ClosureIndex, closure, derive, equivalent, implies

from .oracle import naive_closure, subsets
from .strategies import THEORY, relations


@THEORY
@given(relations())
def test_closure_of_every_subset_matches_the_fixpoint(relation: tuple[int, list[FD]]) -> None:
    r, fds = relation
    index = ClosureIndex(fds)
    for x in subsets(r):
        expected = naive_closure(x, fds)
        assert index.closure(x) == expected
        assert closure(x, fds) == expected


@THEORY
@given(relations(), st.data())
def test_implies_skip_and_equivalence(relation: tuple[int, list[FD]], data: st.DataObject) -> None:
    r, fds = relation
    lhs = data.draw(st.integers(0, r))
    rhs = data.draw(st.integers(0, r))
    assert implies(fds, FD(lhs, rhs)) == (not rhs & ~naive_closure(lhs, fds))
    skip = data.draw(st.sets(st.integers(0, max(len(fds) - 1, 0))) if fds else st.just(set()))
    kept = [fd for i, fd in enumerate(fds) if i not in skip]
    assert ClosureIndex(fds).closure(lhs, skip=skip) == naive_closure(lhs, kept)
    assert ClosureIndex(fds).implies(lhs, rhs, skip=skip) == (not rhs & ~naive_closure(lhs, kept))
    same = all(naive_closure(x, fds) == naive_closure(x, kept) for x in subsets(r))
    assert equivalent(fds, kept) == same


@THEORY
@given(relations(), st.data())
def test_derive_gives_a_valid_chain_of_given_dependencies(
    relation: tuple[int, list[FD]], data: st.DataObject
) -> None:
    r, fds = relation
    target = FD(data.draw(st.integers(0, r)), data.draw(st.integers(0, r)))
    chain = derive(fds, target)
    if target.rhs & ~naive_closure(target.lhs, fds):
        assert chain is None
        return
    assert chain is not None
    known = target.lhs
    for i, step in enumerate(chain):
        assert step in fds
        assert not step.lhs & ~known  # applicable at this point
        used_later = target.rhs
        for later in chain[i + 1 :]:
            used_later |= later.lhs
        assert step.rhs & ~known & used_later  # adds something the rest needs
        known |= step.rhs
    assert not target.rhs & ~known


def test_reversed_chain_reaches_the_end() -> None:
    # a0 -> a1 -> ... -> a127, listed from the last link to the first (the fixpoint's worst case)
    chain = [FD(1 << i, 1 << (i + 1)) for i in reversed(range(127))]
    assert closure(1, chain) == (1 << 128) - 1
    assert derive(chain, FD(1, 1 << 127)) == tuple(reversed(chain))


def test_empty_left_side_holds_from_the_start() -> None:
    constant = FD(0, 0b100)
    assert closure(0, [constant]) == 0b100
    assert derive([constant, FD(0b100, 0b010)], FD(0b001, 0b010)) == (constant, FD(0b100, 0b010))
    assert derive([constant], FD(0b011, 0b001)) == ()
