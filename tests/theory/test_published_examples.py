"""Worked examples from textbooks and papers, renamed into normguard's own scenarios.

Only the dependency structure and the published verdicts (keys, normal form, lossless or not,
the decomposition) are taken; attribute names are ours. Each test names its source, with "from
memory" where the text could not be checked, and "checked" where a secondary source quoting the
example was read.
"""
from __future__ import annotations

from linter.dependencies import (
    FD,
    Attributes,
    bcnf_decompose,
    candidate_keys,
    canonical_cover,
    chase_is_lossless,
    closure,
    normal_form,
    project,
    synthesize_3nf,
)

from .oracle import chase_lossless, oracle_form, oracle_keys


def _fds(attrs: Attributes, *rules: str) -> list[FD]:
    """Dependencies written "a b -> c d"."""
    result = []
    for rule in rules:
        lhs, rhs = rule.split("->")
        result.append(FD(attrs.bits(lhs.split()), attrs.bits(rhs.split())))
    return result


def _sets(attrs: Attributes, *groups: str) -> set[int]:
    """Attribute sets written "a b c"."""
    return {attrs.bits(group.split()) for group in groups}


def test_courier_assignments_not_in_2nf() -> None:
    # Elmasri & Navathe, Fundamentals of Database Systems, 7th ed. (2016), section 14.3.2, the
    # EMP_PROJ relation and its 2NF normalization into three relations (from memory).
    attrs = Attributes(["courier", "route", "hours", "courier_name", "route_name", "route_depot"])
    fds = _fds(
        attrs, "courier route -> hours", "courier -> courier_name", "route -> route_name route_depot"
    )
    report = normal_form(attrs.full, fds)
    assert report.keys.keys == (attrs.bits(["courier", "route"]),)
    assert report.form == "1NF" == oracle_form(attrs.full, fds)
    assert {v.kind for v in report.violations} == {"partial"}
    pieces = {piece.attrs for piece in synthesize_3nf(attrs.full, fds).pieces}
    assert pieces == _sets(
        attrs, "courier route hours", "courier courier_name", "route route_name route_depot"
    )


def test_seed_packets_in_2nf_not_3nf() -> None:
    # Elmasri & Navathe (2016), section 14.3.3, the EMP_DEPT relation: transitive dependency
    # through the department number; 3NF split into two relations (from memory).
    attrs = Attributes(
        ["packet", "seed_name", "harvested", "shelf", "vault", "vault_name", "vault_keeper"]
    )
    fds = _fds(attrs, "packet -> seed_name harvested shelf vault", "vault -> vault_name vault_keeper")
    report = normal_form(attrs.full, fds)
    assert report.keys.keys == (attrs.bits(["packet"]),)
    assert report.form == "2NF" == oracle_form(attrs.full, fds)
    assert {v.kind for v in report.violations} == {"transitive"}
    for result in (synthesize_3nf(attrs.full, fds), bcnf_decompose(attrs.full, fds)):
        assert {piece.attrs for piece in result.pieces} == _sets(
            attrs, "packet seed_name harvested shelf vault", "vault vault_name vault_keeper"
        )
        assert result.lost == ()


def test_field_plots_through_the_normal_forms() -> None:
    # Elmasri & Navathe (2016), sections 14.4 and 14.5, the LOTS relation: two keys, a partial
    # dependency (county -> tax rate) and a transitive one (area -> price); with area -> county
    # added, the part (property, county, lot, area) is in 3NF but not BCNF. The four dependencies
    # and keys checked against a secondary source quoting the example; area -> county from memory.
    attrs = Attributes(["plot", "district", "plot_no", "area", "rent", "levy_rate"])
    fds = _fds(
        attrs,
        "plot -> district plot_no area rent levy_rate",
        "district plot_no -> plot area rent levy_rate",
        "district -> levy_rate",
        "area -> rent",
    )
    report = normal_form(attrs.full, fds)
    assert set(report.keys.keys) == _sets(attrs, "plot", "district plot_no")
    assert report.form == "1NF"
    kinds = {attrs.format_fd(v.fd): v.kind for v in report.violations}
    assert kinds == {"district -> levy_rate": "partial", "area -> rent": "transitive"}
    part = attrs.bits(["plot", "district", "plot_no", "area"])
    with_area = fds + _fds(attrs, "area -> district")
    part_report = normal_form(part, project(with_area, part).fds)
    assert part_report.form == "3NF" == oracle_form(part, with_area)
    assert set(part_report.keys.keys) == _sets(attrs, "plot", "district plot_no", "plot_no area")


def test_rider_training_decompositions() -> None:
    # Elmasri & Navathe (2016), section 14.5, the TEACH relation: 3NF, not BCNF; of its three
    # two-piece decompositions only the one joined on the instructor is nonadditive (checked
    # against a secondary source quoting the example).
    attrs = Attributes(["rider", "skill", "trainer"])
    fds = _fds(attrs, "rider skill -> trainer", "trainer -> skill")
    assert normal_form(attrs.full, fds).form == "3NF"
    verdicts = {
        ("rider trainer", "rider skill"): False,
        ("skill trainer", "skill rider"): False,
        ("trainer skill", "trainer rider"): True,
    }
    for (first, second), lossless in verdicts.items():
        pieces = [attrs.bits(first.split()), attrs.bits(second.split())]
        result = chase_is_lossless(attrs.full, fds, pieces)
        assert result.lossless == lossless == chase_lossless(attrs.full, fds, pieces)
    bcnf = bcnf_decompose(attrs.full, fds)
    assert {piece.attrs for piece in bcnf.pieces} == _sets(attrs, "trainer skill", "trainer rider")
    assert [attrs.format_fd(fd) for fd in bcnf.lost] == ["rider, skill -> trainer"]


def test_ferry_booking_closure_and_key() -> None:
    # Silberschatz, Korth & Sudarshan, Database System Concepts, 6th ed. (2010), section 8.4.1:
    # the closure of AG is all of R(A, B, C, G, H, I), so AG is a candidate key (checked against
    # course notes following the book).
    attrs = Attributes(["booking", "fare_band", "vessel", "sailing_day", "dock", "captain"])
    fds = _fds(
        attrs,
        "booking -> fare_band",
        "booking -> vessel",
        "vessel sailing_day -> dock",
        "vessel sailing_day -> captain",
        "fare_band -> dock",
    )
    assert closure(attrs.bits(["booking", "sailing_day"]), fds) == attrs.full
    keys = candidate_keys(attrs.full, fds).keys
    assert keys == (attrs.bits(["booking", "sailing_day"]),)
    assert set(keys) == oracle_keys(attrs.full, fds)


def test_canonical_cover_of_three_attributes() -> None:
    # Silberschatz, Korth & Sudarshan (2010), section 8.4.3: A -> BC, B -> C, A -> B, AB -> C
    # has the canonical cover A -> B, B -> C (from memory).
    attrs = Attributes(["crate", "pallet", "bay"])
    fds = _fds(attrs, "crate -> pallet bay", "pallet -> bay", "crate -> pallet", "crate pallet -> bay")
    cover = [attrs.format_fd(fd) for fd in canonical_cover(fds)]
    assert cover == ["crate -> pallet", "pallet -> bay"]


def test_seed_deposit_synthesis() -> None:
    # Silberschatz, Korth & Sudarshan (2010), section 8.5.2, the cust_banker_branch relation:
    # synthesis gives three relations, one contained in another, so two remain (from memory).
    attrs = Attributes(["grower", "curator", "vault", "agreement"])
    fds = _fds(
        attrs,
        "grower curator -> vault agreement",
        "curator -> vault",
        "grower vault -> curator",
    )
    cover = [attrs.format_fd(fd) for fd in canonical_cover(fds)]
    assert cover == ["curator -> vault", "grower, curator -> agreement", "grower, vault -> curator"]
    result = synthesize_3nf(attrs.full, fds)
    assert {piece.attrs for piece in result.pieces} == _sets(
        attrs, "grower curator agreement", "grower vault curator"
    )
    assert set(candidate_keys(attrs.full, fds).keys) == _sets(attrs, "grower curator", "grower vault")


def test_ferry_terminals_in_3nf_not_bcnf() -> None:
    # Ullman & Widom, A First Course in Database Systems, 3rd ed. (2008), section 3.5.1: a
    # relation of title, theater and city where theater -> city and title city -> theater; keys,
    # 3NF but not BCNF, and the BCNF split loses a dependency (from memory). The same shape as
    # the street/city/zip relation of Ullman's 1988 Principles (from memory).
    attrs = Attributes(["route", "terminal", "port"])
    fds = _fds(attrs, "terminal -> port", "route port -> terminal")
    report = normal_form(attrs.full, fds)
    assert set(report.keys.keys) == _sets(attrs, "route port", "route terminal")
    assert report.form == "3NF"
    assert [(attrs.format_fd(v.fd), v.kind) for v in report.violations] == [
        ("terminal -> port", "bcnf")
    ]
    result = bcnf_decompose(attrs.full, fds)
    assert {piece.attrs for piece in result.pieces} == _sets(attrs, "terminal port", "route terminal")
    assert [attrs.format_fd(fd) for fd in result.lost] == ["route, port -> terminal"]


def test_chase_on_four_attributes() -> None:
    # Garcia-Molina, Ullman & Widom, Database Systems: The Complete Book, 2nd ed. (2008),
    # section 3.4.2: R(A, B, C, D) with A -> B, B -> C, CD -> A split into AD, AC, BCD is
    # lossless (checked against lecture notes following the book). Section 3.4.3: with B -> AD
    # only, the split AB, BC, CD is not, and the chased rows are a counterexample (from memory).
    attrs = Attributes(["van", "shift", "zone", "day"])
    fds = _fds(attrs, "van -> shift", "shift -> zone", "zone day -> van")
    pieces = [attrs.bits(p.split()) for p in ("van day", "van zone", "shift zone day")]
    assert chase_is_lossless(attrs.full, fds, pieces).lossless
    fds = _fds(attrs, "shift -> van day")
    pieces = [attrs.bits(p.split()) for p in ("van shift", "shift zone", "zone day")]
    result = chase_is_lossless(attrs.full, fds, pieces)
    assert not result.lossless and not chase_lossless(attrs.full, fds, pieces)
    assert result.spurious == ("a1", "a2", "a3", "a4")


def test_chase_on_five_attributes() -> None:
    # Ullman, Principles of Database and Knowledge-Base Systems, vol. I (1988), the tableau
    # example: R(A, B, C, D, E), pieces AD, AB, BE, CDE, AE, with A -> C, B -> C, C -> D,
    # DE -> C, CE -> A, is lossless (from memory).
    attrs = Attributes(["sailing", "berth", "cargo", "deck", "escort"])
    fds = _fds(
        attrs,
        "sailing -> cargo",
        "berth -> cargo",
        "cargo -> deck",
        "deck escort -> cargo",
        "cargo escort -> sailing",
    )
    names = ("sailing deck", "sailing berth", "berth escort", "cargo deck escort", "sailing escort")
    pieces = [attrs.bits(p.split()) for p in names]
    result = chase_is_lossless(attrs.full, fds, pieces)
    assert result.lossless and result.method == "chase"
    assert chase_lossless(attrs.full, fds, pieces)
