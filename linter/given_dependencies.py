"""The functional dependencies a relation is given: one per key, plus the declared ones.

A key K of columns R gives K -> R - K; an annotation or config entry gives its own FD. Each keeps
where it came from, so a finding can point at the constraint or comment behind a dependency.

>>> from linter.model import Span
>>> span = Span("couriers.sql", 1, 1, 1, 2)
>>> attrs, given = given_dependencies(
...     ("courier_id", "depot", "city"), [(("courier_id",), "primary key", span)], [])
>>> [(attrs.format_fd(g.fd), g.origin) for g in given]
[('courier_id -> depot, city', 'primary key')]
"""
from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass

from linter.dependencies import FD, Attributes
from linter.model import Dependency, Span, Table


@dataclass(frozen=True)
class GivenDependency:
    """A dependency with its origin (``primary key``, ``unique index``, ``annotation`` ...) and span."""

    fd: FD
    origin: str
    span: Span


def given_dependencies(
    columns: Sequence[str],
    keys: Iterable[tuple[Sequence[str], str, Span]],
    declared: Iterable[Dependency],
) -> tuple[Attributes, list[GivenDependency]]:
    """The column index of a relation and the dependencies its keys and declarations give."""
    attrs = Attributes(columns)
    given: list[GivenDependency] = []
    for key_columns, origin, span in keys:
        if not set(key_columns) <= set(columns):
            continue
        lhs = attrs.bits(key_columns)
        if attrs.full & ~lhs:
            given.append(GivenDependency(FD(lhs, attrs.full & ~lhs), origin, span))
    for dependency in declared:
        if not set(dependency.lhs + dependency.rhs) <= set(columns):
            continue  # the reader reports unknown columns as annotation errors
        fd = FD(attrs.bits(dependency.lhs), attrs.bits(dependency.rhs))
        if fd.rhs & ~fd.lhs:
            given.append(GivenDependency(fd, dependency.source, dependency.span))
    return attrs, given


def table_dependencies(table: Table) -> tuple[Attributes, list[GivenDependency]]:
    """``given_dependencies`` of a catalog table: its keys (not nullable uniques) and declarations."""
    keys = [(unique.columns, unique.source, unique.span) for unique in table.keys]
    return given_dependencies(table.column_names, keys, table.dependencies)
