"""Everything the rules ask about one table: its dependencies, keys, normal form and decompositions.

>>> from linter.model import Column, Dependency, Span, Table, Unique
>>> at, note = Span("db/001.sql", 1, 1, 1, 9), Span("db/001.sql", 5, 8, 5, 21)
>>> columns = [Column(name, "TEXT", False, at) for name in ("courier_id", "depot", "city")]
>>> table = Table("couriers", at, columns, [Unique(("courier_id",), "primary key", at)],
...               dependencies=[Dependency(("depot",), ("city",), note, "annotation")])
>>> analysis = analyse(table, "bcnf")
>>> analysis.report.form, analysis.format_keys(analysis.keys.keys)
('2NF', 'courier_id')
>>> violation = analysis.report.violations[0]
>>> analysis.attributes.format_fd(violation.fd), analysis.origin(violation.fd).span.line
('depot -> city', 5)
>>> split = analysis.split_on(violation.fd.lhs)
>>> for line in analysis.describe_decomposition(split):
...     print(line)
couriers (courier_id, depot), key courier_id
couriers_by_depot (depot, city), key depot
>>> analysis.chase(split).lossless, analysis.chase(split) is analysis.chase(split)
(True, True)

Where a finding points: a dependency X -> A of the minimal cover is derived from the given ones
(``derive``); the given dependency whose application first put A into the closure of X is its
origin, so the finding lands on the annotation, config entry or constraint that actually states A
rather than on one that only led there.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from functools import cached_property

from linter.dependencies import (
    FD,
    Attributes,
    ChaseResult,
    Decomposition,
    KeySearch,
    NormalFormReport,
    Piece,
    bcnf_decompose,
    candidate_keys,
    chase_is_lossless,
    closure,
    derive,
    minimal_cover,
    normal_form,
    preserves_dependencies,
    project,
    synthesize_3nf,
)
from linter.given_dependencies import GivenDependency, table_dependencies
from linter.model import Table

FORM_RANK: dict[str, int] = {"1NF": 1, "2NF": 2, "3NF": 3, "BCNF": 4}
TARGET_FORM: dict[str, str] = {"2nf": "2NF", "3nf": "3NF", "bcnf": "BCNF"}
KIND_FORM: dict[str, str] = {"partial": "2NF", "transitive": "3NF", "bcnf": "BCNF"}


@dataclass
class TableAnalysis:
    """One table's dependency picture; the decompositions are computed on first use and kept."""

    table: Table
    attributes: Attributes
    given: list[GivenDependency]
    cover: list[FD]
    keys: KeySearch
    report: NormalFormReport
    target: str  # "bcnf", "3nf" or "2nf"
    _splits: dict[int, Decomposition] = field(default_factory=dict, repr=False)
    _chases: dict[tuple[int, ...], ChaseResult] = field(default_factory=dict, repr=False)

    @cached_property
    def bcnf(self) -> Decomposition:
        """A lossless BCNF decomposition, and the cover dependencies it cannot keep in one piece."""
        return bcnf_decompose(self.attributes.full, self.cover)

    @cached_property
    def synthesis(self) -> Decomposition:
        """A lossless, dependency-preserving 3NF decomposition."""
        return synthesize_3nf(self.attributes.full, self.cover)

    def demands(self, kind: str) -> bool:
        """Whether the table's target form rules out a violation of ``kind`` (partial ...)."""
        return FORM_RANK[KIND_FORM[kind]] <= FORM_RANK[TARGET_FORM[self.target]]

    def derivation(self, fd: FD) -> list[GivenDependency]:
        """The given dependencies the closure applied to derive ``fd``, in order."""
        fds = [g.fd for g in self.given]
        return [self.given[fds.index(step)] for step in derive(fds, fd) or ()]

    def origin(self, fd: FD) -> GivenDependency | None:
        """The given dependency that first put an attribute of ``fd.rhs`` into the closure of its lhs."""
        reached = fd.lhs
        for step in self.derivation(fd):
            if step.fd.rhs & fd.rhs & ~reached:
                return step
            reached |= step.fd.rhs
        return None

    def split_on(self, lhs: int) -> Decomposition:
        """The split on X -> X+: R - (X+ - X) first, then X+, with their keys and lost dependencies."""
        if lhs not in self._splits:
            r = self.attributes.full
            determined = closure(lhs, self.cover) & r
            pieces = tuple(self._piece(attrs) for attrs in (lhs | (r & ~determined), determined))
            lost = preserves_dependencies(self.cover, [piece.attrs for piece in pieces])
            self._splits[lhs] = Decomposition(pieces, lost)
        return self._splits[lhs]

    def chase(self, decomposition: Decomposition) -> ChaseResult:
        """Whether ``decomposition``'s pieces join back into the table's rows, chased once per piece set."""
        pieces = tuple(piece.attrs for piece in decomposition.pieces)
        if pieces not in self._chases:
            self._chases[pieces] = chase_is_lossless(self.attributes.full, self.cover, pieces)
        return self._chases[pieces]

    def _piece(self, attrs: int) -> Piece:
        """A piece over ``attrs`` with the projected cover and its candidate keys."""
        fds = project(self.cover, attrs).fds
        return Piece(attrs, candidate_keys(attrs, fds).keys, fds)

    def format_keys(self, keys: tuple[int, ...]) -> str:
        """Keys written ``c, (a, b)``: a one-column key bare, a wider one in parentheses."""
        return ", ".join(self.format_key(key) for key in keys)

    def format_key(self, key: int) -> str:
        """One key: ``c`` or ``(a, b)``."""
        text = self.attributes.format(key)
        return text if key.bit_count() == 1 else f"({text})"

    def piece_names(self, decomposition: Decomposition) -> list[str]:
        """Readable names: the piece holding a key of the table keeps its name, others ``<table>_by_<key>``."""
        names: list[str] = []
        holds_key = [any(not k & ~p.attrs for k in self.keys.keys) for p in decomposition.pieces]
        keeper = holds_key.index(True) if True in holds_key else None
        for i, piece in enumerate(decomposition.pieces):
            base = self.table.name
            if i != keeper:
                base += "_by_" + "_".join(self.attributes.to_names(piece.keys[0]))
            name, n = base, 2
            while name in names:
                name, n = f"{base}_{n}", n + 1
            names.append(name)
        return names

    def describe_decomposition(self, decomposition: Decomposition) -> list[str]:
        """One line per piece: its name, columns and keys."""
        lines = []
        for name, piece in zip(self.piece_names(decomposition), decomposition.pieces):
            label = "key" if len(piece.keys) == 1 else "keys"
            columns = self.attributes.format(piece.keys[0]) + "".join(
                f", {name}" for name in self.attributes.to_names(piece.attrs & ~piece.keys[0]))
            lines.append(f"{name} ({columns}), {label} {self.format_keys(piece.keys)}")
        return lines


def analyse(table: Table, target: str) -> TableAnalysis:
    """The analysis of ``table`` against the ``target`` form (``bcnf``, ``3nf`` or ``2nf``)."""
    attributes, given = table_dependencies(table)
    cover = minimal_cover([g.fd for g in given])
    keys = candidate_keys(attributes.full, cover)
    report = normal_form(attributes.full, cover, keys=keys)
    return TableAnalysis(table, attributes, given, cover, keys, report, target)
