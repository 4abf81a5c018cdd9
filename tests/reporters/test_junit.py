"""JUnit XML against the structure of the Jenkins xUnit schema ``junit-10.xsd``.

Source: pytest-dev/pytest ``testing/example_scripts/junit-10.xsd`` (the copy FORMATS.md §5 cites as
JUNIT-JENKINS): ``testsuites`` holds ``testsuite`` elements; ``testsuite`` requires ``name``,
``tests``, ``failures`` and ``errors``; ``testcase`` requires ``name`` and may hold any number of
``failure`` elements with ``type`` and ``message``. The attribute sets below are those the schema
declares. GitLab ignores test cases with repeated names (FORMATS.md §5, GITLAB-JUNIT).
"""
from __future__ import annotations

import re
import xml.etree.ElementTree as ET

from linter.reporters.junit import UNTIED, render_junit

ALLOWED = {
    "testsuites": {"name", "time", "tests", "failures", "errors"},
    "testsuite": {
        "name", "tests", "failures", "errors", "group", "time", "skipped", "timestamp", "hostname",
        "id", "package", "file", "log", "url", "version",
    },
    "testcase": {"name", "time", "classname", "group"},
    "failure": {"type", "message"},
}
REQUIRED = {"testsuite": {"name", "tests", "failures", "errors"}, "testcase": {"name"}}
SUREFIRE_TIME = re.compile(r"(([0-9]{0,3},)*[0-9]{3}|[0-9]{0,3})*(\.[0-9]{0,3})?")


def _check_structure(root: ET.Element) -> None:
    """Element nesting, attribute names and required attributes as the schema declares them."""
    assert root.tag == "testsuites"
    for element in root.iter():
        assert element.tag in ALLOWED, element.tag
        assert set(element.attrib) <= ALLOWED[element.tag]
        assert REQUIRED.get(element.tag, set()) <= set(element.attrib)
        if "time" in element.attrib and element.tag != "testcase":
            assert SUREFIRE_TIME.fullmatch(element.attrib["time"])
    assert all(child.tag == "testsuite" for child in root)
    for suite in root:
        assert all(child.tag == "testcase" for child in suite)
        for case in suite:
            assert all(child.tag == "failure" for child in case)


def test_structure_and_counts(result):
    root = ET.fromstring(render_junit(result))
    _check_structure(root)
    suite = root[0]
    cases = list(suite)
    names = [(case.get("classname"), case.get("name")) for case in cases]
    assert len(names) == len(set(names))
    assert sorted(name for _, name in names) == sorted(["parcels", "riders", "odd", UNTIED])
    failing = [case for case in cases if len(case)]
    assert suite.get("tests") == str(len(cases)) == root.get("tests")
    assert suite.get("failures") == str(len(failing)) == root.get("failures")
    assert sum(len(case) for case in cases) == len(result.findings)


def test_failure_carries_rule_message_and_location(result):
    root = ET.fromstring(render_junit(result))
    riders = next(case for case in root.iter("testcase") if case.get("name") == "riders")
    (failure,) = list(riders)
    assert failure.get("type") == "transitive-dependency"
    assert failure.get("message") == "riders: depot_id -> depot_city breaks 3NF"
    assert failure.text.splitlines()[0].startswith("db/002 riders.sql:7:5: warning:")
    untied = next(case for case in root.iter("testcase") if case.get("name") == UNTIED)
    assert [f.get("type") for f in untied] == ["syntax-error"]


def test_control_characters_are_dropped(result):
    text = render_junit(result)
    assert "\x07" not in text
    odd = next(c for c in ET.fromstring(text).iter("testcase") if c.get("name") == "odd")
    assert odd[0].get("message") == "100% odd: text,with:colons\nand a second line"


def test_clean_run_passes_every_case(empty_result):
    root = ET.fromstring(render_junit(empty_result))
    _check_structure(root)
    assert root.get("failures") == "0" and root.get("tests") == "3"
