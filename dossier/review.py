"""Running every calc over a validated record."""

from __future__ import annotations

from dossier.findings import Finding, Verdict
from dossier.plugins import Calc, load_calcs
from dossier.standards.chemistries import registry as chemistry_registry


def load_plugins() -> list[Calc]:
    """Every installed plugin, checked before any record is read: the calcs, and the battery chemistries a
    record may name. A broken one raises PluginError or ChemistryError naming it (the command exits 3);
    it is never reported as a problem in the user's record."""
    chemistry_registry()
    return load_calcs()


def review(record, calcs: list[Calc]) -> list[Finding]:
    """All findings for one record, calc by calc, in a stable order."""
    findings: list[Finding] = []
    for calc in calcs:
        findings.extend(_run_one(calc, record))
    return findings


def _run_one(calc: Calc, record) -> list[Finding]:
    try:
        found = list(calc.run(record))
    except Exception as error:  # a calc bug must not hide the other calcs' findings
        return [_crashed(calc, error)]
    undeclared = sorted({f.code for f in found} - set(calc.codes))
    if undeclared:
        return found + [_crashed(calc, ValueError(f"emitted undeclared codes {', '.join(undeclared)}"))]
    return found


def _crashed(calc: Calc, error: Exception) -> Finding:
    return Finding(
        code="CALC-ERROR",
        calc=calc.name,
        subject=calc.name,
        title=f"The {calc.title} calc failed",
        verdict=Verdict.FAIL,
        explanation=f"{type(error).__name__}: {error}. This is a fault in the calc, not in the record; please report it.",
    )
