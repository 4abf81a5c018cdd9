"""The schema catalog and the findings: the data that flows between reader, rules and reporters.

Every object here is plain data with a source span, so any stage can say where a fact came from.

>>> span = Span("db/001_couriers.sql", 3, 5, 3, 12)
>>> span.gnu()
'db/001_couriers.sql:3:5'
"""
from __future__ import annotations

from dataclasses import dataclass, field

SEVERITIES: tuple[str, ...] = ("note", "warning", "error")


@dataclass(frozen=True)
class Span:
    """A region of a source file: 1-based lines and columns, ``end_column`` one past the last character."""

    path: str
    line: int
    column: int
    end_line: int
    end_column: int

    def gnu(self) -> str:
        """The ``path:line:column`` prefix of a GNU-style message."""
        return f"{self.path}:{self.line}:{self.column}"


@dataclass(frozen=True)
class Column:
    """One column of a table as the DDL declares it."""

    name: str
    type: str
    nullable: bool
    span: Span


@dataclass(frozen=True)
class Unique:
    """A uniqueness rule: primary key, unique constraint or unique index.

    ``source`` is ``"primary key"``, ``"unique constraint"`` or ``"unique index"``. A unique index over
    an expression or with a WHERE clause is kept (``expression`` / ``partial``) but is never a key.
    """

    columns: tuple[str, ...]
    source: str
    span: Span
    name: str | None = None
    partial: bool = False
    expression: bool = False
    inherited_from: str | None = None  # the partitioned table this partition's copy of the rule comes from

    @property
    def is_primary(self) -> bool:
        """True for the primary key."""
        return self.source == "primary key"


@dataclass(frozen=True)
class ForeignKey:
    """A FOREIGN KEY / REFERENCES clause; ``ref_columns`` is empty when the DDL names none."""

    columns: tuple[str, ...]
    ref_table: str
    ref_columns: tuple[str, ...]
    span: Span
    name: str | None = None


@dataclass(frozen=True)
class Dependency:
    """A functional dependency declared by an annotation comment or the config file (or carried by a split)."""

    lhs: tuple[str, ...]
    rhs: tuple[str, ...]
    span: Span
    source: str  # "annotation", "config", or "split" (the original's, on what a split's pieces carry)


@dataclass(frozen=True)
class Allow:
    """A ``normguard: allow`` annotation: rules suppressed for one table, with the reason given."""

    rules: tuple[str, ...]
    reason: str
    span: Span


@dataclass(frozen=True)
class Event:
    """One step of a table's history: ``created``, ``altered``, ``renamed``, ``dropped`` ..."""

    action: str
    detail: str
    span: Span


@dataclass
class Table:
    """A relation in the catalog at one moment of the replay."""

    name: str
    span: Span
    columns: list[Column] = field(default_factory=list)
    uniques: list[Unique] = field(default_factory=list)
    foreign_keys: list[ForeignKey] = field(default_factory=list)
    checks: list[str] = field(default_factory=list)
    dependencies: list[Dependency] = field(default_factory=list)
    allows: list[Allow] = field(default_factory=list)
    history: list[Event] = field(default_factory=list)
    split_from: str | None = None
    partition_of: str | None = None  # the partitioned table it is attached to (PostgreSQL)

    def column(self, name: str) -> Column | None:
        """The column called ``name``, or None."""
        for column in self.columns:
            if column.name == name:
                return column
        return None

    @property
    def column_names(self) -> tuple[str, ...]:
        """Column names in declaration order."""
        return tuple(column.name for column in self.columns)

    def is_nullable_unique(self, unique: Unique) -> bool:
        """True when a plain unique rule covers a nullable column (SQL admits many NULLs: not a key)."""
        if unique.partial or unique.expression or unique.is_primary:
            return False
        return any(c is None or c.nullable for c in map(self.column, unique.columns))

    @property
    def keys(self) -> list[Unique]:
        """The uniques that are keys: plain columns, no WHERE clause, every column NOT NULL."""
        return [
            u
            for u in self.uniques
            if not u.partial and not u.expression and not self.is_nullable_unique(u)
        ]


@dataclass(frozen=True)
class SplitPiece:
    """One table a split produced, with the original column feeding each of its columns.

    ``lineage`` maps a piece column to the original column it was copied from, or to None when the
    value came from an expression the reader could not follow.
    """

    table: str
    columns: tuple[str, ...]
    lineage: dict[str, str | None]
    span: Span


@dataclass(frozen=True)
class Split:
    """A decomposition of ``original`` recorded during replay, with the original as it was then."""

    original: str
    original_columns: tuple[str, ...]
    original_keys: tuple[tuple[str, ...], ...]
    original_dependencies: tuple[Dependency, ...]
    pieces: tuple[SplitPiece, ...]
    span: Span  # the statement that completes the split
    how: str  # "data" (moved by SQL) or "declared" (split-from annotations)


@dataclass
class Finding:
    """One problem to report, located at a span."""

    rule: str
    severity: str
    span: Span
    message: str
    table: str | None = None
    dependency: tuple[tuple[str, ...], tuple[str, ...]] | None = None
    explanation: list[str] = field(default_factory=list)
    fingerprint: str = ""
    subject: str = ""  # without a dependency: what sets it apart (a constraint's columns ...)


@dataclass
class Catalog:
    """The schema after replaying every statement, plus what the replay saw on the way."""

    tables: dict[str, Table] = field(default_factory=dict)
    dropped: list[Table] = field(default_factory=list)  # last state of each dropped table, in order
    splits: list[Split] = field(default_factory=list)
    findings: list[Finding] = field(default_factory=list)
    statements_read: int = 0
    statements_skipped: int = 0
    files: list[str] = field(default_factory=list)
