"""Isolation calc: the voltages and conditions a barrier is dimensioned for, each with how it was found."""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.calcs.isolation import words
from dossier.calcs.shared import variac
from dossier.standards import iec60664 as std
from dossier.units import Q_

ASSUMED_CATEGORY = "II"
DOUBLED_GRADES = ("reinforced", "double")


@dataclass(frozen=True)
class Reading:
    """How a value between two table rows is read: the next row up, or interpolated on a named clause."""

    interpolated: bool = False
    clause: str = ""


NEXT_ROW_UP = Reading()


@dataclass(frozen=True)
class Site:
    """One barrier and where it sits in the record."""

    index: int
    barrier: object

    def key(self, *path) -> tuple:
        return ("barriers", self.index, *path)

    @property
    def grade(self) -> str:
        return self.barrier.grade

    @property
    def guidance_only(self) -> bool:
        return self.barrier.grade == "functional"

    @property
    def doubled(self) -> bool:
        """Reinforced and double insulation: dimensioned above the basic values."""
        return self.barrier.grade in DOUBLED_GRADES

    @property
    def touches_mains(self) -> bool:
        return any(side.strip().lower() == "mains" for side in self.barrier.between)


@dataclass(frozen=True)
class Working:
    """The working voltage across a barrier: r.m.s. or d.c. for the creepage table, peak for the clearance."""

    creepage_voltage: object
    peak: object
    notes: tuple[str, ...]
    keys: tuple[tuple, ...]
    from_mains: bool = False


@dataclass(frozen=True)
class Inputs:
    """The voltages and conditions a barrier is dimensioned for, each with how it was found."""

    working: Working
    supply: object
    category: str
    pollution_degree: int
    altitude: object
    supply_note: str
    reading: Reading = NEXT_ROW_UP

    @property
    def creepage_voltage(self):
        return self.working.creepage_voltage

    @property
    def working_peak(self):
        return self.working.peak

    @property
    def notes(self) -> tuple[str, ...]:
        return (*self.working.notes, self.supply_note)

    @property
    def voltage_keys(self) -> tuple[tuple, ...]:
        return self.working.keys

    @property
    def supply_keys(self) -> tuple[tuple, ...]:
        return (("mains", "overvoltage_category"), ("environment", "pollution_degree"), ("environment", "altitude"))


def derive_inputs(record, site: Site, working: Working, reading: Reading = NEXT_ROW_UP) -> Inputs:
    supply, category, supply_note = supply_of(record, working)
    environment = record.environment
    return Inputs(working, supply, category, environment.pollution_degree, environment.altitude, supply_note, reading)


def working_of(record, site: Site) -> Working | None:
    """The declared working voltages; the mains nominal for a barrier between mains and something; else None."""
    barrier = site.barrier
    if barrier.working_voltage is not None or barrier.working_dc is not None:
        return _declared(site)
    if site.touches_mains and record.mains is not None:
        return _from_mains(record, site)
    if barrier.working_peak is not None:
        return _peak_only(site)
    return None


def _declared(site: Site) -> Working:
    ac, dc = site.barrier.working_voltage, site.barrier.working_dc
    parts = [q for q in (ac, dc) if q is not None]
    creepage = sum(parts[1:], parts[0])
    steady_peak = (ac * math.sqrt(2) if ac is not None else Q_(0, "V")) + (dc if dc is not None else Q_(0, "V"))
    keys = tuple(site.key(name) for name, q in (("working_voltage", ac), ("working_dc", dc)) if q is not None)
    peak, peak_note = _with_recurring_peak(site, steady_peak, words.steady_peak_note(ac, dc))
    return Working(creepage, peak, (words.declared_working_note(ac, dc), words.creepage_declared_note(ac, dc), peak_note),
                   keys + _peak_key(site))


def _from_mains(record, site: Site) -> Working:
    """The mains nominal; a variac whose top of scale is above it puts that on its side of any mains barrier (the
    harsher reading: the record does not say which side of the barrier it feeds)."""
    raised = variac.raises_mains(record)
    nominal = record.protection.variac.top_voltage if raised else record.mains.nominal
    volts = nominal.to("V").magnitude
    row, listed = std.rationalised_voltage(volts)
    peak, peak_note = _with_recurring_peak(site, nominal * math.sqrt(2), words.MAINS_PEAK_NOTE)
    first = words.variac_working_note(record.protection.variac.ref, nominal, record.mains.nominal) if raised else words.mains_working_note(nominal)
    notes = (first, words.rationalised_note(volts, row, listed), peak_note)
    keys = (("mains", "nominal"), site.key("working_voltage")) + ((variac.VARIAC_KEY,) if raised else ()) + _peak_key(site)
    return Working(Q_(row, "V"), peak, notes, keys, True)


def _peak_only(site: Site) -> Working:
    peak = site.barrier.working_peak
    return Working(peak, peak, (words.peak_only_note(peak),), (site.key("working_peak"), site.key("working_voltage")))


def _with_recurring_peak(site: Site, steady_peak, steady_note: str):
    """The larger of the steady peak and a declared recurring peak, with how it was found."""
    declared = site.barrier.working_peak
    if declared is None or declared <= steady_peak:
        return steady_peak, words.peak_note(steady_peak, steady_note, declared)
    return declared, words.peak_note(declared, words.DECLARED_PEAK_NOTE, None)


def _peak_key(site: Site) -> tuple:
    return (site.key("working_peak"),) if site.barrier.working_peak is not None else ()


def supply_of(record, working: Working):
    """Line-to-neutral voltage and overvoltage category for Table F.1."""
    mains = record.mains
    if mains is not None:
        return mains.nominal, mains.overvoltage_category, words.supply_note(mains)
    return working.creepage_voltage, ASSUMED_CATEGORY, words.no_mains_supply_note(ASSUMED_CATEGORY)


def material_group_of(barrier) -> tuple[str, str]:
    """The worse of the declared group and the CTI's; raises OutsideTable for a CTI below 100."""
    declared, cti = barrier.material_group, barrier.cti
    from_cti = std.material_group(cti) if cti is not None else None
    if declared is None:
        return from_cti, words.group_from_cti(from_cti, cti)
    if from_cti is None or from_cti == declared:
        return declared, words.group_declared(declared)
    worse = std.worse_group(declared, from_cti)
    return worse, words.group_contradiction(declared, cti, from_cti, worse)


def material_keys(site: Site) -> tuple:
    barrier = site.barrier
    return tuple(site.key(name) for name in ("material_group", "cti") if getattr(barrier, name) is not None)
