"""The verdicts on each split checked outside the project: published worked examples and brute force.

Each fixture's dependency structure is written out by hand below (columns, F, and which original
columns each piece holds), independently of the reader and the theory. The tests check that the
reader and ``split_analysis`` see that structure, that their verdicts agree with the brute-force
oracle in ``split_oracle`` (complete for these sizes, see there), and, where a published worked
example has the same shape, with its published verdict. Sources, all from memory (the shapes and
verdicts only, renamed into our scenarios):

- Heath's theorem (I. J. Heath, 1971, "Unacceptable file operations in a relational data base"):
  a binary split whose common columns determine one side is lossless.
- For functional dependencies the converse holds too: a binary split is lossless only if the
  common columns determine one side (e.g. J. D. Ullman, "Principles of Database and
  Knowledge-Base Systems", vol. 1, ch. 7).
- The street/city/zip relation (street, city -> zip; zip -> city) as in J. D. Ullman and
  J. Widom, "A First Course in Database Systems": 3NF, not BCNF; its BCNF decomposition
  (zip, city), (zip, street) is lossless but loses street, city -> zip.
- The tableau chase (A. V. Aho, C. Beeri and J. D. Ullman, 1979, "The theory of joins in relational
  databases"), with worked examples from H. Garcia-Molina, J. D. Ullman and J. Widom, "Database
  Systems: The Complete Book" (R(A, B, C, D), A -> B, B -> C, CD -> A: {AD, AC, BCD} lossless;
  B -> AD: {AB, BC, CD} lossy) and Ullman's "Principles" (R(A, B, C, D, E), A -> C, B -> C, C -> D,
  DE -> C, CE -> A: {AD, AB, BE, CDE, AE} lossless).
"""
from __future__ import annotations

import re
from dataclasses import dataclass
from itertools import combinations

import pytest

from linter.dependencies import normal_form
from linter.model import Dependency, Span, Split, SplitPiece
from linter.reader import read_catalog
from linter.split_analysis import SplitAnalysis, split_analysis

from ..locations import ROOT
from .split_oracle import (
    closure,
    join_of_projections,
    lossy_counterexample,
    satisfies,
    unpreserved,
)
from .split_support import FIXTURES, dialect_of


@dataclass(frozen=True)
class Shape:
    """A split written out by hand: columns, F (single right sides, a minimal cover), pieces."""

    columns: tuple[str, ...]
    deps: tuple[tuple[tuple[str, ...], tuple[str, ...]], ...]
    pieces: dict[str, tuple[str, ...]]  # piece -> the original columns it holds

    def index(self, names: tuple[str, ...]) -> tuple[int, ...]:
        return tuple(self.columns.index(name) for name in names)

    @property
    def oracle_deps(self) -> list[tuple[tuple[int, ...], tuple[int, ...]]]:
        return [(self.index(lhs), self.index(rhs)) for lhs, rhs in self.deps]

    @property
    def oracle_pieces(self) -> list[tuple[int, ...]]:
        return [self.index(columns) for columns in self.pieces.values()]


SHAPES: dict[str, Shape] = {
    "postgres_lossless_riders": Shape(
        ("delivery_id", "rider_id", "rider_name", "rider_phone", "parcel_grams"),
        ((("delivery_id",), ("rider_id",)), (("delivery_id",), ("parcel_grams",)),
         (("rider_id",), ("rider_name",)), (("rider_id",), ("rider_phone",))),
        {"riders": ("rider_id", "rider_name", "rider_phone"),
         "deliveries": ("delivery_id", "rider_id", "parcel_grams")}),
    "mysql_lossy_seed_lots": Shape(
        ("lot_id", "species", "collector", "vault"),
        ((("lot_id",), ("species",)), (("lot_id",), ("collector",)), (("lot_id",), ("vault",))),
        {"lot_species": ("lot_id", "species", "vault"), "species_collectors": ("species", "collector")}),
    "sqlite_lost_dependency_berths": Shape(
        ("port", "pier", "terminal"),
        ((("port", "pier"), ("terminal",)), (("terminal",), ("port",))),
        {"terminals": ("terminal", "port"), "terminal_piers": ("terminal", "pier")}),
    "postgres_chase_three_way_trials": Shape(
        ("seed_lot", "trial_season", "species", "protocol"),
        ((("seed_lot",), ("species",)), (("trial_season", "species"), ("protocol",))),
        {"lot_protocols": ("seed_lot", "species", "protocol"), "lot_seasons": ("seed_lot", "trial_season"),
         "season_protocols": ("trial_season", "species", "protocol")}),
    "sqlite_renamed_vessels": Shape(
        ("sailing_id", "vessel_code", "vessel_name", "departs_at"),
        ((("sailing_id",), ("vessel_code",)), (("sailing_id",), ("departs_at",)),
         (("vessel_code",), ("vessel_name",))),
        {"vessels": ("vessel_code", "vessel_name"), "departures": ("sailing_id", "vessel_code", "departs_at")}),
    "mysql_declared_vault_drawers": Shape(
        ("drawer_code", "vault", "vault_city", "shelf"),
        ((("drawer_code",), ("vault",)), (("drawer_code",), ("shelf",)), (("vault",), ("vault_city",))),
        {"drawers": ("drawer_code", "vault_city", "shelf"), "vaults": ("vault", "vault_city")}),
    "postgres_two_files_depots": Shape(
        ("courier_id", "name", "depot_code", "depot_city"),
        ((("courier_id",), ("name",)), (("courier_id",), ("depot_code",)), (("depot_code",), ("depot_city",))),
        {"depots": ("depot_code", "depot_city"), "courier_cities": ("courier_id", "name", "depot_city")}),
    "sqlite_untraced_senders": Shape(
        ("parcel_id", "sender_email", "sender_name", "weight_grams"),
        ((("parcel_id",), ("sender_email",)), (("parcel_id",), ("weight_grams",)),
         (("sender_email",), ("sender_name",))),
        {"senders": ("sender_name",), "parcel_weights": ("parcel_id", "sender_email", "weight_grams")}),
}


def _fixture_analysis(case: str, monkeypatch: pytest.MonkeyPatch) -> SplitAnalysis:
    """The analysis of the one split a fixture folder records."""
    monkeypatch.chdir(ROOT)
    [split] = read_catalog([f"{FIXTURES}/{case}"], dialect=dialect_of(case)).splits
    return split_analysis(split)


def _names(analysis: SplitAnalysis, fds) -> set[str]:
    return {analysis.attrs.format_fd(fd) for fd in fds}


def _shape_names(shape: Shape, deps) -> set[str]:
    return {f"{', '.join(shape.columns[a] for a in lhs)} -> {', '.join(shape.columns[a] for a in rhs)}"
            for lhs, rhs in deps}


@pytest.mark.parametrize("case", sorted(SHAPES))
def test_reader_and_analysis_see_the_hand_written_structure(case: str, monkeypatch: pytest.MonkeyPatch) -> None:
    shape, analysis = SHAPES[case], _fixture_analysis(case, monkeypatch)
    assert analysis.attrs.names == shape.columns
    held = {analysis.split.pieces[i].table: analysis.attrs.to_names(analysis.pieces[i]) for i in analysis.carrying}
    assert held == {piece: tuple(c for c in shape.columns if c in cols) for piece, cols in shape.pieces.items()}
    assert _names(analysis, analysis.cover) == _shape_names(shape, shape.oracle_deps)


@pytest.mark.parametrize("case", sorted(SHAPES))
def test_verdicts_agree_with_brute_force(case: str, monkeypatch: pytest.MonkeyPatch) -> None:
    shape, analysis = SHAPES[case], _fixture_analysis(case, monkeypatch)
    counterexample = lossy_counterexample(len(shape.columns), shape.oracle_deps, shape.oracle_pieces)
    assert analysis.chase.lossless == (counterexample is None)
    assert _names(analysis, analysis.lost) == _shape_names(shape, unpreserved(shape.oracle_deps, shape.oracle_pieces))


LOSSY = ["mysql_declared_vault_drawers", "mysql_lossy_seed_lots", "postgres_two_files_depots",
         "sqlite_untraced_senders"]


@pytest.mark.parametrize("case", LOSSY)
def test_chase_example_is_a_real_counterexample(case: str, monkeypatch: pytest.MonkeyPatch) -> None:
    """The rows the finding shows satisfy F, and the join of their projections holds the spurious row."""
    shape, analysis = SHAPES[case], _fixture_analysis(case, monkeypatch)
    assert not analysis.chase.lossless and analysis.chase.spurious is not None
    symbols: dict[str, int] = {}
    rows = frozenset(tuple(symbols.setdefault(s, len(symbols)) for s in row) for row in analysis.chase.rows)
    spurious = tuple(symbols.setdefault(s, len(symbols)) for s in analysis.chase.spurious)
    assert satisfies(rows, shape.oracle_deps)
    assert spurious not in rows
    assert spurious in join_of_projections(rows, shape.oracle_pieces)


@pytest.mark.parametrize("case", LOSSY)
def test_suggested_fix_makes_the_split_lossless(case: str, check) -> None:
    """Carrying the key the finding names into the pieces it names gives a lossless split (brute force)."""
    shape = SHAPES[case]
    [lossy] = [f for f in check(case).findings if f.rule == "lossy-split"]
    said = re.fullmatch(r"fix: carry a key of \w+ \((.+)\) into (.+), or make the common columns a key of one side",
                        lossy.explanation[-1])
    assert said is not None
    key = set(shape.index(tuple(said[1].split(", "))))
    lacking = said[2].replace(" and ", ", ").split(", ")
    fixed = [tuple(sorted(set(shape.index(cols)) | (key if piece in lacking else set())))
             for piece, cols in shape.pieces.items()]
    assert lossy_counterexample(len(shape.columns), shape.oracle_deps, fixed) is None


def test_three_way_split_no_pair_shares_a_key_yet_all_three_join_back(monkeypatch: pytest.MonkeyPatch) -> None:
    """Constructed for this fixture; the oracle proves it, pair by pair and as a whole."""
    shape = SHAPES["postgres_chase_three_way_trials"]
    analysis = _fixture_analysis("postgres_chase_three_way_trials", monkeypatch)
    for first, second in combinations(shape.oracle_pieces, 2):
        reach = closure(frozenset(first) & frozenset(second), shape.oracle_deps)
        assert not set(first) <= reach and not set(second) <= reach
    assert lossy_counterexample(len(shape.columns), shape.oracle_deps, shape.oracle_pieces) is None
    assert (analysis.chase.method, analysis.chase.lossless) == ("chase", True)


def test_berths_is_the_street_city_zip_shape(monkeypatch: pytest.MonkeyPatch) -> None:
    """3NF, not BCNF; the BCNF split on terminal -> port is lossless and loses port, pier -> terminal."""
    analysis = _fixture_analysis("sqlite_lost_dependency_berths", monkeypatch)
    assert normal_form(analysis.relation, list(analysis.cover)).form == "3NF"
    assert analysis.chase.lossless
    assert _names(analysis, analysis.lost) == {"port, pier -> terminal"}


def test_binary_verdicts_follow_heaths_theorem_and_its_converse(monkeypatch: pytest.MonkeyPatch) -> None:
    for case, lossless in [("postgres_lossless_riders", True), ("sqlite_renamed_vessels", True),
                           ("mysql_lossy_seed_lots", False), ("postgres_two_files_depots", False)]:
        shape = SHAPES[case]
        first, second = shape.oracle_pieces
        reach = closure(frozenset(first) & frozenset(second), shape.oracle_deps)
        assert (set(first) <= reach or set(second) <= reach) == lossless
        assert _fixture_analysis(case, monkeypatch).chase.lossless == lossless


def _split(original: str, columns: tuple[str, ...], deps, pieces: dict[str, tuple[str, ...]]) -> Split:
    """A hand-built split: F given as declared dependencies, no key, pieces copying columns unchanged."""
    at = Span("db/009_split.sql", 4, 1, 4, 30)
    declared = tuple(Dependency(lhs, rhs, at, "annotation") for lhs, rhs in deps)
    parts = tuple(SplitPiece(name, cols, {c: c for c in cols}, at) for name, cols in pieces.items())
    return Split(original, columns, (), declared, parts, at, "data")


STEWARDS = ("steward", "cabin", "deck", "shift")


@pytest.mark.parametrize(("deps", "pieces", "lossless"), [
    # Garcia-Molina, Ullman & Widom: A -> B, B -> C, CD -> A with {AD, AC, BCD}: lossless.
    ([(("steward",), ("cabin",)), (("cabin",), ("deck",)), (("deck", "shift"), ("steward",))],
     {"rosters": ("steward", "shift"), "steward_decks": ("steward", "deck"), "cabin_shifts": ("cabin", "deck", "shift")},
     True),
    # Garcia-Molina, Ullman & Widom: B -> AD with {AB, BC, CD}: lossy.
    ([(("cabin",), ("steward", "shift"))],
     {"cabin_stewards": ("steward", "cabin"), "cabin_decks": ("cabin", "deck"), "deck_shifts": ("deck", "shift")},
     False),
])
def test_published_chase_examples(deps, pieces, lossless: bool) -> None:
    analysis = split_analysis(_split("cabin_duties", STEWARDS, deps, pieces))
    assert analysis.chase.lossless == lossless
    shape = Shape(STEWARDS, tuple(deps), pieces)
    assert (lossy_counterexample(4, shape.oracle_deps, shape.oracle_pieces) is None) == lossless


def test_published_five_way_chase_example() -> None:
    """Ullman's five-piece example: lossless. Too large for the oracle (Bell(5)**5 instances)."""
    columns = ("tray", "batch", "chamber", "humidity", "week")
    deps = [(("tray",), ("chamber",)), (("batch",), ("chamber",)), (("chamber",), ("humidity",)),
            (("humidity", "week"), ("chamber",)), (("chamber", "week"), ("tray",))]
    pieces = {"tray_humidity": ("tray", "humidity"), "tray_batches": ("tray", "batch"),
              "batch_weeks": ("batch", "week"), "chamber_weeks": ("chamber", "humidity", "week"),
              "tray_weeks": ("tray", "week")}
    analysis = split_analysis(_split("germination_trays", columns, deps, pieces))
    assert (analysis.chase.method, analysis.chase.lossless) == ("chase", True)
