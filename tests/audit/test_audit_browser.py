"""The audit of the lemmy migrations (../shared, 342 real PostgreSQL migrations) in a real browser.

Headless Chromium loads the page from a file:// URL: no console message at all (the page has no
script and loads nothing), one section per table, an SVG diagram per table with a group per
dependency lane, and a screenshot kept in the test's temporary folder. A copy of the page with a
measuring script added checks the layout as Chromium draws it: every column name fits its box in
the font actually used, and every lane stays inside its diagram.
"""
from __future__ import annotations

import html
import json
import os
import re
from pathlib import Path

import pytest
from click.testing import CliRunner

from linter.cli.main import main

from ..locations import SHARED
from .browser import console_messages, load, png_size

_MEASURE = """<script>
(function () {
  const out = [];
  for (const svg of document.querySelectorAll("svg.dep-diagram")) {
    const shown = svg.getBoundingClientRect(), view = svg.viewBox.baseVal;
    const cols = [...svg.querySelectorAll("g.col")].map(g => {
      const r = g.querySelector("rect").getBBox(), t = g.querySelector("text").getBBox();
      return [r.x, r.width, t.x, t.width];
    });
    const lanes = [...svg.querySelectorAll("g.dep")].map(g => {
      const b = g.getBBox();
      return [b.x, b.y, b.width, b.height];
    });
    out.push({table: svg.closest("section").dataset.table, shown: [shown.width, shown.height],
              view: [view.width, view.height], cols, lanes});
  }
  const pre = document.createElement("pre");
  pre.id = "measured";
  pre.textContent = JSON.stringify(out);
  document.body.appendChild(pre);
})();
</script>"""


@pytest.fixture(scope="module")
def lemmy_audit(tmp_path_factory: pytest.TempPathFactory) -> tuple[Path, dict]:
    """The audit of ../shared/corpus/lemmy/migrations: the HTML page and the JSON data."""
    folder = SHARED / "corpus" / "lemmy" / "migrations"
    if not folder.is_dir():
        pytest.skip("../shared/corpus/lemmy/migrations is not there: the corpus audit needs it")
    out = tmp_path_factory.mktemp("lemmy")
    outcome = CliRunner().invoke(main, [
        "audit", os.path.relpath(folder), "--html", str(out / "audit.html"), "--json", str(out / "audit.json")])
    assert outcome.exit_code == 0, outcome.output
    return out / "audit.html", json.loads((out / "audit.json").read_text(encoding="utf-8"))


def test_audit_covers_the_corpus(lemmy_audit):
    _, data = lemmy_audit
    assert data["summary"]["files"] > 300  # every up.sql of the 342 migrations (MANIFEST.md)
    assert data["summary"]["tables"] > 40
    names = {t["name"] for t in data["tables"]}
    assert {"person", "community", "post", "comment"} <= names
    person = next(t for t in data["tables"] if t["name"] == "person")
    assert len(person["history"]) > 10 and person["keys"][0]["declared"]


def test_page_in_chromium(lemmy_audit, tmp_path: Path):
    page, data = lemmy_audit
    dom, console = load(page, tmp_path / "profile", "--dump-dom")
    assert console == []
    sections = re.findall(r'<section class="table-section[^"]*" id="t\d+" data-table="([^"]*)"', dom)
    assert [html.unescape(name) for name in sections] == [t["name"] for t in data["tables"]]
    for table, chunk in zip(data["tables"], re.split(r"<section ", dom)[1:]):
        assert chunk.count('<svg xmlns="http://www.w3.org/2000/svg" class="dep-diagram"') == 1
        lanes = {(tuple(d["lhs"]), d["kind"]) for d in table["dependencies"]}
        assert chunk.count('<g class="dep dep-') == len(lanes), table["name"]
    assert "<script" not in dom


def test_screenshot(lemmy_audit, tmp_path: Path):
    page, _ = lemmy_audit
    shot = tmp_path / "audit.png"
    _, console = load(page, tmp_path / "profile", f"--screenshot={shot}", "--window-size=1280,4000")
    assert console == []
    assert png_size(shot) == (1280, 4000)
    assert shot.stat().st_size > 100_000  # a blank 1280x4000 page compresses to a few kilobytes


def test_drawn_layout(lemmy_audit, tmp_path: Path):
    page, data = lemmy_audit
    measured_page = tmp_path / "measured.html"
    instrumented = page.read_text(encoding="utf-8").replace("</body>", _MEASURE + "</body>")
    measured_page.write_text(instrumented, encoding="utf-8")
    dom, console = load(measured_page, tmp_path / "profile", "--dump-dom")
    assert console == []
    found = re.search(r'<pre id="measured">(.*?)</pre>', dom, re.DOTALL)
    assert found, "the measuring script did not run"
    diagrams = json.loads(html.unescape(found.group(1)))
    assert len(diagrams) == len(data["tables"])
    for diagram in diagrams:
        assert min(diagram["shown"]) > 0, diagram["table"]
        for rect_x, rect_width, text_x, text_width in diagram["cols"]:
            assert rect_x <= text_x and text_x + text_width <= rect_x + rect_width, diagram["table"]
        width, height = diagram["view"]
        for x, y, w, h in diagram["lanes"]:
            assert 0 <= x and x + w <= width and 0 <= y and y + h <= height, diagram["table"]


def test_console_scan_catches_errors(tmp_path: Path):
    """The console check can fail: a page with a script error is caught."""
    broken = tmp_path / "broken.html"
    broken.write_text("<!DOCTYPE html><p>x</p><script>console.error('boom'); missing();</script>", encoding="utf-8")
    _, console = load(broken, tmp_path / "profile", "--dump-dom")
    assert any("Uncaught" in line for line in console) and any("boom" in line for line in console)
    assert console_messages("[1:1:INFO:CONSOLE:1] \"x\"\nplain line") == ['[1:1:INFO:CONSOLE:1] "x"']
