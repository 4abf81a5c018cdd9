"""Which files are read, in which order, and how their bytes become text."""
from __future__ import annotations

import os
from pathlib import Path

import pytest

from linter.reader import sources
from linter.reader.sources import discover_files, natural_key, read_source
from linter.reader.statements import split_file


def _touch(root: Path, *names: str, text: str = "SELECT 1;\n") -> None:
    for name in names:
        path = root / name
        path.parent.mkdir(parents=True, exist_ok=True)
        path.write_text(text, encoding="utf-8")


def _relative(found: list[str], root: Path) -> list[str]:
    return [Path(os.path.relpath(f, root)).as_posix() for f in found]


def test_numbers_compare_as_numbers(tmp_path: Path) -> None:
    _touch(tmp_path, "V10__ferries.sql", "V9__ports.sql", "V1__init.sql", "2_y.sql", "0001_x.sql", "10_z.sql")
    found = _relative(discover_files([str(tmp_path)]), tmp_path)
    assert found == ["0001_x.sql", "2_y.sql", "10_z.sql", "V1__init.sql", "V9__ports.sql", "V10__ferries.sql"]


def test_one_folder_per_migration_and_down_migrations_skipped(tmp_path: Path) -> None:
    _touch(
        tmp_path,
        "2024-10-02-120000_add_depots/up.sql", "2024-10-02-120000_add_depots/down.sql",
        "2024-09-30-080000_init/up.sql", "2024-09-30-080000_init/down.sql",
        "V3.rename.up.sql", "V3.rename.down.sql", "0004_seed_down.sql", "0005_undo-down.sql",
    )
    found = _relative(discover_files([str(tmp_path)]), tmp_path)
    assert found == [
        "2024-09-30-080000_init/up.sql", "2024-10-02-120000_add_depots/up.sql", "V3.rename.up.sql",
    ]
    everything = _relative(discover_files([str(tmp_path)], skip_down=False), tmp_path)
    assert len(everything) == 8
    assert everything.index("V3.rename.down.sql") > everything.index("0005_undo-down.sql")


def test_synapse_layout_deltas_in_numeric_order_with_suffix_variants(tmp_path: Path) -> None:
    # ../shared/corpus/MANIFEST.md: base full_schemas/72, then delta/<N> in numeric order, files by name.
    _touch(
        tmp_path,
        "full_schemas/72/full.sql.postgres", "delta/10/a.sql", "delta/9/b.sql.postgres", "delta/9/a.sql",
        "delta/54/c.sql.sqlite", "delta/100/notes.txt",
    )
    found = discover_files(
        [str(tmp_path / "full_schemas" / "72"), str(tmp_path / "delta")], include=("*.sql", "*.sql.postgres")
    )
    assert _relative(found, tmp_path) == [
        "full_schemas/72/full.sql.postgres", "delta/9/a.sql", "delta/9/b.sql.postgres", "delta/10/a.sql",
    ]


def test_include_and_exclude_globs(tmp_path: Path) -> None:
    _touch(
        tmp_path, "schema/001_a.sql", "schema/002_b.sql", "seed/001_data.sql", "schema/archive/000_old.sql"
    )
    assert _relative(discover_files([str(tmp_path)], exclude=("seed/**", "**/archive/*")), tmp_path) == [
        "schema/001_a.sql", "schema/002_b.sql",
    ]
    assert _relative(discover_files([str(tmp_path)], include=("schema/*.sql",)), tmp_path) == [
        "schema/001_a.sql", "schema/002_b.sql",
    ]


def test_explicit_files_keep_their_order_and_are_read_even_if_not_included(tmp_path: Path) -> None:
    _touch(tmp_path, "b.sql", "a.sql", "notes.ddl", "dir/1.sql")
    given = [str(tmp_path / name) for name in ("b.sql", "notes.ddl", "dir", "a.sql", "b.sql")]
    assert _relative(discover_files(given), tmp_path) == ["b.sql", "notes.ddl", "dir/1.sql", "a.sql"]


def test_missing_path_is_kept_and_reported_when_read(tmp_path: Path) -> None:
    missing = str(tmp_path / "nope.sql")
    assert discover_files([missing]) == [Path(os.path.relpath(missing)).as_posix()]
    source = read_source(missing)
    assert source.skipped and source.text == ""
    (problem,) = source.problems
    assert (problem.rule, problem.severity, problem.span.line) == ("file-error", "error", 1)
    assert "No such file" in problem.message


def test_paths_are_relative_to_the_working_directory_with_forward_slashes(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    _touch(tmp_path, "db/001.sql")
    monkeypatch.chdir(tmp_path)
    assert discover_files(["db"]) == ["db/001.sql"]
    assert read_source(str(tmp_path / "db" / "001.sql")).path == "db/001.sql"


def test_byte_order_mark_is_not_counted_in_columns(tmp_path: Path) -> None:
    path = tmp_path / "bom.sql"
    path.write_bytes(b"\xef\xbb\xbfCREATE TABLE depots (code text);\n")
    source = read_source(str(path))
    assert source.text.startswith("CREATE") and not source.problems
    statement = split_file(source, "postgres").statements[0]
    assert (statement.span.line, statement.span.column) == (1, 1)


def test_crlf_text_is_kept_and_lines_stay_right(tmp_path: Path) -> None:
    path = tmp_path / "crlf.sql"
    path.write_bytes(b"-- one\r\n\r\nCREATE TABLE depots (code text);\r\n")
    source = read_source(str(path))
    assert "\r\n" in source.text
    statement = split_file(source, "postgres").statements[0]
    assert (statement.span.line, statement.span.column, statement.span.end_column) == (3, 1, 32)


def test_empty_file(tmp_path: Path) -> None:
    path = tmp_path / "empty.sql"
    path.write_bytes(b"")
    source = read_source(str(path))
    assert (source.text, source.problems, source.skipped) == ("", [], False)
    assert split_file(source, "postgres").statements == []


def test_binary_file_is_reported_and_skipped(tmp_path: Path) -> None:
    path = tmp_path / "dump.sql"
    path.write_bytes(b"CREATE TABLE t (a int);\n\x00\x01\x02")
    source = read_source(str(path))
    assert source.skipped and source.text == ""
    (problem,) = source.problems
    assert problem.rule == "file-error" and "binary" in problem.message and "line 2" in problem.message


def test_non_utf8_is_reported_at_line_one_naming_the_line_and_read_with_replacement(tmp_path: Path) -> None:
    path = tmp_path / "latin1.sql"
    path.write_bytes("-- fine\n-- caf\xe9\nCREATE TABLE depots (code text);\n".encode("latin-1"))
    source = read_source(str(path))
    (problem,) = source.problems
    assert (problem.rule, problem.severity, problem.span.line) == ("file-error", "warning", 1)
    assert "0xe9 on line 2" in problem.message
    assert "\ufffd" in source.text and not source.skipped
    assert split_file(source, "postgres").statements[0].span.line == 3


def test_huge_file_is_reported_and_skipped(tmp_path: Path) -> None:
    path = tmp_path / "huge.sql"
    with open(path, "wb") as handle:
        handle.truncate(sources.MAX_FILE_BYTES + 1)
    source = read_source(str(path))
    assert source.skipped and source.text == ""
    (problem,) = source.problems
    assert problem.rule == "file-error" and "limit" in problem.message


def test_a_folder_given_as_a_file_is_reported(tmp_path: Path) -> None:
    source = read_source(str(tmp_path))
    assert source.skipped and "folder" in source.problems[0].message


@pytest.mark.skipif(
    not hasattr(os, "geteuid") or os.geteuid() == 0, reason="root reads files whatever their mode"
)
def test_permission_denied_on_disk(tmp_path: Path) -> None:
    path = tmp_path / "secret.sql"
    path.write_text("SELECT 1;", encoding="utf-8")
    path.chmod(0)
    try:
        source = read_source(str(path))
    finally:
        path.chmod(0o600)
    assert source.skipped and "Permission denied" in source.problems[0].message


def test_permission_denied_is_a_finding(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    path = tmp_path / "secret.sql"
    path.write_text("SELECT 1;", encoding="utf-8")

    def refuse(*args, **kwargs):
        raise PermissionError(13, "Permission denied")

    monkeypatch.setattr("builtins.open", refuse)
    source = read_source(str(path))
    assert source.skipped
    (problem,) = source.problems
    assert (problem.rule, problem.severity) == ("file-error", "error")
    assert problem.message == "cannot read file: Permission denied"


def test_natural_key_ties_break_on_the_text() -> None:
    assert sorted(["01_a.sql", "1_a.sql"], key=natural_key) == ["01_a.sql", "1_a.sql"]


@pytest.mark.skipif(not hasattr(os, "mkfifo"), reason="named pipes are a POSIX feature")
def test_a_named_pipe_is_reported_not_read(tmp_path: Path) -> None:
    pipe = tmp_path / "pipe.sql"
    os.mkfifo(pipe)
    source = read_source(str(pipe))  # would block forever if opened
    assert source.skipped and "not a regular file" in source.problems[0].message
