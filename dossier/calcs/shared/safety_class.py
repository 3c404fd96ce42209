"""Which X or Y class (IEC 60384-14) a suppression capacitor needs where it sits.

A class is accepted when it is tested for at least the impulse its position can bring: across the line, the
rated impulse voltage of the mains' overvoltage category (IEC 60664-1 Table F.1); from line to earth, a Y
class for basic insulation; across a barrier, a Y class for the barrier's grade (Y1 for reinforced or double).
The subclass impulse figures are recalled from IEC 60384-14, not read from it: marked 'from memory'. That one Y1
bridges reinforced insulation and one Y2 basic (mains up to 300 V, category II) is IEC 62368-1 ed. 3 Table G.12,
confirmed in a test house's public answer on the standard.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from dossier.citations import IEC_60384_14, IEC_60664_1, IEC_62368_1
from dossier.findings import Source
from dossier.standards import iec60664

# Peak impulse voltage (kV) each subclass is tested to, IEC 60384-14 subclass tables (from memory);
# Y3 has no impulse test.
IMPULSE_KV = {"X1": 4.0, "X2": 2.5, "X3": 1.2, "Y1": 8.0, "Y2": 5.0, "Y3": 0.0, "Y4": 2.5}
# Insulation a Y subclass may bridge (IEC 60384-14, from memory).
Y_BRIDGES = {"Y1": ("basic", "supplementary", "reinforced", "double"), "Y2": ("basic", "supplementary"), "Y4": ("basic", "supplementary")}
# Highest line voltage (V RMS) each Y subclass is made for (IEC 60384-14, from memory).
Y_MAX_LINE = {"Y1": 500, "Y2": 300, "Y4": 150}

CLASS_SOURCE = replace(IEC_60384_14, edition="edition 4.0, 2013, with amendment 1, 2016",
                       clause="subclasses X1-X3 and Y1-Y4: impulse test voltages and rated voltage ranges (from memory)")
# Which Y subclass may bridge which insulation is set by the product standard.
BRIDGING_SOURCE = replace(IEC_62368_1, edition="edition 3.0, 2018", clause=(
    "clause G.11.3 and Table G.12: one Y1 capacitor may bridge reinforced insulation and one Y2 basic insulation, "
    "for mains up to 300 V in overvoltage category II (confirmed in a test house's public answer on the standard); "
    "other voltages and categories, and Y4, from memory"))
IMPULSE_SOURCE = replace(IEC_60664_1, clause="Table F.1")


@dataclass(frozen=True)
class Requirement:
    accepted: tuple[str, ...]
    reason: str
    sources: tuple[Source, ...]


def rated_impulse_kv(line_to_neutral_volts: float, category: str) -> float | None:
    """Rated impulse voltage (IEC 60664-1 Table F.1) for a line-to-neutral voltage and category, or None above 1000 V."""
    try:
        return iec60664.rated_impulse_voltage(line_to_neutral_volts, category) / 1000
    except iec60664.OutsideTable:
        return None


def across_line(nominal_volts: float, category: str) -> Requirement | None:
    impulse = rated_impulse_kv(nominal_volts, category)
    if impulse is None:
        return None
    accepted = tuple(name for name, kv in IMPULSE_KV.items() if kv >= impulse and _made_for(name, nominal_volts))
    reason = f"across the line of a {nominal_volts:g} V supply in overvoltage category {category} it must take a {impulse:g} kV impulse"
    return Requirement(accepted, reason, (CLASS_SOURCE, IMPULSE_SOURCE))


def _made_for(name: str, nominal_volts: float) -> bool:
    return nominal_volts <= Y_MAX_LINE.get(name, float("inf"))


def bridging(grade: str, nominal_volts: float) -> Requirement | None:
    """A capacitor that bridges insulation of this grade; None for functional insulation (no class needed)."""
    if grade == "functional":
        return None
    accepted = tuple(name for name, grades in Y_BRIDGES.items() if grade in grades and _made_for(name, nominal_volts))
    reason = f"it bridges {grade} insulation on a {nominal_volts:g} V supply, which only a Y class made for that may do"
    return Requirement(accepted, reason, (BRIDGING_SOURCE, CLASS_SOURCE))


def barrier_grade(record, ref: str) -> tuple[str, str]:
    """(grade, how it was found) of the barrier a capacitor bridges: the one listing it, else the strictest mains barrier."""
    for barrier in record.barriers:
        if ref in barrier.parts:
            return barrier.grade, f"barrier '{barrier.name}' lists it"
    mains = [b.grade for b in record.barriers if "mains" in b.between]
    for grade in ("reinforced", "double", "supplementary", "basic"):
        if grade in mains:
            return grade, f"the strictest barrier from the mains is {grade}"
    return "reinforced", "no barrier names it, so reinforced is assumed"
