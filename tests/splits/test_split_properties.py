"""Random small splits: the analysis agrees with the brute-force oracle on every one (see ``split_oracle``)."""
from __future__ import annotations

from hypothesis import given, settings
from hypothesis import strategies as st

from linter.model import Dependency, Span, Split, SplitPiece
from linter.split_analysis import split_analysis

from .split_oracle import (
    join_of_projections,
    lossy_counterexample,
    satisfies,
    unpreserved,
)

COLUMNS = ("hub", "van", "route", "driver")
AT = Span("db/007_vans.sql", 3, 1, 3, 18)

_column = st.sampled_from(range(len(COLUMNS)))
dependencies = st.lists(st.tuples(st.sets(_column, min_size=1, max_size=2), st.sets(_column, min_size=1, max_size=2)),
                        min_size=1, max_size=4)
# Two or three pieces, none inside another (that would make the split trivially lossless);
# they may leave a column out, which the analysis handles by projecting F.
pieces = st.lists(st.frozensets(_column, min_size=2, max_size=3), min_size=2, max_size=3, unique=True).filter(
    lambda held: not any(a < b for a in held for b in held))


def _names(positions) -> tuple[str, ...]:
    return tuple(COLUMNS[a] for a in sorted(positions))


@settings(max_examples=150, deadline=None)
@given(dependencies, pieces)
def test_lossless_and_preserved_agree_with_brute_force(deps, held) -> None:
    declared = tuple(Dependency(_names(lhs), _names(rhs), AT, "annotation") for lhs, rhs in deps)
    parts = tuple(SplitPiece(f"piece{i}", _names(p), {c: c for c in _names(p)}, AT) for i, p in enumerate(held))
    analysis = split_analysis(Split("van_routes", COLUMNS, (), declared, parts, AT, "data"))
    oracle_deps = [(tuple(sorted(lhs)), tuple(sorted(rhs))) for lhs, rhs in deps]
    oracle_pieces = [tuple(sorted(p)) for p in held]

    counterexample = lossy_counterexample(len(COLUMNS), oracle_deps, oracle_pieces)
    assert analysis.chase.lossless == (counterexample is None)

    cover = [(_positions(fd.lhs), _positions(fd.rhs)) for fd in analysis.cover]
    assert set(unpreserved(cover, oracle_pieces)) == {(_positions(fd.lhs), _positions(fd.rhs)) for fd in analysis.lost}

    if not analysis.chase.lossless and all(any(a in p for p in held) for a in range(len(COLUMNS))):
        symbols: dict[str, int] = {}
        rows = frozenset(tuple(symbols.setdefault(s, len(symbols)) for s in row) for row in analysis.chase.rows)
        spurious = tuple(symbols.setdefault(s, len(symbols)) for s in analysis.chase.spurious)
        assert satisfies(rows, oracle_deps)
        assert spurious not in rows and spurious in join_of_projections(rows, oracle_pieces)


def _positions(bits: int) -> tuple[int, ...]:
    return tuple(a for a in range(len(COLUMNS)) if bits >> a & 1)
