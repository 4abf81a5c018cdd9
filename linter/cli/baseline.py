"""``normguard baseline [PATHS]...``: record today's findings so ``check --baseline`` shows only new ones."""
from __future__ import annotations

import os

import click

from linter.atomic_write import atomic_write
from linter.audit.progress import file_progress, stderr_is_terminal
from linter.baseline import (
    DEFAULT_PATH,
    Baseline,
    BaselineError,
    baseline_of,
    compare,
    dump_baseline,
    load_baseline,
    outside,
    plural,
)
from linter.cli.baseline_check import baseline_scope
from linter.cli.check import plan, settings
from linter.cli.errors import Failure, reported
from linter.cli.options import checked_dialect
from linter.config import load_config
from linter.engine import run


def _previous(output: str, prune: bool) -> Baseline | None:
    """The baseline already at ``output``; a file there that is not one is never overwritten."""
    if not os.path.exists(output):
        if prune:
            raise Failure(f"{output}: no such baseline file to prune (create it with `normguard baseline`)")
        return None
    try:
        return load_baseline(output)
    except BaselineError as error:
        raise Failure(f"{error}; not overwriting it (move it away or choose another --output)") from None


@click.command("baseline")
@click.argument("paths", nargs=-1, type=click.Path(path_type=str))
@click.option("--output", "-o", default=DEFAULT_PATH, show_default=True,
              type=click.Path(dir_okay=False, path_type=str), help="Baseline file to write.")
@click.option("--prune", is_flag=True,
              help="Only drop the entries whose finding is gone; keep every other entry as it is.")
@click.option("--dialect", help="sqlglot dialect of the SQL (default from the settings: postgres).")
@click.option("--config", "config_path", type=click.Path(dir_okay=False, path_type=str),
              help="Settings file (default: .normguard.yaml, else [tool.normguard] in pyproject.toml).")
@click.option("--debug", is_flag=True, help="Print the traceback of an internal error.")
def baseline(
    paths: tuple[str, ...], output: str, prune: bool, dialect: str | None, config_path: str | None, debug: bool
) -> int:
    """Record every current finding in a baseline file, or prune the entries that are fixed."""
    with reported(debug):
        config = settings(load_config(config_path), dialect=checked_dialect(dialect))
        read, report = plan(paths, None, config)
        previous = _previous(output, prune)
        with file_progress(stderr_is_terminal()) as on_file:
            result = run(config, read, report_paths=report, on_file=on_file)
        scope = baseline_scope(read, report, config)
        if prune and previous is not None:
            comparison = compare(previous, result.findings, scope)
            if not comparison.fixed:
                click.echo(f"normguard: nothing to prune in {output}: none of its"
                           f" {len(previous.entries)} entries is fixed", err=True)
                return 0
            _write(output, Baseline(comparison.kept))
            fixed, kept = len(comparison.fixed), len(comparison.kept)
            click.echo(f"normguard: dropped {fixed} fixed {plural(fixed, 'entry')} from {output};"
                       f" {kept} {plural(kept, 'entry')} kept", err=True)
            return 0
        kept = outside(previous, scope) if previous is not None else ()
        _write(output, baseline_of(result.findings, kept))
        besides = f" (kept {len(kept)} entries for files not read this time)" if kept else ""
        count = len(result.findings)
        click.echo(f"normguard: recorded {count} {plural(count, 'finding')} in {output}{besides}", err=True)
        return 0


def _write(output: str, recorded: Baseline) -> None:
    """Write the baseline whole (temporary file renamed into place); an I/O problem fails cleanly."""
    try:
        atomic_write(output, dump_baseline(recorded))
    except OSError as error:
        raise Failure(f"{output}: cannot write the baseline: {error.strerror or error}") from None
