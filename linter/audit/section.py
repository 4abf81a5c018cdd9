"""One table's part of the audit page: columns, keys, diagram, findings, decomposition, history.

It renders the table record of the audit data (see ``linter.audit.data``); every name from the
user's files goes through ``html.escape``.

>>> record = {"name": "<ferry>", "path": "db/1.sql", "line": 2, "normal_form": "BCNF",
...           "meets_target": True, "columns": [], "keys": [], "keys_complete": True, "has_declared_key": False,
...           "dependencies": [], "findings": [], "decomposition": None, "history": []}
>>> html = table_section(record, "t1")
>>> "&lt;ferry&gt;" in html and "<ferry>" not in html
True
"""
from __future__ import annotations

from collections.abc import Mapping, Sequence
from html import escape
from itertools import groupby
from typing import Any

from linter.audit.diagram import dependency_svg
from linter.audit.layout import Arrow
from linter.baseline import plural

Record = Mapping[str, Any]
_LEGEND = (
    ("key", "determined by a key (drawn below)"),
    ("violation", "breaks the target normal form (above)"),
    ("other", "other dependency (above)"),
)


def e(value: object) -> str:
    """Text escaped for HTML content and attribute values."""
    return escape(str(value), quote=True)


def where(item: Record) -> str:
    """``path:line`` of an item that has them, as a muted location."""
    return f'<span class="loc">{e(item["path"])}:{e(item["line"])}</span>'


def names(columns: Sequence[str]) -> str:
    """Column names as code, comma-separated."""
    return ", ".join(f"<code>{e(c)}</code>" for c in columns) or "<code>\u2205</code>"


def nf_badge(form: str) -> str:
    """A coloured badge naming a normal form."""
    return f'<span class="badge nf-{e(form)}">{e(form)}</span>'


def table_section(record: Record, anchor: str) -> str:
    """The ``<section>`` of one table."""
    target = '<span class="badge ok">meets target</span>' if record["meets_target"] else (
        '<span class="badge short">below target</span>'
    )
    columns = record["columns"]
    facts = " \u00b7 ".join([
        _count(len(columns), "column"), _count(len(record["keys"]), "candidate key"),
        _count(len(record["dependencies"]), "dependency"), _count(len(record["findings"]), "finding"),
    ])
    everything = [c["name"] for c in columns]
    parts = [
        f'<section class="table-section panel" id="{e(anchor)}" data-table="{e(record["name"])}">',
        f'<div class="head"><h2>{e(record["name"])}</h2>{nf_badge(record["normal_form"])}{target}'
        f"{where(record)}</div>",
        f'<p class="facts">{facts}</p>',
        _diagram(record),
        '<div class="columns2">',
        f"<div><h3>Columns</h3>{_columns(columns)}</div>",
        f"<div><h3>Candidate keys</h3>{_keys(record)}"
        f"<h3>Dependencies</h3>{_dependencies(record['dependencies'], everything)}</div>",
        "</div>",
        f"<h3>Violations and other findings</h3>{_findings(record['findings'])}",
        f"<h3>Proposed decomposition</h3>{_decomposition(record['decomposition'])}",
        f"<h3>History</h3>{_history(record['history'])}",
        "</section>",
    ]
    return "\n".join(parts)


def _count(count: int, word: str) -> str:
    """``1 column``, ``3 columns``, ``2 dependencies``."""
    return f"{count} {plural(count, word)}"


def _columns(columns: Sequence[Record]) -> str:
    """The columns in declaration order with type, nullability and key membership."""
    if not columns:
        return '<p class="empty">No columns.</p>'
    rows = "".join(
        f"<tr><td><code>{e(c['name'])}</code></td><td class=\"mono\">{e(c['type'])}</td>"
        f"<td>{'' if c['nullable'] else 'not null'}</td>"
        f"<td>{'primary key' if c['primary'] else 'key' if c['prime'] else ''}</td></tr>"
        for c in columns
    )
    head = "<thead><tr><th>Name</th><th>Type</th><th>Null</th><th>Key</th></tr></thead>"
    return f'<table class="compact">{head}<tbody>{rows}</tbody></table>'


def _keys(record: Record) -> str:
    """Each candidate key with the constraints that declare it, or a note that it was derived."""
    keys = record["keys"]
    if not record["has_declared_key"]:
        return (
            '<p class="empty">No declared key: the table can hold the same row twice. '
            "Only the whole row could act as one.</p>"
        )
    items = []
    for key in keys:
        declared = "; ".join(f"{e(d['source'])} at {where(d)}" for d in key["declared"])
        items.append(f"<li>{names(key['columns'])} \u2014 {declared or 'follows from the dependencies'}</li>")
    note = "" if record["keys_complete"] else (
        '<p class="empty">The key search stopped early on this wide table; more keys may exist.</p>'
    )
    return f"<ul>{''.join(items)}</ul>{note}"


def _diagram(record: Record) -> str:
    """The inline SVG with a legend, one lane per determinant and kind."""
    grouped: dict[tuple[tuple[str, ...], str], list[Record]] = {}
    for dependency in record["dependencies"]:
        grouped.setdefault((tuple(dependency["lhs"]), dependency["kind"]), []).append(dependency)
    arrows = [
        Arrow(lhs, tuple(dict.fromkeys(c for d in deps for c in d["rhs"])), kind,
              ", ".join(dict.fromkeys(f"{d['source']} at {d['path']}:{d['line']}" for d in deps)))
        for (lhs, kind), deps in grouped.items()
    ]
    columns = [c["name"] for c in record["columns"]]
    svg = dependency_svg(
        columns, arrows,
        primary=[c["name"] for c in record["columns"] if c["primary"]],
        prime=[c["name"] for c in record["columns"] if c["prime"]],
        notes={c["name"]: c["type"] for c in record["columns"]},
        title=f"Dependency diagram of {record['name']}",
    )
    kinds = {arrow.kind for arrow in arrows}
    legend = "".join(
        f'<li><span class="line {kind}-line"></span>{text}</li>' for kind, text in _LEGEND if kind in kinds
    )
    legend += "<li><u>underlined</u>: primary key \u00b7 <b>bold</b>: part of a candidate key</li>"
    return f'<div class="diagram">{svg}</div><ul class="legend">{legend}</ul>'


def _dependencies(dependencies: Sequence[Record], everything: Sequence[str]) -> str:
    """The given dependencies with where each comes from; a key's long right side is summed up."""
    if not dependencies:
        return '<p class="empty">No dependencies known: declare a key or annotate one.</p>'
    items = []
    for d in dependencies:
        rest = len(everything) - len(d["lhs"])
        whole = len(d["rhs"]) == rest and rest > 3
        rhs = f"every other column ({rest})" if whole else names(d["rhs"])
        origin = f"<span class=\"from\">{e(d['source'])}</span> {where(d)}"
        items.append(f"<li>{names(d['lhs'])} \u2192 {rhs}<br>{origin}</li>")
    return f'<ul class="deps">{"".join(items)}</ul>'


def _findings(findings: Sequence[Record]) -> str:
    """Every finding on the table, with its explanation."""
    if not findings:
        return '<p class="empty">None.</p>'
    blocks = []
    for f in findings:
        explanation = "".join(f"<li>{e(line)}</li>" for line in f["explanation"])
        blocks.append(
            f'<div class="finding {e(f["severity"])}"><span class="sev">{e(f["severity"])}</span>'
            f"<code>{e(f['rule'])}</code> {where(f)}<div>{e(f['message'])}</div>"
            f"{f'<ul>{explanation}</ul>' if explanation else ''}</div>"
        )
    return "".join(blocks)


def _decomposition(decomposition: Record | None) -> str:
    """The tables a lossless split would give, what it cannot enforce, and the SQL caution."""
    if decomposition is None:
        return '<p class="empty">None needed: the table meets the target.</p>'
    pieces = "".join(
        f'<div class="piece"><b>{e(p["name"])}</b><div>{names(p["columns"])}</div>'
        f'<div class="loc">{"key" if len(p["keys"]) == 1 else "keys"}: '
        f'{" | ".join(", ".join(map(e, k)) for k in p["keys"])}</div></div>'
        for p in decomposition["pieces"]
    )
    lost = "".join(f"<li>{names(d['lhs'])} \u2192 {names(d['rhs'])}</li>" for d in decomposition["lost"])
    lost_html = f"<p>Not enforceable in any one piece:</p><ul>{lost}</ul>" if lost else ""
    return (
        f"<p>A {e(decomposition['method'])}:</p><div class=\"pieces\">{pieces}</div>{lost_html}"
        f'<p class="caution">{e(decomposition["caution"])}</p>'
    )


def _history(history: Sequence[Record]) -> str:
    """The table's events through the migrations, oldest first, grouped by migration file."""
    if not history:
        return '<p class="empty">No recorded events.</p>'
    items = []
    for _, events in groupby(history, key=lambda h: h["path"]):
        listed = list(events)
        what = "; ".join(f'<span class="event" data-action="{e(h["action"])}">{e(h["detail"])}</span>' for h in listed)
        items.append(f"<li>{where(listed[0])}<div>{what}</div></li>")
    return f'<ol class="history">{"".join(items)}</ol>'
