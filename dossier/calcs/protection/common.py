"""What the protection checks share: the finding maker, their sources and small helpers."""

from __future__ import annotations

import dataclasses

from dossier.calcs.shared.finding_kit import maker
from dossier.citations import EDN_FUSE_CHECKLIST, FUSEOLOGY, IEC_60050_131, IEC_60127_1
from dossier.findings import Measure, Source, Verdict, common_practice

CALC_NAME = "protection"

finding = maker(CALC_NAME)

FUSEOLOGY_DATED = dataclasses.replace(FUSEOLOGY, edition="undated edition on the maker's site (charts and selection factors as cited)")
FUSEOLOGY_RUNNING = dataclasses.replace(FUSEOLOGY_DATED, clause="selection factors: 75 % of rating at 25 degC, temperature re-rating")
FUSEOLOGY_VOLTAGE = dataclasses.replace(FUSEOLOGY_DATED, clause="selection factors: voltage rating at least the circuit voltage")
FUSEOLOGY_WAVESHAPES = dataclasses.replace(FUSEOLOGY_DATED, clause="chart: I^2 t of pulse waveshapes")
FUSEOLOGY_PULSE_CYCLES = dataclasses.replace(FUSEOLOGY_DATED, clause="chart: pulse-cycle withstand capability")
IEC_60127_SERIES = dataclasses.replace(
    IEC_60127_1, edition="edition 2.0, 2006, with amendments 1 (2011) and 2 (2015) (edition from memory)",
    clause="Annex A, preferred rated currents (315 mA to 10 A confirmed; 32 to 250 mA the same R10 steps, from memory)",
)
POWER_FACTOR = dataclasses.replace(IEC_60050_131, edition="edition 2.0, 2002 (from memory)", clause="131-11-46, power factor: active power divided by apparent power (entry number from memory)")
RERATING_LINE = common_practice("fuse ambient re-rating as a straight line, 100 % at 25 degC less 0.5 % per kelvin (from memory)")
RUNNING_SOURCES = (FUSEOLOGY_RUNNING, EDN_FUSE_CHECKLIST, RERATING_LINE)
HALF_SINE_PULSES = common_practice(
    "capacitor-input current as half-sine pulses centred on the voltage crest; the pulse width is the one that gives the power factor"
)
CAPACITOR_INPUT_POWER_FACTOR = Source(
    title="Input current / power factor explained", publisher="Wellforces (power-supply maker), technical resources",
    clause="power factor of a typical switch-mode supply without PFC: 0.4 to 0.6", kind="application-note",
)
OTHER_POWER_FACTORS = common_practice(
    "power factor of a mains transformer feeding a capacitor-input rectifier 0.55 to 0.8; of an input with no bulk capacitor 0.7 to 1 (from memory)"
)
PLAUSIBLE_EFFICIENCY = common_practice("efficiency of a small mains unit between 60 % (small linear supply) and 90 % (switch-mode) (from memory)")
NTC_GUIDES = common_practice("NTC inrush-limiter makers' selection guides: energy 1/2 C V_peak^2 against the rated energy; residual resistance at running current")
RC_CHARGE = common_practice("charging a capacitor through a resistance: i = (V / R) e^(-t / RC) (circuit theory)")


def measure(label: str, quantity) -> Measure:
    return Measure(label, quantity)


def lowered(verdict: Verdict, missing: list[str]) -> Verdict:
    """A finding that had to assume a value it was not given is only information."""
    return Verdict.INFO if missing else verdict


def percent(ratio) -> float:
    return round(float(ratio) * 100, 1)
