"""What the protection checks share: the finding maker, their sources and small helpers."""

from __future__ import annotations

import dataclasses

from dossier.calcs.shared.finding_kit import maker
from dossier.citations import EDN_FUSE_CHECKLIST, FUSEOLOGY, IEC_60050_131, IEC_60127_1
from dossier.findings import Measure, Verdict, common_practice

CALC_NAME = "protection"

finding = maker(CALC_NAME)

FUSEOLOGY_RUNNING = dataclasses.replace(FUSEOLOGY, clause="selection factors: 75 % of rating at 25 degC, temperature re-rating")
FUSEOLOGY_VOLTAGE = dataclasses.replace(FUSEOLOGY, clause="selection factors: voltage rating at least the circuit voltage")
FUSEOLOGY_WAVESHAPES = dataclasses.replace(FUSEOLOGY, clause="chart: I^2 t of pulse waveshapes")
FUSEOLOGY_PULSE_CYCLES = dataclasses.replace(FUSEOLOGY, clause="chart: pulse-cycle withstand capability")
IEC_60127_SERIES = dataclasses.replace(IEC_60127_1, clause="Annex A, preferred rated currents")
POWER_FACTOR = IEC_60050_131
RERATING_LINE = common_practice("fuse ambient re-rating as a straight line, 100 % at 25 degC less 0.5 % per kelvin (from memory)")
RUNNING_SOURCES = (FUSEOLOGY_RUNNING, EDN_FUSE_CHECKLIST, RERATING_LINE)
HALF_SINE_PULSES = common_practice(
    "capacitor-input current as half-sine pulses centred on the voltage crest; the pulse width is the one that gives the power factor"
)
TYPICAL_POWER_FACTORS = common_practice(
    "typical power factor by input: capacitor-input rectifier 0.6, transformer feeding a capacitor-input rectifier 0.7, no bulk capacitor 0.95 (from memory)"
)
TYPICAL_EFFICIENCY = common_practice("typical efficiency of a small mains unit, 75 %, when none is declared (from memory)")
NTC_GUIDES = common_practice("NTC inrush-limiter makers' selection guides: energy 1/2 C V_peak^2 against the rated energy; residual resistance at running current")
RC_CHARGE = common_practice("charging a capacitor through a resistance: i = (V / R) e^(-t / RC) (circuit theory)")


def measure(label: str, quantity) -> Measure:
    return Measure(label, quantity)


def lowered(verdict: Verdict, missing: list[str]) -> Verdict:
    """A finding that had to assume a value it was not given is only information."""
    return Verdict.INFO if missing else verdict


def add_text(missing: list[str]) -> str:
    """' Add protection.bulk_esr and protection.source_resistance.' or ''."""
    if not missing:
        return ""
    return " Add " + " and ".join(missing) + "."


def percent(ratio) -> float:
    return round(float(ratio) * 100, 1)
