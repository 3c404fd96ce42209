"""The charge over time as a constant-current then constant-voltage (CC-then-CV) estimate.

The model, stated so a reader can check it (an estimate, in line with common practice, not a
prediction for a particular battery):

* Charge to deliver from state of charge s to full: (1 - s) * C / eta, with eta the charge efficiency.
* CC phase: the charger gives its current limit I until the battery reaches the chemistry's CV-onset
  state of charge s_cv; the terminal voltage rises in a straight line with state of charge, from the
  chemistry's start voltage at s = 0 to the setpoint at s_cv.
* CV phase: the voltage holds at the setpoint and the current tapers as I(t) = I * exp(-t / tau) until
  it falls to the termination current I_end (a fraction of C). tau is chosen so that the taper delivers
  exactly the remaining charge: tau = (1 - s_cv) * C / eta / (I - I_end). The CV phase then lasts
  tau * ln(I / I_end).
* A battery that starts above s_cv starts in the CV phase, at the current the same taper has there.
* A charger whose limit is at or below I_end never tapers: it charges at I until full.

All values here are plain numbers in the units their names carry (hours, volts, amperes).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.standards.battery import kelvin_from_reference
from dossier.standards.chemistries import chemistry

SAMPLES = 160


@dataclass(frozen=True)
class ChargePlan:
    """What the estimate starts from, taken from the record and the chemistry."""

    capacity_ah: float
    current_a: float
    setpoint_v: float
    float_v: float | None
    start_soc: float
    empty_v: float
    cv_onset: float
    termination_a: float
    efficiency: float

    def charge_to_fill_ah(self, soc: float) -> float:
        return (1 - soc) * self.capacity_ah / self.efficiency

    def cc_voltage(self, soc: float) -> float:
        rise = (self.setpoint_v - self.empty_v) * min(soc / self.cv_onset, 1.0)
        return min(self.empty_v + rise, self.setpoint_v)

    @property
    def tapers(self) -> bool:
        return self.current_a > self.termination_a


@dataclass(frozen=True)
class ChargeEstimate:
    cc_hours: float
    cv_hours: float
    tau_hours: float
    cv_start_a: float

    @property
    def full_hours(self) -> float:
        return self.cc_hours + self.cv_hours


@dataclass(frozen=True)
class CurvePoint:
    hours: float
    volts: float
    amps: float


@dataclass(frozen=True)
class ChargeCurve:
    plan: ChargePlan
    estimate: ChargeEstimate
    points: tuple[CurvePoint, ...]


def compensated(voltage, battery, temperature):
    """A setpoint given at 25 degC, moved to a battery temperature by the charger's compensation (if any).

    The compensation is clamped at the chemistry's charging range: outside it the charger must not charge, so the
    setpoint is not driven further (a -18 mV/K charger at -30 degC would otherwise ask for almost 1 V more).
    """
    if battery.compensation is None:
        return voltage.to("V")
    held = chemistry(battery.chemistry).clamped(temperature)
    return (voltage + battery.compensation * kelvin_from_reference(held)).to("V")


def _volts(voltage, battery, temperature) -> float | None:
    return None if voltage is None else compensated(voltage, battery, temperature).magnitude


def plan_for(record) -> ChargePlan | None:
    """The plan for a charger's battery at its expected temperature, or None for other outputs."""
    output = record.output
    if output is None or output.battery is None:
        return None
    battery = output.battery
    model = chemistry(battery.chemistry).curve
    capacity = battery.capacity.to("A*h").magnitude
    temperature = battery.expected_temperature
    return ChargePlan(
        capacity_ah=capacity,
        current_a=charge_current(output).to("A").magnitude,
        setpoint_v=_volts(battery.absorption_voltage, battery, temperature),
        float_v=_volts(battery.float_voltage, battery, temperature),
        start_soc=battery.start_state_of_charge.to("").magnitude,
        empty_v=(model.start_voltage * battery.cells).to("V").magnitude,
        cv_onset=model.cv_onset,
        termination_a=model.termination.to("1/h").magnitude * capacity,
        efficiency=model.efficiency,
    )


def charge_current(output):
    """The constant-current limit: the battery's own setting, else the output's rating."""
    return output.battery.charge_current if output.battery.charge_current is not None else output.current


def estimate(plan: ChargePlan) -> ChargeEstimate:
    if not plan.tapers:
        return ChargeEstimate(plan.charge_to_fill_ah(plan.start_soc) / plan.current_a, 0.0, 0.0, plan.current_a)
    tau = plan.charge_to_fill_ah(plan.cv_onset) / (plan.current_a - plan.termination_a)
    cc_soc_gain = max(plan.cv_onset - plan.start_soc, 0.0)
    cc_hours = cc_soc_gain * plan.capacity_ah / plan.efficiency / plan.current_a
    cv_start = plan.current_a if cc_hours > 0 else plan.termination_a + plan.charge_to_fill_ah(plan.start_soc) / tau
    return ChargeEstimate(cc_hours, tau * math.log(cv_start / plan.termination_a), tau, cv_start)


def point_at(plan: ChargePlan, result: ChargeEstimate, hours: float) -> CurvePoint:
    if hours < result.cc_hours or not plan.tapers:
        soc = plan.start_soc + hours * plan.current_a * plan.efficiency / plan.capacity_ah
        return CurvePoint(hours, plan.cc_voltage(soc), plan.current_a)
    taper = math.exp(-(hours - result.cc_hours) / result.tau_hours)
    return CurvePoint(hours, plan.setpoint_v, result.cv_start_a * taper)


def sample_times(result: ChargeEstimate, count: int = SAMPLES) -> list[float]:
    times = {result.full_hours * i / count for i in range(count + 1)}
    times.add(result.cc_hours)
    return sorted(times)


def charge_curve(record) -> ChargeCurve | None:
    """Sampled (time, voltage, current) points from empty-ish to full; None when the output is not a charger."""
    plan = plan_for(record)
    if plan is None:
        return None
    result = estimate(plan)
    points = tuple(point_at(plan, result, hours) for hours in sample_times(result))
    return ChargeCurve(plan, result, points)
