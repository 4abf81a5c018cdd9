"""Every file of the shared corpus read without an exception, and no fewer statements than bare sqlglot.

Source outside the project: ../shared/corpus/PARSE_REPORT.md (sqlglot 30.30.0, the version pinned
here) records, per source and dialect, how many statements bare ``sqlglot.parse`` turned into a
real tree ("AST" column, section 1) and how many CREATE TABLE statements with columns it read
("cols" column, section 2). The reader must reach both numbers: it may only add statements (client
separators, recovery after failures), never lose one.

One adjustment, which the report itself explains (section "Main failure patterns", point 5): bare
sqlglot cuts trigger and routine bodies at every ``;`` and counts the pieces as statements, while the
reader keeps a body whole. Such a body is credited with what bare sqlglot makes of its text, and a
TEMPORARY table created inside a routine counts as a table read.

The corpus files are migrations their projects run, so every object kind after CREATE, ALTER or
DROP in them is real: none may be reported as an unknown (misspelt) one.
"""
from __future__ import annotations

import json
import logging
import re
from collections import Counter, defaultdict
from pathlib import Path

import pytest
import sqlglot
from sqlglot import exp
from sqlglot.dialects.dialect import Dialect
from sqlglot.tokens import TokenType

from linter.reader.sources import read_source
from linter.reader.statements import Statement, split_file

from ..locations import SHARED

CORPUS = SHARED / "corpus"
REPORT = CORPUS / "PARSE_REPORT.md"
ROUTINE_HEAD = re.compile(
    r"^(CREATE\s+(OR\s+REPLACE\s+)?(DEFINER\s*=\s*\S+\s+)?"
    r"(TRIGGER|FUNCTION|PROCEDURE|PACKAGE|EVENT)|BEGIN|DECLARE)\b",
    re.IGNORECASE,
)


def _report_rows() -> dict[tuple[str, str], dict[str, int]]:
    """(source, dialect label) -> {"ast": ..., "cols": ...} from the first table of sections 1 and 2."""
    rows: dict[tuple[str, str], dict[str, int]] = defaultdict(dict)
    section = 0
    for line in REPORT.read_text(encoding="utf-8").splitlines():
        if line.startswith("## "):
            section = int(line[3]) if line[3].isdigit() else 0
            continue
        cells = [c.strip() for c in line.strip().strip("|").split("|")]
        if len(cells) < 5 or not cells[2].replace(",", "").isdigit():
            continue
        if "client split" in cells[1] or "total" in cells[0]:
            continue
        number = lambda cell: int(cell.split()[0].replace(",", ""))  # noqa: E731  "57 (100%)" -> 57
        if section == 1:
            rows[(cells[0], cells[1])]["ast"] = number(cells[7])
        elif section == 2:
            rows[(cells[0], cells[1])].setdefault("cols", number(cells[4]))
    return rows


def _plan() -> list[tuple[str, str, str, Path]]:
    """(source, dialect label, dialect, path) per corpus file, the way SOURCES.json assigns them."""
    config = json.loads((CORPUS / "SOURCES.json").read_text(encoding="utf-8"))
    plan = []
    for name, spec in config["sources"].items():
        root = CORPUS / name
        include = re.compile(spec.get("include", r"\.sql$"))
        rules = [
            (re.compile(r[0]), r[1], r[2] if len(r) > 2 else (r[1] or "default")) for r in spec["dialects"]
        ]
        for path in sorted(p for p in root.rglob("*") if p.is_file()):
            relative = path.relative_to(root).as_posix()
            if include.search(relative):
                rule = next(((d, label) for rx, d, label in rules if rx.search(relative)), None)
                if rule is not None:
                    plan.append((name, rule[1], rule[0], path))
    return plan


def _is_table(expression: exp.Expression | None) -> bool:
    """A CREATE TABLE with column definitions."""
    return (
        isinstance(expression, exp.Create)
        and (expression.args.get("kind") or "").upper() == "TABLE"
        and isinstance(expression.this, exp.Schema)
        and any(isinstance(c, exp.ColumnDef) for c in expression.this.expressions)
    )


def _bare_pieces(text: str, dialect: str) -> list[exp.Expression]:
    """What bare sqlglot makes of a text: whole, else cut at ';' tokens (the report's method)."""
    try:
        return [e for e in sqlglot.parse(text, read=dialect or None) if e is not None]
    except sqlglot.errors.SqlglotError:
        pass
    pieces, start = [], 0
    tokens = Dialect.get_or_raise(dialect or None).tokenize(text)
    for cut in [t.end + 1 for t in tokens if t.token_type == TokenType.SEMICOLON] + [len(text)]:
        try:
            pieces.extend(e for e in sqlglot.parse(text[start:cut], read=dialect or None) if e is not None)
        except sqlglot.errors.SqlglotError:
            pass
        start = cut
    return pieces


def _credit(statement: Statement, dialect: str) -> tuple[int, int]:
    """(ASTs, temporary tables) bare sqlglot would have read from a routine body kept whole."""
    if statement.kind not in ("command", "unparsed") or not ROUTINE_HEAD.match(statement.text):
        return 0, 0
    try:
        pieces = _bare_pieces(statement.text, dialect)
    except sqlglot.errors.SqlglotError:
        return 0, 0
    trees = [
        e for e in pieces
        if not isinstance(e, (exp.Command, exp.Semicolon))
        and not (isinstance(e, (exp.Condition, exp.Alias)) and not isinstance(e, exp.Query))
    ]
    temporary = [e for e in trees if _is_table(e) and e.find(exp.TemporaryProperty)]
    return len(trees), len(temporary)


def test_every_corpus_file_is_read_and_no_statement_sqlglot_parses_is_lost(
    caplog: pytest.LogCaptureFixture,
) -> None:
    caplog.set_level(logging.ERROR, logger="sqlglot")  # the bare re-parse of bodies warns
    if not REPORT.is_file():
        pytest.skip(f"{REPORT} is missing: this check reads ../shared/corpus next to the repository")
    expected = _report_rows()
    counts: dict[tuple[str, str], Counter] = defaultdict(Counter)
    crashes, misplaced, unknown_kinds = [], [], []
    for source, label, dialect, path in _plan():
        row = counts[(source, label)]
        row["files"] += 1
        try:
            text = read_source(str(path))
            script = split_file(text, dialect)
        except Exception as error:  # the point of the test: nothing may escape
            crashes.append(f"{path}: {type(error).__name__}: {error}")
            continue
        lines = text.text.count("\n") + 1
        misplaced += [
            f"{path}: {f}" for f in script.findings if not 1 <= f.span.line <= f.span.end_line <= lines
        ]
        unknown_kinds += [
            f"{path}:{f.span.line}: {f.message}"
            for f in script.findings if f.message.startswith("unknown object kind")
        ]
        for statement in [*script.statements, *script.skipped]:
            row[statement.kind] += 1
            row["tables"] += statement.kind == "ast" and _is_table(statement.expression)
            trees, temporary = _credit(statement, dialect)
            row["credited"] += trees
            row["credited tables"] += temporary
    assert not crashes, crashes[:5]
    assert not misplaced, misplaced[:5]
    assert not unknown_kinds, unknown_kinds[:5]

    print("\nsource / dialect: files, read (ast + opaque), skipped, failed, tables [report AST, cols]")
    short = []
    for key, row in counts.items():
        floor = expected.get(key, {})
        read, skipped = row["ast"] + row["opaque"], row["command"] + row["fragment"] + row["unparsed"]
        print(
            f"{key[0]:12} {key[1]:46} {row['files']:5} {read:6} {skipped:5} {row['error']:4}"
            f" {row['tables']:5}"
            f"  [{floor.get('ast')}, {floor.get('cols')}] credited {row['credited']}/{row['credited tables']}"
        )
        assert key in expected, f"{key} has no row in {REPORT.name}"
        if row["ast"] + row["credited"] < floor["ast"]:
            trees = f"{row['ast']} trees (+{row['credited']} credited)"
            short.append(f"{key}: {trees} < {floor['ast']} in the report")
        if row["tables"] + row["credited tables"] < floor["cols"]:
            short.append(f"{key}: {row['tables']} tables < {floor['cols']} in the report")
    assert set(counts) == set(expected), set(expected) ^ set(counts)
    assert not short, short
