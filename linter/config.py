"""normguard's settings: where they come from, what each key means, and its default.

>>> import os, tempfile
>>> folder = tempfile.mkdtemp()
>>> with open(os.path.join(folder, ".normguard.yaml"), "w") as out:
...     _ = out.write("paths: [db]\\ntarget: 3nf\\n"
...                   "tables:\\n  couriers:\\n    dependencies: [depot -> city]\\n")
>>> config = load_config(cwd=folder)
>>> config.paths, config.target, config.fail_on
(('db',), '3nf', 'warning')
>>> config.tables["couriers"].dependencies[0].span.line
5

Sources, first found wins: the ``path`` argument (``.yaml``/``.yml`` or ``.toml`` by suffix; a
``pyproject.toml`` is read from its ``[tool.normguard]`` table), else ``.normguard.yaml`` in ``cwd``,
else ``[tool.normguard]`` in ``cwd/pyproject.toml``, else the defaults.

Keys (every other key is an error naming the key and the file):

- ``paths`` (list of folders or files, default ``["."]``): what ``normguard check`` reads.
- ``migrations`` (folder, default none): the migrations folder the pre-commit hook replays for
  context while reporting only on the staged files.
- ``dialect`` (default ``postgres``): the sqlglot dialect used to parse SQL.
- ``dialects`` (folder -> dialect, default none): per-folder dialect overrides.
- ``target`` (``bcnf``, ``3nf`` or ``2nf``, default ``bcnf``): the normal form tables must reach;
  normal-form findings beyond a table's target are reported as notes.
- ``tables`` (table -> {``target``, ``dependencies``}): a per-table target, and functional
  dependencies written ``"a, b -> c"`` that hold in the data but are not in the DDL.
- ``severity`` (rule id -> ``error``, ``warning``, ``note`` or ``off``): change a rule's level.
- ``select`` (rule ids, default all) and ``ignore`` (rule ids, default none): which rules run.
- ``include`` (globs, default ``["**/*.sql"]``) and ``exclude`` (globs, default none): the files
  read under each path.
- ``down-migrations`` (``skip`` or ``read``, default ``skip``): whether down migrations are replayed.
- ``fail-on`` (``error``, ``warning`` or ``note``, default ``warning``): the lowest severity that
  makes ``normguard check`` exit 1.

Folder and file paths are relative to the settings file and come back relative to ``cwd`` with
forward slashes. Names of rules are checked against ``rules.all_rules()``.
"""
from __future__ import annotations

import os
from collections.abc import Mapping
from dataclasses import dataclass, field

from linter.config_check import SettingsChecker, relative
from linter.config_file import ConfigError, parse_toml, parse_yaml
from linter.model import Dependency
from linter.reader.sources import located_in

__all__ = ["Config", "ConfigError", "TableSettings", "load_config"]

YAML_NAME = ".normguard.yaml"


@dataclass(frozen=True)
class TableSettings:
    """Settings for one table: its own target form (None: the global one) and declared dependencies."""

    target: str | None = None
    dependencies: tuple[Dependency, ...] = ()


@dataclass(frozen=True)
class Config:
    """Every setting with its default; ``source`` is the settings file read, relative to cwd."""

    paths: tuple[str, ...] = (".",)
    migrations: str | None = None
    dialect: str = "postgres"
    dialects: Mapping[str, str] = field(default_factory=dict)
    target: str = "bcnf"
    tables: Mapping[str, TableSettings] = field(default_factory=dict)
    severity: Mapping[str, str] = field(default_factory=dict)
    select: tuple[str, ...] = ()
    ignore: tuple[str, ...] = ()
    include: tuple[str, ...] = ("**/*.sql",)
    exclude: tuple[str, ...] = ()
    down_migrations: str = "skip"
    fail_on: str = "warning"
    source: str | None = None

    def dialect_for(self, path: str) -> str:
        """The dialect of the file at ``path``: that of the deepest ``dialects`` folder holding it."""
        matches = [folder for folder in self.dialects if located_in(path, [folder])]
        return self.dialects[max(matches, key=len)] if matches else self.dialect

    def config_dependencies(self) -> dict[str, list[Dependency]]:
        """Declared dependencies by table, in the shape ``read_catalog`` takes."""
        return {name: list(s.dependencies) for name, s in self.tables.items() if s.dependencies}


def load_config(path: str | None = None, cwd: str = ".") -> Config:
    """The settings from ``path``, ``.normguard.yaml`` or ``pyproject.toml`` in ``cwd``, or defaults."""
    if path is not None:
        full = os.path.join(cwd, path)
        if not os.path.isfile(full):
            raise ConfigError(f"{path}: no such settings file")
        return _load_file(full, cwd, toml_root="tool.normguard" if _is_pyproject(full) else "")
    yaml_file = os.path.join(cwd, YAML_NAME)
    if os.path.isfile(yaml_file):
        return _load_file(yaml_file, cwd, toml_root="")
    pyproject = os.path.join(cwd, "pyproject.toml")
    if os.path.isfile(pyproject):
        return _load_file(pyproject, cwd, toml_root="tool.normguard")
    return Config()


def _is_pyproject(path: str) -> bool:
    """True for a file named ``pyproject.toml``, whose settings live under ``[tool.normguard]``."""
    return os.path.basename(path) == "pyproject.toml"


def _load_file(full: str, cwd: str, toml_root: str) -> Config:
    """Parse one settings file and check it into a ``Config``."""
    shown = relative(full, cwd)
    try:
        with open(full, encoding="utf-8") as handle:
            text = handle.read()
    except (OSError, UnicodeDecodeError) as error:
        raise ConfigError(f"{shown}: cannot read settings: {error}") from None
    suffix = os.path.splitext(full)[1].lower()
    if suffix in (".yaml", ".yml"):
        root = parse_yaml(text, shown)
    elif suffix == ".toml":
        root = parse_toml(text, shown)
        for part in filter(None, toml_root.split(".")):
            table = root.value.get(part) if isinstance(root.value, dict) else None
            if table is None:
                return Config()
            root = table
    else:
        raise ConfigError(f"{shown}: settings must be a .yaml, .yml or .toml file")
    values = SettingsChecker(shown, text, toml_root, os.path.dirname(full), cwd).values(root)
    if "tables" in values:
        values["tables"] = {name: TableSettings(*entry) for name, entry in values["tables"].items()}
    return Config(source=shown, **values)
