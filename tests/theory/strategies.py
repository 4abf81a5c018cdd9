"""Random relations for the property tests, and the settings they run with.

The profile ``theory`` (the default) runs 2,000 examples a property, derandomized so that every
run sees the same ones; NORMGUARD_THEORY_PROFILE=theory-quick runs 100 while working on the code.
"""
from __future__ import annotations

import os

from hypothesis import HealthCheck, settings
from hypothesis import strategies as st

from linter.dependencies import FD

settings.register_profile(
    "theory",
    max_examples=2000,
    deadline=None,
    derandomize=True,
    database=None,
    suppress_health_check=[HealthCheck.too_slow],
)
settings.register_profile("theory-quick", settings.get_profile("theory"), max_examples=100)
THEORY = settings.get_profile(os.environ.get("NORMGUARD_THEORY_PROFILE", "theory"))

MAX_ATTRS = 8
MAX_FDS = 8


def _few(draw: st.DrawFn, full: int) -> int:
    """A nonempty subset of ``full``: each attribute with chance 1/4, else the lowest of a draw."""
    first = draw(st.integers(1, full))
    return first & draw(st.integers(0, full)) or first & -first


@st.composite
def relations(draw: st.DrawFn, min_attrs: int = 1) -> tuple[int, list[FD]]:
    """(r, F): r has 1 to 8 attributes, F up to 8 dependencies with small sides; one relation in
    eight also gets a dependency with an empty left side (constant attributes)."""
    full = (1 << draw(st.integers(min_attrs, MAX_ATTRS))) - 1
    count = draw(st.integers(0, MAX_FDS))
    fds = [FD(_few(draw, full), _few(draw, full)) for _ in range(count)]
    if draw(st.integers(0, 7)) == 0:
        fds.append(FD(0, _few(draw, full)))
    return full, fds


@st.composite
def decompositions(draw: st.DrawFn) -> tuple[int, list[FD], list[int]]:
    """(r, F, pieces): 1 to 4 nonempty pieces that together cover r."""
    r, fds = draw(relations())
    count = draw(st.integers(1, 4))
    pieces = [draw(st.integers(1, r)) for _ in range(count)]
    missing = r
    for piece in pieces:
        missing &= ~piece
    pieces[draw(st.integers(0, count - 1))] |= missing
    return r, fds, pieces
