"""What ``check --baseline FILE`` adds: the file read before the run, the report with it applied after.

>>> from linter.model import Catalog, Finding, Span
>>> found = Finding("missing-key", "warning", Span("db/001.sql", 4, 1, 4, 9), "no key", "crate",
...                 fingerprint="c3")
>>> result = Result(Catalog(), [found], [], {}, [])
>>> shown, comparison = apply_baseline(result, Baseline(()), ["db"])
>>> [f.fingerprint for f in shown.findings], comparison.fixed
(['c3'], ())
"""
from __future__ import annotations

import dataclasses
from collections.abc import Sequence

import click

from linter.baseline import (
    Baseline,
    BaselineError,
    Comparison,
    compare,
    load_baseline,
    notes,
)
from linter.cli.errors import Failure
from linter.config import Config
from linter.engine import Result
from linter.reporters import render
from linter.reporters.sarif import render_sarif


def baseline_scope(read: list[str], report: list[str] | None, config: Config) -> list[str]:
    """The files a run speaks for: the reported files, else all it read and the settings file.

    Dependencies in the settings draw findings located in the settings file, so a full run
    compares and re-records their entries too instead of keeping them aside as another file's.
    """
    if report is not None:
        return report
    return [*read, config.source] if config.source else read


def read_baseline(path: str) -> Baseline:
    """The baseline at ``path``; missing, unreadable, corrupt or foreign fails with exit status 2."""
    try:
        return load_baseline(path)
    except BaselineError as error:
        raise Failure(str(error)) from None


def apply_baseline(result: Result, recorded: Baseline, scope: Sequence[str]) -> tuple[Result, Comparison]:
    """The result with only the findings the baseline does not hold, and the full comparison."""
    comparison = compare(recorded, result.findings, scope)
    return dataclasses.replace(result, findings=list(comparison.new)), comparison


def baseline_report(
    fmt: str, result: Result, comparison: Comparison, path: str, *, color: bool, exit_code: int
) -> str:
    """The report of new findings; SARIF marks every result's baseline state, text lists fixed entries."""
    if fmt == "sarif":
        return render_sarif(result, exit_code=exit_code, baseline=comparison)
    text = render(fmt, result, color=color, exit_code=exit_code)
    lines = notes(comparison, path)
    if fmt == "text":
        return text + "".join(f"{line}\n" for line in lines)
    for line in lines:
        click.echo(line, err=True)
    return text
