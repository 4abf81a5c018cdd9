"""Brute-force definitions the theory tests compare against: small relations only (2^|R| work).

Nothing here uses ``linter.dependencies`` beyond the ``FD`` tuple: closures by fixpoint, keys and
F+ by enumerating subsets, normal forms by their definitions, the chase on named symbols, and
the natural join of projections of concrete rows. The definitions followed (from memory):
closure and F+ by Armstrong (1974), "Dependency structures of data base relationships"; 2NF and
3NF by Codd (1971), "Further normalization of the data base relational model"; BCNF by Codd
(1974), "Recent investigations in relational data base systems"; the chase by Aho, Beeri & Ullman
(1979), "The theory of joins in relational databases".
"""
from __future__ import annotations

from collections.abc import Iterable, Iterator, Sequence
from itertools import product

from linter.dependencies import FD

Row = tuple[str, ...]


def naive_closure(x: int, fds: Iterable[tuple[int, int]]) -> int:
    """X+ by applying every dependency until nothing changes."""
    fds = list(fds)
    result = x
    changed = True
    while changed:
        changed = False
        for lhs, rhs in fds:
            if not lhs & ~result and rhs & ~result:
                result |= rhs
                changed = True
    return result


def subsets(s: int) -> Iterator[int]:
    """Every subset of s, s itself first, the empty set last."""
    sub = s
    while True:
        yield sub
        if sub == 0:
            return
        sub = (sub - 1) & s


def bits_of(s: int) -> list[int]:
    """The one-attribute subsets of s."""
    return [1 << i for i in range(s.bit_length()) if s >> i & 1]


def projected_closures(fds: Sequence[tuple[int, int]], s: int) -> dict[int, int]:
    """X -> X+ n s for every X in s: the projection of F+ onto s, all of it."""
    return {x: naive_closure(x, fds) & s for x in subsets(s)}


def as_fds(closures: dict[int, int]) -> list[FD]:
    """The closure table as dependencies X -> X+."""
    return [FD(x, c) for x, c in closures.items()]


def is_key(x: int, closures: dict[int, int], r: int) -> bool:
    """Whether X is a minimal superkey of r."""
    return closures[x] == r and all(closures[x & ~a] != r for a in bits_of(x))


def oracle_keys(r: int, fds: Sequence[tuple[int, int]]) -> set[int]:
    """All candidate keys of r (dependencies may leave r: closures are cut to r)."""
    closures = projected_closures(fds, r)
    return {x for x in closures if is_key(x, closures, r)}


def oracle_form(r: int, fds: Sequence[tuple[int, int]]) -> str:
    """The highest of 1NF, 2NF, 3NF, BCNF by the definitions over all of F+ on r."""
    closures = projected_closures(fds, r)
    keys = [x for x in closures if is_key(x, closures, r)]
    prime = 0
    for key in keys:
        prime |= key
    superkey = {x: closures[x] == r for x in closures}
    if all(superkey[x] or closures[x] == x for x in closures):
        return "BCNF"
    if all(superkey[x] or not (closures[x] & ~x & ~prime) for x in closures):
        return "3NF"
    for key in keys:
        for part in subsets(key):
            if part != key and closures[part] & ~prime:
                return "1NF"
    return "2NF"


def implied_on(fds: Sequence[tuple[int, int]], s: int, by: Sequence[tuple[int, int]]) -> bool:
    """Whether ``by`` (over s) implies every dependency of F+ on s, and nothing more on s."""
    return all(
        naive_closure(x, by) & s == closure for x, closure in projected_closures(fds, s).items()
    )


def union_of_projections(fds: Sequence[tuple[int, int]], pieces: Sequence[int]) -> list[FD]:
    """All dependencies of F+ on each piece, together."""
    union: list[FD] = []
    for piece in pieces:
        union.extend(as_fds(projected_closures(fds, piece)))
    return union


def chase_lossless(r: int, fds: Sequence[tuple[int, int]], pieces: Sequence[int]) -> bool:
    """The chase by its definition: rows of named symbols, equated pairwise until stable."""
    columns = bits_of(r)
    rows = [
        [f"a{j}" if column & piece else f"b{i}.{j}" for j, column in enumerate(columns)]
        for i, piece in enumerate(pieces)
    ]
    changed = True
    while changed:
        changed = False
        for lhs, rhs in fds:
            for first, second in product(rows, rows):
                if all(first[j] == second[j] for j, c in enumerate(columns) if c & lhs):
                    for j, c in enumerate(columns):
                        if c & rhs and first[j] != second[j]:
                            _rename(rows, j, first[j], second[j])
                            changed = True
    return any(all(value.startswith("a") for value in row) for row in rows)


def _rename(rows: list[list[str]], j: int, one: str, other: str) -> None:
    """Make the two symbols one in column j, keeping the distinguished one if there is one."""
    keep = min(one, other, key=lambda value: (not value.startswith("a"), value))
    drop = other if keep == one else one
    for row in rows:
        if row[j] == drop:
            row[j] = keep


def satisfies(rows: Sequence[Row], fds: Sequence[tuple[int, int]], columns: Sequence[int]) -> bool:
    """Whether the rows satisfy every dependency (columns: the attribute bit of each position)."""
    for lhs, rhs in fds:
        for first, second in product(rows, rows):
            agree = all(first[j] == second[j] for j, c in enumerate(columns) if c & lhs)
            if agree and any(first[j] != second[j] for j, c in enumerate(columns) if c & rhs):
                return False
    return True


def join_of_projections(
    rows: Sequence[Row], pieces: Sequence[int], columns: Sequence[int]
) -> set[Row]:
    """The natural join of the projections of ``rows`` onto the pieces, as rows over r."""
    partial: list[dict[int, str]] = [{}]
    for piece in pieces:
        positions = [j for j, c in enumerate(columns) if c & piece]
        projected = {tuple(row[j] for j in positions) for row in rows}
        partial = [
            {**known, **dict(zip(positions, values))}
            for known in partial
            for values in projected
            if all(known.get(j, v) == v for j, v in zip(positions, values))
        ]
    return {tuple(known[j] for j in range(len(columns))) for known in partial}
