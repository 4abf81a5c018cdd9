"""BCNF decomposition, 3NF synthesis and dependency preservation, checked piece by piece."""
from __future__ import annotations

from hypothesis import given

from linter.dependencies import (
    FD,
    Decomposition,
    bcnf_decompose,
    chase_is_lossless,
    minimal_cover,
    normal_form,
    preserves_dependencies,
    synthesize_3nf,
)

from .oracle import (
    chase_lossless,
    implied_on,
    naive_closure,
    oracle_form,
    oracle_keys,
    union_of_projections,
)
from .strategies import THEORY, decompositions, relations


def _check_pieces(r: int, fds: list[FD], result: Decomposition) -> list[int]:
    """Pieces cover r, join back losslessly, carry their true keys and projected covers."""
    attrs = [piece.attrs for piece in result.pieces]
    union = 0
    for piece in result.pieces:
        union |= piece.attrs
        assert set(piece.keys) == oracle_keys(piece.attrs, fds)
        assert implied_on(fds, piece.attrs, piece.fds)
        assert all(not fd.rhs & ~naive_closure(fd.lhs, fds) for fd in piece.fds)
        assert not any(piece.attrs & ~other == 0 for other in attrs if other != piece.attrs)
    assert union == r
    assert chase_is_lossless(r, fds, attrs).lossless
    assert chase_lossless(r, fds, attrs)
    assert list(result.lost) == _oracle_lost(fds, attrs)
    return attrs


def _oracle_lost(fds: list[FD], pieces: list[int]) -> list[FD]:
    """The dependencies of the minimal cover that the projections together do not imply."""
    union = union_of_projections(fds, pieces)
    return [fd for fd in minimal_cover(fds) if fd.rhs & ~naive_closure(fd.lhs, union)]


@THEORY
@given(relations())
def test_bcnf_decomposition(relation: tuple[int, list[FD]]) -> None:
    r, fds = relation
    result = bcnf_decompose(r, fds)
    for piece in _check_pieces(r, fds, result):
        assert oracle_form(piece, fds) == "BCNF"
    for piece in result.pieces:
        assert normal_form(piece.attrs, piece.fds).form == "BCNF"
    assert bcnf_decompose(r, list(reversed(fds))) == result


@THEORY
@given(relations())
def test_3nf_synthesis(relation: tuple[int, list[FD]]) -> None:
    r, fds = relation
    result = synthesize_3nf(r, fds)
    for piece in _check_pieces(r, fds, result):
        assert oracle_form(piece, fds) in ("3NF", "BCNF")
    for piece in result.pieces:
        assert normal_form(piece.attrs, piece.fds).form in ("3NF", "BCNF")
    assert result.lost == ()
    assert synthesize_3nf(r, list(reversed(fds))) == result


@THEORY
@given(decompositions())
def test_preserved_dependencies_against_the_union_of_projections(
    case: tuple[int, list[FD], list[int]],
) -> None:
    r, fds, pieces = case
    assert list(preserves_dependencies(fds, pieces)) == _oracle_lost(fds, pieces)


def test_relation_without_attributes() -> None:
    assert bcnf_decompose(0, []).pieces[0].keys == (0,)
    assert [piece.attrs for piece in synthesize_3nf(0, []).pieces] == [0]
    assert normal_form(0, []).form == "BCNF"
    assert chase_is_lossless(0, [], [0]).lossless
