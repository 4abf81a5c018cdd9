"""A baseline file that is missing, corrupt or not ours is an error naming the file, never an empty baseline.

Exit status 2 for trouble follows GNU diff's convention (0 nothing, 1 findings, 2 trouble;
../shared/standards/FORMATS.md, source GNU-DIFF); the one-line ``program: message`` form follows the
GNU Coding Standards §4.4.
"""
from __future__ import annotations

from pathlib import Path

import pytest

from linter.baseline import Baseline, Entry, compare, dump_baseline, parse_baseline
from linter.cli.main import main
from linter.model import Finding, Span

from ..locations import one_line_error

FOREIGN = {
    "pre-commit settings": ("repos:\n  - repo: local\n    hooks: []\n", "not a normguard baseline"),
    "empty file": ("", "the baseline file is empty"),
    "a list": ("- fingerprint: 0011223344556677\n", "not a normguard baseline"),
    "a newer format": ("normguard-baseline: 2\nfindings: []\n", "format version 2"),
    "findings not a list": ("normguard-baseline: 1\nfindings: many\n", "`findings` must be a list"),
    "entry without fingerprint": (
        "normguard-baseline: 1\nfindings:\n  - rule: missing-key\n    path: a.sql\n",
        "entry 1 of `findings` has no `fingerprint`",
    ),
    "broken YAML": ("normguard-baseline: 1\nfindings: [\n  {rule: x\n", "not valid YAML"),
    "a python object tag": ("normguard-baseline: !!python/object/apply:os.getcwd []\n", "not valid YAML"),
}



def test_missing_baseline(library, runner):
    line = one_line_error(runner.invoke(main, ["check", "--baseline", "absent.yaml", "migrations"]))
    assert line == "normguard: absent.yaml: no such baseline file (create it with `normguard baseline`)"


@pytest.mark.parametrize("case", sorted(FOREIGN))
def test_bad_baseline_names_file_and_problem(library, runner, case):
    text, problem = FOREIGN[case]
    Path("accepted.yaml").write_text(text, encoding="utf-8")
    line = one_line_error(runner.invoke(main, ["check", "--baseline", "accepted.yaml", "migrations"]))
    assert line.startswith("normguard: accepted.yaml") and problem in line


def test_yaml_error_gives_the_line(library, runner):
    Path("accepted.yaml").write_text("normguard-baseline: 1\nfindings:\n  - {rule: x\n", encoding="utf-8")
    line = one_line_error(runner.invoke(main, ["check", "--baseline", "accepted.yaml", "migrations"]))
    assert line.startswith("normguard: accepted.yaml:4: not valid YAML")


def test_baseline_never_overwrites_a_file_that_is_not_one(library, runner):
    settings = Path(".pre-commit-config.yaml")
    settings.write_text("repos: []\n", encoding="utf-8")
    line = one_line_error(runner.invoke(main, ["baseline", "migrations", "--output", str(settings)]))
    assert "not a normguard baseline" in line and "not overwriting it" in line
    assert settings.read_text(encoding="utf-8") == "repos: []\n"


def test_prune_needs_an_existing_baseline(library, runner):
    line = one_line_error(runner.invoke(main, ["baseline", "--prune", "migrations"]))
    assert "no such baseline file to prune" in line
    assert not Path(".normguard-baseline.yaml").exists()


def test_round_trip_of_awkward_text():
    """Quotes, colons, hashes and non-ASCII names survive a dump and a parse unchanged."""
    entry = Entry("00ff00ff00ff00ff", "missing-key", 'Fähre "Nord": #2', "db/über: 1.sql", "- has no key # sure?")
    assert parse_baseline(dump_baseline(Baseline((entry,))), "b.yaml").entries == (entry,)


def test_repeated_fingerprints_match_one_for_one():
    """Two findings with one fingerprint against one entry: one unchanged, one new."""
    at = Span("db/1.sql", 1, 1, 1, 2)
    twice = [Finding("missing-key", "warning", at, "no key", "crate", fingerprint="aa") for _ in range(2)]
    recorded = Baseline((Entry("aa", "missing-key", "crate", "db/1.sql", "no key"),))
    comparison = compare(recorded, twice)
    assert (len(comparison.new), len(comparison.unchanged), comparison.fixed) == (1, 1, ())
