"""Lossless-join test by the tableau chase (Aho, Beeri & Ullman 1979), with a counterexample.

>>> # (courier, depot, city) with courier -> depot, split into (courier, depot) and (depot, city)
>>> result = chase_is_lossless(0b111, [FD(0b001, 0b010)], [0b011, 0b110])
>>> result.lossless, result.method, result.common
(False, 'binary', 2)
>>> result.rows, result.spurious
((('a1', 'a2', 'b3'), ('b1', 'a2', 'a3')), ('a1', 'a2', 'a3'))

The tableau has one row per piece, with the distinguished symbol ``a<j>`` in the columns of the
piece and a symbol of its own elsewhere. For each X -> A, rows equal on X are made equal on A
(to ``a<j>`` when either has it) until nothing changes. The join is lossless exactly when a row
becomes all ``a``. Two pieces take the fast path (``method="binary"``): lossless exactly when
R1 n R2 -> R1 or R1 n R2 -> R2, and the chased tableau is then known directly.

When lossy, the chased rows are an instance of r satisfying the dependencies whose projections
join into the all-``a`` row, which is not among them. ``rows`` keeps just enough of them for that
and ``spurious`` is the all-``a`` row; values are written ``a1``, ``b1``, ``c1`` ... per column
(letter by order of appearance, then column number in r). ``tableau`` is the whole chased tableau
in either case. The pieces must cover r and the dependencies mention only attributes of r.
"""
from __future__ import annotations

from collections.abc import Sequence
from typing import NamedTuple

from .closure import closure
from .fd import FD, members, positions, require_within
from .minimal_cover import minimal_cover

Tableau = list[list[int]]  # one row per piece; symbol 0 is the distinguished one


class ChaseResult(NamedTuple):
    """Whether the join is lossless, how it was decided, and a counterexample when it is not."""

    lossless: bool
    method: str  # "binary" or "chase"
    common: int  # R1 n R2 for two pieces, else 0
    rows: tuple[tuple[str, ...], ...]
    spurious: tuple[str, ...] | None
    tableau: tuple[tuple[str, ...], ...]


def chase_is_lossless(
    r: int, fds: Sequence[tuple[int, int]], pieces: Sequence[int]
) -> ChaseResult:
    """Whether r is the natural join of its projections onto ``pieces`` under ``fds``."""
    require_within(r, fds)
    _require_cover(r, pieces)
    columns = [1 << p for p in positions(r)]
    if len(pieces) == 2:
        common = pieces[0] & pieces[1]
        determined = closure(common, fds)
        tableau = [_row(columns, piece | determined, i + 1) for i, piece in enumerate(pieces)]
        return _result(tableau, "binary", common, pieces, columns)
    tableau = [_row(columns, piece, i + 1) for i, piece in enumerate(pieces)]
    _chase(tableau, minimal_cover(fds), columns)
    return _result(tableau, "chase", 0, pieces, columns)


def _require_cover(r: int, pieces: Sequence[int]) -> None:
    """Raise ValueError unless the pieces lie in r and together cover it."""
    union = 0
    for piece in pieces:
        union |= piece
    if union != r:
        raise ValueError("the pieces must lie within the relation and cover all of it")


def _row(columns: Sequence[int], distinguished: int, own: int) -> list[int]:
    """A row with 0 in the columns of ``distinguished`` and the symbol ``own`` elsewhere."""
    return [0 if column & distinguished else own for column in columns]


def _chase(tableau: Tableau, fds: Sequence[FD], columns: Sequence[int]) -> None:
    """Apply the dependencies to the tableau until none changes it."""
    where = {column: j for j, column in enumerate(columns)}
    rules = [([where[a] for a in members(fd.lhs)], where[fd.rhs]) for fd in fds]
    changed = True
    while changed:
        changed = False
        for lhs, rhs in rules:
            while _equate_once(tableau, lhs, rhs):
                changed = True


def _equate_once(tableau: Tableau, lhs: Sequence[int], rhs: int) -> bool:
    """Make two rows equal on X but not on A agree on A; whether there were such rows."""
    seen: dict[tuple[int, ...], int] = {}
    for row in tableau:
        agreed = tuple(row[j] for j in lhs)
        value = seen.setdefault(agreed, row[rhs])
        if value != row[rhs]:
            keep, drop = min(value, row[rhs]), max(value, row[rhs])
            for other in tableau:
                if other[rhs] == drop:
                    other[rhs] = keep
            return True
    return False


def _result(
    tableau: Tableau, method: str, common: int, pieces: Sequence[int], columns: Sequence[int]
) -> ChaseResult:
    """The verdict, with the rows of a counterexample when the join is lossy."""
    written = _names(tableau)
    if any(not any(row) for row in tableau):
        return ChaseResult(True, method, common, (), None, written)
    needed = _needed_rows(tableau, pieces, columns)
    rows = tuple(dict.fromkeys(written[i] for i in needed))
    spurious = tuple(f"a{j + 1}" for j in range(len(columns)))
    return ChaseResult(False, method, common, rows, spurious, written)


def _needed_rows(tableau: Tableau, pieces: Sequence[int], columns: Sequence[int]) -> list[int]:
    """Row positions kept so that each piece still has a row all ``a`` on it."""
    kept = list(range(len(tableau)))
    for i in reversed(range(len(tableau))):
        rest = [k for k in kept if k != i]
        if all(any(_all_a(tableau[k], piece, columns) for k in rest) for piece in pieces):
            kept = rest
    return kept


def _all_a(row: Sequence[int], piece: int, columns: Sequence[int]) -> bool:
    """Whether the row holds the distinguished symbol in every column of the piece."""
    return all(value == 0 for value, column in zip(row, columns) if column & piece)


def _names(tableau: Tableau) -> tuple[tuple[str, ...], ...]:
    """Readable symbols: a letter by order of appearance in the column, then the column number."""
    names: list[list[str]] = [[] for _ in tableau]
    for j in range(len(tableau[0]) if tableau else 0):
        rank = {0: 0}
        for i, row in enumerate(tableau):
            letter = rank.setdefault(row[j], len(rank))
            names[i].append(_symbol(letter, j + 1))
    return tuple(tuple(row) for row in names)


def _symbol(rank: int, column: int) -> str:
    """``a3`` for rank 0 in column 3, ``b3`` for rank 1 ... and ``v27.3`` past the alphabet."""
    if rank < 26:
        return f"{chr(ord('a') + rank)}{column}"
    return f"v{rank}.{column}"
