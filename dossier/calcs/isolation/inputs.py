"""Isolation calc: the voltages and conditions a barrier is dimensioned for, each with how it was found."""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.standards import iec60664 as std
from dossier.units import Q_, fmt

ASSUMED_CATEGORY = "II"


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


@dataclass(frozen=True)
class Inputs:
    """The voltages and conditions a barrier is dimensioned for, each with how it was found."""

    working_rms: object
    working_peak: object
    creepage_voltage: object
    supply: object
    category: str
    pollution_degree: int
    altitude: object
    rms_note: str
    peak_note: str
    creepage_note: str
    supply_note: str
    rms_key: tuple

    @property
    def notes(self) -> tuple[str, ...]:
        return (self.rms_note, self.peak_note, self.creepage_note, self.supply_note)

    @property
    def supply_keys(self) -> tuple[tuple, ...]:
        return (("mains", "overvoltage_category"), ("environment", "pollution_degree"), ("environment", "altitude"))


def derive_inputs(record, site: Site) -> Inputs:
    rms, rms_note, rms_key = working_rms(record, site)
    peak = site.barrier.working_peak if site.barrier.working_peak is not None else rms * math.sqrt(2)
    creepage_voltage, creepage_note = creepage_voltage_of(record, site)
    supply, category, supply_note = supply_of(record, rms)
    environment = record.environment
    return Inputs(rms, peak, creepage_voltage, supply, category, environment.pollution_degree, environment.altitude,
                  rms_note, peak_note(site, peak), creepage_note, supply_note, rms_key)


def working_rms(record, site: Site):
    """(RMS working voltage, how it was found, the record key it came from)."""
    declared = site.barrier.working_voltage
    if declared is not None:
        return declared, f"working voltage {fmt(declared)} RMS, declared on the barrier", site.key("working_voltage")
    nominal = record.mains.nominal
    return nominal, f"working voltage {fmt(nominal)} RMS, the mains nominal voltage", ("mains", "nominal")


def peak_note(site: Site, peak) -> str:
    how = "declared on the barrier" if site.barrier.working_peak is not None else "RMS x sqrt 2"
    return f"peak working voltage {fmt(peak)} ({how})"


def creepage_voltage_of(record, site: Site):
    """The voltage Table F.5 is entered with: a declared working voltage, or the mains rationalised by Table F.3."""
    if site.barrier.working_voltage is not None:
        return site.barrier.working_voltage, "Table F.5 entered with the declared working voltage"
    nominal = record.mains.nominal.to("V").magnitude
    row, listed = std.rationalised_voltage(nominal)
    if listed:
        return Q_(row, "V"), f"Table F.3: a {nominal:g} V supply uses the {row:g} V row of Table F.5"
    return Q_(row, "V"), (f"{nominal:g} V is not among the Table F.3 systems held here: "
                          f"the next Table F.5 row up, {row:g} V, is used")


def supply_of(record, rms):
    """Line-to-neutral voltage and overvoltage category for Table F.1."""
    mains = record.mains
    if mains is not None:
        note = f"supply {fmt(mains.nominal)} line to neutral, overvoltage category {mains.overvoltage_category}"
        return mains.nominal, mains.overvoltage_category, note
    note = f"no mains record: Table F.1 entered with the working voltage and overvoltage category {ASSUMED_CATEGORY} (assumed)"
    return rms, ASSUMED_CATEGORY, note


def material_group_of(barrier) -> tuple[str, str]:
    """The declared group, else the group of the CTI; raises OutsideTable below CTI 100."""
    if barrier.material_group is None:
        group = std.material_group(barrier.cti)
        return group, f"material group {group} from CTI {barrier.cti}"
    note = f"material group {barrier.material_group} (declared)"
    if barrier.cti is not None and std.material_group(max(barrier.cti, 100)) != barrier.material_group:
        note += f"; note that CTI {barrier.cti} does not fall in that group: check which is right"
    return barrier.material_group, note


def material_key(site: Site) -> tuple:
    return site.key("material_group" if site.barrier.material_group is not None else "cti")

