"""Running every calc over a validated record: its findings, and the products later stages use."""

from __future__ import annotations

from dataclasses import dataclass, field

from dossier.findings import Finding, Verdict
from dossier.plugins import Calc, CalcResult, load_calcs
from dossier.standards.chemistries import registry as chemistry_registry


CALC_ERROR = "CALC-ERROR"


@dataclass(frozen=True)
class Review:
    """Every calc's findings, and the products each calc handed on, keyed by calc name then product name.

    A calc that crashed hands on nothing: a later stage that finds no product says so instead of computing it.
    """

    findings: tuple[Finding, ...]
    products: dict[str, dict[str, object]] = field(default_factory=dict)

    def product(self, calc: str, name: str):
        """The product, or None when the calc did not run, crashed or had nothing to hand on."""
        return self.products.get(calc, {}).get(name)


def run_review(record, calcs: list[Calc]) -> Review:
    """All findings for one record, calc by calc, in a stable order, with every calc's products."""
    findings: list[Finding] = []
    products: dict[str, dict[str, object]] = {}
    for calc in calcs:
        found, handed_on = _run_one(calc, record)
        findings.extend(found)
        if handed_on:
            products[calc.name] = handed_on
    return Review(tuple(findings), products)


def load_plugins() -> list[Calc]:
    """Every installed plugin, checked before any record is read: the calcs, and the battery chemistries a
    record may name. A broken one raises PluginError or ChemistryError naming it (the command exits 3);
    it is never reported as a problem in the user's record."""
    chemistry_registry()
    return load_calcs()


def review(record, calcs: list[Calc]) -> list[Finding]:
    """The findings alone, for callers that need no products."""
    return list(run_review(record, calcs).findings)


def _run_one(calc: Calc, record) -> tuple[list[Finding], dict[str, object]]:
    try:
        found, products = _results(calc.run(record))
    except Exception as error:  # a calc bug must not hide the other calcs' findings
        return [_crashed(calc, error)], {}
    wrong = _undeclared(found, products, calc)
    if wrong:
        return found + [_crashed(calc, ValueError(wrong))], {}
    return found, products


def _results(returned) -> tuple[list[Finding], dict[str, object]]:
    products = returned.products if isinstance(returned, CalcResult) else {}
    return list(returned), dict(products)


def _undeclared(found: list[Finding], products: dict[str, object], calc: Calc) -> str:
    codes = sorted({f.code for f in found} - set(calc.codes))
    names = sorted(set(products) - set(calc.products))
    parts = ([f"emitted undeclared codes {', '.join(codes)}"] if codes else [])
    parts += ([f"handed on undeclared products {', '.join(names)}"] if names else [])
    return "; ".join(parts)


def _crashed(calc: Calc, error: Exception) -> Finding:
    return Finding(
        code=CALC_ERROR,
        calc=calc.name,
        subject=calc.name,
        title=f"The {calc.title} calc failed",
        verdict=Verdict.FAIL,
        explanation=f"{type(error).__name__}: {error}. This is a fault in the calc, not in the record; please report it.",
    )
