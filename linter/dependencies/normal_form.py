"""The highest normal form of a relation, with each violating dependency classified.

>>> # courier -> depot, depot -> city over (courier, depot, city): key courier, city transitive
>>> report = normal_form(0b111, [FD(0b001, 0b010), FD(0b010, 0b100)])
>>> report.form, report.violations
('2NF', (Violation(fd=FD(lhs=2, rhs=4), kind='transitive', key=1),))

The relation is assumed to be in 1NF. With all candidate keys known, the verdict is exact for the
definitions over F+: BCNF when every nontrivial X -> A has X a superkey; 3NF when moreover A may be
prime; 2NF when no non-prime attribute depends on a proper subset of a key. It is enough to check
the dependencies of a minimal cover for BCNF and 3NF, but not for 2NF: with A -> C, A -> E,
CE -> D and keys AB, BC, BE, the cover's CE -> D hides the partial A -> D. So each violating
X -> A of the cover is classified as

- ``bcnf``: A is prime (3NF holds for it); ``key`` is the first key holding A;
- ``partial``: A is not prime, X is made of prime attributes and is determined by a proper
  subset of ``key`` (simplest case: X is a proper subset of it), so A depends on part of a key;
- ``transitive``: A is not prime and the above does not hold; ``key`` is the first key.

There is a ``partial`` violation exactly when 2NF fails, and a ``partial`` or ``transitive`` one
exactly when 3NF fails; ``form`` is read from them. The dependencies must mention only attributes
of r. When ``keys.complete`` is False the prime attributes are those of the keys found: BCNF is
still exact and a 3NF verdict still sound, but a lower form may be reported for a relation in 3NF,
and 1NF and 2NF are told apart by the keys found only.
"""
from __future__ import annotations

from collections.abc import Sequence
from typing import NamedTuple

from .candidate_keys import KeySearch, candidate_keys, prime_attributes
from .closure import ClosureIndex
from .fd import FD, members, require_within
from .minimal_cover import minimal_cover


class Violation(NamedTuple):
    """A dependency of the minimal cover whose left side is not a superkey."""

    fd: FD
    kind: str  # "partial", "transitive" or "bcnf"
    key: int


class NormalFormReport(NamedTuple):
    """The highest normal form that holds, the violations, and the keys it rests on."""

    form: str  # "1NF", "2NF", "3NF" or "BCNF"
    violations: tuple[Violation, ...]
    keys: KeySearch


def normal_form(
    r: int, fds: Sequence[tuple[int, int]], keys: KeySearch | None = None
) -> NormalFormReport:
    """Normal form of r under ``fds``; pass ``keys`` when they are already known."""
    require_within(r, fds)
    cover = minimal_cover(fds)
    if keys is None:
        keys = candidate_keys(r, cover)
    index = ClosureIndex(cover)
    prime = prime_attributes(r, cover, keys)
    parts = _KeyParts(keys.keys, index)
    violations = tuple(
        Violation(fd, *_classify(fd, prime, keys.keys, parts))
        for fd in cover
        if not index.implies(fd.lhs, r)
    )
    return NormalFormReport(_form(violations), violations, keys)


class _KeyParts:
    """Closures of each key less one attribute, taken when first needed."""

    def __init__(self, keys: Sequence[int], index: ClosureIndex) -> None:
        self._keys = keys
        self._index = index
        self._closures: dict[int, int] = {}

    def key_determining(self, x: int) -> int | None:
        """The first key with a proper subset whose closure holds X, if any."""
        for key in self._keys:
            for a in members(key):
                part = key & ~a
                if part not in self._closures:
                    self._closures[part] = self._index.closure(part)
                if not x & ~self._closures[part]:
                    return key
        return None


def _classify(fd: FD, prime: int, keys: Sequence[int], parts: _KeyParts) -> tuple[str, int]:
    """The kind of a violating dependency and the key it is reported against."""
    if fd.rhs & prime:
        return "bcnf", next(key for key in keys if key & fd.rhs)
    if not fd.lhs & ~prime:
        key = parts.key_determining(fd.lhs)
        if key is not None:
            return "partial", key
    return "transitive", keys[0]


def _form(violations: Sequence[Violation]) -> str:
    """The highest form the classified violations leave standing."""
    kinds = {violation.kind for violation in violations}
    if "partial" in kinds:
        return "1NF"
    if "transitive" in kinds:
        return "2NF"
    if "bcnf" in kinds:
        return "3NF"
    return "BCNF"
