"""Statements sqlglot keeps as opaque text, read from their tokens: RENAME CONSTRAINT, ATTACH PARTITION.

The catalog needs them (a later DROP CONSTRAINT looks for the new name; a partition carries its
parent's keys) and their grammar is small enough to follow token by token:
``ALTER TABLE [IF EXISTS] [ONLY] t RENAME CONSTRAINT a TO b`` and
``ALTER TABLE [IF EXISTS] [ONLY] t ATTACH | DETACH PARTITION c ...``.

>>> from linter.reader.dialects import get_dialect
>>> tokens = get_dialect("postgres").tokenize('"Billing".invoices RENAME')
>>> name, after = _name(tokens, 0)
>>> name.sql(dialect="postgres"), tokens[after].text
('"Billing".invoices', 'RENAME')
"""
from __future__ import annotations

from dataclasses import replace

from sqlglot import exp
from sqlglot.errors import TokenError
from sqlglot.tokens import Token, TokenType

from linter.reader.dialects import get_dialect
from linter.reader.names import fold_column, table_name, token_identifier
from linter.reader.partitions import attach, detach
from linter.reader.state import ReplayState
from linter.reader.tokens import word

_NAME_TYPES = frozenset({TokenType.VAR, TokenType.IDENTIFIER})


def recover(state: ReplayState, text: str) -> bool:
    """Replay an ALTER TABLE ... RENAME CONSTRAINT / ATTACH / DETACH PARTITION; False for others."""
    try:
        tokens = get_dialect(state.dialect).tokenize(text)
    except TokenError:
        return False
    if [word(token) for token in tokens[:2]] != ["ALTER", "TABLE"]:
        return False
    i = 2
    while i < len(tokens) and word(tokens[i]) in ("IF", "EXISTS", "ONLY"):
        i += 1
    if_exists = any(word(token) == "EXISTS" for token in tokens[2:i])
    target, i = _name(tokens, i)
    if target is None:
        return False
    return _rename_constraint(state, tokens, i, target, if_exists) or _partition(state, tokens, i, target, if_exists)


def _name(tokens: list[Token], start: int) -> tuple[exp.Table | None, int]:
    """A possibly qualified name starting at ``start``, and the index after it."""
    parts: list[exp.Identifier] = []
    i = start
    while i < len(tokens) and tokens[i].token_type in _NAME_TYPES:
        parts.append(token_identifier(tokens[i]))
        if i + 1 < len(tokens) and tokens[i + 1].token_type == TokenType.DOT:
            i += 2
        else:
            i += 1
            break
    if not parts:
        return None, start
    names = ["catalog", "db", "this"][-len(parts):] if len(parts) <= 3 else []
    return (exp.Table(**dict(zip(names, parts))) if names else None), i


def _partition(state: ReplayState, tokens: list[Token], i: int, parent: exp.Table, if_exists: bool) -> bool:
    """``... t ATTACH | DETACH PARTITION c [FOR VALUES ... | DEFAULT | CONCURRENTLY | FINALIZE]``."""
    verb = [word(token) for token in tokens[i : i + 2]]
    if verb not in (["ATTACH", "PARTITION"], ["DETACH", "PARTITION"]):
        return False
    child, after = _name(tokens, i + 2)
    if child is None:
        return False
    parent_name, name = table_name(parent, state.dialect), table_name(child, state.dialect)
    if verb[0] == "ATTACH":
        attach(state, parent_name, name, state.text_span(tokens[i + 2].start, tokens[after - 1].end + 1), if_exists)
    else:
        finalize = any(word(token) == "FINALIZE" for token in tokens[after:])
        detach(state, parent_name, name, if_exists, finalize)
    return True


def _rename_constraint(state: ReplayState, tokens: list[Token], i: int, target: exp.Table, if_exists: bool) -> bool:
    """``ALTER TABLE [IF EXISTS] [ONLY] t RENAME CONSTRAINT a TO b``: the rule keeps its columns."""
    words = [word(token) for token in tokens[i:]]
    if len(words) != 5 or words[:2] != ["RENAME", "CONSTRAINT"] or words[3] != "TO":
        return False
    old_token, new_token = tokens[i + 2], tokens[i + 4]
    if old_token.token_type not in _NAME_TYPES or new_token.token_type not in _NAME_TYPES:
        return False
    old, new = (fold_column(token_identifier(token), state.dialect) for token in (old_token, new_token))
    table = state.table(table_name(target, state.dialect))
    if table is None:
        if not if_exists:
            state.conflict(f"RENAME CONSTRAINT on {table_name(target, state.dialect)}, which does not exist")
        return True
    table.uniques = [replace(u, name=new) if u.name == old else u for u in table.uniques]
    table.foreign_keys = [replace(f, name=new) if f.name == old else f for f in table.foreign_keys]
    state.event(table, "altered", f"renamed constraint {old} to {new}")
    return True
