"""Fingerprints: a finding's identity across edits, so a baseline survives moved and reformatted SQL.

>>> from linter.model import Finding, Span
>>> found = Finding("transitive-dependency", "warning", Span("db/001.sql", 7, 3, 7, 20),
...                 "depot -> city ...", "couriers", (("depot",), ("city",)))
>>> moved = Finding("transitive-dependency", "warning", Span("db/001.sql", 12, 5, 12, 22),
...                 "reworded", "couriers", (("depot",), ("city",)))
>>> fingerprint(found) == fingerprint(moved), len(fingerprint(found))
(True, 16)

The digest covers the rule id, the table, the file path and the dependency (names sorted on each
side), never a line, a column or the message. A finding without a dependency adds its ``subject``
(rule modules set it: a constraint's columns, for instance); when that is empty too, the message
stands in with every digit removed and whitespace collapsed, so positions quoted in it do not count.
"""
from __future__ import annotations

import hashlib
import re

from linter.model import Finding

_DIGITS = re.compile(r"\d+")


def fingerprint(finding: Finding) -> str:
    """A 16-hex-digit digest of what the finding is about, independent of where it sits."""
    if finding.dependency is not None:
        lhs, rhs = finding.dependency
        about = f"{','.join(sorted(lhs))}->{','.join(sorted(rhs))}"
    else:
        about = finding.subject or " ".join(_DIGITS.sub("", finding.message).split())
    parts = (finding.rule, finding.table or "", finding.span.path, about)
    return hashlib.sha256("\x1f".join(parts).encode("utf-8")).hexdigest()[:16]
