"""Dependency diagram geometry: column boxes in a row, one lane per determinant, arrows into boxes.

Dependencies whose determinant is a key run in lanes under the row, the others above it, so the
dependencies that break a normal form stand apart. Each lane is a horizontal line at its own depth;
the determinant columns drop onto it as a bracket and it rises into each determined column.

>>> layout = diagram_layout(["ferry", "port", "country"],
...     [Arrow(("ferry",), ("port", "country"), "key", "primary key"),
...      Arrow(("port",), ("country",), "violation", "annotation")])
>>> [(lane.arrow.kind, lane.side, lane.depth) for lane in layout.lanes]
[('violation', 'above', 0), ('key', 'below', 0)]
>>> layout.width > 3 * BOX_MIN_WIDTH
True
"""
from __future__ import annotations

from collections import defaultdict
from collections.abc import Sequence
from dataclasses import dataclass

FONT_SIZE = 13
CHAR_WIDTH = 0.61 * FONT_SIZE  # a monospace advance, so widths need no font metrics
BOX_PADDING = 12
BOX_MIN_WIDTH = 44
BOX_HEIGHT = 30
BOX_GAP = 16
MARGIN = 14
FIRST_LANE = 20
LANE_STEP = 16


@dataclass(frozen=True)
class Arrow:
    """A dependency to draw: ``kind`` is ``key``, ``violation`` or ``other``; ``label`` says its origin."""

    lhs: tuple[str, ...]
    rhs: tuple[str, ...]
    kind: str
    label: str


@dataclass(frozen=True)
class Box:
    """One column box: left edge and width; every box shares the row's top and height."""

    name: str
    x: float
    width: float

    @property
    def center(self) -> float:
        """The x of the box's middle."""
        return self.x + self.width / 2


@dataclass(frozen=True)
class Lane:
    """One arrow placed: its side of the row, its depth there, and x of each column it touches."""

    arrow: Arrow
    side: str  # "above" or "below"
    depth: int
    sources: tuple[float, ...]
    targets: tuple[float, ...]


@dataclass(frozen=True)
class Layout:
    """The whole diagram: size, the row's top edge, boxes and lanes."""

    width: float
    height: float
    row_top: float
    boxes: tuple[Box, ...]
    lanes: tuple[Lane, ...]

    @property
    def row_bottom(self) -> float:
        """The y of the row's bottom edge."""
        return self.row_top + BOX_HEIGHT

    def lane_y(self, lane: Lane) -> float:
        """The y of a lane's horizontal line."""
        offset = FIRST_LANE + lane.depth * LANE_STEP
        return self.row_top - offset if lane.side == "above" else self.row_bottom + offset


def diagram_layout(columns: Sequence[str], arrows: Sequence[Arrow]) -> Layout:
    """Place the boxes and give every arrow a lane, narrow spans nearest the row to limit crossings."""
    boxes = _boxes(columns)
    index = {name: position for position, name in enumerate(columns)}
    usable = [a for a in dict.fromkeys(arrows) if set(a.lhs + a.rhs) <= index.keys() and set(a.rhs) - set(a.lhs)]
    placed = {side: _depths([a for a in usable if _side(a) == side], index) for side in ("above", "below")}
    slots = _slots(placed, index)
    lanes: list[Lane] = []
    for side in ("above", "below"):
        for arrow, depth in placed[side]:
            sources = tuple(_x(boxes, slots, index[c], side, arrow) for c in arrow.lhs)
            targets = tuple(_x(boxes, slots, index[c], side, arrow) for c in arrow.rhs if c not in arrow.lhs)
            lanes.append(Lane(arrow, side, depth, sources, targets))
    above = 1 + max((depth for _, depth in placed["above"]), default=-1)
    below = 1 + max((depth for _, depth in placed["below"]), default=-1)
    row_top = MARGIN + _band(above)
    width = (boxes[-1].x + boxes[-1].width if boxes else 0) + MARGIN
    height = row_top + BOX_HEIGHT + _band(below) + MARGIN
    return Layout(width, height, row_top, tuple(boxes), tuple(lanes))


def _boxes(columns: Sequence[str]) -> list[Box]:
    """One box per column, wide enough for its name."""
    boxes: list[Box] = []
    x = float(MARGIN)
    for name in columns:
        width = max(BOX_MIN_WIDTH, round(len(name) * CHAR_WIDTH + 2 * BOX_PADDING))
        boxes.append(Box(name, x, width))
        x += width + BOX_GAP
    return boxes


def _band(lanes: int) -> float:
    """The height the lanes of one side take."""
    return FIRST_LANE + (lanes - 1) * LANE_STEP + 6 if lanes else 0


def _side(arrow: Arrow) -> str:
    """Key dependencies go under the row, the others above it."""
    return "below" if arrow.kind == "key" else "above"


def _span(arrow: Arrow, index: dict[str, int]) -> tuple[int, int]:
    """The first and last column position an arrow touches."""
    positions = [index[c] for c in arrow.lhs + arrow.rhs]
    return min(positions), max(positions)


def _depths(arrows: list[Arrow], index: dict[str, int]) -> list[tuple[Arrow, int]]:
    """Give each arrow the shallowest depth where its span overlaps no other: interval packing."""
    order = sorted(arrows, key=lambda a: (_span(a, index)[1] - _span(a, index)[0], _span(a, index)))
    taken: dict[int, list[tuple[int, int]]] = defaultdict(list)
    placed: list[tuple[Arrow, int]] = []
    for arrow in order:
        first, last = _span(arrow, index)
        depth = 0
        while any(not (last < a or b < first) for a, b in taken[depth]):
            depth += 1
        taken[depth].append((first, last))
        placed.append((arrow, depth))
    return placed


def _slots(
    placed: dict[str, list[tuple[Arrow, int]]], index: dict[str, int]
) -> dict[tuple[int, str], list[Arrow]]:
    """For each box side, the arrows meeting it, ordered by where their lane lies (left to right)."""
    slots: dict[tuple[int, str], list[tuple[float, int, Arrow]]] = defaultdict(list)
    for side, arrows in placed.items():
        for arrow, depth in arrows:
            first, last = _span(arrow, index)
            for column in dict.fromkeys(arrow.lhs + arrow.rhs):
                # lanes reaching right attach on the right, and deeper lanes further out
                lean = (first + last) / 2 - index[column]
                slots[(index[column], side)].append((lean, depth if lean > 0 else -depth, arrow))
    return {key: [arrow for _, _, arrow in sorted(entries, key=lambda e: e[:2])] for key, entries in slots.items()}


def _x(boxes: list[Box], slots: dict[tuple[int, str], list[Arrow]], column: int, side: str, arrow: Arrow) -> float:
    """Where an arrow meets a box: the box's width shared evenly among the arrows on that side."""
    box, meeting = boxes[column], slots[(column, side)]
    step = (box.width - 8) / (len(meeting) + 1)
    return round(box.x + 4 + step * (meeting.index(arrow) + 1), 1)
