"""Split analysis and the two rules on hand-built ``Split`` objects, without the reader."""
from __future__ import annotations

import pytest

from linter.dependencies import Projection
from linter.explain_split import split_lines
from linter.model import Catalog, Dependency, Span, Split, SplitPiece
from linter.rule import Context
from linter.split_analysis import split_analysis
from rules import get_rule

from .split_oracle import lossy_counterexample

AT = Span("db/005_split.sql", 7, 1, 7, 20)


def _piece(table: str, lineage: dict[str, str | None]) -> SplitPiece:
    return SplitPiece(table, tuple(lineage), lineage, AT)


def _same(table: str, *columns: str) -> SplitPiece:
    return _piece(table, {c: c for c in columns})


def _split(original: str, columns: tuple[str, ...], keys, deps, *pieces: SplitPiece, how: str = "data") -> Split:
    declared = tuple(Dependency(lhs, rhs, AT, "annotation") for lhs, rhs in deps)
    return Split(original, columns, tuple(keys), declared, pieces, AT, how)


def _run(split: Split) -> list[tuple[str, str]]:
    context = Context(Catalog(splits=[split]), {})
    return [(f.rule, f.message) for rule in ("lossy-split", "unenforceable-dependency")
            for f in get_rule(rule).check(context)]


COURIERS = ("courier_id", "depot", "city", "name")


def test_renamed_columns_count_under_their_original_names() -> None:
    split = _split("couriers", COURIERS, [("courier_id",)], [(("depot",), ("city",))],
                   _piece("depots", {"code": "depot", "town": "city"}),
                   _piece("staff", {"courier_id": "courier_id", "depot_code": "depot", "full_name": "name"}))
    analysis = split_analysis(split)
    assert [analysis.attrs.to_names(bits) for bits in analysis.pieces] == [("depot", "city"), ("courier_id", "depot", "name")]
    assert analysis.untraced == () and analysis.chase.lossless and analysis.lost == ()
    assert _run(split) == []


def test_each_kind_of_untraced_column_says_why() -> None:
    data = _split("couriers", COURIERS, [("courier_id",)], [],
                  _piece("staff", {"courier_id": "courier_id", "badge": None, "name": "name"}),
                  SplitPiece("homes", ("courier_id", "city", "row_id"), {"courier_id": "courier_id", "city": "gone"}, AT))
    reasons = {(u.piece, u.column): u.reason for u in split_analysis(data).untraced}
    assert reasons == {
        ("staff", "badge"): "comes from an expression normguard cannot trace to one column of couriers",
        ("homes", "city"): "comes from gone, which is not a column of couriers at the split",
        ("homes", "row_id"): "is not filled from couriers",
    }
    declared = _split("couriers", COURIERS, [("courier_id",)], [],
                      SplitPiece("staff", ("courier_id", "nickname"), {"courier_id": "courier_id"}, AT),
                      how="declared")
    [untraced] = split_analysis(declared).untraced
    assert untraced.reason == "has no column of the same name in couriers"


def test_columns_no_piece_carries_leave_the_check_through_the_projection() -> None:
    """depot is dropped: courier_id -> city still holds (through depot), so joining on courier_id is lossless."""
    split = _split("couriers", COURIERS, [("courier_id",)], [(("depot",), ("city",))],
                   _same("courier_cities", "courier_id", "city"), _same("courier_names", "courier_id", "name"))
    analysis = split_analysis(split)
    assert analysis.attrs.format(analysis.dropped) == "depot"
    assert {analysis.attrs.format_fd(fd) for fd in analysis.fds} == {"courier_id -> city", "courier_id -> name"}
    assert analysis.chase.lossless and analysis.lost == ()
    assert _run(split) == []
    assert "  no piece carries depot: the check covers the other columns of couriers" in split_lines(split)


def test_nothing_traced_gives_no_verdict_and_says_so() -> None:
    split = _split("couriers", COURIERS, [("courier_id",)], [],
                   _piece("badges", {"badge": None}), _piece("tags", {"tag": None}))
    assert _run(split) == []
    assert split_lines(split) == [
        "split of couriers into badges and tags (data moved, db/005_split.sql:7:1)",
        "  badges: badge",
        "  tags: tag",
        "  dependencies of couriers then: courier_id -> depot, city, name (key)",
        "  badges.badge comes from an expression normguard cannot trace to one column of couriers;"
        " it is not counted as carrying any column",
        "  tags.tag comes from an expression normguard cannot trace to one column of couriers;"
        " it is not counted as carrying any column",
        "  no piece carries courier_id, depot, city, name: the check covers the other columns of couriers",
        "  no verdict: no piece column could be traced to a column of couriers",
    ]


def test_projection_cut_short_gives_no_verdict(monkeypatch: pytest.MonkeyPatch) -> None:
    """When F can only be projected in part the verdicts would be guesses: neither rule reports."""
    monkeypatch.setattr("linter.split_analysis.project", lambda fds, s: Projection((), False))
    split = _split("parcel_routes", ("parcel", "hub", "van", "driver"), [("parcel",)], [(("van",), ("driver",))],
                   _same("parcel_hubs", "parcel", "hub"), _same("hub_drivers", "hub", "driver"))
    assert _run(split) == []
    assert split_lines(split)[-1] == (
        "  no verdict: the dependencies of the carried columns could only be projected in part")


def test_equal_splits_share_one_analysis() -> None:
    def make() -> Split:
        return _split("couriers", COURIERS, [("courier_id",)], [], _same("a", "courier_id", "depot"),
                      _same("b", "courier_id", "city", "name"))
    assert split_analysis(make()) is split_analysis(make())


def test_three_way_lossy_split_speaks_of_each_pair() -> None:
    """Garcia-Molina, Ullman & Widom's lossy chase example (B -> AD, pieces AB, BC, CD; from memory)."""
    split = _split("cabin_duties", ("steward", "cabin", "deck", "shift"), [], [(("cabin",), ("steward", "shift"))],
                   _same("cabin_stewards", "steward", "cabin"), _same("cabin_decks", "cabin", "deck"),
                   _same("deck_shifts", "deck", "shift"))
    context = Context(Catalog(splits=[split]), {})
    [lossy] = get_rule("lossy-split").check(context)
    assert lossy.message == (
        "split of cabin_duties into cabin_stewards, cabin_decks and deck_shifts is lossy: joining them back on"
        " their common columns cabin, deck gives rows cabin_duties never held")
    assert lossy.explanation[:3] == [
        "cabin is a key of cabin_stewards",
        "cabin_stewards and deck_shifts share no column",
        "deck would need to be a key of cabin_decks (it does not determine cabin) or of deck_shifts"
        " (it does not determine shift)",
    ]
    assert lossy.explanation[-1] == (
        "fix: carry a key of cabin_duties (cabin, deck) into cabin_stewards and deck_shifts,"
        " or make the common columns a key of one side")
    # The fix checked by brute force: (steward, cabin, deck), (cabin, deck), (cabin, deck, shift).
    assert lossy_counterexample(4, [((1,), (0, 3))], [(0, 1, 2), (1, 2), (1, 2, 3)]) is None


def test_lost_dependencies_with_one_left_side_are_one_finding() -> None:
    split = _split("seed_lots", ("lot_id", "species", "collector", "vault"), [("lot_id",)], [],
                   _same("lot_species", "lot_id", "species"),
                   _same("species_stores", "species", "collector", "vault"))
    lost = [m for rule, m in _run(split) if rule == "unenforceable-dependency"]
    assert lost == ["after the split of seed_lots, no single table holds lot_id -> collector, vault: its columns"
                    " went to lot_species and species_stores, so checking it needs a join on every write"]


def test_lossless_preserving_split_is_explained_not_reported() -> None:
    split = _split("couriers", COURIERS, [("courier_id",)], [(("depot",), ("city",))],
                   _same("depots", "depot", "city"), _same("couriers", "courier_id", "depot", "name"))
    assert _run(split) == []
    assert split_lines(split)[-5:] == [
        "  lossless: the common column depot is a key of depots (depot -> city)",
        "  every dependency is preserved:",
        "    courier_id -> depot: held by couriers",
        "    courier_id -> name: held by couriers",
        "    depot -> city: held by depots",
    ]


def test_dependency_preserved_only_through_the_pieces_together() -> None:
    """a -> b, b -> c, c -> a over (a, b, c) split into (a, b), (b, c): c -> a sits in no piece, yet follows."""
    split = _split("ring", ("a", "b", "c"), [], [(("a",), ("b",)), (("b",), ("c",)), (("c",), ("a",))],
                   _same("ab", "a", "b"), _same("bc", "b", "c"))
    analysis = split_analysis(split)
    assert analysis.lost == ()
    assert lossy_counterexample(3, [((0,), (1,)), ((1,), (2,)), ((2,), (0,))], [(0, 1), (1, 2)]) is None
    lines = split_lines(split)
    assert any(line.endswith(": follows from the dependencies the pieces enforce on their own") for line in lines)
