"""Speed of the dependency theory against the brute force, measured side by side.

    .venv/bin/python bench/theory.py [--quick]

Prints medians for generated relations of 16, 32, 64 and 128 attributes with twice as many
dependencies: closure, minimal cover, candidate keys, normal form, 3NF synthesis and BCNF
decomposition, each beside the brute-force version (the tests' oracle, ``tests/theory/oracle.py``,
and ``bench/theory_oracle.py`` built on it: fixpoint closure everywhere; subset enumeration for
keys, normal forms and projections up to 16 attributes) and their ratio. Then closure against
the fixpoint on random sets and on a reversed chain of 128 links, and the full analysis of
64-attribute, 128-dependency relations.
Goals: closure no slower than the fixpoint on random sets, 20 times faster on the reversed chain;
a 64-attribute relation analysed (keys, normal form, both decompositions) in under 50 ms.
"""
from __future__ import annotations

import argparse
import random
import statistics
import sys
import time
from collections.abc import Callable
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent.parent))

import theory_oracle as brute  # the helper beside this script

from linter.dependencies import (
    FD,
    ClosureIndex,
    bcnf_decompose,
    candidate_keys,
    closure,
    minimal_cover,
    normal_form,
    synthesize_3nf,
)
from tests.theory.generated import generated_relation
from tests.theory.oracle import naive_closure, oracle_form, oracle_keys

SIZES = (16, 32, 64, 128)
BRUTE_LIMIT = 16  # subset enumeration beyond this takes minutes


def random_sets(n: int, m: int, seed: int) -> list[FD]:
    """m dependencies with 1 to 3 attributes on the left and 1 or 2 on the right, anywhere."""
    rng = random.Random(seed)
    fds = []
    for _ in range(m):
        lhs = sum(1 << p for p in rng.sample(range(n), rng.randint(1, 3)))
        rhs = sum(1 << p for p in rng.sample(range(n), rng.randint(1, 2)))
        fds.append(FD(lhs, rhs))
    return fds


def median_seconds(
    run: Callable[[], object], repeats: int, clock: Callable[[], float] = time.perf_counter
) -> float:
    """The median time of ``repeats`` runs: wall time, or CPU time with ``time.process_time``."""
    times = []
    for _ in range(repeats):
        started = clock()
        run()
        times.append(clock() - started)
    return statistics.median(times)


def _ms(seconds: float | None) -> str:
    return "—" if seconds is None else f"{seconds * 1000:9.2f}"


def _ratio(ours: float, theirs: float | None) -> str:
    return "—" if theirs is None else f"{theirs / ours:8.1f}x"


def _queries(n: int, count: int, seed: int) -> list[int]:
    rng = random.Random(seed)
    return [sum(1 << p for p in rng.sample(range(n), rng.randint(1, 4))) for _ in range(count)]


Operation = Callable[[int, list[FD]], object]

# name, ours, the brute force, whether the brute force enumerates subsets (small relations only)
OPERATIONS: list[tuple[str, Operation, Operation, bool]] = [
    ("minimal cover", lambda r, f: minimal_cover(f), lambda r, f: brute.naive_minimal_cover(f), False),
    ("candidate keys", lambda r, f: candidate_keys(r, f, time_limit=None), oracle_keys, True),
    ("normal form", normal_form, oracle_form, True),
    ("3NF synthesis", synthesize_3nf, brute.synthesis_by_subsets, True),
    ("BCNF decompose", bcnf_decompose, brute.bcnf_by_subsets, True),
]


def sizes_table(repeats: int) -> None:
    """Each operation against its brute-force twin, per size."""
    print("operation        attrs   ours ms  brute ms     brute/ours  notes")
    for n in SIZES:
        r, fds = generated_relation(n, seed=n)
        keys = candidate_keys(r, fds, time_limit=None)
        notes = f"{len(keys.keys)} key(s), {normal_form(r, fds, keys).form}"
        index = ClosureIndex(fds)
        queries = _queries(n, 200, seed=n)
        mine = median_seconds(lambda: [index.closure(x) for x in queries], repeats)
        other = median_seconds(lambda: [naive_closure(x, fds) for x in queries], repeats)
        _print_row("closure x200", n, mine, other, notes)
        for name, ours, theirs, by_subsets in OPERATIONS:
            mine = median_seconds(lambda: ours(r, fds), repeats)
            other = None
            if n <= BRUTE_LIMIT or not by_subsets:
                other = median_seconds(lambda: theirs(r, fds), 3)
            _print_row(name, n, mine, other, notes)
        print()


def _print_row(name: str, n: int, mine: float, other: float | None, notes: str) -> None:
    print(f"{name:16} {n:5} {_ms(mine)} {_ms(other):>9} {_ratio(mine, other):>14}  {notes}")


def closure_table(repeats: int) -> None:
    """The counter algorithm against the fixpoint: random sets and the reversed chain."""
    fds = random_sets(64, 128, seed=7)
    index = ClosureIndex(fds)
    queries = _queries(64, 500, seed=8)
    prepared = median_seconds(lambda: [index.closure(x) for x in queries], repeats)
    one_shot = median_seconds(lambda: [closure(x, fds) for x in queries], repeats)
    naive = median_seconds(lambda: [naive_closure(x, fds) for x in queries], repeats)
    per = 1e6 / len(queries)
    print("closure, 64 attributes, 128 random dependencies, 500 queries (us per query):")
    print(f"  prepared index {prepared * per:7.2f}   one-shot closure() {one_shot * per:7.2f}"
          f"   fixpoint {naive * per:7.2f}")
    print(f"  fixpoint / prepared {naive / prepared:5.2f}x   fixpoint / one-shot {naive / one_shot:5.2f}x")
    chain = [FD(1 << i, 1 << (i + 1)) for i in reversed(range(127))]
    chain_index = ClosureIndex(chain)
    prepared = median_seconds(lambda: chain_index.closure(1), repeats)
    one_shot = median_seconds(lambda: closure(1, chain), repeats)
    naive = median_seconds(lambda: naive_closure(1, chain), repeats)
    print("closure of a0 over the chain a0 -> a1 -> ... -> a127 listed last link first (us):")
    print(f"  prepared index {prepared * 1e6:8.1f}   one-shot closure() {one_shot * 1e6:8.1f}"
          f"   fixpoint {naive * 1e6:9.1f}")
    print(f"  fixpoint / prepared {naive / prepared:6.1f}x   fixpoint / one-shot {naive / one_shot:6.1f}x")
    print()


def full_analysis(repeats: int) -> None:
    """Keys, normal form and both decompositions of 64-attribute, 128-dependency relations."""
    print("full analysis, 64 attributes, 128 dependencies (keys, normal form, BCNF, 3NF):")
    medians = []
    cpu_medians = []
    for seed in range(1, 6):
        r, fds = generated_relation(64, seed)

        def analyse() -> None:
            keys = candidate_keys(r, fds)
            normal_form(r, fds, keys)
            bcnf_decompose(r, fds)
            synthesize_3nf(r, fds)

        median = median_seconds(analyse, repeats)
        cpu = median_seconds(analyse, repeats, time.process_time)
        medians.append(median)
        cpu_medians.append(cpu)
        keys = candidate_keys(r, fds)
        pieces = len(bcnf_decompose(r, fds).pieces), len(synthesize_3nf(r, fds).pieces)
        print(f"  seed {seed}: {median * 1000:6.1f} ms median ({cpu * 1000:5.1f} ms CPU)"
              f"   {len(keys.keys)} key(s), complete {keys.complete};"
              f" BCNF {pieces[0]} pieces, 3NF {pieces[1]} pieces")
    print(f"  median over the seeds: {statistics.median(medians) * 1000:.1f} ms"
          f" ({statistics.median(cpu_medians) * 1000:.1f} ms CPU; goal: under 50 ms)")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true", help="fewer repetitions")
    repeats = 3 if parser.parse_args().quick else 15
    sizes_table(repeats)
    closure_table(repeats)
    full_analysis(repeats)


if __name__ == "__main__":
    main()
