"""A 64-attribute relation with 128 dependencies analysed completely; key explosions bounded."""
from __future__ import annotations

import random

import pytest

from linter.dependencies import (
    FD,
    bcnf_decompose,
    candidate_keys,
    chase_is_lossless,
    closure,
    implies,
    normal_form,
    synthesize_3nf,
)


def _wide_relation(seed: int) -> tuple[int, list[FD]]:
    """64 attributes, 128 one-attribute dependencies: most point forward (later attributes
    depend on earlier ones), one in six points back into the first eight, making alternate keys."""
    rng = random.Random(seed)
    fds = []
    for _ in range(128):
        if rng.random() < 1 / 6:
            rhs, pool = rng.randrange(8), range(8, 64)
        else:
            rhs = rng.randrange(8, 64)
            pool = range(rhs)
        lhs = 0
        for position in rng.sample(pool, rng.choice((1, 1, 2, 2, 3))):
            lhs |= 1 << position
        fds.append(FD(lhs, 1 << rhs))
    return (1 << 64) - 1, fds


@pytest.mark.parametrize("seed", [1, 2, 3])
def test_wide_relation_is_analysed_completely(seed: int) -> None:
    r, fds = _wide_relation(seed)
    keys = candidate_keys(r, fds, time_limit=None)
    assert keys.complete
    for key in keys.keys:
        assert closure(key, fds) == r
        assert all(closure(key & ~(1 << i), fds) != r for i in range(64) if key >> i & 1)
    report = normal_form(r, fds, keys)
    assert report.violations and report.form in ("1NF", "2NF", "3NF")
    bcnf = bcnf_decompose(r, fds)
    synthesis = synthesize_3nf(r, fds)
    assert synthesis.lost == ()
    for result, forms in ((bcnf, ("BCNF",)), (synthesis, ("3NF", "BCNF"))):
        pieces = [piece.attrs for piece in result.pieces]
        assert chase_is_lossless(r, fds, pieces).lossless
        for piece in result.pieces:
            assert all(implies(fds, fd) for fd in piece.fds)
            assert normal_form(piece.attrs, piece.fds).form in forms


def test_normal_form_with_a_stopped_key_search() -> None:
    pairs = []
    for i in range(20):
        a, b = 1 << (2 * i), 1 << (2 * i + 1)
        pairs += [FD(a, b), FD(b, a)]
    keys = candidate_keys((1 << 40) - 1, pairs, max_keys=64)
    report = normal_form((1 << 40) - 1, pairs, keys)
    assert not report.keys.complete and len(report.keys.keys) == 64
    assert report.form == "3NF"  # the keys found hold every attribute, so all are prime
