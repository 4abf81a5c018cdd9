"""What a rule is: an id, a default severity, a one-line summary, a page, and a check function.

Every module under ``rules/`` defines one ``RULE``; the engine runs ``RULE.check(context)``.

>>> from linter.rule import Rule
>>> rule = Rule("demo", "warning", "A demonstration.", "# demo", lambda context: [])
>>> rule.id, rule.severity
('demo', 'warning')
"""
from __future__ import annotations

from collections.abc import Callable, Iterable, Mapping
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

from linter.model import Catalog, Finding

if TYPE_CHECKING:
    from linter.analysis import TableAnalysis


@dataclass(frozen=True)
class Context:
    """What a rule may look at: the replayed catalog, the per-table analyses and the settings."""

    catalog: Catalog
    analyses: Mapping[str, TableAnalysis]
    settings: Mapping[str, Any] = field(default_factory=dict)


@dataclass(frozen=True)
class Rule:
    """One rule: ``page`` is Markdown with what it flags, why it matters, an example and the fix."""

    id: str
    severity: str
    summary: str
    page: str
    check: Callable[[Context], Iterable[Finding]]
