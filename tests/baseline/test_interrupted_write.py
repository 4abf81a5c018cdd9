"""An interrupted write leaves the old file whole and no temporary file behind."""
from __future__ import annotations

import os
from pathlib import Path

import pytest

import linter.atomic_write
from linter.atomic_write import atomic_write
from linter.cli.main import main


def _failing_replace(source: str, target: str) -> None:
    """Stands in for ``os.replace`` when the disk is pulled away at the last moment."""
    raise OSError(5, "Input/output error")


def test_failed_rename_keeps_the_old_file(tmp_path: Path, monkeypatch: pytest.MonkeyPatch):
    target = tmp_path / "report.html"
    target.write_text("the old report\n", encoding="utf-8")
    monkeypatch.setattr(linter.atomic_write.os, "replace", _failing_replace)
    with pytest.raises(OSError):
        atomic_write(target, "the new report, cut short")
    assert target.read_text(encoding="utf-8") == "the old report\n"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["report.html"]


def test_interrupt_while_writing_keeps_the_old_file(tmp_path: Path, monkeypatch: pytest.MonkeyPatch):
    """Ctrl-C during the write (before the rename) leaves the old file and cleans up."""
    target = tmp_path / "baseline.yaml"
    target.write_text("old\n", encoding="utf-8")

    def interrupted(descriptor: int) -> None:
        raise KeyboardInterrupt

    monkeypatch.setattr(linter.atomic_write.os, "fsync", interrupted)
    with pytest.raises(KeyboardInterrupt):
        atomic_write(target, "new\n")
    assert target.read_text(encoding="utf-8") == "old\n"
    assert [p.name for p in tmp_path.iterdir()] == ["baseline.yaml"]


def test_permissions_of_a_replaced_file_are_kept(tmp_path: Path):
    target = tmp_path / "baseline.yaml"
    target.write_text("old\n", encoding="utf-8")
    target.chmod(0o640)
    atomic_write(target, "new\n")
    assert target.stat().st_mode & 0o777 == 0o640 and target.read_text(encoding="utf-8") == "new\n"


def test_baseline_command_keeps_the_old_baseline(library, runner, monkeypatch: pytest.MonkeyPatch):
    assert runner.invoke(main, ["baseline", "migrations"]).exit_code == 0
    old = Path(".normguard-baseline.yaml").read_text(encoding="utf-8")
    (library / "004_workshops.sql").write_text("CREATE TABLE workshop_slot (room text);\n", encoding="utf-8")
    monkeypatch.setattr(linter.atomic_write.os, "replace", _failing_replace)
    outcome = runner.invoke(main, ["baseline", "migrations"])
    assert outcome.exit_code == 2
    assert outcome.stderr.strip() == (
        "normguard: .normguard-baseline.yaml: cannot write the baseline: Input/output error"
    )
    assert Path(".normguard-baseline.yaml").read_text(encoding="utf-8") == old
    assert sorted(os.listdir(".")) == [".normguard-baseline.yaml", "migrations"]
