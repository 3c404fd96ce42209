"""A transformer-fed rail's rise from full load to no load, from the windings' resistances.

The winding's source resistance, the primary's referred through the turns ratio:
  R_s = R_primary (N_s / N_p)^2 + R_secondary              (both at the winding's hot temperature)
and the rise V_no-load / V_loaded - 1 by what follows the winding:
  AC rail (a heater winding), resistive load:   rise = I R_s / V          (leakage reactance neglected)
  capacitor-input rectifier (large C):          tan theta - theta = pi R_s / (n R_L),  V_dc = V_pk cos theta - V_r / 2,
      n the charging pulses per cycle (2 full-wave, 1 half-wave, 1/2 a full-wave doubler, whose two capacitors each
      carry the load current and charge once a cycle), R_L = V_dc / I the load the rectifier sees, theta the half
      conduction angle; with no load the reservoir charges to the peak, so rise = V_pk / V_loaded - 1
  choke-input filter:                            V_dc = (2 / pi) V_pk - I (R_s + R_choke), and with no load (below the
      critical current) it rises to the peak: rise = V_pk / V_loaded - 1                              (harsher reading)
A choke's DC resistance between the reservoir and the rail drops I R_choke under load, which the no-load rail gets back.
The capacitor-input relation is the classic analysis of a rectifier with source resistance feeding a large reservoir
(O. H. Schade, "Analysis of rectifier operation", Proc. IRE 31 (1943); its curves are reproduced in The ARRL Handbook's
power-supplies chapter and the RCA and Radiotron handbooks).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

FULL_WAVE = ("bridge", "centre-tapped", "valve-centre-tapped")
HALF_WAVE = ("half-wave", "valve-half-wave")
HALF_OF_WINDING = ("centre-tapped", "valve-centre-tapped")
PULSES = {**{name: 2.0 for name in FULL_WAVE}, **{name: 1.0 for name in HALF_WAVE}, "doubler": 0.5}


@dataclass(frozen=True)
class WindingFigures:
    """One winding of a wound component, as the magnetics calc works it out.

    resistance  DC resistance of the whole winding at the hot temperature (None: its mean turn is not known)
    cold        the same at 20 degC
    peak        its no-load peak voltage at nominal line, from the turns ratio (None: the drive is not known)
    key         record key path of the winding
    """

    ref: str
    magnetic: int
    position: int
    name: str
    role: str
    turns: float
    centre_tap: bool
    resistance: object
    cold: object
    temperature: object
    peak: object
    key: tuple

    @property
    def label(self) -> str:
        return f"{self.ref} {self.name}"


def referred_resistance(primary: WindingFigures, secondary: WindingFigures, half: bool):
    """R_s = R_p (N_s / N_p)^2 + R_s; half: one half of a centre-tapped secondary conducts at a time."""
    turns, resistance = (secondary.turns / 2, secondary.resistance / 2) if half else (secondary.turns, secondary.resistance)
    return (primary.resistance * (turns / primary.turns) ** 2 + resistance).to("ohm")


def conduction_angle(ratio: float) -> float:
    """theta in (0, pi/2) with tan theta - theta = ratio (bisection; the left side rises monotonically)."""
    low, high = 0.0, math.pi / 2 - 1e-12
    for _ in range(200):
        middle = (low + high) / 2
        if math.tan(middle) - middle < ratio:
            low = middle
        else:
            high = middle
    return (low + high) / 2


def capacitor_input_peak(loaded, current, source, pulses: float, ripple=None):
    """The winding's rectified peak that gives `loaded` at the reservoir: (V_dc + V_r / 2) / cos theta."""
    load = (loaded / current).to("ohm")
    theta = conduction_angle(math.pi * (source / (pulses * load)).to("").magnitude)
    lifted = loaded + (ripple / 2 if ripple is not None else 0 * loaded)
    return (lifted / math.cos(theta)).to(loaded.units), theta


def choke_input_peak(loaded, current, resistance):
    """V_pk = (pi / 2)(V_dc + I R): the peak a choke-input filter's output rises to with no load."""
    return (math.pi / 2 * (loaded + current * resistance)).to(loaded.units)


def ac_rise(loaded, current, source) -> float:
    return float((current * source / loaded).to("").magnitude)
