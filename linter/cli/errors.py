"""How commands fail: exit 2 with one line on stderr, the traceback only when asked for.

>>> Failure("no such file: db/9.sql").exit_code
2
"""
from __future__ import annotations

import traceback
from collections.abc import Iterator
from contextlib import contextmanager

import click

from linter.config_file import ConfigError


class Failure(click.ClickException):
    """A usage, configuration or input problem: reported in one line, exit status 2."""

    exit_code = 2


@contextmanager
def reported(debug: bool) -> Iterator[None]:
    """Turn a configuration problem or an unexpected exception into a ``Failure``."""
    try:
        yield
    except (click.ClickException, click.exceptions.Exit, click.Abort):
        raise
    except ConfigError as error:
        raise Failure(error.message) from None
    except Exception as error:
        if debug:
            traceback.print_exc()
        hint = "" if debug else " (run again with --debug for the traceback)"
        raise Failure(f"internal error: {type(error).__name__}: {error}{hint}") from None
