"""The audit page's stylesheet: our own palette, a dark variant and a print layout, no web fonts.

Everything is inline in the page so it works from a ``file://`` URL with no network at all.

>>> "prefers-color-scheme: dark" in STYLESHEET and "@media print" in STYLESHEET
True
"""
from __future__ import annotations

STYLESHEET = """
:root {
  --paper: #f7f5f0; --surface: #ffffff; --ink: #1f2328; --muted: #5f6871; --rule: #dcd8cf;
  --accent: #1d6a86; --accent-soft: #e3eff3; --box: #f3f5f7; --box-line: #66727d;
  --nf-1: #c8553d; --nf-2: #e09f3e; --nf-3: #7d9d3c; --nf-b: #2f8a5f;
  --sev-error: #b83a2a; --sev-warning: #a8660c; --sev-note: #3f6f8f;
  --dep-key: #2f6f9f; --dep-violation: #c0392b; --dep-other: #7a5fa0;
  --code: #f1eee7; --shadow: 0 1px 2px rgba(40, 35, 20, .08), 0 2px 8px rgba(40, 35, 20, .05);
  color-scheme: light dark;
}
@media (prefers-color-scheme: dark) {
  :root {
    --paper: #14171b; --surface: #1c2026; --ink: #e4e7ea; --muted: #9aa5af; --rule: #333a42;
    --accent: #6cb6d3; --accent-soft: #1f3540; --box: #252b32; --box-line: #8d99a4;
    --nf-1: #e0735c; --nf-2: #e8b45c; --nf-3: #a2c25f; --nf-b: #58b98a;
    --sev-error: #f08a77; --sev-warning: #e8b45c; --sev-note: #8ebad6;
    --dep-key: #72b0dc; --dep-violation: #f07c6c; --dep-other: #b49ad8;
    --code: #22272e; --shadow: none;
  }
}
* { box-sizing: border-box; }
body {
  margin: 0; background: var(--paper); color: var(--ink);
  font: 15px/1.5 system-ui, -apple-system, "Segoe UI", "Noto Sans", "DejaVu Sans", sans-serif;
}
main { max-width: 1180px; margin: 0 auto; padding: 28px 24px 64px; }
h1 { font-size: 1.7rem; margin: 0 0 4px; letter-spacing: -.01em; }
h2 { font-size: 1.25rem; margin: 0; }
h3 { font-size: .8rem; margin: 22px 0 8px; text-transform: uppercase; letter-spacing: .08em; color: var(--muted); }
a { color: var(--accent); text-decoration: none; }
a:hover { text-decoration: underline; }
code, .mono, .loc { font-family: ui-monospace, "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: .88em; }
code { background: var(--code); padding: 1px 5px; border-radius: 4px; }
td code { white-space: nowrap; }
.loc { color: var(--muted); white-space: nowrap; }
.lede { color: var(--muted); margin: 0 0 22px; }
.panel > h3:first-child, .panel > div > h3:first-child { margin-top: 0; }
.panel {
  background: var(--surface); border: 1px solid var(--rule); border-radius: 10px;
  box-shadow: var(--shadow); padding: 18px 22px; margin: 18px 0;
}
.cards { display: grid; grid-template-columns: repeat(auto-fit, minmax(170px, 1fr)); gap: 14px; margin: 18px 0; }
.card { background: var(--surface); border: 1px solid var(--rule); border-radius: 10px; padding: 14px 18px; box-shadow: var(--shadow); }
.card .num { font-size: 1.9rem; font-weight: 650; line-height: 1.1; }
.card .what { color: var(--muted); font-size: .85rem; }
.stack { display: flex; height: 26px; border-radius: 6px; overflow: hidden; margin: 6px 0 10px; background: var(--rule); }
.stack span { display: block; height: 100%; }
.legend { display: flex; flex-wrap: wrap; gap: 6px 18px; font-size: .88rem; color: var(--muted); padding: 0; margin: 0; list-style: none; }
.swatch { display: inline-block; width: .8em; height: .8em; border-radius: 3px; margin-right: 6px; vertical-align: -1px; }
.nf-1NF { background: var(--nf-1); } .nf-2NF { background: var(--nf-2); }
.nf-3NF { background: var(--nf-3); } .nf-BCNF { background: var(--nf-b); }
.badge { display: inline-block; border-radius: 999px; padding: 1px 10px; font-size: .78rem; font-weight: 650; color: #fff; vertical-align: 3px; }
.badge.nf-2NF { color: #2b1d05; }
.badge.ok { background: transparent; color: var(--nf-b); border: 1px solid currentColor; }
.badge.short { background: transparent; color: var(--sev-error); border: 1px solid currentColor; }
.columns2 { display: grid; grid-template-columns: 1fr 1fr; gap: 0 32px; }
table { border-collapse: collapse; width: 100%; font-size: .92rem; }
th, td { text-align: left; padding: 5px 10px 5px 0; border-bottom: 1px solid var(--rule); vertical-align: top; }
th { font-weight: 600; color: var(--muted); font-size: .8rem; text-transform: uppercase; letter-spacing: .05em; }
td.n { text-align: right; font-variant-numeric: tabular-nums; width: 4em; }
td.barcell { width: 40%; vertical-align: middle; }
.columns2 > .panel { margin: 0; }
div.columns2:has(> .panel) { margin: 18px 0; }
.bar { height: 8px; border-radius: 4px; background: var(--accent); min-width: 2px; }
.index { columns: 4 180px; column-gap: 24px; padding: 0; margin: 0; list-style: none; font-size: .9rem; }
.index li { break-inside: avoid; padding: 1px 0; }
.index .swatch { width: .65em; height: .65em; }
section.table-section { scroll-margin-top: 12px; }
.head { display: flex; flex-wrap: wrap; align-items: baseline; gap: 4px 14px; }
.head .loc { margin-left: auto; }
.diagram { overflow-x: auto; padding: 6px 0 2px; }
.diagram svg { display: block; }
.dep-diagram .col rect { fill: var(--box); stroke: var(--box-line); }
.dep-diagram .col text { fill: var(--ink); }
.dep-diagram .halo { stroke: var(--surface); }
.dep-key { stroke: var(--dep-key); fill: var(--dep-key); }
.dep-violation { stroke: var(--dep-violation); fill: var(--dep-violation); }
.dep-other { stroke: var(--dep-other); fill: var(--dep-other); }
.key-line { background: var(--dep-key); } .violation-line { background: var(--dep-violation); } .other-line { background: var(--dep-other); }
.legend .line { display: inline-block; width: 22px; height: 3px; border-radius: 2px; vertical-align: 4px; margin-right: 6px; }
.empty { color: var(--muted); font-style: italic; }
.finding { border-left: 4px solid var(--sev-warning); background: var(--paper); border-radius: 0 8px 8px 0; padding: 8px 14px; margin: 8px 0; }
.finding.error { border-color: var(--sev-error); } .finding.note { border-color: var(--sev-note); }
.finding .sev { font-weight: 650; text-transform: uppercase; font-size: .75rem; letter-spacing: .06em; margin-right: 8px; }
.finding.error .sev { color: var(--sev-error); } .finding.warning .sev { color: var(--sev-warning); } .finding.note .sev { color: var(--sev-note); }
.finding ul { margin: 4px 0 0; padding-left: 18px; color: var(--muted); }
.pieces { display: grid; grid-template-columns: repeat(auto-fill, minmax(240px, 1fr)); gap: 10px; }
.piece { border: 1px dashed var(--box-line); border-radius: 8px; padding: 8px 12px; }
.caution { border-left: 4px solid var(--sev-warning); padding: 6px 12px; background: var(--paper); font-size: .9rem; }
pre { background: var(--code); padding: 10px 12px; border-radius: 6px; overflow-x: auto; font-size: .85rem; }
table.compact td { padding: 3px 10px 3px 0; }
table.compact { font-size: .88rem; }
ol.history { list-style: none; margin: 0; padding: 0 0 0 14px; border-left: 2px solid var(--rule); font-size: .9rem; }
ol.history li { position: relative; padding: 3px 0 7px 6px; break-inside: avoid; }
ol.history li::before { content: ""; position: absolute; left: -20px; top: 9px; width: 8px; height: 8px; border-radius: 50%; background: var(--accent); }
ol.history .loc { white-space: normal; overflow-wrap: anywhere; }
.history .event[data-action="created"], .history .event[data-action="dropped"] { font-weight: 600; }
.facts { color: var(--muted); margin: 2px 0 4px; font-size: .9rem; }
ul.deps { list-style: none; padding: 0; margin: 0; }
ul.deps li { padding: 5px 0; border-bottom: 1px solid var(--rule); }
ul.deps .from { color: var(--muted); font-size: .85rem; }
footer { color: var(--muted); font-size: .85rem; margin-top: 36px; }
@media (max-width: 760px) { .columns2 { grid-template-columns: 1fr; } }
@media print {
  :root { --paper: #fff; --surface: #fff; --ink: #000; --muted: #444; --rule: #bbb; --shadow: none; --code: #f3f3f3; }
  body { font-size: 10.5pt; background: #fff; }
  main { max-width: none; padding: 0; }
  .panel, .card { box-shadow: none; border-color: #bbb; }
  section.table-section { break-before: page; }
  .nav { display: none; }
  .diagram { overflow: visible; }
  .diagram svg { max-width: 100%; height: auto; }
  .stack span, .swatch, .badge, .bar, .legend .line { print-color-adjust: exact; -webkit-print-color-adjust: exact; }
  a { color: inherit; }
}
"""
