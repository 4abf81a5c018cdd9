"""read_catalog's options: dialect per folder, progress callback, file filters, files recorded."""
from __future__ import annotations

from pathlib import Path

from linter.reader import read_catalog


def _write(folder: Path, name: str, text: str) -> None:
    """Write one migration file, creating its folder."""
    path = folder / name
    path.parent.mkdir(parents=True, exist_ok=True)
    path.write_text(text, encoding="utf-8")


def test_dialect_overrides_pick_the_longest_matching_folder(tmp_path: Path) -> None:
    _write(tmp_path / "pg", "001.sql", 'CREATE TABLE "Ferries" (id int PRIMARY KEY);')
    _write(tmp_path / "legacy" / "my", "001.sql", "CREATE TABLE `Cabins` (`Deck` int NOT NULL, UNIQUE KEY (`Deck`));")
    _write(tmp_path / "legacy", "000.sql", "CREATE TABLE [Piers] ([Code] INT NOT NULL PRIMARY KEY);")
    catalog = read_catalog(
        [str(tmp_path / "pg"), str(tmp_path / "legacy")],
        dialect="postgres",
        dialect_overrides={str(tmp_path / "legacy"): "tsql", str(tmp_path / "legacy" / "my"): "mysql"},
    )
    assert set(catalog.tables) == {"Ferries", "Cabins", "piers"}
    assert catalog.tables["Cabins"].column_names == ("deck",)
    assert catalog.findings == []


def test_progress_callback_and_files_in_replay_order(tmp_path: Path) -> None:
    _write(tmp_path, "V10__later.sql", "ALTER TABLE hulls ADD COLUMN paint text;")
    _write(tmp_path, "V9__first.sql", "CREATE TABLE hulls (id int PRIMARY KEY);")
    _write(tmp_path, "V9__first.down.sql", "DROP TABLE hulls;")
    _write(tmp_path, "notes.txt", "CREATE TABLE ignored (x int);")
    calls: list[tuple[int, int, str]] = []
    catalog = read_catalog([str(tmp_path)], on_file=lambda i, n, path: calls.append((i, n, Path(path).name)))
    assert calls == [(0, 2, "V9__first.sql"), (1, 2, "V10__later.sql")]
    assert [Path(f).name for f in catalog.files] == ["V9__first.sql", "V10__later.sql"]
    assert catalog.tables["hulls"].column_names == ("id", "paint")


def test_include_exclude_and_down_files(tmp_path: Path) -> None:
    _write(tmp_path, "a/up.sql", "CREATE TABLE decks (id int);")
    _write(tmp_path, "a/down.sql", "DROP TABLE decks;")
    _write(tmp_path, "b/up.sql", "CREATE TABLE masts (id int);")
    catalog = read_catalog([str(tmp_path)], exclude=("b/**",))
    assert set(catalog.tables) == {"decks"} and catalog.findings == []
    catalog = read_catalog([str(tmp_path)], exclude=("b/**",), skip_down=False)  # down.sql sorts first
    assert [(Path(f.span.path).name, f.rule) for f in catalog.findings] == [("down.sql", "schema-conflict")]
    catalog = read_catalog([str(tmp_path)], include=("b/*.sql",))
    assert set(catalog.tables) == {"masts"}
