"""Temperature and the charge setpoints: the band of battery temperatures over which a charger's
setpoints stay inside the chemistry's windows, and the compensation finding built on it.

Both the setpoint and the window are straight lines in battery temperature T:

    setpoint(T) = setpoint(25 degC) + k_charger x (T - 25 degC)      (k_charger = 0 without compensation)
    window(T)   = window(25 degC)   + k_chemistry x (T - 25 degC)    (k_chemistry: cells x typical per cell)

so each window edge allows T on one side of a crossing point, and the band is where all edges allow it.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.calcs.charge.windows import nearer_edge
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.standards.battery import REFERENCE_TEMPERATURE
from dossier.units import Q_, fmt

DRIFT_ALLOWANCE_K = 5.0
DRIFT_SOURCE = common_practice(
    "allow about 5 K of battery-temperature drift around the declared figure: a battery warms while it charges "
    "and the room around it changes (from memory)"
)
ROUNDING = 9


@dataclass(frozen=True)
class Band:
    """Battery temperatures (degC) from coldest to warmest at which every setpoint is in its window."""

    coldest: float
    warmest: float

    @property
    def empty(self) -> bool:
        return self.coldest > self.warmest

    def room(self, span: tuple[float, float]) -> float:
        """Kelvin to spare beyond the expected span on its tighter side (negative when the span leaves the band)."""
        return min(span[0] - self.coldest, self.warmest - span[1])


def allowed(gap: float, slope: float) -> tuple[float, float]:
    """The x (kelvin from 25 degC) for which gap + slope * x >= 0."""
    gap = round(gap, ROUNDING)
    if abs(slope) < 1e-12:
        return (-math.inf, math.inf) if gap >= 0 else (math.inf, -math.inf)
    crossing = -gap / slope
    return (crossing, math.inf) if slope > 0 else (-math.inf, crossing)


def edge_limits(setpoint: float, low: float, high: float, slope: float) -> list[tuple[float, float]]:
    """Limits from one window; slope is k_charger - k_chemistry in V/K."""
    return [allowed(setpoint - low, slope), allowed(high - setpoint, -slope)]


def band(pairs, charger_slope: float, window_slope: float) -> Band:
    """pairs: (setpoint at 25 degC, window low, window high) in volts, one per stage."""
    limits = [limit for pair in pairs for limit in edge_limits(*pair, charger_slope - window_slope)]
    offset = REFERENCE_TEMPERATURE.magnitude
    return Band(max(low for low, _ in limits) + offset, min(high for _, high in limits) + offset)


def charger_band(charger) -> Band:
    battery = charger.battery
    pairs = [_pair(battery.absorption_voltage, charger.absorption_window(REFERENCE_TEMPERATURE))]
    float_window = charger.float_window(REFERENCE_TEMPERATURE)
    if battery.float_voltage is not None and float_window is not None:
        pairs.append(_pair(battery.float_voltage, float_window))
    charger_slope = battery.compensation.to("V/K").magnitude if battery.compensation is not None else 0.0
    return band(pairs, charger_slope, charger.window_slope.to("V/K").magnitude)


def _pair(setpoint, window) -> tuple[float, float, float]:
    return setpoint.to("V").magnitude, window.low.to("V").magnitude, window.high.to("V").magnitude


def expected_span(battery) -> tuple[float, float]:
    low, high = battery.temperature_span
    return low.to("degC").magnitude, high.to("degC").magnitude


def compensation_finding(charger) -> Finding | None:
    chem, battery = charger.chemistry, charger.battery
    if chem.compensation is None:
        return None if battery.compensation is None else _not_wanted(charger)
    if battery.compensation is None:
        return _without_compensation(charger)
    return _with_compensation(charger)


def _coefficient_verdict(per_cell, window) -> Verdict:
    if per_cell.magnitude >= 0:
        return Verdict.FAIL
    inside = window.low <= per_cell <= window.high
    return Verdict.PASS if inside else Verdict.MARGINAL


def _with_compensation(charger) -> Finding:
    battery, chem = charger.battery, charger.chemistry
    per_cell = (battery.compensation / battery.cells).to("mV/K")
    limit, relation = nearer_edge(per_cell, chem.compensation, f"{chem.label} per-cell coefficient")
    verdict = _coefficient_verdict(per_cell, chem.compensation)
    room_verdict, room_text = _room_judgement(charger)
    verdict = min(verdict, room_verdict, key=lambda v: v.rank)
    return _finding(
        charger,
        title=f"Temperature compensation of {fmt(battery.compensation)} against {chem.label}",
        verdict=verdict,
        values=(Measure("declared coefficient per cell", per_cell),),
        limit=limit,
        relation=relation,
        explanation=" ".join(part for part in (_coefficient_text(per_cell, verdict), room_text) if part),
        keys=(("output", "battery", "compensation"),),
        sources=chem.compensation.sources,
    )


def _coefficient_text(per_cell, verdict) -> str:
    if per_cell.magnitude >= 0:
        return (f"The coefficient {fmt(per_cell)} per cell raises the setpoints as the battery warms; it must be negative, "
                "or a warm battery is driven harder and can run away thermally.")
    return ""


def _without_compensation(charger) -> Finding:
    battery, chem = charger.battery, charger.chemistry
    verdict, text = _room_judgement(charger)
    room = charger_band(charger).room(expected_span(battery))
    return _finding(
        charger,
        title=f"No temperature compensation declared for the {chem.label} battery",
        verdict=Verdict.INFO if verdict is Verdict.PASS else verdict,
        values=(Measure("room in the windows beyond the expected battery temperatures", _kelvin(room)),),
        limit=Measure("allowance for battery-temperature drift", Q_(DRIFT_ALLOWANCE_K, "K")),
        relation=">=",
        explanation=text + " A fixed setpoint suits a battery kept near one temperature; otherwise fit compensation "
        f"(about {fmt(chem.typical_compensation * battery.cells)} for this battery, a sensor on the battery) "
        "or declare lowest_temperature and highest_temperature so the range is checked.",
        keys=(("output", "battery"),),
        sources=chem.compensation.sources + (DRIFT_SOURCE,),
    )


def _room_judgement(charger) -> tuple[Verdict, str]:
    found = charger_band(charger)
    span = expected_span(charger.battery)
    if found.empty:
        return Verdict.FAIL, "No battery temperature puts every setpoint inside its window at once."
    room = found.room(span)
    text = f"The setpoints stay inside the {charger.chemistry.label} windows for battery temperatures {_band_text(found)}. "
    if room < 0:
        return Verdict.FAIL, text + f"Part of the expected range, {_span_text(span)}, is outside that."
    if room < DRIFT_ALLOWANCE_K:
        return Verdict.MARGINAL, text + _tight_side_text(found, span, room)
    return Verdict.PASS, text


def _tight_side_text(found: Band, span: tuple[float, float], room: float) -> str:
    colder = span[0] - found.coldest <= found.warmest - span[1]
    side, effect = ("below", "undercharged") if colder else ("above", "overcharged")
    if room < 0.05:
        return f"There is no room {side} the expected {_span_text(span)}: a battery any {'colder' if colder else 'warmer'} is {effect}."
    return f"That leaves only {fmt(_kelvin(room))} {side} the expected {_span_text(span)} before the battery is {effect}."


def _not_wanted(charger) -> Finding:
    return _finding(
        charger,
        title=f"Temperature compensation declared for {charger.chemistry.label}",
        verdict=Verdict.MARGINAL,
        values=(Measure("declared coefficient", charger.battery.compensation),),
        explanation=f"The {charger.chemistry.title} window takes no temperature compensation; check the maker's charging guide.",
        keys=(("output", "battery", "compensation"),),
        sources=charger.chemistry.absorption.sources,
    )


def _finding(charger, **fields) -> Finding:
    return Finding(code="CHG-COMPENSATION", calc="charge", subject="battery", method=METHOD, **fields)


def _kelvin(value: float):
    return Q_(round(value, 3), "K")


def _band_text(found: Band) -> str:
    if math.isinf(found.coldest) and math.isinf(found.warmest):
        return "at any temperature"
    if math.isinf(found.coldest):
        return f"up to {found.warmest:.0f} °C"
    if math.isinf(found.warmest):
        return f"from {found.coldest:.0f} °C up"
    return f"from {found.coldest:.0f} to {found.warmest:.0f} °C"


def _span_text(span: tuple[float, float]) -> str:
    if span[0] == span[1]:
        return f"{span[0]:g} °C"
    return f"{span[0]:g} to {span[1]:g} °C"


METHOD = (
    "setpoint(T) = setpoint(25 degC) + k_charger (T - 25 degC); window(T) = window(25 degC) + cells x k_cell (T - 25 degC); "
    "the band is the battery temperatures where every setpoint is inside its window"
)
