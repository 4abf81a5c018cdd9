"""A progress bar on stderr while a large folder is read, only when stderr is a terminal.

>>> with file_progress(False) as on_file:
...     on_file is None
True
"""
from __future__ import annotations

import sys
from collections.abc import Callable, Iterator
from contextlib import ExitStack, contextmanager
from typing import Any

import click

OnFile = Callable[[int, int, str], None]


def stderr_is_terminal() -> bool:
    """True when stderr is an interactive terminal (not a pipe, a file or a CI log)."""
    return sys.stderr.isatty()


@contextmanager
def file_progress(enabled: bool) -> Iterator[OnFile | None]:
    """An ``on_file`` callback drawing a bar of files read, or None when disabled; the bar ends on exit."""
    if not enabled:
        yield None
        return
    with ExitStack() as stack:
        bars: list[Any] = []

        def on_file(index: int, total: int, path: str) -> None:
            """Advance the bar to file ``index`` (0-based) of ``total``, naming it."""
            if not bars:
                bar = click.progressbar(
                    length=total, label="reading SQL", file=sys.stderr, show_pos=True,
                    item_show_func=lambda item: item and item[-48:],
                )
                bars.append(stack.enter_context(bar))
            bars[0].update(index + 1 - bars[0].pos, current_item=path)

        yield on_file
