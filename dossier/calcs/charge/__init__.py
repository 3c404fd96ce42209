"""Charge profile calc: a charger's setpoints, current limit and charge time against its battery's chemistry.

Runs only when the record's output names a battery (the unit is a charger). Windows come from the
chemistry registry (dossier.standards.chemistries); the charge-time estimate from charge_curve.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.charge.curve import charge_current, charge_curve, compensated
from dossier.calcs.charge.safeguards import cutoff_finding, timer_finding
from dossier.calcs.charge.temperature import compensation_finding, range_finding
from dossier.calcs.charge import words
from dossier.calcs.charge.windows import judge_window, tolerance_band
from dossier.findings import Finding, Measure, Verdict, judge
from dossier.plugins import Calc, CalcResult
from dossier.standards.battery import Chemistry, Window
from dossier.standards.chemistries import chemistry
from dossier.units import Q_

__all__ = ["CALC", "CURVE", "charge_curve", "run"]

NAME = "charge"
CURVE = "curve"  # product: the ChargeCurve the time estimate was made from, for the chart

BATTERY = ("output", "battery")
WINDOW_METHOD = (
    "window at T = cells x (window per cell at 25 degC + k_cell (T - 25 degC)); setpoint at T = setpoint at 25 degC "
    "+ k_charger (T - 25 degC); fail outside the window, marginal when the output tolerance band crosses an edge"
)


@dataclass(frozen=True)
class Charger:
    """A charger's output and battery, with the battery's chemistry looked up once."""

    output: object
    battery: object
    chemistry: Chemistry

    @property
    def window_slope(self):
        return self.chemistry.typical_compensation * self.battery.cells

    def absorption_window(self, temperature) -> Window:
        return self.chemistry.absorption_at(temperature).scaled(self.battery.cells)

    def float_window(self, temperature) -> Window | None:
        found = self.chemistry.float_at(temperature)
        return found.scaled(self.battery.cells) if found else None

    @property
    def temperature(self):
        return self.battery.expected_temperature

    def at_temperature(self, voltage):
        """A setpoint given at 25 degC, as the charger sets it at the expected battery temperature."""
        return compensated(voltage, self.battery, self.temperature)


def charger_of(record) -> Charger | None:
    output = record.output
    if output is None or output.battery is None:
        return None
    return Charger(output, output.battery, chemistry(output.battery.chemistry))


def run(record) -> CalcResult:
    charger = charger_of(record)
    if charger is None:
        return CalcResult([])
    curve = charge_curve(record)
    found = [setpoint_finding(charger), float_finding(charger), compensation_finding(charger),
             range_finding(charger, record.environment.max_ambient),
             current_finding(charger), rating_finding(charger), timer_finding(charger), cutoff_finding(charger),
             time_finding(record, curve)]
    return CalcResult([finding for finding in found if finding is not None], {CURVE: curve})


def voltage_finding(charger, code: str, stage: str, declared, window: Window, key: str) -> Finding:
    value = charger.at_temperature(declared)
    band = tolerance_band(value, charger.output.tolerance)
    judged = judge_window(value, window, f"{charger.chemistry.label} {stage}", band=band)
    where = words.setpoint_where(charger.temperature)
    return Finding(
        code=code, calc="charge", subject="battery",
        title=words.setpoint_title(stage, charger.battery.cells, charger.chemistry.label, where),
        verdict=judged.verdict,
        values=(Measure(words.setpoint_label(stage, where), value),),
        limit=judged.limit, relation=judged.relation, method=WINDOW_METHOD,
        explanation=_voltage_text(judged.verdict, value, window, band, stage)
        + words.temperature_note(charger.battery.temperature is not None),
        keys=(BATTERY + (key,),),
        sources=window.sources,
        extra=(Measure("window low", window.low), Measure("window high", window.high),
               Measure("per cell", value / charger.battery.cells)) + _setpoint_measures(charger, window, band),
    )


def _setpoint_measures(charger, window: Window, band) -> tuple[Measure, ...]:
    """The numbers the setpoint's title and sentences print besides the value and the window."""
    measures = (Measure("battery temperature", charger.temperature), Measure("cells", Q_(charger.battery.cells)),
                Measure("window middle", (window.low + window.high) / 2))
    if band is not None:
        measures += (Measure("tolerance band low", band[0]), Measure("tolerance band high", band[1]))
    return measures


def _voltage_text(verdict: Verdict, value, window: Window, band, stage: str) -> str:
    span = words.window_span(stage, window)
    if verdict is Verdict.FAIL and value < window.low:
        return words.below_window(value, span)
    if verdict is Verdict.FAIL:
        return words.above_window(value, span)
    if verdict is Verdict.MARGINAL:
        return words.band_past_edge(value, band, span, _band_advice(window, band))
    return words.inside_window(span)


def _band_advice(window: Window, band) -> str:
    if band[1] - band[0] > window.high - window.low:
        return words.BAND_WIDER_THAN_WINDOW
    return words.set_nearer((window.low + window.high) / 2)


def setpoint_finding(charger) -> Finding:
    window = charger.absorption_window(charger.temperature)
    return voltage_finding(charger, "CHG-SETPOINT", "absorption", charger.battery.absorption_voltage, window, "absorption_voltage")


def float_finding(charger) -> Finding:
    window = charger.float_window(charger.temperature)
    declared = charger.battery.float_voltage
    if window is not None and declared is not None:
        return voltage_finding(charger, "CHG-FLOAT", "float", declared, window, "float_voltage")
    if window is not None:
        return _no_float_stage(charger, window)
    if declared is not None:
        return _float_not_wanted(charger)
    return None


def _no_float_stage(charger, window: Window) -> Finding:
    return Finding(
        code="CHG-FLOAT", calc="charge", subject="battery",
        title=words.no_float_title(charger.chemistry.label),
        verdict=Verdict.INFO,
        explanation=words.no_float_stage(charger.chemistry.label, window),
        keys=(BATTERY,), sources=window.sources,
        extra=(Measure("float window low", window.low), Measure("float window high", window.high)),
    )


def _float_not_wanted(charger) -> Finding:
    return Finding(
        code="CHG-FLOAT", calc="charge", subject="battery",
        title=words.float_not_wanted_title(charger.chemistry.label),
        verdict=Verdict.MARGINAL,
        values=(Measure("float setpoint", charger.battery.float_voltage),),
        explanation=words.float_not_wanted(charger.chemistry.title),
        keys=(BATTERY + ("float_voltage",),), sources=charger.chemistry.absorption.sources,
    )


def current_window(charger) -> Window:
    """The chemistry's C-rate range as currents for this battery."""
    rates, capacity = charger.chemistry.charge_rate, charger.battery.capacity
    return Window((rates.low * capacity).to("A"), (rates.high * capacity).to("A"), rates.sources)


def _current_key(charger) -> tuple:
    return BATTERY + ("charge_current",) if charger.battery.charge_current is not None else ("output", "current")


def current_finding(charger) -> Finding:
    current = charge_current(charger.output).to("A")
    capacity = charger.battery.capacity
    rate = (current / capacity).to("1/h").magnitude
    window = current_window(charger)
    judged = judge_window(current, window, f"{charger.chemistry.label} charge-current")
    verdict = Verdict.MARGINAL if judged.verdict is Verdict.FAIL and current < window.low else judged.verdict
    rates = charger.chemistry.charge_rate
    return Finding(
        code="CHG-CURRENT", calc="charge", subject="battery",
        title=words.current_title(current, capacity, charger.chemistry.label, rate),
        verdict=verdict,
        values=(Measure("constant-current limit", current),),
        limit=judged.limit, relation=judged.relation,
        method="window = capacity x (C-rate low .. C-rate high) of the chemistry; above it fails, below it is marginal",
        explanation=_current_text(verdict, current, window, charger),
        keys=(_current_key(charger),),
        sources=window.sources,
        extra=(Measure("C-rate (per hour)", Q_(round(rate, 4), "1/h")), Measure("battery capacity", capacity),
               Measure("usual range low", window.low), Measure("usual range high", window.high),
               Measure("C-rate low", rates.low), Measure("C-rate high", rates.high)),
    )


def _current_text(verdict: Verdict, current, window: Window, charger) -> str:
    rates = charger.chemistry.charge_rate
    span = words.current_span(window, rates.low.magnitude, rates.high.magnitude)
    if verdict is Verdict.FAIL:
        return words.current_too_high(current, span)
    if verdict is Verdict.MARGINAL:
        return words.current_too_low(current, span)
    return words.current_inside(span)


def rating_finding(charger) -> Finding | None:
    limit_set = charger.battery.charge_current
    if limit_set is None:
        return None
    rating = charger.output.current
    verdict = judge(limit_set, rating, "<=")
    return Finding(
        code="CHG-RATING", calc="charge", subject="battery",
        title=words.rating_title(limit_set),
        verdict=verdict,
        values=(Measure("constant-current limit", limit_set),),
        limit=Measure("charger's current rating", rating.to(limit_set.units)), relation="<=",
        method="the limit set for the battery must not exceed the output's rated current",
        explanation="" if verdict is Verdict.PASS else words.RATING_EXCEEDED,
        keys=(BATTERY + ("charge_current",), ("output", "current")),
    )


def time_finding(record, curve) -> Finding:
    plan, result = curve.plan, curve.estimate
    chem = chemistry(record.output.battery.chemistry)
    return Finding(
        code="CHG-TIME", calc="charge", subject="battery",
        title=words.time_title(plan.start_soc * 100),
        verdict=Verdict.INFO,
        values=(Measure("estimated time to full", Q_(round(result.full_hours, 2), "h")),),
        method=("CC to the CV-onset charge, then I = I_cc exp(-t / tau) to the termination current; "
                "tau = (1 - SoC_cv) C / eta / (I_cc - I_end)"),
        explanation=_time_text(plan, result),
        keys=(BATTERY,),
        sources=chem.curve.sources,
        extra=_time_measures(plan, result),
    )


def _time_text(plan, result) -> str:
    taper = words.taper_text(result.cv_hours, plan.setpoint_v, plan.termination_a) if plan.tapers else words.NO_TAPER
    return words.time_text(result.cc_hours, plan.current_a, plan.cv_onset * 100, taper, plan.efficiency * 100)


def _time_measures(plan, result) -> tuple[Measure, ...]:
    return (
        Measure("constant-current phase", Q_(round(result.cc_hours, 2), "h")),
        Measure("constant-voltage phase", Q_(round(result.cv_hours, 2), "h")),
        Measure("taper time constant", Q_(round(result.tau_hours, 2), "h")),
        Measure("termination current", Q_(round(plan.termination_a, 3), "A")),
        Measure("charge efficiency", Q_(plan.efficiency * 100, "percent")),
        Measure("starting charge", Q_(plan.start_soc * 100, "percent")),
        Measure("constant current", Q_(plan.current_a, "A")),
        Measure("charge at the start of constant voltage", Q_(plan.cv_onset * 100, "percent")),
        Measure("constant-voltage setpoint", Q_(plan.setpoint_v, "V")),
    )


CODES = {
    "CHG-SETPOINT": "Absorption (constant-voltage) setpoint at the expected battery temperature against the chemistry's window.",
    "CHG-FLOAT": "Float setpoint against the chemistry's float window; information when the charger has no float stage.",
    "CHG-COMPENSATION": "Temperature compensation: the declared coefficient, and the battery temperatures over which the setpoints stay in their windows.",
    "CHG-TEMPERATURE": "Coldest and warmest battery temperature while charging against the chemistry's charging range; above it fails (a valve-regulated battery charged hot can run away thermally).",
    "CHG-CURRENT": "Constant-current limit against the battery's capacity (the chemistry's C-rate range).",
    "CHG-RATING": "Constant-current limit set for the battery against the charger's current rating.",
    "CHG-TIMER": "An absorption timer ends absorption when a failed cell keeps the current from tapering; none declared is marginal.",
    "CHG-HOT-CUTOFF": "A high-temperature cut-off read by a sensor on the battery; a valve-regulated battery without one fails (thermal runaway).",
    "CHG-TIME": "Estimated time to full from a CC-then-CV model (information).",
}

CALC = Calc(
    name=NAME,
    title="Charge profile",
    run=run,
    summary=(
        "For a charger: the absorption and float setpoints against the window of the battery's chemistry at the "
        "expected battery temperature, the temperature compensation, the constant-current limit against the "
        "battery's capacity and the charger's rating, the charger's safeguards (an absorption timer, a high-temperature "
        "cut-off read on the battery), and an estimated time to full from a CC-then-CV model."
    ),
    codes=CODES,
    order=60,
    products={CURVE: "the sampled CC-then-CV charge curve (time, voltage, current) behind CHG-TIME"},
)
