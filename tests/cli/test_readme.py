"""The README's commands and settings example stay true to the project."""
from __future__ import annotations

import re

from linter.config import load_config

from ..locations import ROOT

README = (ROOT / "README.md").read_text(encoding="utf-8")


def _section(title: str) -> str:
    """The text of one ``## title`` section."""
    start = README.index(f"\n## {title}\n")
    end = README.find("\n## ", start + 1)
    return README[start : end if end >= 0 else len(README)]


def _blocks(text: str, language: str) -> list[str]:
    """The fenced code blocks of ``language`` in ``text``."""
    return [block.strip() for block in re.findall(rf"```{language}\n(.*?)```", text, flags=re.S)]


def test_exactly_two_commands_to_try_it():
    example, tests = _blocks(_section("Try it"), "sh")
    assert example.startswith("python3 -m venv .venv && .venv/bin/pip install -q -e . && ")
    assert example.endswith("cd examples/courier && ../../.venv/bin/normguard check")
    assert (ROOT / "examples" / "courier" / ".normguard.yaml").is_file()
    assert tests == "python3 -m venv .venv && .venv/bin/pip install -q -e '.[test]' && .venv/bin/python -m pytest"


def test_ci_runs_the_readme_test_command():
    (_, tests) = _blocks(_section("Try it"), "sh")
    ci = (ROOT / ".ci" / "run").read_text(encoding="utf-8").splitlines()
    assert tests in ci


def test_the_settings_example_is_valid(tmp_path):
    (settings,) = _blocks(_section("Configuration"), "yaml")
    for folder in ("db/migrations", "db/legacy"):
        (tmp_path / folder).mkdir(parents=True)
    (tmp_path / ".normguard.yaml").write_text(settings + "\n", encoding="utf-8")
    config = load_config(cwd=str(tmp_path))
    assert config.tables["tariffs"].target == "3nf"
    assert config.severity["redundant-unique"] == "off"


def test_the_proposal_caution_is_there():
    caution = _section("Proposed SQL is a proposal")
    assert "review them, back up the data" in caution and "never applies a migration" in caution
