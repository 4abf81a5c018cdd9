"""``normguard check [PATHS]...``: read the SQL, run the rules, print a report, exit 0, 1 or 2."""
from __future__ import annotations

import dataclasses
import os
import sys

import click

from linter.atomic_write import atomic_write
from linter.cli.baseline_check import (
    apply_baseline,
    baseline_report,
    baseline_scope,
    read_baseline,
)
from linter.cli.errors import Failure, reported
from linter.cli.options import checked_dialect, exit_status, split_ids, use_color
from linter.cli.show_rules import unknown_rule
from linter.config import Config, load_config
from linter.config_check import FAIL_LEVELS, TARGETS
from linter.engine import run
from linter.reader.sources import display_path, located_in
from linter.reporters import FORMATS, render
from rules import all_rules


def existing(paths: tuple[str, ...] | list[str], what: str) -> list[str]:
    """The paths, relative; a missing one fails naming it."""
    for path in paths:
        if not os.path.exists(path):
            raise Failure(f"{path}: no such file or directory ({what})")
    return [display_path(path) for path in paths]


def plan(paths: tuple[str, ...], context: str | None, config: Config) -> tuple[list[str], list[str] | None]:
    """What to read and what to report on: with a context folder and files, read all, report the files."""
    if not paths:
        return existing(config.paths, f"from 'paths' in {config.source or 'the defaults'}"), None
    given = existing(paths, "given on the command line")
    folder = context if context is not None else config.migrations
    if folder is None:
        return given, None
    where = "--context" if context is not None else f"'migrations' in {config.source}"
    (folder,) = existing([folder], f"from {where}")
    if any(located_in(folder, [path]) for path in given):
        return given, None  # the whole folder was asked for: nothing to add, nothing to leave out
    return [folder, *(path for path in given if not located_in(path, [folder]))], given


def _rule_ids(values: tuple[str, ...]) -> tuple[str, ...]:
    """Split and check rule ids given to --select or --ignore."""
    known = sorted(rule.id for rule in all_rules())
    ids = split_ids(values)
    for rule_id in ids:
        if rule_id not in known:
            raise unknown_rule(rule_id, known)
    return ids


def settings(config: Config, **overrides: object) -> Config:
    """The configuration with the command-line values that were given laid over it."""
    return dataclasses.replace(config, **{k: v for k, v in overrides.items() if v})


def write_report(text: str, output: str | None) -> None:
    """Print the report, or write it whole to ``output`` (an existing file is replaced only at the end)."""
    if output is None:
        click.echo(text, nl=False)
        return
    folder = os.path.dirname(output) or "."
    if not os.path.isdir(folder):
        raise Failure(f"{output}: cannot write the report: no such folder '{folder}'")
    try:
        atomic_write(output, text)
    except OSError as error:
        raise Failure(f"{output}: cannot write the report: {error.strerror or error}") from None


@click.command()
@click.argument("paths", nargs=-1, type=click.Path(path_type=str))
@click.option("--dialect", help="sqlglot dialect of the SQL (default from the settings: postgres).")
@click.option("--format", "fmt", type=click.Choice(list(FORMATS)), default="text", show_default=True,
              help="Report format.")
@click.option("--output", "-o", type=click.Path(dir_okay=False, path_type=str),
              help="Write the report to FILE (replaced whole, only once the report is complete).")
@click.option("--target", type=click.Choice(TARGETS, case_sensitive=False),
              help="Normal form every table must reach (default from the settings: bcnf).")
@click.option("--select", multiple=True, metavar="RULES",
              help="Run only these rules (repeat or comma-separate).")
@click.option("--ignore", multiple=True, metavar="RULES",
              help="Do not run these rules (repeat or comma-separate).")
@click.option("--config", "config_path", type=click.Path(dir_okay=False, path_type=str),
              help="Settings file (default: .normguard.yaml, else [tool.normguard] in pyproject.toml).")
@click.option("--fail-on", type=click.Choice(FAIL_LEVELS), help="Lowest severity that makes the exit status 1.")
@click.option("--context", type=click.Path(file_okay=False, path_type=str),
              help="Folder replayed for context; only findings in the given PATHS are reported.")
@click.option("--color/--no-color", default=None,
              help="Colour the text report (default: on a terminal, unless NO_COLOR is set).")
@click.option("--baseline", "baseline_path", type=click.Path(dir_okay=False, path_type=str),
              help="Report only findings not recorded in this baseline file (see: normguard baseline).")
@click.option("--debug", is_flag=True, help="Print the traceback of an internal error.")
def check(
    paths: tuple[str, ...], dialect: str | None, fmt: str, output: str | None, target: str | None,
    select: tuple[str, ...], ignore: tuple[str, ...], config_path: str | None, fail_on: str | None,
    context: str | None, color: bool | None, baseline_path: str | None, debug: bool,
) -> int:
    """Check SQL files and folders (default: 'paths' from the settings) and report each problem."""
    with reported(debug):
        config = settings(
            load_config(config_path), dialect=checked_dialect(dialect), target=target and target.lower(),
            select=_rule_ids(select), ignore=_rule_ids(ignore), fail_on=fail_on,
        )
        read, report = plan(paths, context, config)
        recorded = read_baseline(baseline_path) if baseline_path is not None else None
        result = run(config, read, report_paths=report)
        wanted = report or read
        if not any(located_in(path, wanted) for path in result.catalog.files):
            click.echo(f"normguard: no SQL file found under {', '.join(wanted)} (include: "
                       f"{', '.join(config.include)}); nothing was checked", err=True)
        if recorded is not None:
            result, comparison = apply_baseline(result, recorded, baseline_scope(read, report, config))
        code = exit_status(result.findings, config.fail_on)
        colored = use_color(color, is_tty=output is None and sys.stdout.isatty(), environ=os.environ)
        if recorded is None:
            text = render(fmt, result, color=colored, exit_code=code)
        else:
            text = baseline_report(fmt, result, comparison, baseline_path, color=colored, exit_code=code)
        if output is not None and display_path(output) in result.catalog.files:
            raise Failure(f"{output}: refusing to write the report over a SQL file that was just read")
        write_report(text, output)
        return code
