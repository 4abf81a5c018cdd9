"""The rule runner: read the catalog, analyse each table, run the rules, filter, fingerprint, sort.

>>> import os, tempfile
>>> from linter.config import Config
>>> folder = tempfile.mkdtemp()
>>> with open(os.path.join(folder, "001_parcels.sql"), "w") as handle:
...     _ = handle.write("CREATE TABLE parcels (tag TEXT, weight INT);\\n")
>>> result = run(Config(paths=(folder,)))
>>> [(f.rule, f.severity, f.span.line, f.table) for f in result.findings]
[('missing-key', 'warning', 1, 'parcels')]

Severities: a rule set to ``off`` (``severity``) or left out by ``select``/``ignore`` does not run,
and the reader's findings under its id are dropped. Otherwise a configured level replaces the level
of every finding of the rule, except the notes a rule emits below its default level (normal-form
findings beyond a table's target), which stay notes. An ``allow`` annotation moves the findings of
the rules it names, for its table, to ``Result.suppressed``; an allow naming a rule id normguard
does not have is an ``annotation-error``. With ``report_paths`` only findings located in those files
(or folders) are kept; the rest of the catalog is still read for context.
"""
from __future__ import annotations

import dataclasses
from collections.abc import Callable, Collection, Iterable, Sequence
from dataclasses import dataclass

from linter.analysis import TableAnalysis, analyse
from linter.config import Config
from linter.config_check import suggestion
from linter.fingerprint import fingerprint
from linter.model import Catalog, Finding
from linter.reader import read_catalog
from linter.reader.names import parse_table_name
from linter.reader.sources import display_path, located_in
from linter.rule import Context, Rule
from rules import all_rules

_ALLOW_ERROR = "annotation-error"


@dataclass
class Result:
    """What a run found: kept and suppressed findings, the catalog, the analyses and the rules run."""

    catalog: Catalog
    findings: list[Finding]
    suppressed: list[Finding]
    analyses: dict[str, TableAnalysis]
    rules: list[Rule]


def run(
    config: Config,
    paths: Sequence[str] | None = None,
    *,
    report_paths: Collection[str] | None = None,
    on_file: Callable[[int, int, str], None] | None = None,
) -> Result:
    """Check the SQL under ``paths`` (default: the configured ones) with the selected rules."""
    catalog = read_catalog(
        list(paths or config.paths),
        dialect=config.dialect,
        dialect_overrides=dict(config.dialects),
        include=config.include,
        exclude=config.exclude,
        skip_down=config.down_migrations == "skip",
        config_dependencies=config.config_dependencies(),
        on_file=on_file,
    )
    targets = table_targets(config)
    analyses = {
        name: analyse(table, targets.get(name, config.target)) for name, table in catalog.tables.items()
    }
    rules = selected_rules(config)
    context = Context(catalog, analyses, {"dialect_for": config.dialect_for})
    found = [_leveled(f, rule, config) for rule in rules for f in rule.check(context)]
    allow_rule = next((rule for rule in rules if rule.id == _ALLOW_ERROR), None)
    if allow_rule is not None:
        found += [_leveled(f, allow_rule, config) for f in _unknown_allows(catalog)]
    kept, suppressed = _suppress(found, catalog)
    if report_paths is not None:
        wanted = [display_path(path) for path in report_paths]
        kept = [f for f in kept if located_in(f.span.path, wanted)]
        suppressed = [f for f in suppressed if located_in(f.span.path, wanted)]
    return Result(catalog, _finished(kept), _finished(suppressed), analyses, rules)


def selected_rules(config: Config) -> list[Rule]:
    """The rules to run: ``select`` (all when empty) minus ``ignore`` minus those set ``off``."""
    return [
        rule
        for rule in all_rules()
        if (not config.select or rule.id in config.select)
        and rule.id not in config.ignore
        and config.severity.get(rule.id) != "off"
    ]


def table_targets(config: Config) -> dict[str, str]:
    """Per-table targets keyed by catalog name (the names folded as the dialect folds them)."""
    return {
        parse_table_name(name, config.dialect): settings.target
        for name, settings in config.tables.items()
        if settings.target
    }


def _leveled(finding: Finding, rule: Rule, config: Config) -> Finding:
    """A copy of ``finding`` at its configured level; a note below the rule's default stays a note."""
    level = config.severity.get(rule.id)
    lowered = finding.severity == "note" and rule.severity != "note"
    if level is None or lowered:
        return dataclasses.replace(finding)
    return dataclasses.replace(finding, severity=level)


def _unknown_allows(catalog: Catalog) -> Iterable[Finding]:
    """An ``annotation-error`` for every allow that names a rule id no rule module defines."""
    known = [rule.id for rule in all_rules()]
    for table in [*catalog.tables.values(), *catalog.dropped]:
        for allow in table.allows:
            for rule_id in allow.rules:
                if rule_id not in known:
                    hint = suggestion(rule_id, known) or " (see normguard rules)"
                    yield Finding(
                        _ALLOW_ERROR,
                        "error",
                        allow.span,
                        f"allow names rule '{rule_id}', which normguard does not have{hint}",
                        table.name,
                        subject=f"allow {rule_id}",
                    )


def _suppress(findings: list[Finding], catalog: Catalog) -> tuple[list[Finding], list[Finding]]:
    """Split findings into kept and those an ``allow`` annotation of their table names.

    Dropped tables count too: a split's findings belong to its original, which is often gone.
    """
    allowed: dict[str, set[str]] = {}
    for table in [*catalog.dropped, *catalog.tables.values()]:
        rules = allowed.setdefault(table.name, set())
        rules.update(rule_id for allow in table.allows for rule_id in allow.rules)
    kept, suppressed = [], []
    for finding in findings:
        is_allowed = finding.rule in allowed.get(finding.table or "", ())
        (suppressed if is_allowed else kept).append(finding)
    return kept, suppressed


def _finished(findings: list[Finding]) -> list[Finding]:
    """Fingerprinted and sorted by path, line, column and rule."""
    for finding in findings:
        finding.fingerprint = fingerprint(finding)
    return sorted(findings, key=lambda f: (f.span.path, f.span.line, f.span.column, f.rule))
