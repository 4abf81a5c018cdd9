"""Comments between tokens, with their positions (sqlglot keeps them without): ``collect_comments``.

>>> from linter.reader.dialects import get_dialect
>>> from linter.reader.line_index import LineIndex
>>> from linter.reader.read_state import ReadState
>>> text = "-- depots\\nSELECT '--' /* a /* b */ c */;"
>>> state = ReadState(text, get_dialect("postgres"), LineIndex("db/001.sql", text))
>>> collect_comments(state, state.dialect.tokenize(text), 0, len(text))
>>> [(c.text, c.span.line, c.span.column) for c in state.comments]
[(' depots', 1, 1), (' a /* b */ c ', 2, 13)]
"""
from __future__ import annotations

import bisect
import re
from collections.abc import Sequence
from functools import lru_cache

from sqlglot.tokens import Token

from linter.reader.read_state import ReadState
from linter.reader.script import Comment

__all__ = ["collect_comments", "comment_syntax"]


def collect_comments(state: ReadState, tokens: Sequence[Token], start: int, stop: int) -> None:
    """Record the comments of ``text[start:stop]`` found between ``tokens`` in ``state.comments``.

    The text between two tokens holds only white space and comments, so every comment opener met
    outside a token and outside a comment already read starts a comment.
    """
    syntax, nested, openers = comment_syntax(state.dialect.tokenizer_class)
    text = state.text
    starts = [token.start for token in tokens]
    done = start
    for match in openers.finditer(text, start, stop):
        i = match.start()
        if i < done:
            continue
        k = bisect.bisect_right(starts, i) - 1
        if k >= 0 and tokens[k].end >= i:
            continue  # inside a string, a quoted name or a command's text
        gap_end = starts[k + 1] if k + 1 < len(starts) else stop
        done = _read_comment(state, i, match.group(), syntax[match.group()], gap_end, nested)


@lru_cache(maxsize=None)
def comment_syntax(tokenizer_class: type) -> tuple[dict[str, str | None], bool, re.Pattern[str]]:
    """A dialect's comment openers with their closers, whether ``/* */`` nests, an opener regex."""
    pairs = {c: None for c in tokenizer_class.COMMENTS if isinstance(c, str)}
    pairs.update((c[0], c[1]) for c in tokenizer_class.COMMENTS if not isinstance(c, str))
    pairs["{#"] = "#}"  # sqlglot reads Jinja comments in every dialect
    pattern = "|".join(re.escape(opener) for opener in sorted(pairs, key=len, reverse=True))
    return pairs, bool(tokenizer_class.NESTED_COMMENTS), re.compile(pattern)


def _read_comment(state: ReadState, i: int, opener: str, closer: str | None, end: int, nested: bool) -> int:
    """Record the comment opened at ``i`` (it ends by ``end``); return the offset after it."""
    text = state.text
    body = i + len(opener)
    if closer is None:
        after = text.find("\n", body, end)
        after = end if after < 0 else after
        inner_end = after - 1 if after > body and text[after - 1] == "\r" else after
        shown = inner_end  # a line comment's span stops before its line break
    else:
        after, inner_end = _block_end(text, body, end, opener, closer, nested)
        if inner_end < 0:
            state.finding(
                "syntax-error", "error", i, body,
                f"comment opened with {opener} is never closed: the rest of the file is ignored",
            )
            inner_end = after
        shown = after
    state.comments.append(Comment(text[body:inner_end], state.lines.span(i, shown), start=i, end=after))
    return after


def _block_end(text: str, body: int, end: int, opener: str, closer: str, nested: bool) -> tuple[int, int]:
    """(offset after the closer, offset of the closer) of a block comment; (end, -1) if unclosed."""
    depth, i = 1, body
    while i < end:
        close = text.find(closer, i, end)
        if close < 0:
            return end, -1
        if nested:
            inner = text.find(opener, i, close)
            if inner >= 0:
                depth += 1
                i = inner + len(opener)
                continue
        depth -= 1
        if depth == 0:
            return close + len(closer), close
        i = close + len(closer)
    return end, -1
