"""A table's dependency diagram as inline SVG: no scripts, no external resources, names escaped.

Colours come from CSS classes (``dep-key``, ``dep-violation``, ``dep-other``) so the page's light,
dark and print palettes all apply; the SVG also carries plain fallbacks for viewing on its own.

>>> svg = dependency_svg(["ferry", "port", "country"],
...     [Arrow(("ferry",), ("port", "country"), "key", "primary key"),
...      Arrow(("port",), ("country",), "violation", "annotation")], primary=["ferry"])
>>> svg.startswith("<svg") and svg.count('class="dep dep-violation"')
1
>>> "<b>" in dependency_svg(["<b>"], [])
False
"""
from __future__ import annotations

from collections.abc import Collection, Mapping, Sequence
from html import escape

from linter.audit.layout import (
    BOX_HEIGHT,
    FONT_SIZE,
    Arrow,
    Box,
    Lane,
    Layout,
    diagram_layout,
)

_RADIUS = 7
_HEAD = 8
_SHRINK = 0.75  # a wide diagram may shrink this far to fit the page, then it scrolls
_FALLBACK = {"key": "#2f6f9f", "violation": "#c0392b", "other": "#7a6a9a"}


def dependency_svg(
    columns: Sequence[str],
    arrows: Sequence[Arrow],
    *,
    primary: Collection[str] = (),
    prime: Collection[str] = (),
    notes: Mapping[str, str] | None = None,
    title: str = "",
) -> str:
    """The diagram of ``arrows`` over ``columns``; primary key columns underlined, prime ones bold."""
    layout = diagram_layout(columns, arrows)
    label = escape(title or "Dependency diagram", quote=True)
    parts = [
        f'<svg xmlns="http://www.w3.org/2000/svg" class="dep-diagram" role="img" aria-label="{label}"'
        f' width="{layout.width:g}" height="{layout.height:g}"'
        f' style="width:clamp({_SHRINK * layout.width:.0f}px,100%,{layout.width:g}px);height:auto"'
        f' viewBox="0 0 {layout.width:g} {layout.height:g}" font-family="monospace" font-size="{FONT_SIZE}">',
        f"<title>{label}</title>",
    ]
    # deeper lanes first: the halo round each nearer lane shows where lines pass under it
    parts.extend(_lane(layout, lane) for lane in sorted(layout.lanes, key=lambda lane: -lane.depth))
    parts.extend(_box(layout, box, primary, prime, (notes or {}).get(box.name, "")) for box in layout.boxes)
    parts.append("</svg>")
    return "\n".join(parts)


def _box(layout: Layout, box: Box, primary: Collection[str], prime: Collection[str], note: str) -> str:
    """One column: a rounded rectangle with the name centred, a tooltip with its type."""
    name = box.name
    classes = ["col"] + (["col-primary"] if name in primary else []) + (["col-prime"] if name in prime else [])
    tooltip = escape(f"{name} {note}".strip(), quote=False)
    text_y = layout.row_top + BOX_HEIGHT / 2 + FONT_SIZE * 0.35
    weight = ' font-weight="bold"' if name in prime else ""
    decoration = ' text-decoration="underline"' if name in primary else ""
    return (
        f'<g class="{" ".join(classes)}"><title>{tooltip}</title>'
        f'<rect x="{box.x:g}" y="{layout.row_top:g}" width="{box.width:g}" height="{BOX_HEIGHT}" rx="5"'
        f' fill="#f4f6f8" stroke="#5b6670"/>'
        f'<text x="{box.center:g}" y="{text_y:g}" text-anchor="middle"{weight}{decoration}'
        f' fill="#1d2328">{escape(name, quote=False)}</text></g>'
    )


def _lane(layout: Layout, lane: Lane) -> str:
    """One dependency: the determinant bracket, the lane line and an arrow into each determined box."""
    arrow, y = lane.arrow, layout.lane_y(lane)
    edge = layout.row_top if lane.side == "above" else layout.row_bottom
    toward = 1 if edge > y else -1
    left, right = min(lane.sources), max(lane.sources)
    tooltip = escape(f"{', '.join(arrow.lhs)} \u2192 {', '.join(arrow.rhs)} ({arrow.label})", quote=False)
    colour = _FALLBACK.get(arrow.kind, _FALLBACK["other"])
    paths = [f"M{x:g} {edge:g}V{y:g}" for x in lane.sources]
    paths.append(f"M{left:g} {y:g}H{right:g}")
    heads: list[str] = []
    for target in lane.targets:
        start = right if target > right else left if target < left else min(lane.sources, key=lambda s: abs(s - target))
        paths.append(_bend(start, target, y, edge, toward))
        heads.append(
            f"M{target:g} {edge:g}L{target - _HEAD / 2:g} {edge - toward * _HEAD:g}"
            f"H{target + _HEAD / 2:g}Z"
        )
    dots = "".join(f'<circle cx="{x:g}" cy="{edge:g}" r="2.6"/>' for x in lane.sources)
    return (
        f'<g class="dep dep-{escape(arrow.kind, quote=True)}" stroke="{colour}" fill="{colour}">'
        f"<title>{tooltip}</title>"
        f'<path class="halo" d="{" ".join(paths)}" fill="none" stroke="#fff" stroke-width="5"/>'
        f'<path d="{" ".join(paths)}" fill="none" stroke-width="1.6" stroke-linecap="round"/>'
        f'<path d="M{left:g} {y:g}H{right:g}" fill="none" stroke-width="4" stroke-linecap="round"/>'
        f'<path d="{" ".join(heads)}" stroke="none"/>{dots}</g>'
    )


def _bend(start: float, target: float, y: float, edge: float, toward: int) -> str:
    """Along the lane from ``start``, a rounded corner, then straight into the box edge."""
    across = 1 if target > start else -1
    radius = min(_RADIUS, abs(target - start) / 2, abs(edge - y) / 2)
    stop = edge - toward * (_HEAD - 1)
    return (
        f"M{start:g} {y:g}H{target - across * radius:g}"
        f"Q{target:g} {y:g} {target:g} {y + toward * radius:g}V{stop:g}"
    )
