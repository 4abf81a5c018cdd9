"""Character offsets of one text -> 1-based lines and columns: ``LineIndex``.

>>> lines = LineIndex("db/001.sql", "CREATE TABLE depot (\\r\\n  city text\\r);")
>>> lines.position(24), lines.offset(3, 1)
((2, 3), 34)
>>> span = lines.span(24, 28)
>>> span.line, span.column, span.end_line, span.end_column
(2, 3, 2, 7)
"""
from __future__ import annotations

import bisect
import re

from linter.model import Span

__all__ = ["LineIndex"]

_LINE_BREAK = re.compile(r"\r\n?|\n")


class LineIndex:
    """Converts character offsets of one text to 1-based lines and columns.

    Lines end at ``\\n``, ``\\r\\n`` or a lone ``\\r``, as sqlglot's tokenizer counts them.
    """

    def __init__(self, path: str, text: str) -> None:
        self.path = path
        self.size = len(text)
        self.starts = [0]
        self.starts.extend(m.end() for m in _LINE_BREAK.finditer(text))

    def position(self, offset: int) -> tuple[int, int]:
        """(line, column) of the character at ``offset``, both 1-based."""
        offset = max(0, min(offset, self.size))
        line = bisect.bisect_right(self.starts, offset)
        return line, offset - self.starts[line - 1] + 1

    def offset(self, line: int, column: int) -> int:
        """The offset of a 1-based (line, column), clamped into the text."""
        line = max(1, min(line, len(self.starts)))
        return max(0, min(self.starts[line - 1] + column - 1, self.size))

    def span(self, start: int, end: int) -> Span:
        """The span of ``text[start:end]`` (``end`` exclusive)."""
        line, column = self.position(start)
        if end <= start:
            return Span(self.path, line, column, line, column)
        end_line, end_column = self.position(end - 1)
        return Span(self.path, line, column, end_line, end_column + 1)
