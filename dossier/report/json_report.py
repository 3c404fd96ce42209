"""The machine-readable shape of `dossier check --format json` (documented in docs/reference/json.md)."""

from __future__ import annotations

from dossier.findings import Finding, Measure, Source, counts
from dossier.problems import Problem
from dossier.reading.yaml_source import dotted

SHAPE_VERSION = 1


def measure_json(measure: Measure | None):
    if measure is None:
        return None
    quantity = measure.quantity
    if hasattr(quantity, "units"):
        return {"label": measure.label, "value": float(quantity.magnitude), "unit": f"{quantity.units:~P}" or "1"}
    return {"label": measure.label, "value": quantity, "unit": None}


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


def record_json(file: str, findings: list[Finding], locate) -> dict:
    tally = counts(findings)
    return {
        "file": file,
        "valid": True,
        "counts": {verdict.value: n for verdict, n in tally.items()},
        "findings": [finding_json(f, locate) for f in findings],
    }


def signoff_json(state) -> dict:
    """The revision's sign-off state and each sign-off file with whether it is stale."""
    files = [{"file": str(j.signoff.path), "reviewer": j.entry.reviewer, "date": j.entry.date.isoformat(),
              "clearance": j.entry.clearance.value, "stale": j.stale} for j in state.signoffs]
    return {"state": state.state.value, "signoffs": files}


def invalid_json(file: str, problems: list[Problem]) -> dict:
    return {"file": file, "valid": False, "problems": [problem_json(p) for p in problems]}
