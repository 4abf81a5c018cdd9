"""``normguard explain`` on the courier example.

The expected keys, forms and splits were worked out by hand with the usual algorithms (from
memory): attribute closure for keys, and for zone_dispatch (dispatcher -> zone, key courier_id,
zone) the standard case of a relation in 3NF but not BCNF, whose BCNF split loses
``courier_id, zone -> dispatcher`` while the 3NF synthesis keeps the table whole.
"""
from __future__ import annotations

from linter.cli.main import main


def _explain(runner, *args: str):
    return runner.invoke(main, ["explain", *args])


def test_keys_dependencies_and_derivation(example, runner):
    outcome = _explain(runner, "--table", "couriers")
    assert outcome.exit_code == 0
    text = outcome.stdout
    assert text.splitlines()[0] == "table couriers (migrations/0001_depots_and_couriers.sql:10:14): 2NF, target BCNF"
    assert "  primary key (courier_id): a key, migrations/0001_depots_and_couriers.sql:11:5" in text
    assert "  unique constraint (phone): not a key: a column allows NULL" in text
    assert "  depot_id -> depot_city  (annotation, migrations/0001_depots_and_couriers.sql:9:4)" in text
    assert "candidate keys (complete search): courier_id" in text
    assert "    derived from depot_id -> depot_city (annotation, migrations/0001_depots_and_couriers.sql:9:4)" in text


def test_decompositions_with_what_they_keep(example, runner):
    text = _explain(runner, "--table", "zone_dispatch", "--no-sql").stdout
    assert "candidate keys (complete search): (courier_id, zone), (courier_id, dispatcher)" in text
    assert "BCNF decomposition: 2 table(s), lossless (checked by the chase)" in text
    assert "  does not preserve courier_id, zone -> dispatcher" in text
    assert "3NF synthesis: 1 table(s), lossless (checked by the chase)" in text
    assert "CREATE TABLE" not in text


def test_proposed_sql_is_marked_as_a_proposal(example, runner):
    text = _explain(runner, "--table", "route_stops").stdout
    sql = text[text.index("proposed SQL"):]
    assert "PROPOSAL ONLY" in sql and "never applies" in sql
    assert "Review this, back up the data and test" in sql
    assert "CREATE TABLE route_stops_by_route_id (\n    route_id INT NOT NULL,\n    route_name TEXT NOT NULL," in sql


def test_table_in_bcnf_has_nothing_to_propose(example, runner):
    text = _explain(runner, "--table", "DEPOTS").stdout  # names fold as the dialect folds them
    assert "already in BCNF: no decomposition to propose" in text
    assert "CREATE TABLE" not in text


def test_unknown_table_and_a_dropped_one(example, runner):
    unknown = _explain(runner, "--table", "courier")
    assert unknown.exit_code == 2
    assert unknown.stderr == "normguard: no table courier in the schema read; did you mean couriers, courier_bikes?\n"
    split = _explain(runner, "--table", "shifts")  # dropped by a split: the split is what is left of it
    assert split.exit_code == 0 and split.stdout.startswith("split of shifts into shift_times and courier_bikes")
    assert _explain(runner).exit_code == 2  # --table is required
