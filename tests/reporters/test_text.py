"""The text report against the GNU Coding Standards, section 4.4 "Formatting Error Messages".

The standard's compiler form is ``FILE:LINE:COLUMN: MESSAGE`` with lines and columns from 1; the
severity word after the location is GCC practice (common practice, no formal source).
"""
from __future__ import annotations

import re

from linter.reporters.text import render_text

# GNU Coding Standards §4.4: sourcefile:lineno:column: message
GNU_LINE = re.compile(
    r"^(?P<file>[^\n]+?):(?P<line>[1-9][0-9]*):(?P<column>[1-9][0-9]*): "
    r"(?P<severity>error|warning|note): (?P<message>.+) \[(?P<rule>[a-z0-9-]+)\]$"
)
ANSI = re.compile(r"\x1b\[[0-9;]*m")


def test_every_finding_is_one_gnu_line_then_its_explanation(result):
    lines = render_text(result).splitlines()
    heads = [line for line in lines if GNU_LINE.match(line)]
    assert len(heads) == len(result.findings)
    first = GNU_LINE.match(heads[0])
    assert first is not None
    assert (first["file"], first["line"], first["column"]) == ("db/001_base.sql", "2", "1")
    riders = lines.index(next(h for h in heads if h.startswith("db/002 riders.sql:7:5: warning:")))
    assert lines[riders + 1 : riders + 3] == [
        "    depot_id is not a key of riders",
        "    split off depots(depot_id, depot_city)",
    ]


def test_a_message_with_line_breaks_stays_on_one_line(result):
    text = render_text(result)
    odd = [line for line in text.splitlines() if line.startswith("db/a,b:c.sql:1:1:")]
    assert odd == ["db/a,b:c.sql:1:1: warning: 100% odd: text,with:colons and a second line\x07 [missing-key]"]


def test_summary_counts_by_severity_and_files(result):
    assert render_text(result).splitlines()[-1] == "normguard: 1 error, 2 warnings, 1 note in 4 files"


def test_no_colour_unless_asked(result):
    assert not ANSI.search(render_text(result))
    coloured = render_text(result, color=True)
    assert "\x1b[1;31merror\x1b[0m" in coloured
    assert [ANSI.sub("", line) for line in coloured.splitlines()] == render_text(result).splitlines()


def test_clean_run_prints_only_the_summary(empty_result):
    assert render_text(empty_result) == "normguard: 0 errors, 0 warnings, 0 notes in 4 files\n"
