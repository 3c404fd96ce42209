"""The charge-profile calc: setpoints, float, compensation, current and time findings."""

from __future__ import annotations

import pytest
from tests.fixtures.chargers import DROP, charger, findings_by_code
from tests.fixtures.demo import load_demo

from dossier.calcs.charge import CALC, run
from dossier.findings import Verdict
from dossier.review import review
from dossier.units import Q_

CHARGE_CODES = {"CHG-SETPOINT", "CHG-FLOAT", "CHG-COMPENSATION", "CHG-TEMPERATURE", "CHG-CURRENT", "CHG-RATING", "CHG-TIME"}


def test_the_calc_declares_every_code_it_can_emit():
    assert CALC.name == "charge"
    assert set(CALC.codes) == CHARGE_CODES


@pytest.mark.parametrize("build", ["bench-psu-13v8", "rotator-control"])
def test_builds_that_are_not_chargers_get_no_charge_findings(build):
    assert run(load_demo(build)) == []


@pytest.mark.parametrize("revision", ["A", "B", "C"])
def test_demo_charger_runs_cleanly_through_review(revision, calcs):
    found = [f for f in review(load_demo("sw-charger-12v", revision), calcs) if f.calc == "charge"]
    assert {f.code for f in found} == CHARGE_CODES - {"CHG-RATING"}  # no separate limit declared
    assert not [f for f in found if f.code == "CALC-ERROR"]


def test_demo_charger_without_compensation_is_marginal_and_says_why():
    finding = findings_by_code(load_demo("sw-charger-12v", "C"))["CHG-COMPENSATION"]
    # 14.4 V is the bottom of the AGM window at 25 degC, so any colder battery falls below it
    # (window moves by -3 mV per cell per kelvin: BU-403 'Charging Lead Acid', Battery University).
    assert finding.verdict is Verdict.MARGINAL
    assert "from 25 to 36 °C" in finding.explanation
    assert "any colder is undercharged" in finding.explanation
    assert finding.value.quantity == Q_(0, "K")


def test_demo_setpoints_are_inside_the_agm_windows_but_the_tolerance_band_is_not():
    found = findings_by_code(load_demo("sw-charger-12v", "C"))
    # AGM (VRLA cyclic) 14.40-14.70 V and float 13.50-13.80 V at 25 degC: BU-403 'Charging Lead Acid'
    # (Battery University, Cadex Electronics); a 2 % band around 14.4 V reaches down to 14.1 V.
    assert found["CHG-SETPOINT"].verdict is Verdict.MARGINAL
    assert found["CHG-FLOAT"].verdict is Verdict.MARGINAL
    assert "14.1 V to 14.7 V" in found["CHG-SETPOINT"].explanation


def test_without_a_tolerance_the_demo_setpoints_pass():
    found = findings_by_code(charger(output={"tolerance": DROP}))
    assert found["CHG-SETPOINT"].verdict is Verdict.PASS
    assert found["CHG-FLOAT"].verdict is Verdict.PASS


@pytest.mark.parametrize("setpoint, word", [("14.0 V", "below"), ("15.0 V", "above")])
def test_agm_setpoint_outside_the_window_fails(setpoint, word):
    finding = findings_by_code(charger(absorption_voltage=setpoint, float_voltage="13.6 V"))["CHG-SETPOINT"]
    # AGM window 14.40-14.70 V for six cells at 25 degC (BU-403, Battery University).
    assert finding.verdict is Verdict.FAIL
    assert f"is {word} the window" in finding.explanation


def test_gel_takes_a_lower_absorption_voltage_than_agm():
    # Gel 2.35-2.40 V/cell (Handbook for Gel-VRLA-Batteries Part 2, GNB/Exide; from memory): 14.7 V is too high.
    found = findings_by_code(charger(chemistry="gel", absorption_voltage="14.7 V", output={"tolerance": DROP}))
    assert found["CHG-SETPOINT"].verdict is Verdict.FAIL
    assert findings_by_code(charger(chemistry="gel", absorption_voltage="14.2 V", output={"tolerance": DROP}))["CHG-SETPOINT"].verdict is Verdict.PASS


def test_a_warm_battery_moves_the_window_down_and_a_cold_one_up():
    # -3 mV per cell per kelvin (BU-403): at 35 degC the AGM window is 14.22-14.52 V, at 0 degC 14.85-15.15 V.
    warm = findings_by_code(charger(temperature="35 degC", output={"tolerance": DROP}))["CHG-SETPOINT"]
    cold = findings_by_code(charger(temperature="0 degC", output={"tolerance": DROP}))["CHG-SETPOINT"]
    assert warm.verdict is Verdict.PASS
    assert cold.verdict is Verdict.FAIL
    assert cold.limit.quantity.to("V").magnitude == pytest.approx(14.85)


def test_compensation_follows_a_cold_battery_into_its_window():
    # -18 mV/K for a 12 V battery is the BU-403 figure (-3 mV per cell per kelvin).
    found = findings_by_code(charger(temperature="0 degC", compensation="-18 mV/K", output={"tolerance": DROP}))
    assert found["CHG-SETPOINT"].verdict is Verdict.PASS
    assert found["CHG-SETPOINT"].value.quantity.to("V").magnitude == pytest.approx(14.85)
    assert found["CHG-COMPENSATION"].verdict is Verdict.PASS


def test_compensation_with_the_wrong_sign_fails():
    finding = findings_by_code(charger(compensation="18 mV/K"))["CHG-COMPENSATION"]
    assert finding.verdict is Verdict.FAIL
    assert "must be negative" in finding.explanation


def test_compensation_far_stronger_than_makers_quote_is_not_a_pass():
    # Makers quote up to -5 mV per cell per kelvin (Trojan Battery User's Guide; from memory); -10 is beyond it.
    finding = findings_by_code(charger(compensation="-60 mV/K", output={"tolerance": DROP}))["CHG-COMPENSATION"]
    assert finding.verdict is Verdict.MARGINAL
    assert finding.value.quantity.to("mV/K").magnitude == pytest.approx(-10)


def test_a_declared_cold_range_without_compensation_fails():
    finding = findings_by_code(charger(lowest_temperature="0 degC"))["CHG-COMPENSATION"]
    assert finding.verdict is Verdict.FAIL
    assert "0 to 25 °C" in finding.explanation


def test_a_fixed_setpoint_in_the_middle_of_the_window_is_information_only():
    # 14.55 V sits 0.15 V from both AGM edges: 0.15 / 0.018 V/K = 8.3 K either way (BU-403 coefficient).
    found = findings_by_code(charger(absorption_voltage="14.55 V", float_voltage="13.65 V", output={"tolerance": DROP}))
    assert found["CHG-COMPENSATION"].verdict is Verdict.INFO
    assert found["CHG-COMPENSATION"].value.quantity.magnitude == pytest.approx(8.33, abs=0.01)


def test_no_float_stage_is_information_with_the_reason():
    finding = findings_by_code(charger(float_voltage=DROP))["CHG-FLOAT"]
    assert finding.verdict is Verdict.INFO
    assert "overcharges" in finding.explanation


@pytest.mark.parametrize("current, chemistry, verdict", [
    ("6 A", "agm", Verdict.PASS),       # 0.15 C, inside 10-30 % of capacity (BU-403)
    ("20 A", "agm", Verdict.FAIL),      # 0.5 C, above the 0.3 C sealed types take (BU-403; makers' guides)
    ("2 A", "agm", Verdict.MARGINAL),   # 0.05 C, below 10 % of capacity (BU-403)
    ("10 A", "gel", Verdict.FAIL),      # 0.25 C, above gel's 0.2 C (GNB/Exide gel handbook; from memory)
    ("10 A", "flooded", Verdict.PASS),  # 0.25 C, inside 10-30 % (BU-403)
])
def test_charge_current_against_capacity(current, chemistry, verdict):
    record = charger(output={"current": current}, chemistry=chemistry, absorption_voltage="14.4 V", float_voltage="13.5 V")
    assert findings_by_code(record)["CHG-CURRENT"].verdict is verdict


def test_a_limit_set_above_the_chargers_rating_fails():
    found = findings_by_code(charger(charge_current="8 A"))
    assert found["CHG-RATING"].verdict is Verdict.FAIL
    assert found["CHG-RATING"].limit.quantity == Q_(6, "A")
    assert findings_by_code(charger(charge_current="4 A"))["CHG-RATING"].verdict is Verdict.PASS


def test_time_to_full_is_information_with_the_phases():
    # the figure itself is worked by hand in test_temperature_range.py::test_time_to_full_worked_by_hand
    finding = findings_by_code(load_demo("sw-charger-12v", "C"))["CHG-TIME"]
    assert finding.verdict is Verdict.INFO
    assert {m.label for m in finding.extra} >= {"constant-current phase", "constant-voltage phase", "charge efficiency"}


def test_a_missing_battery_temperature_is_assumed_and_said():
    finding = findings_by_code(charger(temperature=DROP))["CHG-SETPOINT"]
    assert "25 °C is assumed" in finding.explanation


def test_the_calc_is_pure():
    record = load_demo("sw-charger-12v", "C")
    before = record.model_dump()
    assert run(record) == run(record)
    assert record.model_dump() == before


def test_every_charge_finding_names_a_source_or_is_the_rating_check():
    for finding in run(charger(charge_current="4 A")):
        assert finding.sources or finding.code == "CHG-RATING", finding.code
