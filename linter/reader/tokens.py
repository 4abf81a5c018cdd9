"""Part of a file -> sqlglot tokens in file coordinates, comments collected on the way: ``tokenize``.

>>> from linter.reader.dialects import get_dialect
>>> from linter.reader.line_index import LineIndex
>>> from linter.reader.read_state import ReadState
>>> text = "-- depots\\nCREATE TABLE depot (city text);"
>>> state = ReadState(text, get_dialect("postgres"), LineIndex("db/001.sql", text))
>>> tokens = tokenize(state, 0, len(text))
>>> [(word(t), t.line, t.start) for t in tokens[:2]], [c.text for c in state.comments]
([('CREATE', 2, 10), ('TABLE', 2, 17)], [' depots'])
"""
from __future__ import annotations

import re

from sqlglot.errors import TokenError
from sqlglot.tokens import Token, Tokenizer, TokenType

from linter.reader.comments import collect_comments, comment_syntax
from linter.reader.dialects import tokenizer_for
from linter.reader.read_state import ReadState

__all__ = ["QUOTED_TOKENS", "token_at", "tokenize", "word"]

QUOTED_TOKENS = frozenset(
    {TokenType.STRING, TokenType.IDENTIFIER, TokenType.NATIONAL_STRING, TokenType.HEREDOC_STRING,
     TokenType.RAW_STRING, TokenType.BYTE_STRING, TokenType.BIT_STRING, TokenType.HEX_STRING,
     TokenType.UNICODE_STRING}
)
"""Token types whose text was written in quotes: never a keyword, never cut into."""


def word(token: Token | None) -> str:
    """A token's text in upper case ('' for no token)."""
    return token.text.upper() if token is not None else ""


def token_at(tokens: list[Token] | tuple[Token, ...], i: int) -> Token | None:
    """tokens[i], or None past the end."""
    return tokens[i] if i < len(tokens) else None


def tokenize(state: ReadState, start: int, end: int) -> list[Token]:
    """Tokenize ``text[start:end]`` into file coordinates and collect its comments.

    When the tokenizer fails (an unterminated string ...) a ``syntax-error`` is reported at its
    position and the tokens before that point are kept.
    """
    chunk = state.text[start:end]
    tokenizer = tokenizer_for(state.dialect)
    try:
        tokens = tokenizer.tokenize(chunk)
        stop = scan_end = end
    except TokenError as error:
        where, reason = _token_error(error, chunk, comment_syntax(state.dialect.tokenizer_class)[0])
        stop = start + where
        scan_end = end if reason is None else stop
        if reason is not None:
            skipped = state.lines.position(end - 1)[0] - state.lines.position(stop)[0]
            rest = f"; the {skipped} line(s) after it were not read" if skipped > 0 else ""
            state.finding("syntax-error", "error", stop, min(stop + 1, end), f"{reason}{rest}")
        try:
            tokens = tokenizer.tokenize(chunk[:where])
        except TokenError:
            tokens = []
        if reason is not None:
            # The statement the error is in is incomplete: keep only what ends with a ';'.
            semicolons = (i for i, t in enumerate(tokens) if t.token_type == TokenType.SEMICOLON)
            del tokens[max(semicolons, default=-1) + 1 :]
    _place_command_text(tokenizer, chunk, tokens)
    if start:
        line0, column0 = state.lines.position(start)
        for token in tokens:
            if token.line == 1:
                token.col += column0 - 1
            token.line += line0 - 1
            token.start += start
            token.end += start
    collect_comments(state, tokens, start, scan_end)
    return tokens


def _place_command_text(tokenizer: Tokenizer, chunk: str, tokens: list[Token]) -> None:
    """Give correct offsets to the text sqlglot reads whole after a command word (RENAME, EXECUTE ...).

    The tokenizer turns everything from such a word at a statement start up to the next ``;`` into
    one STRING token, but records it with the offsets of the last token it scanned.
    """
    commands, prefixes = tokenizer.COMMANDS, tokenizer.COMMAND_PREFIX_TOKENS
    for i in [i for i, token in enumerate(tokens) if token.token_type in commands]:
        if i + 1 < len(tokens) and tokens[i + 1].token_type == TokenType.STRING and (
            i == 0 or tokens[i - 1].token_type in prefixes
        ):
            command, token = tokens[i], tokens[i + 1]
            begin = chunk.find(token.text, command.end + 1)
            if begin >= 0:
                token.start, token.end = begin, begin + len(token.text) - 1
                token.line = command.line + chunk.count("\n", command.end, token.end)


def _token_error(error: TokenError, chunk: str, closers: dict[str, str | None]) -> tuple[int, str | None]:
    """(offset in the chunk where the tokenizer gave up, reason) as far as its error tells.

    The reason is None when the tokenizer ran off the end inside an unclosed block comment: the
    comment scan reports that one itself.
    """
    cause = error.__cause__ or error.__context__
    message = str(cause or "")
    found = re.fullmatch(r"(Missing (.+?)|Numeric string .*?) from (\d+):(\d+)\s*", message)
    if found:
        where = min(int(found.group(4)), len(chunk))
        if found.group(2):
            return where, f"unterminated quoted text: no closing {found.group(2)} after this point"
        return where, "invalid characters in a numeric string literal"
    if isinstance(cause, IndexError):
        openers = (chunk.rfind(opener) for opener, closer in closers.items() if closer)
        opened = max(openers, default=-1)
        if opened >= 0:
            return opened, None
    if error.start:  # the context snippet runs 50 characters either side of the stop
        where = min(error.start + 50, len(chunk))
    elif error.end is not None and error.end < len(chunk) - 1:
        where = max(error.end - 50, 0)
    else:
        where = 0
    return where, "cannot split this text into SQL tokens"
