"""The column index: names to bitsets and back, and how sets and dependencies are written."""
from __future__ import annotations

import pytest

from linter.dependencies import FD, Attributes


def test_names_bits_and_formatting() -> None:
    attrs = Attributes(["ferry", "port", "berth", "tide"])
    assert attrs.names == ("ferry", "port", "berth", "tide")
    assert attrs.full == 0b1111
    assert attrs.bits(["tide", "ferry"]) == 0b1001
    assert attrs.bits([]) == 0
    assert attrs.to_names(0b1010) == ("port", "tide")
    assert attrs.format(0b0110) == "port, berth"
    assert attrs.format(0) == "∅"
    assert attrs.format_fd(FD(0b0001, 0b0110)) == "ferry -> port, berth"
    assert attrs.format_fd(FD(0, 0b1000)) == "∅ -> tide"


def test_unknown_and_repeated_names_are_refused() -> None:
    with pytest.raises(KeyError):
        Attributes(["ferry"]).bits(["harbour"])
    with pytest.raises(ValueError):
        Attributes(["ferry", "ferry"])


def test_empty_relation() -> None:
    attrs = Attributes([])
    assert attrs.full == 0 and attrs.to_names(0) == () and attrs.format(attrs.full) == "∅"
