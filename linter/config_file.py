"""Reading a settings file into values that remember their line, so errors and spans can point there.

YAML goes through ``yaml.compose`` with the safe loader (no object construction at all); every
scalar is kept as the text written, which is what every setting wants (``off`` stays ``"off"``
instead of YAML 1.1's ``False``). TOML has no positions in ``tomllib``, so TOML values carry no line.

>>> node = parse_yaml("target: 3nf\\nseverity:\\n  missing-key: off\\n", "cfg.yaml")
>>> node.value["severity"].value["missing-key"].value, node.value["severity"].line
('off', 3)
"""
from __future__ import annotations

import tomllib
from dataclasses import dataclass
from typing import Any

import yaml


class ConfigError(Exception):
    """A settings problem, as one line naming the file, the key (and the line when known)."""

    def __init__(self, message: str) -> None:
        super().__init__(message)
        self.message = message


@dataclass(frozen=True)
class Node:
    """A settings value: a dict or list of ``Node``, a string, a TOML scalar or None.

    ``line``/``column`` are 1-based, ``end_line``/``end_column`` one past the value; all None for TOML.
    """

    value: Any
    line: int | None = None
    column: int | None = None
    end_line: int | None = None
    end_column: int | None = None


def parse_yaml(text: str, path: str) -> Node:
    """The YAML document in ``text`` as a ``Node`` tree; an empty document is an empty mapping."""
    try:
        root = yaml.compose(text, Loader=yaml.SafeLoader)
    except yaml.YAMLError as error:
        mark = getattr(error, "problem_mark", None)
        where = f"{path}:{mark.line + 1}" if mark is not None else path
        problem = getattr(error, "problem", None) or str(error).splitlines()[0]
        raise ConfigError(f"{where}: not valid YAML: {problem}") from None
    if root is None:
        return Node({}, 1, 1, 1, 1)
    return _from_yaml(root, path)


def _from_yaml(node: yaml.Node, path: str) -> Node:
    """Convert one composed node, refusing duplicate or non-text mapping keys."""
    start, end = node.start_mark, node.end_mark
    position = (start.line + 1, start.column + 1, end.line + 1, end.column + 1)
    if isinstance(node, yaml.MappingNode):
        mapping: dict[str, Node] = {}
        for key_node, value_node in node.value:
            if not isinstance(key_node, yaml.ScalarNode):
                raise ConfigError(f"{path}:{key_node.start_mark.line + 1}: a key must be plain text")
            if key_node.value in mapping:
                line = key_node.start_mark.line + 1
                raise ConfigError(f"{path}:{line}: key '{key_node.value}' appears twice")
            mapping[key_node.value] = _from_yaml(value_node, path)
        return Node(mapping, *position)
    if isinstance(node, yaml.SequenceNode):
        return Node([_from_yaml(item, path) for item in node.value], *position)
    if node.tag == "tag:yaml.org,2002:null":
        return Node(None, *position)
    return Node(node.value, *position)


def parse_toml(text: str, path: str) -> Node:
    """The TOML document in ``text`` as a ``Node`` tree without positions."""
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as error:
        raise ConfigError(f"{path}: not valid TOML: {error}") from None
    return _from_plain(data)


def _from_plain(value: Any) -> Node:
    """Wrap parsed TOML values recursively."""
    if isinstance(value, dict):
        return Node({str(key): _from_plain(item) for key, item in value.items()})
    if isinstance(value, list):
        return Node([_from_plain(item) for item in value])
    return Node(value)


def locate_text(text: str, wanted: str) -> tuple[int, int, int, int] | None:
    """Where the quoted string ``wanted`` first appears in ``text`` (for TOML values), or None.

    >>> locate_text('a = 1\\ndeps = ["depot -> city"]\\n', "depot -> city")
    (2, 9, 2, 24)
    """
    for number, line in enumerate(text.splitlines(), start=1):
        for quote in ('"', "'"):
            at = line.find(f"{quote}{wanted}{quote}")
            if at >= 0:
                return number, at + 1, number, at + len(wanted) + 3
    return None
