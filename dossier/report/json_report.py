"""The machine-readable shape of `dossier check --format json` (documented in docs/reference/json.md)."""

from __future__ import annotations

import json
import math

from dossier.caution import MAINS_CAUTION
from dossier.checklist.overview import CommissioningState
from dossier.findings import Finding, Measure, Source, counts
from dossier.problems import Problem
from dossier.reading.yaml_source import dotted
from dossier.report.result import CheckResult, RecordCheck

SHAPE_VERSION = 1


def check_json(result: CheckResult, exit_code: int) -> str:
    body = {"shape": SHAPE_VERSION, "exit_code": exit_code, "records": [record_json(r) for r in result.records], "caution": MAINS_CAUTION}
    return json.dumps(standard(body), indent=2, ensure_ascii=False, allow_nan=False)


def record_json(record: RecordCheck) -> dict:
    body: dict = {"file": record.file, "valid": record.valid}
    if record.findings is not None:
        body["counts"] = {verdict.value: n for verdict, n in counts(record.findings).items()}
        body["findings"] = [finding_json(f, record.locate) for f in record.findings]
    body["problems"] = [problem_json(p) for p in record.problems]
    if record.commissioning is not None and record.commissioning.commissioning is not None:
        body["commissioning"] = commissioning_json(record.commissioning)
    if record.signoff is not None:
        body["signoff"] = signoff_json(record.signoff)
    return body


def measure_json(measure: Measure | None):
    if measure is None:
        return None
    quantity = measure.quantity
    if hasattr(quantity, "units"):
        return {"label": measure.label, "value": float(quantity.magnitude), "unit": f"{quantity.units:~P}" or "1"}
    return {"label": measure.label, "value": quantity, "unit": None}


def standard(body):
    """Standard JSON has no Infinity and no NaN: an unbounded number is written as the text 'infinity'
    (or '-infinity'), a number that is not one as null."""
    if isinstance(body, dict):
        return {key: standard(value) for key, value in body.items()}
    if isinstance(body, (list, tuple)):
        return [standard(value) for value in body]
    if isinstance(body, float) and math.isnan(body):
        return None
    if isinstance(body, float) and math.isinf(body):
        return "infinity" if body > 0 else "-infinity"
    return body


def source_json(source: Source) -> dict:
    return {"kind": source.kind, "title": source.title, "publisher": source.publisher, "edition": source.edition, "clause": source.clause}


def finding_json(finding: Finding, locate) -> dict:
    return {
        "code": finding.code,
        "calc": finding.calc,
        "subject": finding.subject,
        "title": finding.title,
        "verdict": finding.verdict.value,
        "values": [measure_json(m) for m in finding.values],
        "limit": measure_json(finding.limit),
        "extra": [measure_json(m) for m in finding.extra],
        "relation": finding.relation if finding.limit else None,
        "method": finding.method,
        "explanation": finding.explanation,
        "keys": [{"key": dotted(k), "at": str(locate(k))} for k in finding.keys],
        "sources": [source_json(s) for s in finding.sources],
        "guards_hazard": finding.guards_hazard,
        "blocks_power_up": finding.blocks_power_up,
    }


def problem_json(problem: Problem) -> dict:
    where = problem.location
    return {"code": problem.code, "file": where.file, "line": where.line, "column": where.column, "key": problem.key, "expected": problem.expected, "found": problem.found, "hint": problem.hint}


def commissioning_json(state: CommissioningState) -> dict:
    entry = state.commissioning.entry
    return {
        "file": state.commissioning.sources.file,
        "date": entry.date.isoformat(),
        "tested_by": entry.tested_by,
        "witness": entry.witness,
        "passed": state.summary.passed,
        "status": state.status.title,
        "text": state.overview_text(),
    }


def signoff_json(state) -> dict:
    """The revision's sign-off state and each sign-off file with whether it is stale or its review outdated."""
    files = [{"file": str(j.signoff.path), "reviewer": j.entry.reviewer, "date": j.entry.date.isoformat(),
              "clearance": j.entry.clearance.value, "stale": j.stale, "outdated": j.outdated is not None} for j in state.signoffs]
    body = {"state": state.state.value, "signoffs": files}
    if state.outdated is not None:
        changed = state.outdated.outdated
        body["since_review"] = {"new": [{"code": f.code, "subject": f.subject, "verdict": f.verdict.value} for f in changed.unnamed],
                                "settled": [{"code": d.code, "subject": d.subject} for d in changed.settled]}
    return body

