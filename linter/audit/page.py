"""The audit as one self-contained HTML page: summary first, then a section per table.

The page has no script and loads nothing: styles and diagrams are inline, so it opens from a
``file://`` URL, prints, and follows the reader's light or dark preference.

>>> data = {"tool": {"name": "normguard", "version": "0"}, "target": "BCNF", "paths": ["db"],
...         "summary": {"files": 1, "tables": 0, "findings": 0, "at_target": 0,
...                     "normal_forms": {"1NF": 0, "2NF": 0, "3NF": 0, "BCNF": 0},
...                     "findings_by_rule": [], "worst_tables": []},
...         "tables": [], "other_findings": []}
>>> html = render_html(data)
>>> html.startswith("<!DOCTYPE html>") and "http" not in html.split("<body>")[0]
True
"""
from __future__ import annotations

import posixpath
from collections.abc import Mapping, Sequence
from typing import Any

from linter.audit.section import Record, e, nf_badge, table_section, where
from linter.audit.stylesheet import STYLESHEET

FORMS = ("1NF", "2NF", "3NF", "BCNF")


def anchor(index: int) -> str:
    """The id of the n-th table's section: names from user files never go into ids."""
    return f"t{index}"


def render_html(data: Mapping[str, Any]) -> str:
    """The whole page for the audit data built by ``linter.audit.data.audit_data``."""
    base = posixpath.commonpath(data["paths"]) if data["paths"] else ""
    data = _relative(data, base)
    tables: Sequence[Record] = data["tables"]
    anchors = {table["name"]: anchor(i) for i, table in enumerate(tables, 1)}
    title = f"normguard audit \u2014 {', '.join(data['paths'])}"
    body = [
        "<main>",
        f"<header><h1>Schema audit</h1><p class=\"lede\">{e(', '.join(data['paths']))} \u00b7 "
        f"target normal form {e(data['target'])} \u00b7 normguard {e(data['tool']['version'])}</p></header>",
        _cards(data["summary"], data["target"]),
        _forms(data["summary"]["normal_forms"]),
        '<div class="columns2">',
        _rules(data["summary"]["findings_by_rule"]),
        _worst(data["summary"]["worst_tables"], anchors),
        "</div>",
        _index(tables, anchors),
        _others(data["other_findings"]),
        *(table_section(table, anchors[table["name"]]) for table in tables),
        "<footer>Written by normguard from the SQL files listed above. Decompositions are proposals: "
        "generated migrations can destroy data, so review, back up and test before applying any.</footer>",
        "</main>",
    ]
    return (
        '<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n'
        '<meta name="viewport" content="width=device-width, initial-scale=1">\n'
        '<meta name="color-scheme" content="light dark">\n'
        f"<title>{e(title)}</title>\n<style>{STYLESHEET}</style>\n</head>\n<body>\n"
        + "\n".join(body)
        + "\n</body>\n</html>\n"
    )


def _relative(value: Any, base: str) -> Any:
    """A copy of the data with each ``path`` inside the folder ``base`` written relative to it."""
    if isinstance(value, Mapping):
        inside = base + "/"
        return {
            key: item[len(inside):] if key == "path" and base and str(item).startswith(inside) else _relative(item, base)
            for key, item in value.items()
        }
    if isinstance(value, list):
        return [_relative(item, base) for item in value]
    return value


def _cards(summary: Record, target: str) -> str:
    """The headline numbers."""
    cards = [
        (summary["tables"], "tables"),
        (f"{summary['at_target']}/{summary['tables']}", f"tables in {target}"),
        (summary["findings"], "findings"),
        (summary["files"], "files read"),
    ]
    items = "".join(
        f'<div class="card"><div class="num">{e(n)}</div><div class="what">{e(w)}</div></div>' for n, w in cards
    )
    return f'<div class="cards" id="summary">{items}</div>'


def _forms(forms: Mapping[str, int]) -> str:
    """Tables by normal form: a stacked bar and its legend."""
    total = sum(forms.values()) or 1
    bar = "".join(
        f'<span class="nf-{form}" style="width:{100 * forms[form] / total:.2f}%" title="{form}: {forms[form]}"></span>'
        for form in FORMS
        if forms[form]
    )
    legend = "".join(
        f'<li><span class="swatch nf-{form}"></span>{form}: <b>{forms[form]}</b></li>' for form in FORMS
    )
    return _panel("Tables by normal form", f'<div class="stack">{bar}</div><ul class="legend">{legend}</ul>', "")


def _panel(title: str, body: str, empty: str, tag: str = "div", classes: str = "panel") -> str:
    """A titled panel holding ``body``, or the ``empty`` note when there is nothing to show."""
    content = body or f'<p class="empty">{empty}</p>'
    return f'<{tag} class="{classes}"><h3>{title}</h3>{content}</{tag}>'


def _rules(by_rule: Sequence[Record]) -> str:
    """Findings counted by rule, with a bar for each."""
    most = max((item["count"] for item in by_rule), default=1)
    rows = "".join(
        f"<tr><td><code>{e(item['rule'])}</code></td><td>{e(item['severity'])}</td><td class=\"n\">{item['count']}</td>"
        f'<td class="barcell"><div class="bar" style="width:{100 * item["count"] / most:.1f}%"></div></td></tr>'
        for item in by_rule
    )
    return _panel("Findings by rule", rows and f"<table><tbody>{rows}</tbody></table>", "No findings.")


def _worst(worst: Sequence[Record], anchors: Mapping[str, str]) -> str:
    """The tables furthest from the target, most findings first."""
    rows = "".join(
        f'<tr><td><a href="#{anchors[item["name"]]}">{e(item["name"])}</a></td><td>{nf_badge(item["normal_form"])}</td>'
        f'<td class="n">{item["findings"]}</td></tr>'
        for item in worst
    )
    head = '<thead><tr><th>Table</th><th>Form</th><th class="n">Findings</th></tr></thead>'
    body = rows and f"<table>{head}<tbody>{rows}</tbody></table>"
    return _panel("Worst tables", body, "Every table meets the target.")


def _index(tables: Sequence[Record], anchors: Mapping[str, str]) -> str:
    """Every table, linked, with a swatch of its normal form."""
    items = "".join(
        f'<li><span class="swatch nf-{e(t["normal_form"])}" title="{e(t["normal_form"])}"></span>'
        f'<a href="#{anchors[t["name"]]}">{e(t["name"])}</a></li>'
        for t in tables
    )
    body = items and f'<ul class="index">{items}</ul>'
    return _panel("Tables", body, "No tables were found.", tag="nav", classes="panel nav")


def _others(findings: Sequence[Record]) -> str:
    """Findings that belong to no table (unreadable files, unsupported statements), folded away."""
    if not findings:
        return ""
    items = "".join(
        f"<li>{where(f)} <code>{e(f['rule'])}</code> {e(f['message'])}</li>" for f in findings
    )
    return (
        f'<details class="panel"><summary>{len(findings)} findings outside any table</summary>'
        f'<ul class="others">{items}</ul></details>'
    )
