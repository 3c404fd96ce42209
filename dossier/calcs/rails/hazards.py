"""Hazardous voltages beyond the mains: each rail's worst case against the extra-low-voltage limits.

A rail is hazardous when its worst case (no load, high line) exceeds the ES1 limit of IEC 62368-1 (60 V DC, 30 V
RMS AC); those limits are lower than the IEC 61140 extra-low-voltage band (120 V ripple-free DC, 50 V AC), so they
are the harsher reading.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.rails import words
from dossier.calcs.shared.finding_kit import maker
from dossier.calcs.shared.rail_voltage import RailVoltage
from dossier.citations import IEC_61140_ELV, IEC_62368_1_ES1
from dossier.findings import Finding, Measure, Verdict
from dossier.standards import iec62368
from dossier.units import Q_

NAME = "rails"
finding = maker(NAME)
SAFE_LIMITS = {"dc": Q_(60, "V"), "ac": Q_(30, "V")}


@dataclass(frozen=True)
class RailHazard:
    """A rail above the safe limit, as the pages, drawings and checklist name it."""

    name: str
    stage: str
    kind: str
    worst: object
    nominal: object
    limit: object
    accessible: bool


def hazardous(found: RailVoltage) -> bool:
    return found.worst > SAFE_LIMITS[found.kind]


def energy_classes(standard, origin: str):
    """Under IEC 62368-1, a function naming a rail's energy-source class; otherwise None (no class is named)."""
    if standard is None or standard.key != iec62368.KEY:
        return None
    return lambda found: iec62368.energy_class(found.worst.to("V").magnitude, found.kind)


def _class_parts(found: RailVoltage, classes) -> tuple[tuple, str]:
    if classes is None:
        return (), ""
    named = classes(found)
    return (Measure(ES_LABEL, named),), " " + words.energy_class(found.name, named)


ES_LABEL = "IEC 62368-1 energy source class"


def voltage_finding(found: RailVoltage, classes=None) -> Finding:
    measures, text = _class_parts(found, classes)
    return finding(
        code="RAILS-VOLTAGE", subject=found.name, title=f"Rail {found.name} at its worst case", verdict=Verdict.INFO,
        values=(Measure("worst case (no load, high line)", found.worst),),
        extra=(Measure("declared (loaded, nominal line)", found.loaded), Measure("no load, nominal line", found.no_load)) + found.measures + measures,
        method=found.formula, explanation=words.worst_case(found) + text, keys=found.keys,
        sources=found.sources + ((IEC_62368_1_ES1,) if classes else ()),
    )


def hazard_finding(record, found: RailVoltage, classes=None) -> Finding:
    rail = record.rails[found.index]
    limit = SAFE_LIMITS[found.kind]
    verdict = Verdict.FAIL if rail.accessible else Verdict.INFO
    keys = found.keys + ((("rails", found.index, "accessible"),) if rail.accessible else ())
    return finding(
        code="RAILS-HAZARD", subject=found.name, title=f"Rail {found.name}: hazardous voltage", verdict=verdict,
        values=(Measure("worst case (no load, high line)", found.worst),),
        limit=Measure(f"ES1 limit ({found.kind.upper()})", limit), relation="<=",
        method="hazardous when V_worst > 60 V DC or 30 V RMS AC",
        explanation=words.hazard(found.name, found.worst, limit, rail.accessible) + _class_parts(found, classes)[1],
        keys=keys, sources=(IEC_62368_1_ES1, IEC_61140_ELV) + found.sources,
        extra=(Measure("accessible", "yes" if rail.accessible else "no"),) + _class_parts(found, classes)[0],
        guards_hazard=True,
    )


def rail_hazard(record, found: RailVoltage) -> RailHazard:
    rail = record.rails[found.index]
    return RailHazard(found.name, rail.stage, found.kind, found.worst, found.loaded, SAFE_LIMITS[found.kind], rail.accessible)
