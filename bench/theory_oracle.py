"""The brute-force side of ``bench/theory.py``: fixpoint closure and subset enumeration.

The same textbook steps as ``linter.dependencies``, with the naive closure (every dependency,
pass after pass, until nothing changes) and with projections, keys and normal forms taken from the
closures of all subsets. Only usable up to about 16 attributes.
"""
from __future__ import annotations

from collections.abc import Iterator, Sequence

FDs = Sequence[tuple[int, int]]


def naive_closure(x: int, fds: FDs) -> int:
    """X+ by passes over all dependencies until one changes nothing."""
    result = x
    changed = True
    while changed:
        changed = False
        for lhs, rhs in fds:
            if not lhs & ~result and rhs & ~result:
                result |= rhs
                changed = True
    return result


def _bits(s: int) -> list[int]:
    return [1 << i for i in range(s.bit_length()) if s >> i & 1]


def _subsets(s: int) -> Iterator[int]:
    sub = s
    while True:
        yield sub
        if sub == 0:
            return
        sub = (sub - 1) & s


def naive_minimal_cover(fds: FDs) -> list[tuple[int, int]]:
    """Split right sides, drop extraneous left attributes, drop redundant dependencies."""
    single = sorted({(lhs, a) for lhs, rhs in fds for a in _bits(rhs & ~lhs)})
    reduced = []
    for lhs, a in single:
        for b in _bits(lhs):
            if naive_closure(lhs & ~b, single) & a:
                lhs &= ~b
        reduced.append((lhs, a))
    cover = sorted(set(reduced))
    for fd in list(cover):
        others = [other for other in cover if other != fd]
        if naive_closure(fd[0], others) & fd[1]:
            cover = others
    return cover


def _closures(fds: FDs, s: int) -> dict[int, int]:
    return {x: naive_closure(x, fds) & s for x in _subsets(s)}


def keys_by_subsets(r: int, fds: FDs) -> list[int]:
    """Every minimal subset of r whose closure is r."""
    closures = _closures(fds, r)
    return [
        x for x, c in closures.items() if c == r and all(closures[x & ~b] != r for b in _bits(x))
    ]


def normal_form_by_definition(r: int, fds: FDs) -> str:
    """BCNF, 3NF, 2NF or 1NF from the closures of all subsets of r."""
    closures = _closures(fds, r)
    keys = [x for x, c in closures.items() if c == r and all(closures[x & ~b] != r for b in _bits(x))]
    prime = 0
    for key in keys:
        prime |= key
    if all(c == r or c == x for x, c in closures.items()):
        return "BCNF"
    if all(c == r or not c & ~x & ~prime for x, c in closures.items()):
        return "3NF"
    partial = any(closures[p] & ~prime for key in keys for p in _subsets(key) if p != key)
    return "1NF" if partial else "2NF"


def project_by_subsets(fds: FDs, s: int) -> list[tuple[int, int]]:
    """A minimal cover of X -> X+ n s over all subsets X of s."""
    return naive_minimal_cover([(x, c) for x, c in _closures(fds, s).items()])


def bcnf_by_subsets(r: int, fds: FDs) -> list[int]:
    """Split a piece on its smallest violating subset X (X+ n P neither X nor P) until none."""
    done = []
    work = [r]
    while work:
        piece = work.pop()
        violation = None
        for x in sorted(_subsets(piece), key=int.bit_count):
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
        schemas.append(min(keys_by_subsets(r, fds)))
    kept = [s for s in schemas if not any(s != t and not s & ~t for t in schemas)]
    return [(schema, project_by_subsets(fds, schema)) for schema in dict.fromkeys(kept)]
