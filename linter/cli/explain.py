"""``normguard explain [PATHS]... --table T``: everything normguard knows and proposes about one table."""
from __future__ import annotations

import difflib

import click

from linter.cli.check import existing, settings
from linter.cli.ddl_sketch import ddl_sketch
from linter.cli.errors import Failure, reported
from linter.cli.explain_report import explain_lines
from linter.cli.options import checked_dialect
from linter.config import load_config
from linter.config_check import TARGETS
from linter.engine import Result, run
from linter.explain_split import split_section
from linter.reader.names import parse_table_name


def _analysis_of(result: Result, name: str, dialect: str) -> str:
    """The catalog name of the table asked for; an unknown one fails with the closest names."""
    folded = parse_table_name(name, dialect)
    if folded in result.analyses:
        return folded
    dropped = {table.name for table in result.catalog.dropped}
    if folded in dropped:
        raise Failure(f"table {folded} was dropped by the migrations; explain shows tables that exist at the end")
    close = difflib.get_close_matches(folded, sorted(result.analyses), n=3)
    hint = f"; did you mean {', '.join(close)}?" if close else ""
    raise Failure(f"no table {folded} in the schema read{hint}")


@click.command()
@click.argument("paths", nargs=-1, type=click.Path(path_type=str))
@click.option("--table", "-t", "table", required=True, help="Table to explain.")
@click.option("--dialect", help="sqlglot dialect of the SQL (default from the settings: postgres).")
@click.option("--target", type=click.Choice(TARGETS, case_sensitive=False), help="Normal form to aim for.")
@click.option("--config", "config_path", type=click.Path(dir_okay=False, path_type=str), help="Settings file.")
@click.option("--sql/--no-sql", default=True, show_default=True, help="Show CREATE TABLE sketches of the proposals.")
@click.option("--debug", is_flag=True, help="Print the traceback of an internal error.")
def explain(
    paths: tuple[str, ...], table: str, dialect: str | None, target: str | None, config_path: str | None,
    sql: bool, debug: bool,
) -> None:
    """Explain TABLE: keys, dependencies, derivations, normal form and proposed decompositions."""
    with reported(debug):
        config = settings(load_config(config_path), dialect=checked_dialect(dialect),
                          target=target and target.lower())
        read = existing(paths, "given on the command line") if paths else existing(config.paths, "from 'paths'")
        result = run(config, read)
        name = parse_table_name(table, config.dialect)
        splits = split_section(result.catalog, name)
        if splits and name not in result.analyses:
            click.echo("\n".join(splits[1:]))  # a dropped original: its splits are what is left of it
            return
        analysis = result.analyses[_analysis_of(result, table, config.dialect)]
        lines = explain_lines(analysis)
        if sql and analysis.report.form != "BCNF":
            lines += ["", "proposed SQL for the BCNF decomposition:", *ddl_sketch(analysis, analysis.bcnf)]
        click.echo("\n".join(lines + splits))
