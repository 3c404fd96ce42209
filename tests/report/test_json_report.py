"""`check --format json` is standard JSON whatever a calc measures: no Infinity, no NaN."""

from __future__ import annotations

import json
import math

from dossier.findings import Finding, Measure, Verdict
from dossier.report.json_report import check_json
from dossier.report.result import CheckResult, RecordCheck
from dossier.units import Q_


def _unbounded_finding() -> Finding:
    return Finding(
        code="TEST-BAND", calc="testcalc", subject="battery", title="Band", verdict=Verdict.INFO,
        values=(Measure("warmest", Q_(math.inf, "degC")), Measure("coldest", Q_(-math.inf, "degC")), Measure("slope", Q_(math.nan, "K"))),
    )


def _strict(constant: str):
    raise AssertionError(f"non-standard JSON constant {constant}")


def test_unbounded_and_undefined_numbers_are_written_as_standard_json():
    result = CheckResult([RecordCheck("rev-A.yaml", "amp", [_unbounded_finding()], lambda key: None)])
    body = json.loads(check_json(result, 0), parse_constant=_strict)
    values = body["records"][0]["findings"][0]["values"]
    assert [value["value"] for value in values] == ["infinity", "-infinity", None]
