"""Loading settings: where they come from, every key, defaults, and one-line errors naming file and key."""
from __future__ import annotations

from pathlib import Path

import pytest

from linter.config import Config, ConfigError, load_config

EVERY_KEY_YAML = """\
paths: [db, extra/schema.sql]
migrations: db/migrations
dialect: mysql
dialects:
  db/legacy: tsql
target: 3nf
tables:
  couriers:
    target: 2nf
    dependencies:
      - depot -> city
      - "depot, shift -> route"
severity:
  missing-key: off
  redundant-unique: warning
select: [missing-key, transitive-dependency, redundant-unique]
ignore: [redundant-unique]
include: ["**/*.sql", "*.sql.postgres"]
exclude: ["dumps/**"]
down-migrations: read
fail-on: error
"""

EVERY_KEY_TOML = """\
[project]
name = "courier-app"

[tool.normguard]
paths = ["db", "extra/schema.sql"]
migrations = "db/migrations"
dialect = "mysql"
target = "3nf"
select = ["missing-key", "transitive-dependency", "redundant-unique"]
ignore = ["redundant-unique"]
include = ["**/*.sql", "*.sql.postgres"]
exclude = ["dumps/**"]
down-migrations = "read"
fail-on = "error"

[tool.normguard.dialects]
"db/legacy" = "tsql"

[tool.normguard.severity]
missing-key = "off"
redundant-unique = "warning"

[tool.normguard.tables.couriers]
target = "2nf"
dependencies = ["depot -> city", "depot, shift -> route"]
"""


def _write(folder: Path, name: str, text: str) -> None:
    """Write a settings file."""
    (folder / name).parent.mkdir(parents=True, exist_ok=True)
    (folder / name).write_text(text, encoding="utf-8")


def _error(folder: Path, name: str, text: str, path: str | None = None) -> str:
    """The ConfigError message for a settings file."""
    _write(folder, name, text)
    with pytest.raises(ConfigError) as caught:
        load_config(path, cwd=str(folder))
    assert "\n" not in caught.value.message
    return caught.value.message


def _check_every_key(config: Config) -> None:
    """The values both EVERY_KEY documents declare."""
    assert config.paths == ("db", "extra/schema.sql")
    assert config.migrations == "db/migrations"
    assert config.dialect == "mysql"
    assert dict(config.dialects) == {"db/legacy": "tsql"}
    assert config.target == "3nf"
    assert config.tables["couriers"].target == "2nf"
    declared = config.tables["couriers"].dependencies
    assert [(d.lhs, d.rhs, d.source) for d in declared] == [
        (("depot",), ("city",), "config"),
        (("depot", "shift"), ("route",), "config"),
    ]
    assert dict(config.severity) == {"missing-key": "off", "redundant-unique": "warning"}
    assert config.select == ("missing-key", "transitive-dependency", "redundant-unique")
    assert config.ignore == ("redundant-unique",)
    assert config.include == ("**/*.sql", "*.sql.postgres")
    assert config.exclude == ("dumps/**",)
    assert config.down_migrations == "read"
    assert config.fail_on == "error"


def test_yaml_file_sets_every_key(tmp_path: Path) -> None:
    _write(tmp_path, ".normguard.yaml", EVERY_KEY_YAML)
    config = load_config(cwd=str(tmp_path))
    _check_every_key(config)
    assert config.source == ".normguard.yaml"


def test_yaml_dependencies_span_their_line_and_column(tmp_path: Path) -> None:
    _write(tmp_path, ".normguard.yaml", EVERY_KEY_YAML)
    first, second = load_config(cwd=str(tmp_path)).tables["couriers"].dependencies
    assert (first.span.path, first.span.line, first.span.column) == (".normguard.yaml", 11, 9)
    assert (second.span.line, second.span.column, second.span.end_column) == (12, 9, 32)


def test_pyproject_table_sets_every_key(tmp_path: Path) -> None:
    _write(tmp_path, "pyproject.toml", EVERY_KEY_TOML)
    config = load_config(cwd=str(tmp_path))
    _check_every_key(config)
    assert config.source == "pyproject.toml"
    first = config.tables["couriers"].dependencies[0]
    assert (first.span.path, first.span.line, first.span.column) == ("pyproject.toml", 25, 17)


def test_explicit_toml_file_holds_the_settings_at_top_level(tmp_path: Path) -> None:
    _write(tmp_path, "ci/normguard.toml", 'target = "2nf"\npaths = ["../db"]\n')
    config = load_config("ci/normguard.toml", cwd=str(tmp_path))
    assert (config.target, config.paths, config.source) == ("2nf", ("db",), "ci/normguard.toml")


def test_paths_are_relative_to_the_settings_file(tmp_path: Path) -> None:
    _write(tmp_path, "conf/settings.yml", "paths: [../db]\nmigrations: ../db/up\ndialects: {../db/old: sqlite}\n")
    config = load_config("conf/settings.yml", cwd=str(tmp_path))
    assert (config.paths, config.migrations, dict(config.dialects)) == (("db",), "db/up", {"db/old": "sqlite"})


def test_yaml_file_wins_over_pyproject(tmp_path: Path) -> None:
    _write(tmp_path, "pyproject.toml", '[tool.normguard]\ntarget = "2nf"\n')
    _write(tmp_path, ".normguard.yaml", "target: 3nf\n")
    assert load_config(cwd=str(tmp_path)).target == "3nf"


def test_defaults_without_any_settings(tmp_path: Path) -> None:
    assert load_config(cwd=str(tmp_path)) == Config()
    _write(tmp_path, "pyproject.toml", '[project]\nname = "x"\n')
    config = load_config(cwd=str(tmp_path))
    assert config == Config()
    assert (config.paths, config.dialect, config.target, config.fail_on) == ((".",), "postgres", "bcnf", "warning")
    assert (config.include, config.exclude, config.down_migrations) == (("**/*.sql",), (), "skip")


def test_empty_yaml_file_gives_defaults(tmp_path: Path) -> None:
    _write(tmp_path, ".normguard.yaml", "# nothing set yet\n")
    assert load_config(cwd=str(tmp_path)) == Config(source=".normguard.yaml")


def test_yaml_words_stay_text(tmp_path: Path) -> None:
    # YAML 1.1 resolves off and no to booleans (yaml.org/type/bool.html, from memory); settings keep them as text
    _write(tmp_path, ".normguard.yaml", "severity:\n  missing-key: off\n  nullable-unique: no\n")
    message = _error(tmp_path, ".normguard.yaml", "severity:\n  missing-key: off\n  nullable-unique: no\n")
    assert message == ".normguard.yaml:3: severity.nullable-unique: expected one of error, warning, note, off, got 'no'"


def test_unknown_key_names_key_file_and_line(tmp_path: Path) -> None:
    message = _error(tmp_path, ".normguard.yaml", "target: 3nf\nfail_on: error\n")
    assert message == ".normguard.yaml:2: fail_on: unknown key (did you mean 'fail-on'?)"


def test_unknown_key_in_pyproject_names_the_full_key(tmp_path: Path) -> None:
    message = _error(tmp_path, "pyproject.toml", '[tool.normguard]\nfolders = ["db"]\n')
    assert message == "pyproject.toml: tool.normguard.folders: unknown key"


def test_unknown_table_key(tmp_path: Path) -> None:
    message = _error(tmp_path, ".normguard.yaml", "tables:\n  couriers:\n    fds: [a -> b]\n")
    assert message.startswith(".normguard.yaml:3: tables.couriers.fds: unknown key")


@pytest.mark.parametrize(
    ("text", "expected"),
    [
        ("target: 4nf\n", ".normguard.yaml:1: target: expected one of bcnf, 3nf, 2nf, got '4nf'"),
        ("dialect: postgress\n", ".normguard.yaml:1: dialect: unknown SQL dialect 'postgress' (did you mean 'postgres'?)"),
        ("dialects:\n  db: nosql\n", ".normguard.yaml:2: dialects.db: unknown SQL dialect 'nosql' (did you mean 'tsql'?)"),
        ("fail-on: never\n", ".normguard.yaml:1: fail-on: expected one of error, warning, note, got 'never'"),
        ("down-migrations: yes please\n", ".normguard.yaml:1: down-migrations: expected one of skip, read, got 'yes please'"),
        ("paths: db\n", ".normguard.yaml:1: paths: expected a list of strings"),
        ("include: [\"\"]\n", ".normguard.yaml:1: include: expected a non-empty string"),
        ("migrations: [a, b]\n", ".normguard.yaml:1: migrations: expected a non-empty string"),
        ("tables: [couriers]\n", ".normguard.yaml:1: tables: expected a mapping of keys to values"),
        ("tables:\n  couriers:\n    target: 1nf\n", ".normguard.yaml:3: tables.couriers.target: expected one of bcnf, 3nf, 2nf, got '1nf'"),
        ("tables:\n  couriers:\n    dependencies: [depot city]\n",
         ".normguard.yaml:3: tables.couriers.dependencies: expected 'columns -> columns', got 'depot city'"),
        ("tables:\n  couriers:\n    dependencies: ['depot, -> city']\n",
         ".normguard.yaml:3: tables.couriers.dependencies: a column name is missing in 'depot, -> city'"),
        ("severity:\n  missing-keys: off\n", ".normguard.yaml:2: severity: unknown rule id 'missing-keys' (did you mean 'missing-key'?)"),
        ("severity:\n  missing-key: loud\n", ".normguard.yaml:2: severity.missing-key: expected one of error, warning, note, off, got 'loud'"),
        ("select: [missing-key, bcnf]\n", ".normguard.yaml:1: select: unknown rule id 'bcnf'"),
        ("ignore:\n  - nulable-unique\n", ".normguard.yaml:2: ignore: unknown rule id 'nulable-unique' (did you mean 'nullable-unique'?)"),
        ("target: 3nf\ntarget: 2nf\n", ".normguard.yaml:2: key 'target' appears twice"),
        ("- paths\n", ".normguard.yaml:1: expected a mapping of keys to values"),
    ],
)
def test_bad_values_name_file_line_and_key(tmp_path: Path, text: str, expected: str) -> None:
    assert _error(tmp_path, ".normguard.yaml", text) == expected


def test_malformed_yaml_gives_its_line(tmp_path: Path) -> None:
    message = _error(tmp_path, ".normguard.yaml", "target: 3nf\npaths: [db\nfail-on: error\n")
    assert message.startswith(".normguard.yaml:3: not valid YAML")


def test_malformed_toml(tmp_path: Path) -> None:
    message = _error(tmp_path, "pyproject.toml", "[tool.normguard\ntarget = 1\n")
    assert message.startswith("pyproject.toml: not valid TOML") and "line 1" in message


def test_toml_value_of_the_wrong_type(tmp_path: Path) -> None:
    message = _error(tmp_path, "pyproject.toml", "[tool.normguard]\ntarget = 3\n")
    assert message == "pyproject.toml: tool.normguard.target: expected a non-empty string"


def test_explicit_path_missing_or_of_unknown_kind(tmp_path: Path) -> None:
    with pytest.raises(ConfigError, match=r"^nowhere\.yaml: no such settings file$"):
        load_config("nowhere.yaml", cwd=str(tmp_path))
    assert _error(tmp_path, "normguard.ini", "[x]\n", "normguard.ini") == (
        "normguard.ini: settings must be a .yaml, .yml or .toml file"
    )


def test_safe_loader_refuses_python_objects(tmp_path: Path) -> None:
    message = _error(tmp_path, ".normguard.yaml", "target: !!python/object/apply:os.getcwd []\n")
    assert message == ".normguard.yaml:1: target: expected a non-empty string"


def test_dialect_for_picks_the_deepest_folder() -> None:
    config = Config(dialect="postgres", dialects={"db": "mysql", "db/legacy": "tsql"})
    assert config.dialect_for("db/legacy/001.sql") == "tsql"
    assert config.dialect_for("db/002.sql") == "mysql"
    assert config.dialect_for("dbx/003.sql") == "postgres"
