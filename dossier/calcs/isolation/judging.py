"""Isolation calc: how its findings are made and judged, shared by the basic-standard and product-standard checks."""

from __future__ import annotations

from dataclasses import replace

from dossier.calcs.isolation import words
from dossier.calcs.isolation.inputs import Site
from dossier.calcs.shared.finding_kit import maker
from dossier.citations import IEC_60335_1, IEC_61010_1, IEC_61558_1, IEC_62368_1
from dossier.findings import Finding, Verdict, judge

NAME = "isolation"
finding = maker(NAME)
MARGINAL_WITHIN = 0.10  # dossier's own band: within 10 % of the requirement is marginal
STANDARD_SOURCES = {
    "iec-62368-1": IEC_62368_1, "iec-60335-1": IEC_60335_1, "iec-61010-1": IEC_61010_1, "iec-61558-1": IEC_61558_1,
}


def standard_source(standard, clause: str):
    """The product standard's citation with its edition and the clause or table used."""
    return replace(STANDARD_SOURCES[standard.key], edition=standard.edition_text, clause=clause)


def verdict(site: Site, declared, required) -> Verdict:
    if site.guidance_only:
        return Verdict.INFO
    return judge(declared.to("mm"), required.to("mm"), ">=", MARGINAL_WITHIN)


def unassessed_verdict(site: Site) -> Verdict:
    """A safety barrier that cannot be assessed blocks power-up (not assessed, guarding a hazard); functional insulation is guidance."""
    return Verdict.INFO if site.guidance_only else Verdict.NOT_ASSESSED


def not_assessed(site: Site, code: str, what: str, reason: str, keys: tuple, source) -> Finding:
    return finding(code=code, subject=site.barrier.name, title=words.not_assessed_title(what, site),
                   verdict=unassessed_verdict(site), explanation=words.not_assessed_text(reason, site),
                   keys=keys, sources=(source,), guards_hazard=not site.guidance_only)
