"""Projections of F+ onto subsets, by both methods, against enumeration of the subsets."""
from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st

from linter.dependencies import FD, ClosureIndex, minimal_cover, project
from linter.dependencies.project import project_by_subsets
from linter.dependencies.resolution import eliminate

from .oracle import bits_of, implied_on, naive_closure
from .strategies import THEORY, relations


def _holds(fds: list[FD], found: tuple[FD, ...] | list[FD], s: int) -> bool:
    """Every found dependency lies in s and follows from F."""
    return all(
        not (fd.lhs | fd.rhs) & ~s and not fd.rhs & ~naive_closure(fd.lhs, fds) for fd in found
    )


@THEORY
@given(relations(), st.data())
def test_projection_is_a_minimal_cover_of_f_plus_on_s(
    relation: tuple[int, list[FD]], data: st.DataObject
) -> None:
    r, fds = relation
    s = data.draw(st.integers(0, r))
    for projection in (
        project(fds, s),
        project_by_subsets(ClosureIndex(fds), s),
    ):
        assert projection.complete
        assert _holds(fds, projection.fds, s)
        assert implied_on(fds, s, projection.fds)
        assert list(projection.fds) == minimal_cover(projection.fds)


@THEORY
@given(relations(), st.data())
def test_resolution_keeps_exactly_what_holds_on_the_rest(
    relation: tuple[int, list[FD]], data: st.DataObject
) -> None:
    r, fds = relation
    gone = data.draw(st.integers(0, r))
    single = [FD(lhs, a) for lhs, rhs in fds for a in bits_of(rhs & ~lhs)]
    eliminated = eliminate(single, gone, 1 << 16)
    assert eliminated is not None
    assert _holds(fds, eliminated, r & ~gone)
    assert implied_on(fds, r & ~gone, eliminated)


@THEORY
@given(relations(min_attrs=3), st.data())
def test_subset_bound_gives_a_sound_partial_projection(
    relation: tuple[int, list[FD]], data: st.DataObject
) -> None:
    r, fds = relation
    s = data.draw(st.integers(0, r))
    bound = data.draw(st.integers(1, 6))
    partial = project_by_subsets(ClosureIndex(fds), s, max_subsets=bound)
    assert _holds(fds, partial.fds, s)
    if partial.complete:
        assert implied_on(fds, s, partial.fds)
