"""A 64-attribute relation with 128 dependencies analysed completely; key explosions bounded."""
from __future__ import annotations

import pytest

from linter.dependencies import (
    bcnf_decompose,
    candidate_keys,
    chase_is_lossless,
    closure,
    implies,
    normal_form,
    synthesize_3nf,
)

from .generated import generated_relation, independent_pairs


@pytest.mark.parametrize("seed", [1, 2, 3])
def test_wide_relation_is_analysed_completely(seed: int) -> None:
    r, fds = generated_relation(64, seed)
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
    pairs = independent_pairs(20)
    keys = candidate_keys((1 << 40) - 1, pairs, max_keys=64)
    report = normal_form((1 << 40) - 1, pairs, keys)
    assert not report.keys.complete and len(report.keys.keys) == 64
    assert report.form == "3NF"  # the keys found hold every attribute, so all are prime
