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

from dossier.calcs.charge import words
from dossier.calcs.charge.curve import compensated
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
    return inside_range(band(pairs, charger_slope, charger.window_slope.to("V/K").magnitude), charger.chemistry.charge_temperature)


def inside_range(found: Band, charging) -> Band:
    """The band cut to the chemistry's charging range: no setpoint is in its window where the battery must not charge."""
    if charging is None:
        return found
    low, high = charging.low.to("degC").magnitude, charging.high.to("degC").magnitude
    return Band(max(found.coldest, low), min(found.warmest, high))


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
        title=words.compensation_title(battery.compensation, chem.label),
        verdict=verdict,
        values=(Measure("declared coefficient per cell", per_cell),),
        limit=limit,
        relation=relation,
        explanation=" ".join(part for part in (_coefficient_text(per_cell, verdict), room_text) if part),
        keys=(("output", "battery", "compensation"),),
        sources=chem.compensation.sources + _range_sources(chem),
        extra=_compensated_measures(charger) + _band_measures(charger) + _room_measure(charger),
    )


def _range_sources(chem) -> tuple:
    return chem.charge_temperature.sources if chem.charge_temperature is not None else ()


def _compensated_measures(charger) -> tuple:
    """The absorption setpoint as the charger sets it at the coldest and warmest expected battery temperature (clamped)."""
    battery = charger.battery
    span = sorted(set(expected_span(battery)))
    return tuple(Measure(words.compensated_label("absorption", t), compensated(battery.absorption_voltage, battery, Q_(t, "degC")))
                 for t in span)


def _band_measures(charger) -> tuple:
    """The numbers the band's sentences print: the expected battery temperatures and the band's finite edges."""
    span = expected_span(charger.battery)
    found = charger_band(charger)
    measures = (Measure("coldest expected battery temperature", Q_(span[0], "degC")),
                Measure("warmest expected battery temperature", Q_(span[1], "degC")))
    if found.empty:
        return measures
    edges = (("coldest battery temperature inside every window", found.coldest),
             ("warmest battery temperature inside every window", found.warmest))
    return measures + tuple(Measure(label, Q_(value, "degC")) for label, value in edges if not math.isinf(value))


def _room_measure(charger) -> tuple:
    found = charger_band(charger)
    room = found.room(expected_span(charger.battery))
    if found.empty or math.isinf(room):
        return ()
    return (Measure("room in the windows beyond the expected battery temperatures", _kelvin(room)),)


def _coefficient_text(per_cell, verdict) -> str:
    if per_cell.magnitude >= 0:
        return words.rising_coefficient(per_cell)
    return ""


def _without_compensation(charger) -> Finding:
    battery, chem = charger.battery, charger.chemistry
    verdict, text = _room_judgement(charger)
    room = charger_band(charger).room(expected_span(battery))
    return _finding(
        charger,
        title=words.no_compensation_title(chem.label),
        verdict=Verdict.INFO if verdict is Verdict.PASS else verdict,
        values=(Measure("room in the windows beyond the expected battery temperatures", _kelvin(room)),),
        limit=Measure("allowance for battery-temperature drift", Q_(DRIFT_ALLOWANCE_K, "K")),
        relation=">=",
        explanation=words.without_compensation(text, chem.typical_compensation * battery.cells),
        keys=(("output", "battery"),),
        sources=chem.compensation.sources + _range_sources(chem) + (DRIFT_SOURCE,),
        extra=_band_measures(charger) + (Measure("typical compensation for this battery", chem.typical_compensation * battery.cells),),
    )


def _room_judgement(charger) -> tuple[Verdict, str]:
    found = charger_band(charger)
    span = expected_span(charger.battery)
    if found.empty:
        return Verdict.FAIL, words.NO_COMMON_TEMPERATURE
    room = found.room(span)
    text = words.inside_band(charger.chemistry.label, words.band_text(found.coldest, found.warmest))
    if room < 0:
        return Verdict.FAIL, text + words.outside_band(span)
    if room < DRIFT_ALLOWANCE_K:
        return Verdict.MARGINAL, text + _tight_side_text(found, span, room)
    return Verdict.PASS, text


def _tight_side_text(found: Band, span: tuple[float, float], room: float) -> str:
    colder = span[0] - found.coldest <= found.warmest - span[1]
    return words.tight_side(colder, span, room, fmt(_kelvin(room)))


def _not_wanted(charger) -> Finding:
    return _finding(
        charger,
        title=words.compensation_not_wanted_title(charger.chemistry.label),
        verdict=Verdict.MARGINAL,
        values=(Measure("declared coefficient", charger.battery.compensation),),
        explanation=words.not_wanted(charger.chemistry.title),
        keys=(("output", "battery", "compensation"),),
        sources=charger.chemistry.absorption.sources,
    )


def _finding(charger, **fields) -> Finding:
    return Finding(code="CHG-COMPENSATION", calc="charge", subject="battery", method=METHOD, **fields)


def _kelvin(value: float):
    return Q_(round(value, 3), "K")


METHOD = (
    "setpoint(T) = setpoint(25 degC) + k_charger (T - 25 degC); window(T) = window(25 degC) + cells x k_cell (T - 25 degC); "
    "the band is the battery temperatures where every setpoint is inside its window"
)


def range_finding(charger, ambient) -> Finding | None:
    """The coldest and warmest battery temperature while charging against the chemistry's charging range."""
    charging = charger.chemistry.charge_temperature
    if charging is None:
        return None
    battery = charger.battery
    coldest, warmest = expected_span(battery)
    basis = words.HIGHEST_DECLARED
    if battery.highest_temperature is None:
        warmest, basis = max(warmest, ambient.to("degC").magnitude), words.highest_assumed(ambient)
    low, high = charging.low.to("degC"), charging.high.to("degC")
    verdict, text, limit, relation = _range_verdict(charger, coldest, warmest, low, high)
    return Finding(
        code="CHG-TEMPERATURE", calc="charge", subject="battery", title=words.range_title(charger.chemistry.label),
        verdict=verdict, values=(Measure("warmest battery temperature", Q_(warmest, "degC")),
                                 Measure("coldest battery temperature", Q_(coldest, "degC"))),
        limit=limit, relation=relation, method=words.range_method(basis), explanation=text,
        keys=(("output", "battery", "highest_temperature"), ("output", "battery", "lowest_temperature"), ("environment", "max_ambient")),
        sources=charging.sources, extra=(Measure("charging range low", low), Measure("charging range high", high)),
    )


def _range_verdict(charger, coldest: float, warmest: float, low, high):
    if warmest > high.magnitude:
        return Verdict.FAIL, words.too_hot(warmest, high, charger.chemistry.valve_regulated), Measure("charging range high", high), "<="
    if coldest < low.magnitude:
        return Verdict.FAIL, words.too_cold(coldest, low), Measure("charging range low", low), ">="
    return Verdict.PASS, words.inside_range((coldest, warmest), low, high), Measure("charging range high", high), "<="
