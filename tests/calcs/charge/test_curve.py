"""The CC-then-CV charge estimate: its phases, its charge balance and its edge cases."""

from __future__ import annotations

import math

import pytest
from tests.fixtures.chargers import charger
from tests.fixtures.demo import load_demo
from hypothesis import given, settings
from hypothesis import strategies as st

from dossier.calcs.charge.curve import ChargePlan, charge_curve, estimate, point_at, sample_times


def delivered_ah(points) -> float:
    """Charge delivered, by the trapezoid rule over the sampled current."""
    return sum((b.hours - a.hours) * (a.amps + b.amps) / 2 for a, b in zip(points, points[1:]))


def plan(**changes) -> ChargePlan:
    values = dict(capacity_ah=65.0, current_a=7.0, setpoint_v=29.0, float_v=27.3, start_soc=0.2, empty_v=24.0,
                  cv_onset=0.7, termination_a=1.95, efficiency=0.85)
    values.update(changes)
    return ChargePlan(**values)


def test_demo_phases_follow_the_documented_formulas():
    result = charge_curve(load_demo("solar-bank-charger", "C")).estimate
    # CC: (0.70 - 0.20) x 65 Ah / 0.85 / 7 A; tau: 0.30 x 65 Ah / 0.85 / (7 A - 1.95 A); CV: tau x ln(7 / 1.95)
    assert result.cc_hours == pytest.approx(0.5 * 65 / 0.85 / 7)
    assert result.tau_hours == pytest.approx(0.3 * 65 / 0.85 / 5.05)
    assert result.cv_hours == pytest.approx(result.tau_hours * math.log(7 / 1.95))
    assert result.full_hours == pytest.approx(11.269, abs=0.001)


def test_the_curve_delivers_the_charge_the_battery_needs():
    curve = charge_curve(load_demo("solar-bank-charger", "C"))
    assert delivered_ah(curve.points) == pytest.approx(0.8 * 65 / 0.85, rel=0.005)


def test_curve_shape_cc_then_cv():
    curve = charge_curve(load_demo("solar-bank-charger", "C"))
    points = curve.points
    assert points[0].hours == 0 and points[-1].hours == pytest.approx(curve.estimate.full_hours)
    assert points[0].amps == pytest.approx(7.0)
    assert points[-1].amps == pytest.approx(1.95)  # 0.03 C of 65 Ah: the termination current
    assert all(a.amps >= b.amps - 1e-12 for a, b in zip(points, points[1:]))
    assert all(a.volts <= b.volts + 1e-12 for a, b in zip(points, points[1:]))
    in_cv = [p for p in points if p.hours > curve.estimate.cc_hours]
    # 29.0 V at 25 degC, compensated by -36 mV/K to the demo battery's 15 degC: 29.36 V
    assert in_cv and all(p.volts == pytest.approx(29.36) for p in in_cv)


def test_a_slow_charge_matches_the_published_charge_time_of_sealed_lead_acid():
    # BU-403 'Charging Lead Acid' (Battery University): a sealed lead acid battery charges in 12-16 hours
    # at the usual low currents (from memory); here 0.1 C from empty.
    result = estimate(plan(current_a=6.5, start_soc=0.0))
    assert 12 <= result.full_hours <= 16


def test_a_battery_above_the_cv_onset_starts_tapering_at_once():
    start = plan(start_soc=0.9)
    result = estimate(start)
    assert result.cc_hours == 0
    assert 1.95 < result.cv_start_a < 7.0
    points = [point_at(start, result, t) for t in sample_times(result, 400)]
    assert delivered_ah(points) == pytest.approx(0.1 * 65 / 0.85, rel=0.005)


def test_a_charger_below_the_termination_current_never_tapers():
    trickle = plan(current_a=1.0)
    result = estimate(trickle)
    assert result.cv_hours == 0
    assert result.full_hours == pytest.approx(0.8 * 65 / 0.85 / 1.0)
    assert point_at(trickle, result, result.full_hours / 2).amps == 1.0


def test_non_chargers_have_no_curve():
    assert charge_curve(load_demo("bench-psu-13v8")) is None


def test_compensation_moves_the_curves_setpoint_with_battery_temperature():
    curve = charge_curve(charger(temperature="5 degC", compensation="-36 mV/K"))
    assert curve.plan.setpoint_v == pytest.approx(29.0 + 0.036 * 20)
    assert curve.plan.float_v == pytest.approx(27.3 + 0.036 * 20)


def test_an_explicit_charge_current_sets_the_cc_phase():
    assert charge_curve(charger(charge_current="4 A")).plan.current_a == pytest.approx(4.0)


@settings(max_examples=40, deadline=None)
@given(
    capacity=st.floats(1, 400),
    rate=st.floats(0.01, 0.5),
    start=st.floats(0, 0.99),
)
def test_any_plan_delivers_exactly_the_missing_charge(capacity, rate, start):
    chosen = plan(capacity_ah=capacity, current_a=rate * capacity, start_soc=start, termination_a=0.03 * capacity)
    result = estimate(chosen)
    points = [point_at(chosen, result, t) for t in sample_times(result, 800)]
    assert result.full_hours > 0
    assert delivered_ah(points) == pytest.approx((1 - start) * capacity / 0.85, rel=0.01)
