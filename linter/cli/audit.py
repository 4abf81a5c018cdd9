"""``normguard audit [PATHS]... --html FILE [--json FILE]``: where the schema stands, table by table."""
from __future__ import annotations

import json

import click

from linter.audit.data import audit_data
from linter.audit.page import render_html
from linter.audit.progress import file_progress, stderr_is_terminal
from linter.cli.check import plan, settings, write_report
from linter.cli.errors import Failure, reported
from linter.cli.options import checked_dialect
from linter.config import load_config
from linter.config_check import TARGETS
from linter.engine import run


@click.command("audit")
@click.argument("paths", nargs=-1, type=click.Path(path_type=str))
@click.option("--html", "html_path", type=click.Path(dir_okay=False, path_type=str),
              help="Write the report as one self-contained HTML page to FILE.")
@click.option("--json", "json_path", type=click.Path(dir_okay=False, path_type=str),
              help="Write the same data as JSON to FILE (format: normguard-audit, version 1).")
@click.option("--dialect", help="sqlglot dialect of the SQL (default from the settings: postgres).")
@click.option("--target", type=click.Choice(TARGETS, case_sensitive=False),
              help="Normal form every table should reach (default from the settings: bcnf).")
@click.option("--config", "config_path", type=click.Path(dir_okay=False, path_type=str),
              help="Settings file (default: .normguard.yaml, else [tool.normguard] in pyproject.toml).")
@click.option("--debug", is_flag=True, help="Print the traceback of an internal error.")
def audit(
    paths: tuple[str, ...], html_path: str | None, json_path: str | None, dialect: str | None,
    target: str | None, config_path: str | None, debug: bool,
) -> int:
    """Write an audit of every table: normal form, keys, dependency diagram, findings, split, history."""
    with reported(debug):
        if html_path is None and json_path is None:
            raise Failure("audit needs --html FILE and/or --json FILE to write to")
        config = settings(load_config(config_path), dialect=checked_dialect(dialect), target=target and target.lower())
        read, report = plan(paths, None, config)
        with file_progress(stderr_is_terminal()) as on_file:
            result = run(config, read, report_paths=report, on_file=on_file)
        data = audit_data(result, report or read)
        if json_path is not None:
            write_report(json.dumps(data, indent=2, ensure_ascii=False) + "\n", json_path)
        if html_path is not None:
            write_report(render_html(data), html_path)
        written = " and ".join(path for path in (html_path, json_path) if path)
        click.echo(f"normguard: audit of {len(data['tables'])} tables written to {written}", err=True)
        return 0
