"""Charge profile calc: a charger's setpoints, current limit and charge time against its battery's chemistry.

Runs only when the record's output names a battery (the unit is a charger). Windows come from the
chemistry registry (dossier.standards.chemistries); the charge-time estimate from charge_curve.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.charge.curve import charge_current, charge_curve, compensated
from dossier.calcs.charge.temperature import compensation_finding, range_finding
from dossier.calcs.charge.windows import judge_window, tolerance_band
from dossier.findings import Finding, Measure, Verdict, judge
from dossier.plugins import Calc, CalcResult
from dossier.standards.battery import Chemistry, Window
from dossier.standards.chemistries import chemistry
from dossier.units import Q_, fmt

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
             current_finding(charger), rating_finding(charger), time_finding(record, curve)]
    return CalcResult([finding for finding in found if finding is not None], {CURVE: curve})


def _temperature_note(charger) -> str:
    if charger.battery.temperature is None:
        return " No battery temperature is given; 25 °C is assumed."
    return ""


def _window_text(window: Window) -> str:
    return f"{fmt(window.low)} to {fmt(window.high)}"


def voltage_finding(charger, code: str, stage: str, declared, window: Window, key: str) -> Finding:
    value = charger.at_temperature(declared)
    band = tolerance_band(value, charger.output.tolerance)
    judged = judge_window(value, window, f"{charger.chemistry.label} {stage}", band=band)
    where = f"at {fmt(charger.temperature)}"
    return Finding(
        code=code, calc="charge", subject="battery",
        title=f"{stage.capitalize()} setpoint for a {charger.battery.cells}-cell {charger.chemistry.label} battery {where}",
        verdict=judged.verdict,
        values=(Measure(f"{stage} setpoint {where}", value),),
        limit=judged.limit, relation=judged.relation, method=WINDOW_METHOD,
        explanation=_voltage_text(judged.verdict, value, window, band, stage) + _temperature_note(charger),
        keys=(BATTERY + (key,),),
        sources=window.sources,
        extra=(Measure("window low", window.low), Measure("window high", window.high),
               Measure("per cell", value / charger.battery.cells)),
    )


def _voltage_text(verdict: Verdict, value, window: Window, band, stage: str) -> str:
    span = f"the {stage} window is {_window_text(window)}"
    if verdict is Verdict.FAIL and value < window.low:
        return f"{fmt(value)} is below the window ({span}): the battery is left undercharged and sulphates over time."
    if verdict is Verdict.FAIL:
        return (f"{fmt(value)} is above the window ({span}): the battery gasses and loses water "
                "(a sealed one dries out for good) and runs hot.")
    if verdict is Verdict.MARGINAL:
        return (f"{fmt(value)} is inside the window, but with the output tolerance it may sit anywhere from "
                f"{fmt(band[0])} to {fmt(band[1])}, past an edge ({span}). {_band_advice(window, band)}")
    return f"Inside the window ({span})."


def _band_advice(window: Window, band) -> str:
    if band[1] - band[0] > window.high - window.low:
        return "The tolerance band is wider than the window itself: tighten the tolerance (or trim the setting on the bench)."
    return f"Set it nearer {fmt((window.low + window.high) / 2)} or tighten the tolerance."


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
        title=f"No float stage declared for the {charger.chemistry.label} battery",
        verdict=Verdict.INFO,
        explanation=(f"A {charger.chemistry.label} battery left on at its absorption voltage overcharges. Without a float "
                     f"stage ({_window_text(window)} here), the charger must end the charge once the current has "
                     "tapered, or the battery must be taken off when full."),
        keys=(BATTERY,), sources=window.sources,
    )


def _float_not_wanted(charger) -> Finding:
    return Finding(
        code="CHG-FLOAT", calc="charge", subject="battery",
        title=f"Float stage declared for {charger.chemistry.label}",
        verdict=Verdict.MARGINAL,
        values=(Measure("float setpoint", charger.battery.float_voltage),),
        explanation=f"The {charger.chemistry.title} windows take no float stage; the charge should end when full.",
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
    return Finding(
        code="CHG-CURRENT", calc="charge", subject="battery",
        title=f"Charge current {fmt(current)} for a {fmt(capacity)} {charger.chemistry.label} battery ({rate:.2g} C)",
        verdict=verdict,
        values=(Measure("constant-current limit", current),),
        limit=judged.limit, relation=judged.relation,
        method="window = capacity x (C-rate low .. C-rate high) of the chemistry; above it fails, below it is marginal",
        explanation=_current_text(verdict, current, window, charger),
        keys=(_current_key(charger),),
        sources=window.sources,
        extra=(Measure("C-rate (per hour)", Q_(round(rate, 4), "1/h")),),
    )


def _current_text(verdict: Verdict, current, window: Window, charger) -> str:
    rates = f"{charger.chemistry.charge_rate.low.magnitude:g} C to {charger.chemistry.charge_rate.high.magnitude:g} C"
    span = f"{_window_text(window)}, i.e. {rates}"
    if verdict is Verdict.FAIL:
        return f"{fmt(current)} is more than the battery should take ({span}): it heats and gasses, and its life shortens."
    if verdict is Verdict.MARGINAL:
        return (f"{fmt(current)} is below the usual range ({span}): charging is slow, and a flooded battery's "
                "electrolyte may stratify without the stirring a stronger charge gives.")
    return f"Inside the usual range ({span})."


def rating_finding(charger) -> Finding | None:
    limit_set = charger.battery.charge_current
    if limit_set is None:
        return None
    rating = charger.output.current
    verdict = judge(limit_set, rating, "<=")
    return Finding(
        code="CHG-RATING", calc="charge", subject="battery",
        title=f"Charge-current limit {fmt(limit_set)} against the charger's rating",
        verdict=verdict,
        values=(Measure("constant-current limit", limit_set),),
        limit=Measure("charger's current rating", rating.to(limit_set.units)), relation="<=",
        method="the limit set for the battery must not exceed the output's rated current",
        explanation="" if verdict is Verdict.PASS else "The charger cannot deliver the limit set for the battery; lower it or uprate the charger.",
        keys=(BATTERY + ("charge_current",), ("output", "current")),
    )


def time_finding(record, curve) -> Finding:
    plan, result = curve.plan, curve.estimate
    chem = chemistry(record.output.battery.chemistry)
    return Finding(
        code="CHG-TIME", calc="charge", subject="battery",
        title=f"Estimated time to full from {plan.start_soc * 100:g} % charge",
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
    hours = lambda value: fmt(Q_(round(value, 2), "h"))  # noqa: E731 - a local formatter
    taper = (f"then {hours(result.cv_hours)} at {plan.setpoint_v:.3g} V while the current tapers to "
             f"{plan.termination_a:.3g} A" if plan.tapers else "the limit is below the termination current, so there is no taper")
    return (f"About {hours(result.cc_hours)} at a constant {plan.current_a:.3g} A to {plan.cv_onset * 100:g} % charge, {taper}; "
            f"charge efficiency taken as {plan.efficiency * 100:g} %. An estimate from a simple model, not a measurement: "
            "an old, cold or sulphated battery takes longer.")


def _time_measures(plan, result) -> tuple[Measure, ...]:
    return (
        Measure("constant-current phase", Q_(round(result.cc_hours, 2), "h")),
        Measure("constant-voltage phase", Q_(round(result.cv_hours, 2), "h")),
        Measure("taper time constant", Q_(round(result.tau_hours, 2), "h")),
        Measure("termination current", Q_(round(plan.termination_a, 3), "A")),
        Measure("charge efficiency", Q_(plan.efficiency * 100, "percent")),
    )


CODES = {
    "CHG-SETPOINT": "Absorption (constant-voltage) setpoint at the expected battery temperature against the chemistry's window.",
    "CHG-FLOAT": "Float setpoint against the chemistry's float window; information when the charger has no float stage.",
    "CHG-COMPENSATION": "Temperature compensation: the declared coefficient, and the battery temperatures over which the setpoints stay in their windows.",
    "CHG-TEMPERATURE": "Coldest and warmest battery temperature while charging against the chemistry's charging range; above it fails (a valve-regulated battery charged hot can run away thermally).",
    "CHG-CURRENT": "Constant-current limit against the battery's capacity (the chemistry's C-rate range).",
    "CHG-RATING": "Constant-current limit set for the battery against the charger's current rating.",
    "CHG-TIME": "Estimated time to full from a CC-then-CV model (information).",
}

CALC = Calc(
    name=NAME,
    title="Charge profile",
    run=run,
    summary=(
        "For a charger: the absorption and float setpoints against the window of the battery's chemistry at the "
        "expected battery temperature, the temperature compensation, the constant-current limit against the "
        "battery's capacity and the charger's rating, and an estimated time to full from a CC-then-CV model."
    ),
    codes=CODES,
    order=60,
    products={CURVE: "the sampled CC-then-CV charge curve (time, voltage, current) behind CHG-TIME"},
)
