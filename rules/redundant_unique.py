"""``redundant-unique``: a unique rule whose columns contain another key, so it enforces nothing more.

>>> from linter.model import Catalog, Column, Span, Table, Unique
>>> at = Span("db/004.sql", 2, 1, 2, 30)
>>> columns = [Column(name, "INT", False, at) for name in ("sailing_id", "vessel")]
>>> table = Table("sailings", at, columns, [Unique(("sailing_id",), "primary key", at),
...                                        Unique(("sailing_id", "vessel"), "unique index", at)])
>>> [finding] = check(Context(Catalog({"sailings": table}), {}))
>>> print(finding.message)
unique index (sailing_id, vessel) of sailings contains the primary key (sailing_id): it rejects no row that key accepts
"""
from __future__ import annotations

from collections.abc import Iterator

from linter.model import Catalog, Finding, Table, Unique
from linter.rule import Context, Rule
from rules import read_page

ID = "redundant-unique"


def check(context: Context) -> Iterator[Finding]:
    """One finding per unique rule that contains another key, at the redundant rule."""
    for table in context.catalog.tables.values():
        for position, unique in enumerate(table.uniques):
            key = _contained_key(table, position)
            if key is None or _referenced(context.catalog, table.name, unique, key):
                continue
            same = set(key.columns) == set(unique.columns)
            yield Finding(
                ID,
                RULE.severity,
                unique.span,
                f"{unique.source} ({', '.join(unique.columns)}) of {table.name}"
                f" {'repeats' if same else 'contains'} the {key.source} ({', '.join(key.columns)}):"
                " it rejects no row that key accepts",
                table.name,
                explanation=["drop it" if same else "drop it, or make it a plain index if queries use it"],
                subject=",".join(unique.columns),
            )


def _contained_key(table: Table, position: int) -> Unique | None:
    """The key whose columns lie within the unique at ``position``, preferring the primary key.

    Two rules over the same columns are reported once: the later one, unless it is the primary key.
    """
    unique = table.uniques[position]
    if unique.expression:
        return None
    candidates = []
    for other_position, key in enumerate(table.uniques):
        if other_position == position or key not in table.keys:
            continue
        if set(key.columns) < set(unique.columns):
            candidates.append(key)
        elif set(key.columns) == set(unique.columns):
            if not unique.is_primary and (key.is_primary or other_position < position):
                candidates.append(key)
    candidates.sort(key=lambda key: (not key.is_primary, len(key.columns)))
    return candidates[0] if candidates else None


def _referenced(catalog: Catalog, table: str, unique: Unique, key: Unique) -> bool:
    """True when a foreign key points at exactly the unique's columns, which then need it."""
    if set(key.columns) == set(unique.columns):
        return False
    return any(
        foreign.ref_table == table and set(foreign.ref_columns) == set(unique.columns)
        for other in catalog.tables.values()
        for foreign in other.foreign_keys
    )


RULE = Rule(ID, "note", "A unique rule contains another key, so it enforces nothing more.",
            read_page(ID), check)
