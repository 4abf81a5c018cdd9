"""The column index of one relation: names to bitsets and back.

>>> attrs = Attributes(["courier", "depot", "city"])
>>> attrs.bits(["city", "depot"])
6
>>> attrs.to_names(6)
('depot', 'city')
>>> attrs.format(6), attrs.format(0)
('depot, city', '∅')
>>> attrs.format_fd(FD(attrs.bits(["depot"]), attrs.bits(["city"])))
'depot -> city'

The empty set is written ``∅``.
"""
from __future__ import annotations

from collections.abc import Iterable

from .fd import FD, members


class Attributes:
    """Attribute names in column order; bit i of a set stands for ``names[i]``."""

    def __init__(self, names: Iterable[str]) -> None:
        self.names: tuple[str, ...] = tuple(names)
        self._bit: dict[str, int] = {name: 1 << i for i, name in enumerate(self.names)}
        if len(self._bit) != len(self.names):
            raise ValueError(f"repeated attribute name in {self.names}")
        self.full: int = (1 << len(self.names)) - 1

    def __repr__(self) -> str:
        return f"Attributes({list(self.names)!r})"

    def bits(self, names: Iterable[str]) -> int:
        """The set of the given names; KeyError on a name that is not a column."""
        result = 0
        for name in names:
            result |= self._bit[name]
        return result

    def to_names(self, bits: int) -> tuple[str, ...]:
        """The names in ``bits``, in column order."""
        return tuple(self.names[low.bit_length() - 1] for low in members(bits))

    def format(self, bits: int) -> str:
        """The names joined by commas, or ``∅`` for the empty set."""
        return ", ".join(self.to_names(bits)) or "∅"

    def format_fd(self, fd: FD) -> str:
        """``lhs -> rhs`` with both sides formatted."""
        return f"{self.format(fd.lhs)} -> {self.format(fd.rhs)}"
