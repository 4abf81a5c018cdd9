"""Seeded relations too large for the oracle, shared by the large-relation tests and the bench.

>>> r, fds = generated_relation(16, seed=1)
>>> r == (1 << 16) - 1, len(fds), all(fd.rhs.bit_count() == 1 for fd in fds)
(True, 32, True)
>>> independent_pairs(2)
[FD(lhs=1, rhs=2), FD(lhs=2, rhs=1), FD(lhs=4, rhs=8), FD(lhs=8, rhs=4)]
"""
from __future__ import annotations

import random

from linter.dependencies import FD


def generated_relation(n: int, seed: int) -> tuple[int, list[FD]]:
    """n attributes, 2n one-attribute dependencies: most point forward (an attribute depends on
    earlier ones), one in six points back into the first n/8, which makes alternate keys."""
    rng = random.Random(seed)
    front = max(2, n // 8)
    fds = []
    for _ in range(2 * n):
        if rng.random() < 1 / 6:
            rhs, pool = rng.randrange(front), range(front, n)
        else:
            rhs = rng.randrange(front, n)
            pool = range(rhs)
        lhs = 0
        for position in rng.sample(pool, rng.choice((1, 1, 2, 2, 3))):
            lhs |= 1 << position
        fds.append(FD(lhs, 1 << rhs))
    return (1 << n) - 1, fds


def independent_pairs(n: int) -> list[FD]:
    """n independent pairs a_i <-> b_i (a_i is bit 2i, b_i bit 2i+1): 2^n candidate keys."""
    fds = []
    for i in range(n):
        a, b = 1 << (2 * i), 1 << (2 * i + 1)
        fds += [FD(a, b), FD(b, a)]
    return fds
