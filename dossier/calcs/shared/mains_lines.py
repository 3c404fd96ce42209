"""The mains at low, nominal and high line, as RMS and as peak: one place for every calc that needs them.

Low and high line are the nominal voltage less and plus the record's tolerance (dossier.record.supply.Mains).
A peak is sqrt 2 times the RMS of a sine, taken with no diode drop and no ripple: the worst case for flux
density, reverse voltage and switch-on current at high line.
"""

from __future__ import annotations

import math

LINES = ("low", "nominal", "high")
HIGH_PEAK_FORMULA = "sqrt(2) x V_mains x (1 + tolerance)"


def line_rms(mains) -> dict:
    """Mains RMS voltage at low, nominal and high line."""
    return {"low": mains.low, "nominal": mains.nominal, "high": mains.high}


def line_peaks(mains) -> dict:
    """Crest of the mains sine at low, nominal and high line: the rectified peak, no diode drop."""
    return {line: (value * math.sqrt(2)).to("V") for line, value in line_rms(mains).items()}


def high_line_peak(mains):
    """Crest of the highest mains voltage: sqrt 2 (1 + tolerance) V_nominal."""
    return line_peaks(mains)["high"]
