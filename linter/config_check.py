"""Checking a parsed settings tree key by key, so every mistake names the file, the key and the line.

>>> from linter.config_file import parse_yaml
>>> checker = SettingsChecker("cfg.yaml", "", "", ".", ".")
>>> checker.values(parse_yaml("target: 3NF\\nfail-on: error\\n", "cfg.yaml"))
{'target': '3nf', 'fail_on': 'error'}
>>> checker.values(parse_yaml("targets: 3nf\\n", "cfg.yaml"))
Traceback (most recent call last):
linter.config_file.ConfigError: cfg.yaml:1: targets: unknown key (did you mean 'target'?)
"""
from __future__ import annotations

import difflib
import os
from collections.abc import Callable, Iterable
from typing import Any

from sqlglot.dialects.dialect import Dialects

from linter.config_file import ConfigError, Node, locate_text
from linter.model import Dependency, Span
from rules import all_rules

TARGETS: tuple[str, ...] = ("bcnf", "3nf", "2nf")
RULE_LEVELS: tuple[str, ...] = ("error", "warning", "note", "off")
FAIL_LEVELS: tuple[str, ...] = ("error", "warning", "note")
DIALECTS: frozenset[str] = frozenset(d.value for d in Dialects if d.value)
TABLE_KEYS: tuple[str, ...] = ("target", "dependencies")


def parse_dependency(text: str) -> tuple[tuple[str, ...], tuple[str, ...]] | str:
    """``"a, b -> c"`` as (lhs, rhs) column names, or a message saying what is wrong with it.

    >>> parse_dependency("depot, day -> route")
    (('depot', 'day'), ('route',))
    >>> parse_dependency("depot city")
    "expected 'columns -> columns', got 'depot city'"
    """
    sides = text.split("->")
    if len(sides) != 2:
        return f"expected 'columns -> columns', got '{text}'"
    lhs, rhs = ([name.strip() for name in side.split(",")] for side in sides)
    if not all(lhs) or not all(rhs):
        return f"a column name is missing in '{text}'"
    return tuple(lhs), tuple(rhs)


class SettingsChecker:
    """Validates a parsed settings tree; every error names the file, the key and (YAML) the line."""

    def __init__(self, shown: str, text: str, root_key: str, folder: str, cwd: str) -> None:
        self.shown, self.text, self.root_key = shown, text, root_key
        self.folder, self.cwd = folder, cwd

    def fail(self, node: Node, key: str, problem: str) -> ConfigError:
        """An error about ``key`` at ``node``'s line."""
        where = f"{self.shown}:{node.line}" if node.line else self.shown
        name = ".".join(filter(None, (self.root_key, key)))
        return ConfigError(f"{where}: {name}: {problem}" if name else f"{where}: {problem}")

    def values(self, root: Node) -> dict[str, Any]:
        """Every key of the top-level mapping, checked and converted to ``Config`` field values."""
        settings = self.mapping(root, "")
        handlers: dict[str, Callable[[Node], Any]] = {
            "paths": lambda n: self.paths(n, "paths"),
            "migrations": lambda n: self.path(n, "migrations"),
            "dialect": lambda n: self.dialect(n, "dialect"),
            "dialects": self.dialects,
            "target": lambda n: self.choice(n, "target", TARGETS),
            "tables": self.tables,
            "severity": self.severity,
            "select": lambda n: self.rule_ids(n, "select"),
            "ignore": lambda n: self.rule_ids(n, "ignore"),
            "include": lambda n: tuple(self.strings(n, "include")),
            "exclude": lambda n: tuple(self.strings(n, "exclude")),
            "down-migrations": lambda n: self.choice(n, "down-migrations", ("skip", "read")),
            "fail-on": lambda n: self.choice(n, "fail-on", FAIL_LEVELS),
        }
        values = {}
        for key, node in settings.items():
            if key not in handlers:
                raise self.fail(node, key, f"unknown key{suggestion(key, handlers)}")
            values[key.replace("-", "_")] = handlers[key](node)
        return values

    def mapping(self, node: Node, key: str) -> dict[str, Node]:
        """``node`` as a mapping, or an error."""
        if not isinstance(node.value, dict):
            raise self.fail(node, key, "expected a mapping of keys to values")
        return node.value

    def string(self, node: Node, key: str) -> str:
        """``node`` as non-empty text, or an error."""
        if not isinstance(node.value, str) or not node.value.strip():
            raise self.fail(node, key, "expected a non-empty string")
        return node.value.strip()

    def strings(self, node: Node, key: str) -> list[str]:
        """``node`` as a list of non-empty strings, or an error."""
        if not isinstance(node.value, list):
            raise self.fail(node, key, "expected a list of strings")
        return [self.string(item, key) for item in node.value]

    def choice(self, node: Node, key: str, allowed: tuple[str, ...]) -> str:
        """``node`` as one of ``allowed`` (case-insensitive), or an error listing them."""
        value = self.string(node, key).lower()
        if value not in allowed:
            raise self.fail(node, key, f"expected one of {', '.join(allowed)}, got '{value}'")
        return value

    def path(self, node: Node, key: str) -> str:
        """A path relative to the settings file, returned relative to cwd."""
        value = self.string(node, key)
        return relative(os.path.join(self.folder, value), self.cwd)

    def paths(self, node: Node, key: str) -> tuple[str, ...]:
        """A list of paths relative to the settings file."""
        self.strings(node, key)
        return tuple(self.path(item, key) for item in node.value)

    def dialect(self, node: Node, key: str) -> str:
        """A sqlglot dialect name."""
        value = self.string(node, key).lower()
        if value not in DIALECTS:
            raise self.fail(node, key, f"unknown SQL dialect '{value}'{suggestion(value, DIALECTS)}")
        return value

    def dialects(self, node: Node) -> dict[str, str]:
        """Folder -> dialect overrides."""
        overrides = {}
        for folder, item in self.mapping(node, "dialects").items():
            key = f"dialects.{folder}"
            overrides[self.path(Node(folder, item.line), key)] = self.dialect(item, key)
        return overrides

    def rule_ids(self, node: Node, key: str) -> tuple[str, ...]:
        """A list of known rule ids."""
        ids = self.strings(node, key)
        for item, rule in zip(node.value, ids):
            self.rule_id(item, rule, key)
        return tuple(ids)

    def rule_id(self, node: Node, rule: str, key: str) -> None:
        """Refuse a rule id that no module in ``rules/`` defines."""
        known = _rule_ids()
        if rule not in known:
            raise self.fail(node, key, f"unknown rule id '{rule}'{suggestion(rule, known)}")

    def severity(self, node: Node) -> dict[str, str]:
        """Rule id -> level."""
        levels = {}
        for rule, item in self.mapping(node, "severity").items():
            self.rule_id(item, rule, "severity")
            levels[rule] = self.choice(item, f"severity.{rule}", RULE_LEVELS)
        return levels

    def tables(self, node: Node) -> dict[str, tuple[str | None, tuple[Dependency, ...]]]:
        """Per-table target and declared dependencies."""
        result = {}
        for table, item in self.mapping(node, "tables").items():
            key = f"tables.{table}"
            entry = self.mapping(item, key)
            for name, value in entry.items():
                if name not in TABLE_KEYS:
                    raise self.fail(value, f"{key}.{name}", f"unknown key{suggestion(name, TABLE_KEYS)}")
            target = entry.get("target")
            deps = entry.get("dependencies")
            result[table] = (
                self.choice(target, f"{key}.target", TARGETS) if target else None,
                self.dependencies(deps, f"{key}.dependencies") if deps else (),
            )
        return result

    def dependencies(self, node: Node, key: str) -> tuple[Dependency, ...]:
        """``"a, b -> c"`` strings as ``Dependency`` objects spanning their place in the file."""
        self.strings(node, key)
        declared = []
        for item in node.value:
            parsed = parse_dependency(item.value.strip())
            if isinstance(parsed, str):
                raise self.fail(item, key, parsed)
            declared.append(Dependency(parsed[0], parsed[1], self.span(item), "config"))
        return tuple(declared)

    def span(self, node: Node) -> Span:
        """Where a value sits in the settings file: YAML marks, or the quoted string's place in TOML."""
        if node.line is not None:
            return Span(self.shown, node.line, node.column, node.end_line, node.end_column)
        found = locate_text(self.text, node.value) or (1, 1, 1, 1)
        return Span(self.shown, *found)


def relative(path: str, cwd: str) -> str:
    """``path`` relative to ``cwd`` with forward slashes."""
    return os.path.relpath(path, cwd).replace(os.sep, "/")


def _rule_ids() -> frozenset[str]:
    """Every rule id the ``rules`` package defines."""
    return frozenset(rule.id for rule in all_rules())


def suggestion(word: str, choices: Iterable[str]) -> str:
    """`` (did you mean 'x'?)`` when a choice is close to ``word``, else nothing."""
    close = difflib.get_close_matches(word, sorted(choices), n=1)
    return f" (did you mean '{close[0]}'?)" if close else ""
