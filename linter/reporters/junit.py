"""JUnit XML: one test case per table, one for findings tied to no table, a failure per finding.

Element and attribute names follow the Jenkins xUnit ``junit-10.xsd`` (testsuites > testsuite >
testcase > failure); ``classname`` is the file that created the table.

>>> from types import SimpleNamespace
>>> from linter.model import Catalog, Finding, Span
>>> found = Finding("syntax-error", "error", Span("db/002.sql", 4, 7, 4, 9), "unexpected 'TABEL'")
>>> result = SimpleNamespace(findings=[found], catalog=Catalog(files=["db/002.sql"]))
>>> print(render_junit(result).splitlines()[1])
<testsuites name="normguard" tests="1" failures="1" errors="0" time="0">
"""
from __future__ import annotations

import xml.etree.ElementTree as ET
from typing import TYPE_CHECKING

from linter.model import Finding
from linter.reporters.ordering import ordered

if TYPE_CHECKING:
    from linter.engine import Result

UNTIED = "findings tied to no table"


def _xml_text(text: str) -> str:
    """Drop the characters XML 1.0 cannot carry even escaped (controls other than tab, LF, CR)."""
    return "".join(
        c
        for c in text
        if c in "\t\n\r" or (" " <= c <= "\ud7ff") or ("\ue000" <= c <= "\ufffd") or c >= "\U00010000"
    )


def _cases(result: Result) -> dict[tuple[str, str], list[Finding]]:
    """Test cases keyed by (classname, name): every final table, each table findings name, the rest."""
    cases: dict[tuple[str, str], list[Finding]] = {}
    where = {name: table.span.path for name, table in result.catalog.tables.items()}
    for name in sorted(where):
        cases[(where[name], name)] = []
    cases[("normguard", UNTIED)] = []
    for finding in ordered(result.findings):
        if finding.table is None:
            key = ("normguard", UNTIED)
        else:
            key = (where.get(finding.table, finding.span.path), finding.table)
        cases.setdefault(key, []).append(finding)
    return cases


def _failure(case: ET.Element, finding: Finding) -> None:
    """Add one ``failure`` element: the rule as type, the message, the GNU line and explanation."""
    failure = ET.SubElement(case, "failure", type=finding.rule, message=_xml_text(finding.message))
    head = f"{finding.span.gnu()}: {finding.severity}: {finding.message} [{finding.rule}]"
    failure.text = _xml_text("\n".join([head, *finding.explanation]))


def render_junit(result: Result) -> str:
    """The whole report as a JUnit XML document."""
    cases = _cases(result)
    tests, failures = str(len(cases)), str(sum(1 for found in cases.values() if found))
    root = ET.Element("testsuites", name="normguard", tests=tests, failures=failures, errors="0")
    root.set("time", "0")
    suite = ET.SubElement(root, "testsuite", name="normguard", tests=tests, failures=failures)
    suite.set("errors", "0")
    suite.set("skipped", "0")
    suite.set("time", "0")
    for (classname, name), found in cases.items():
        case = ET.SubElement(suite, "testcase", classname=_xml_text(classname), name=_xml_text(name))
        case.set("time", "0")
        for finding in found:
            _failure(case, finding)
    ET.indent(root)
    return '<?xml version="1.0" encoding="UTF-8"?>\n' + ET.tostring(root, encoding="unicode") + "\n"
