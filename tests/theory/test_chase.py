"""The chase against its definition, and its counterexamples checked on concrete rows."""
from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from linter.dependencies import FD, chase_is_lossless

from .oracle import (
    bits_of,
    chase_lossless,
    join_of_projections,
    naive_closure,
    satisfies,
)
from .strategies import THEORY, decompositions


@THEORY
@given(decompositions(), st.data())
def test_chase_verdict_and_counterexample(
    case: tuple[int, list[FD], list[int]], data: st.DataObject
) -> None:
    r, fds, pieces = case
    columns = bits_of(r)
    result = chase_is_lossless(r, fds, pieces)
    assert result.lossless == chase_lossless(r, fds, pieces)
    assert len(result.tableau) == len(pieces)
    assert all(len(row) == len(columns) for row in result.tableau)
    assert satisfies(result.tableau, fds, columns)  # the chase ends where F holds
    if len(pieces) == 2:
        common = pieces[0] & pieces[1]
        determined = naive_closure(common, fds)
        binary = not pieces[0] & ~determined or not pieces[1] & ~determined
        assert (result.method, result.common, result.lossless) == ("binary", common, binary)
    else:
        assert (result.method, result.common) == ("chase", 0)
    if result.lossless:
        assert result.spurious is None and result.rows == ()
        assert any(all(value.startswith("a") for value in row) for row in result.tableau)
        rows = _instance_satisfying(data, fds, columns)
        assert join_of_projections(rows, pieces, columns) == set(rows)
    else:
        assert result.spurious is not None and result.spurious not in result.rows
        assert 1 <= len(result.rows) <= len(pieces)
        assert satisfies(result.rows, fds, columns)
        assert result.spurious in join_of_projections(result.rows, pieces, columns)


def _instance_satisfying(
    data: st.DataObject, fds: list[FD], columns: list[int]
) -> list[tuple[str, ...]]:
    """Up to five random rows over a two-value domain, each kept only if F still holds."""
    row = st.tuples(*[st.sampled_from("xy") for _ in columns])
    rows: list[tuple[str, ...]] = []
    for candidate in data.draw(st.lists(row, max_size=5)):
        if candidate not in rows and satisfies(rows + [candidate], fds, columns):
            rows.append(candidate)
    return rows


def test_single_piece_is_lossless() -> None:
    result = chase_is_lossless(0b11, [], [0b11])
    assert result.lossless and result.method == "chase" and result.tableau == (("a1", "a2"),)


@pytest.mark.parametrize("pieces", [[0b001], [0b011, 0b100, 0b1000]])
def test_pieces_must_cover_the_relation_and_stay_inside(pieces: list[int]) -> None:
    with pytest.raises(ValueError, match="cover"):
        chase_is_lossless(0b111, [], pieces)
