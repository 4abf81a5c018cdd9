"""The ``normguard`` command group: every failure ends as one line on stderr and a status code.

Exit status: 0 no finding at or above the failing level, 1 findings, 2 usage, configuration,
input or internal error.
"""
from __future__ import annotations

import sys
from collections.abc import Sequence
from typing import Any

import click

from linter import __version__
from linter.cli.audit import audit
from linter.cli.baseline import baseline
from linter.cli.check import check
from linter.cli.explain import explain
from linter.cli.show_rules import show_rules


class _Group(click.Group):
    """A click group that prints errors as ``normguard: message`` and never lets a traceback out."""

    def main(  # type: ignore[override]
        self,
        args: Sequence[str] | None = None,
        prog_name: str | None = None,
        complete_var: str | None = None,
        standalone_mode: bool = True,
        **extra: Any,
    ) -> Any:
        """Run a command; return (or exit with) its status."""
        code = _run(super().main, args, prog_name, complete_var, extra)
        if standalone_mode:
            sys.exit(code)
        return code


def _run(
    run: Any, args: Sequence[str] | None, prog_name: str | None, complete_var: str | None,
    extra: dict[str, Any],
) -> int:
    """Call click's ``main`` without its own error handling and map each outcome to a status."""
    try:
        outcome = run(args, prog_name, complete_var, standalone_mode=False, **extra)
    except click.exceptions.NoArgsIsHelpError as error:
        click.echo(error.format_message(), err=True)
        return 2
    except click.UsageError as error:
        command = error.ctx.command_path if error.ctx is not None else "normguard"
        _say(f"{error.format_message()} (see '{command} --help')")
        return 2
    except click.ClickException as error:
        _say(error.format_message())
        return error.exit_code
    except click.Abort:
        _say("interrupted")
        return 2
    except Exception as error:  # last resort: commands report their own with --debug
        _say(f"internal error: {type(error).__name__}: {error}")
        return 2
    return outcome if isinstance(outcome, int) else 0


def _say(message: str) -> None:
    """One GNU-style ``program: message`` line on stderr."""
    click.echo(f"normguard: {message}", err=True)


@click.group("normguard", cls=_Group, context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(__version__, "--version", prog_name="normguard", message="%(prog)s %(version)s")
def main() -> None:
    """Keep relational schemas normalized: check SQL migrations for keys and normal forms."""


main.add_command(check)
main.add_command(show_rules)
main.add_command(explain)
main.add_command(baseline)
main.add_command(audit)
