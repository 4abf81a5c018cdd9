"""Import and parse time of sqlglot with its compiled companion (sqlglotc) and without, side by side.

    .venv/bin/python bench/parse.py [PATHS...] [--dialect postgres] [--runs 5] [--pure-python PYTHON]

Each measurement runs in a fresh interpreter. "compiled" is this interpreter as installed (sqlglotc's
extension modules loaded); "pure" is the same interpreter with sqlglot's ``.py`` sources forced by an
import hook, or, with ``--pure-python``, another interpreter whose environment has plain sqlglot only
(e.g. a scratch venv outside the repository). Prints the medians and the ratio pure / compiled.
Default input: the bundled example's migrations.
"""
from __future__ import annotations

import argparse
import importlib.abc
import importlib.machinery
import importlib.util
import json
import statistics
import subprocess
import sys
import time
from pathlib import Path
from types import ModuleType

_HERE = Path(__file__).resolve()
_DEFAULT = _HERE.parent.parent / "examples" / "courier" / "migrations"


class _SourceOnly(importlib.abc.MetaPathFinder):
    """Load every ``sqlglot`` module from its ``.py`` file even where a compiled one sits beside it."""

    def find_spec(self, name: str, path: object, target: ModuleType | None = None) -> object:
        """The source spec of a sqlglot module, or None to let the usual finders work."""
        if name.split(".")[0] != "sqlglot":
            return None
        spec = importlib.machinery.PathFinder.find_spec(name, path)  # type: ignore[arg-type]
        if spec is None or spec.origin is None or spec.origin.endswith(".py"):
            return spec
        source = Path(spec.origin).parent / f"{name.rsplit('.', 1)[-1]}.py"
        return importlib.util.spec_from_file_location(name, source) if source.exists() else spec


def _files(paths: list[str]) -> list[Path]:
    """The SQL files under ``paths`` (``*.sql`` and ``*.sql.<dialect>``), sorted."""
    found: list[Path] = []
    for given in map(Path, paths):
        candidates = given.rglob("*") if given.is_dir() else [given]
        found += [p for p in candidates if p.is_file() and ".sql" in p.name.lower()]
    return sorted(found)


def _worker(sources: bool, dialect: str, paths: list[str]) -> dict[str, object]:
    """Time ``import sqlglot`` and the parse of every file (best of three) in this interpreter."""
    if sources:
        sys.meta_path.insert(0, _SourceOnly())
    start = time.perf_counter()
    import sqlglot
    from sqlglot import tokens

    sqlglot.Dialect.get_or_raise(dialect)
    imported = time.perf_counter() - start
    texts = [p.read_text(encoding="utf-8", errors="replace") for p in _files(paths)]
    best, failed = float("inf"), 0
    for _ in range(3):
        failed, start = 0, time.perf_counter()
        for text in texts:
            try:
                sqlglot.parse(text, read=dialect)
            except (sqlglot.errors.ParseError, sqlglot.errors.TokenError):
                failed += 1
        best = min(best, time.perf_counter() - start)
    return {
        "import": imported, "parse": best, "files": len(texts), "failed": failed,
        "compiled": tokens.SQLGLOTC_INSTALLED,
    }


def _measure(args: argparse.Namespace) -> tuple[dict[str, object], dict[str, object]]:
    """Median timings over ``args.runs`` fresh interpreters, compiled and pure runs interleaved."""
    def command(python: str, mode: str) -> list[str]:
        return [python, str(_HERE), "--worker", mode, "--dialect", args.dialect, *args.paths]

    pure = (args.pure_python, "as-installed") if args.pure_python else (sys.executable, "sources")
    commands = (command(sys.executable, "as-installed"), command(*pure))
    for warm in commands:  # fill the bytecode caches before timing
        subprocess.run(warm, capture_output=True, check=True)
    runs: tuple[list[dict[str, object]], list[dict[str, object]]] = ([], [])
    for _ in range(args.runs):
        for found, cmd in zip(runs, commands):
            out = subprocess.run(cmd, capture_output=True, text=True, check=True)
            found.append(json.loads(out.stdout))
    return tuple(  # type: ignore[return-value]
        {
            **found[0],
            "import": statistics.median(float(r["import"]) for r in found),
            "parse": statistics.median(float(r["parse"]) for r in found),
        }
        for found in runs
    )


def main() -> int:
    """Measure both ways and print a small table with the ratios."""
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("paths", nargs="*", default=[str(_DEFAULT)])
    parser.add_argument("--dialect", default="postgres")
    parser.add_argument("--runs", type=int, default=5)
    parser.add_argument("--pure-python", help="interpreter with plain sqlglot (no sqlglotc)")
    parser.add_argument("--worker", choices=["as-installed", "sources"], help=argparse.SUPPRESS)
    args = parser.parse_args()
    if args.worker:
        print(json.dumps(_worker(args.worker == "sources", args.dialect, args.paths)))
        return 0
    compiled, pure = _measure(args)
    if not compiled["compiled"] or pure["compiled"]:
        print("bench: sqlglotc is not installed here, or the pure run still loaded it", file=sys.stderr)
        return 2
    print(f"{compiled['files']} files, dialect {args.dialect}, median of {args.runs} fresh interpreters")
    print(f"{'':8} {'pure sqlglot':>13} {'with sqlglotc':>14} {'ratio':>7}")
    for key in ("import", "parse"):
        ratio = float(pure[key]) / float(compiled[key])
        print(f"{key:8} {float(pure[key]):12.3f}s {float(compiled[key]):13.3f}s {ratio:6.2f}x")
    return 0


if __name__ == "__main__":
    sys.exit(main())
