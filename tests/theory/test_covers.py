"""Minimal and canonical covers: equivalent, reduced, irredundant, and order-independent."""
from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st

from linter.dependencies import FD, canonical_cover, fd_order, minimal_cover

from .oracle import bits_of, naive_closure, subsets
from .strategies import THEORY, relations


def _equivalent(f: list[FD], g: list[FD], r: int) -> bool:
    """Same closure of every subset of r."""
    return all(naive_closure(x, f) == naive_closure(x, g) for x in subsets(r))


@THEORY
@given(relations(), st.randoms(use_true_random=False))
def test_minimal_cover_by_definition(relation: tuple[int, list[FD]], rng) -> None:
    r, fds = relation
    cover = minimal_cover(fds)
    assert _equivalent(cover, fds, r)
    assert cover == sorted(cover, key=fd_order)
    assert len(set(cover)) == len(cover)
    for i, fd in enumerate(cover):
        assert fd.rhs.bit_count() == 1 and not fd.rhs & fd.lhs
        others = cover[:i] + cover[i + 1 :]
        assert fd.rhs & ~naive_closure(fd.lhs, others), "redundant"
        for a in bits_of(fd.lhs):
            assert fd.rhs & ~naive_closure(fd.lhs & ~a, cover), "extraneous left attribute"
    shuffled = list(fds) + [fds[0]] if fds else []
    rng.shuffle(shuffled)
    assert minimal_cover(shuffled) == cover


@THEORY
@given(relations())
def test_canonical_cover_merges_equal_left_sides(relation: tuple[int, list[FD]]) -> None:
    r, fds = relation
    cover = canonical_cover(fds)
    assert _equivalent(cover, fds, r)
    lefts = [fd.lhs for fd in cover]
    assert len(set(lefts)) == len(lefts)
    split = sorted((FD(fd.lhs, a) for fd in cover for a in bits_of(fd.rhs)), key=fd_order)
    assert split == minimal_cover(fds)


def test_trivial_and_repeated_dependencies_vanish() -> None:
    assert minimal_cover([FD(0b11, 0b01), FD(0b1, 0b1)]) == []
    assert minimal_cover([FD(0b1, 0b10), FD(0b1, 0b10)]) == [FD(0b1, 0b10)]
