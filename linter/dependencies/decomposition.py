"""The result of a decomposition: pieces with their keys and dependencies, and what was lost.

>>> piece = make_piece(0b011, [FD(0b001, 0b010)])
>>> piece
Piece(attrs=3, keys=(1,), fds=(FD(lhs=1, rhs=2),))
>>> drop_contained([0b011, 0b001, 0b110, 0b011])
[3, 6]
"""
from __future__ import annotations

from collections.abc import Sequence
from typing import NamedTuple

from .candidate_keys import candidate_keys
from .fd import FD


class Piece(NamedTuple):
    """One relation of a decomposition: its attributes, candidate keys, a cover of its FDs."""

    attrs: int
    keys: tuple[int, ...]
    fds: tuple[FD, ...]


class Decomposition(NamedTuple):
    """The pieces, and the dependencies of the minimal cover that they do not preserve."""

    pieces: tuple[Piece, ...]
    lost: tuple[FD, ...]


def make_piece(attrs: int, fds: Sequence[FD]) -> Piece:
    """A piece with the keys of ``attrs`` under ``fds`` (its projected cover), as many as
    ``candidate_keys`` finds within its default bounds."""
    return Piece(attrs, candidate_keys(attrs, fds).keys, tuple(fds))


def drop_contained(schemas: Sequence[int]) -> list[int]:
    """The schemas not contained in another; of equal ones, the first stays."""
    kept = []
    for i, schema in enumerate(schemas):
        if not any(
            not schema & ~other and (schema != other or j < i)
            for j, other in enumerate(schemas)
            if j != i
        ):
            kept.append(schema)
    return kept
