"""The dependency diagram's geometry, for any columns and dependencies: nothing overlaps, all fits.

The SVG is parsed with the standard library's XML parser (an outside check that it is well-formed
XML whatever the names hold).
"""
from __future__ import annotations

import xml.etree.ElementTree as ElementTree

from hypothesis import given
from hypothesis import strategies as st

from linter.audit.diagram import dependency_svg
from linter.audit.layout import BOX_HEIGHT, Arrow, diagram_layout

SVG = "{http://www.w3.org/2000/svg}"
NAMES = st.text(alphabet=st.characters(blacklist_categories=("Cs", "Cc")), min_size=1, max_size=24)


@st.composite
def diagrams(draw: st.DrawFn) -> tuple[list[str], list[Arrow]]:
    """Distinct column names and arrows between them, of every kind."""
    columns = draw(st.lists(NAMES, min_size=1, max_size=12, unique=True))
    some = st.lists(st.sampled_from(columns), min_size=1, max_size=4, unique=True).map(tuple)
    kinds = st.sampled_from(["key", "violation", "other"])
    arrows = draw(st.lists(st.builds(Arrow, some, some, kinds, NAMES), max_size=10))
    return columns, arrows


@given(diagrams())
def test_boxes_in_order_without_overlap(diagram):
    columns, arrows = diagram
    layout = diagram_layout(columns, arrows)
    assert [box.name for box in layout.boxes] == columns
    for left, right in zip(layout.boxes, layout.boxes[1:]):
        assert left.x + left.width < right.x
    assert layout.boxes[-1].x + layout.boxes[-1].width < layout.width


@given(diagrams())
def test_lanes_sharing_a_depth_never_overlap(diagram):
    columns, arrows = diagram
    layout = diagram_layout(columns, arrows)
    seen: dict[tuple[str, int], list[tuple[float, float]]] = {}
    for lane in layout.lanes:
        xs = lane.sources + lane.targets
        span = (min(xs), max(xs))
        for other in seen.get((lane.side, lane.depth), []):
            assert span[1] < other[0] or other[1] < span[0]
        seen.setdefault((lane.side, lane.depth), []).append(span)
        assert 0 < layout.lane_y(lane) < layout.height
        assert (lane.side == "below") == (lane.arrow.kind == "key")


@given(diagrams())
def test_every_arrow_meets_its_own_boxes(diagram):
    columns, arrows = diagram
    layout = diagram_layout(columns, arrows)
    boxes = {box.name: box for box in layout.boxes}
    ends: dict[str, list[float]] = {"above": [], "below": []}
    drawn = [a for a in dict.fromkeys(arrows) if set(a.rhs) - set(a.lhs)]
    assert len(layout.lanes) == len(drawn)
    for lane in layout.lanes:
        targets = [c for c in lane.arrow.rhs if c not in lane.arrow.lhs]
        for name, x in [*zip(lane.arrow.lhs, lane.sources), *zip(targets, lane.targets)]:
            assert boxes[name].x < x < boxes[name].x + boxes[name].width
        ends[lane.side] += [*lane.sources, *lane.targets]
    for side in ends.values():
        assert len(set(side)) == len(side)  # two arrows never meet a box at one point


@given(diagrams())
def test_svg_is_well_formed_and_keeps_the_names(diagram):
    columns, arrows = diagram
    root = ElementTree.fromstring(dependency_svg(columns, arrows, title="t"))
    texts = [t.text for t in root.iter(f"{SVG}text")]
    assert texts == columns
    groups = [g for g in root.iter(f"{SVG}g") if g.get("class", "").startswith("dep ")]
    assert len(groups) == len(diagram_layout(columns, arrows).lanes)


def test_a_plain_three_column_picture():
    """ferry -> port -> country: the key below, the transitive step above, the row in between."""
    layout = diagram_layout(
        ["ferry", "port", "country"],
        [Arrow(("ferry",), ("port", "country"), "key", "primary key"),
         Arrow(("port",), ("country",), "violation", "annotation")],
    )
    above, below = sorted(layout.lanes, key=lambda lane: lane.side)
    assert layout.lane_y(above) < layout.row_top < layout.row_bottom < layout.lane_y(below)
    assert layout.row_bottom - layout.row_top == BOX_HEIGHT
