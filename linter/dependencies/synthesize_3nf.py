"""Lossless, dependency-preserving decomposition into 3NF by synthesis (Bernstein 1976).

>>> from linter.dependencies import FD
>>> # courier -> depot, depot -> city over (courier, depot, city)
>>> result = synthesize_3nf(0b111, [FD(0b001, 0b010), FD(0b010, 0b100)])
>>> [piece.attrs for piece in result.pieces], result.lost
([3, 6], ())

One relation X u Y for each X -> Y of the canonical cover, in its order; when none of them holds
a candidate key of r, one is added as a last relation (r reduced to a key from the last column
backwards, the key ``candidate_keys`` finds first); then a relation contained in another is
dropped (of equal ones the first stays). Each piece carries its keys and a cover of its projected
dependencies. ``lost`` is computed, and is empty. The dependencies must mention only attributes
of r.
"""
from __future__ import annotations

from collections.abc import Sequence

from .candidate_keys import candidate_keys
from .closure import ClosureIndex
from .decomposition import Decomposition, drop_contained, make_piece
from .fd import require_within
from .minimal_cover import merge_equal_lhs, minimal_cover
from .preserves_dependencies import not_preserved
from .project import project_with


def synthesize_3nf(r: int, fds: Sequence[tuple[int, int]]) -> Decomposition:
    """A 3NF decomposition of r that is lossless and preserves every dependency."""
    require_within(r, fds)
    minimal = minimal_cover(fds)
    cover = merge_equal_lhs(minimal)
    index = ClosureIndex(cover)
    schemas = [fd.lhs | fd.rhs for fd in cover]
    if not any(index.implies(schema, r) for schema in schemas):
        schemas.append(candidate_keys(r, cover, max_keys=1).keys[0])
    kept = drop_contained(schemas)
    pieces = tuple(make_piece(schema, project_with(index, schema).fds) for schema in kept)
    return Decomposition(pieces, not_preserved(minimal, index.closure, kept))
