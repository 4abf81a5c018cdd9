"""A brute-force oracle for splits, independent of ``linter.dependencies``: instances and joins.

Dependencies here are pairs of column-index tuples over one relation, e.g. ``((0,), (1, 2))``.

Lossless join: every instance with as many rows as there are pieces is enumerated, each column's
values given as a partition of the rows (a restricted growth string), which covers every such
instance up to renaming values. By the chase theorem (Aho, Beeri & Ullman 1979, "The theory of
joins in relational databases"), a decomposition that is lossy under functional dependencies has a
counterexample of exactly that size -- the final chase tableau read as data -- so the search is
complete, not a sample.

Dependency preservation: the textbook definition, spelled out by enumeration: project F onto each
piece as X -> X+ for every subset X of the piece, and ask whether their union implies F
(Ullman, "Principles of Database and Knowledge-Base Systems" vol. 1, ch. 7; from memory).
"""
from __future__ import annotations

from collections.abc import Iterator, Sequence
from itertools import combinations, product

Dep = tuple[tuple[int, ...], tuple[int, ...]]
Row = tuple[int, ...]


def growth_strings(n: int) -> list[tuple[int, ...]]:
    """Every partition of n rows into classes, as restricted growth strings (Bell(n) of them)."""
    found: list[tuple[int, ...]] = []

    def extend(prefix: tuple[int, ...], top: int) -> None:
        if len(prefix) == n:
            found.append(prefix)
            return
        for value in range(top + 2):
            extend(prefix + (value,), max(top, value))

    if n == 0:
        return [()]
    extend((0,), 0)
    return found


def instances(width: int, rows: int) -> Iterator[frozenset[Row]]:
    """Every instance of ``rows`` rows over ``width`` columns, up to renaming values per column."""
    for columns in product(growth_strings(rows), repeat=width):
        yield frozenset(tuple(column[i] for column in columns) for i in range(rows))


def satisfies(instance: frozenset[Row], deps: Sequence[Dep]) -> bool:
    """Whether every two rows that agree on a left side agree on its right side."""
    for first, second in combinations(instance, 2):
        for lhs, rhs in deps:
            if all(first[a] == second[a] for a in lhs) and any(first[a] != second[a] for a in rhs):
                return False
    return True


def join_of_projections(instance: frozenset[Row], pieces: Sequence[Sequence[int]]) -> set[Row]:
    """The natural join of the instance's projections onto the pieces, over the columns they cover."""
    partial: list[dict[int, int]] = [{}]
    for piece in pieces:
        projected = {tuple(row[a] for a in piece) for row in instance}
        partial = [
            {**done, **dict(zip(piece, values))}
            for done in partial
            for values in projected
            if all(done.get(a, v) == v for a, v in zip(piece, values))
        ]
    return {tuple(row[a] for a in sorted(row)) for row in partial}


def covered_rows(instance: frozenset[Row], pieces: Sequence[Sequence[int]]) -> set[Row]:
    """The instance projected onto the columns the pieces cover: what their join should give back."""
    covered = sorted({a for piece in pieces for a in piece})
    return {tuple(row[a] for a in covered) for row in instance}


def lossy_counterexample(width: int, deps: Sequence[Dep], pieces: Sequence[Sequence[int]]) -> frozenset[Row] | None:
    """An instance satisfying ``deps`` whose join of projections gives an extra row, or None.

    Pieces that leave columns out are tested against the instance projected onto the columns
    they cover; the chase argument above bounds the counterexample the same way.
    """
    for instance in instances(width, len(pieces)):
        if satisfies(instance, deps) and join_of_projections(instance, pieces) != covered_rows(instance, pieces):
            return instance
    return None


def closure(x: frozenset[int], deps: Sequence[Dep]) -> frozenset[int]:
    """X+ by the naive fixpoint."""
    result = set(x)
    changed = True
    while changed:
        changed = False
        for lhs, rhs in deps:
            if set(lhs) <= result and not set(rhs) <= result:
                result |= set(rhs)
                changed = True
    return frozenset(result)


def unpreserved(deps: Sequence[Dep], pieces: Sequence[Sequence[int]]) -> list[Dep]:
    """The dependencies of ``deps`` not implied by the union of their projections onto the pieces."""
    projected: list[Dep] = []
    for piece in pieces:
        for size in range(1, len(piece) + 1):
            for x in combinations(piece, size):
                determined = tuple(sorted(closure(frozenset(x), deps) & set(piece)))
                projected.append((x, determined))
    return [(lhs, rhs) for lhs, rhs in deps if not set(rhs) <= closure(frozenset(lhs), projected)]
