"""Building findings the same way in every calc: the maker, the 'not assessed' finding, two-limit verdicts."""

from __future__ import annotations

from functools import partial

from dossier.findings import Finding, Verdict


def maker(calc: str):
    """Finding(...) with the calc's name filled in."""
    return partial(Finding, calc=calc)


def not_assessed(calc: str, code: str, subject: str, title: str, why: str, keys: tuple, sources: tuple = (),
                 guards_hazard: bool = False) -> Finding:
    """A check that could not be made, saying why (and so what to add); on the mains it blocks power-up."""
    return Finding(code=code, calc=calc, subject=subject, title=title, verdict=Verdict.NOT_ASSESSED,
                   explanation=f"Not assessed: {why}.", keys=keys, sources=sources, guards_hazard=guards_hazard)


def banded(value, wanted, bound, relation: str) -> Verdict:
    """Pass when value meets `wanted` (the limit with its allowance); fail beyond `bound` (the hard limit);
    marginal in between. relation '>=' for ratings that must be high enough, '<=' for temperatures."""
    if not meets(value, bound, relation):
        return Verdict.FAIL
    return Verdict.PASS if meets(value, wanted, relation) else Verdict.MARGINAL


def meets(value, limit, relation: str) -> bool:
    """value >= limit or value <= limit; temperatures compared in kelvin, as offset units need."""
    value, limit = _absolute(value), _absolute(limit)
    return value >= limit if relation == ">=" else value <= limit


def _absolute(quantity):
    return quantity.to("K") if str(quantity.units) == "degree_Celsius" else quantity
