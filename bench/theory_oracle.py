"""The brute-force side of ``bench/theory.py`` that the tests' oracle does not already hold.

Closures, keys and normal forms by enumeration come from ``tests/theory/oracle.py`` (the
definitions the theory tests check against); here are the textbook steps built on them: the
minimal cover with the fixpoint closure, and projections and both decompositions from the
closures of all subsets. Only usable up to about 16 attributes.
"""
from __future__ import annotations

from collections.abc import Sequence

from tests.theory.oracle import (
    bits_of,
    naive_closure,
    oracle_keys,
    projected_closures,
    subsets,
)

FDs = Sequence[tuple[int, int]]


def naive_minimal_cover(fds: FDs) -> list[tuple[int, int]]:
    """Split right sides, drop extraneous left attributes, drop redundant dependencies."""
    single = sorted({(lhs, a) for lhs, rhs in fds for a in bits_of(rhs & ~lhs)})
    reduced = []
    for lhs, a in single:
        for b in bits_of(lhs):
            if naive_closure(lhs & ~b, single) & a:
                lhs &= ~b
        reduced.append((lhs, a))
    cover = sorted(set(reduced))
    for fd in list(cover):
        others = [other for other in cover if other != fd]
        if naive_closure(fd[0], others) & fd[1]:
            cover = others
    return cover


def project_by_subsets(fds: FDs, s: int) -> list[tuple[int, int]]:
    """A minimal cover of X -> X+ n s over all subsets X of s."""
    return naive_minimal_cover(list(projected_closures(fds, s).items()))


def bcnf_by_subsets(r: int, fds: FDs) -> list[int]:
    """Split a piece on its smallest violating subset X (X+ n P neither X nor P) until none."""
    done = []
    work = [r]
    while work:
        piece = work.pop()
        violation = None
        for x in sorted(subsets(piece), key=int.bit_count):
            determined = naive_closure(x, fds) & piece
            if determined not in (x, piece):
                violation = x
                break
        if violation is None:
            done.append(piece)
            continue
        determined = naive_closure(violation, fds) & piece
        work += [determined, violation | (piece & ~determined)]
    return done


def synthesis_by_subsets(r: int, fds: FDs) -> list[tuple[int, list[tuple[int, int]]]]:
    """One relation per left side of the cover, a key if none holds one, each projected."""
    merged: dict[int, int] = {}
    for lhs, rhs in naive_minimal_cover(fds):
        merged[lhs] = merged.get(lhs, 0) | rhs
    schemas = [lhs | rhs for lhs, rhs in merged.items()]
    if not any(naive_closure(schema, fds) & r == r for schema in schemas):
        schemas.append(min(oracle_keys(r, fds)))
    kept = [s for s in schemas if not any(s != t and not s & ~t for t in schemas)]
    return [(schema, project_by_subsets(fds, schema)) for schema in dict.fromkeys(kept)]
