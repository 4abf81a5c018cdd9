"""Workflow-command annotations against the actions toolkit's rules.

Source: github.com/actions/toolkit ``packages/core/src/command.ts`` (as summarised in
``../shared/standards/FORMATS.md`` §3): property values escape ``%``, CR, LF, ``:`` and ``,``;
message data escapes ``%``, CR and LF; ``col``/``endColumn`` are dropped when a span covers several
lines; severities are ``error``, ``warning`` and ``notice``. The decoder below is written from those
rules, independently of the reporter.
"""
from __future__ import annotations

import re

from linter.reporters.github import render_github

COMMAND = re.compile(r"^::(?P<kind>error|warning|notice) (?P<props>[^:]*)::(?P<data>.*)$")


def _unescape(text: str) -> str:
    """Undo the toolkit escapes (``%25`` last, so ``%253A`` stays ``%3A``)."""
    for escaped, plain in (("%0D", "\r"), ("%0A", "\n"), ("%3A", ":"), ("%2C", ","), ("%25", "%")):
        text = text.replace(escaped, plain)
    return text


def decode(line: str) -> tuple[str, dict[str, str], str]:
    """(kind, properties, message) of one workflow command line."""
    match = COMMAND.match(line)
    assert match, line
    props = dict(item.split("=", 1) for item in match["props"].split(","))
    assert all(re.fullmatch(r"[^,:\r\n]*", value) for value in props.values())  # escaped
    assert not re.search(r"[\r\n]", match["data"])
    return match["kind"], {k: _unescape(v) for k, v in props.items()}, _unescape(match["data"])


def _commands(result) -> list[tuple[str, dict[str, str], str]]:
    return [decode(line) for line in render_github(result).splitlines() if line.startswith("::")]


def test_escaping_round_trips(result):
    odd = next(c for c in _commands(result) if c[1]["file"] == "db/a,b:c.sql")
    kind, props, message = odd
    assert kind == "warning"
    assert props["title"] == "normguard missing-key"
    assert message == "100% odd: text,with:colons\nand a second line\x07\nexplained"


def test_one_line_span_has_inclusive_columns(result):
    _, props, _ = next(c for c in _commands(result) if c[1]["file"] == "db/002 riders.sql")
    # the reporter's span is columns 5..24 (end 25 exclusive); the runner's endColumn is inclusive
    assert props == {
        "file": "db/002 riders.sql", "line": "7", "endLine": "7", "col": "5", "endColumn": "24",
        "title": "normguard transitive-dependency",
    }


def test_multi_line_span_drops_columns(result):
    kind, props, _ = next(c for c in _commands(result) if c[1]["file"] == "db/001_base.sql")
    assert kind == "notice"
    assert (props["line"], props["endLine"]) == ("2", "5")
    assert "col" not in props and "endColumn" not in props


def test_errors_come_first_and_the_summary_last(result):
    lines = render_github(result).splitlines()
    assert [decode(line)[0] for line in lines[:-1]] == ["error", "warning", "warning", "notice"]
    assert lines[-1].startswith("normguard: 1 error, 2 warnings, 1 note")


def test_annotations_past_the_runner_limit_are_counted(result):
    many = result.findings[2]
    result.findings = [many] * 12
    lines = render_github(result).splitlines()
    assert sum(line.startswith("::warning ") for line in lines) == 12
    assert lines[-2].startswith("normguard: 2 findings past the runner's limit")
