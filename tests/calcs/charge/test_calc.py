"""The charge-profile calc: setpoints, float, compensation, current and time findings."""

from __future__ import annotations

import pytest
from tests.fixtures.chargers import DROP, charger, findings_by_code
from tests.fixtures.demo import load_demo

from dossier.calcs.charge import CALC, run
from dossier.findings import Verdict
from dossier.review import review
from dossier.units import Q_

CHARGE_CODES = {"CHG-SETPOINT", "CHG-FLOAT", "CHG-COMPENSATION", "CHG-TEMPERATURE", "CHG-CURRENT", "CHG-RATING", "CHG-TIMER",
                "CHG-HOT-CUTOFF", "CHG-TIME"}


def test_the_calc_declares_every_code_it_can_emit():
    assert CALC.name == "charge"
    assert set(CALC.codes) == CHARGE_CODES


@pytest.mark.parametrize("build", ["bench-psu-13v8", "rotator-control"])
def test_builds_that_are_not_chargers_get_no_charge_findings(build):
    assert run(load_demo(build)) == []


@pytest.mark.parametrize("revision", ["A", "B", "C", "D"])
def test_demo_charger_runs_cleanly_through_review(revision, calcs):
    found = [f for f in review(load_demo("solar-bank-charger", revision), calcs) if f.calc == "charge"]
    assert {f.code for f in found} == CHARGE_CODES - {"CHG-RATING"}  # no separate limit declared
    assert not [f for f in found if f.code == "CALC-ERROR"]


def test_a_fixed_setpoint_at_the_bottom_of_the_window_is_marginal_and_says_why():
    finding = findings_by_code(charger(absorption_voltage="28.8 V", float_voltage="27.2 V"))["CHG-COMPENSATION"]
    # 28.8 V is the bottom of the 12-cell AGM window at 25 degC (12 x 2.40 V), so any colder battery falls
    # below it; the window moves by -3 mV per cell per kelvin (BU-403 'Charging Lead Acid', Battery University).
    # Warmer: float 27.2 V leaves the 27.0-27.6 V window when 27.6 - 0.036 x dT < 27.2, dT > 11.1 K: 36 degC.
    assert finding.verdict is Verdict.MARGINAL
    assert "from 25 to 36 °C" in finding.explanation
    assert "any colder is undercharged" in finding.explanation
    assert finding.value.quantity == Q_(0, "K")


def test_the_demo_setpoints_leave_about_5_kelvin_either_way():
    # 29.0 V in 28.8-29.4 V and 27.3 V in 27.0-27.6 V at 25 degC (AGM 2.40-2.45 and 2.25-2.30 V per cell, BU-403):
    # colder by 0.2 / 0.036 = 5.56 K, warmer by 0.3 / 0.036 = 8.33 K: 19 to 33 degC.
    finding = findings_by_code(charger())["CHG-COMPENSATION"]
    assert finding.verdict is Verdict.INFO
    assert finding.value.quantity.to("K").magnitude == pytest.approx(5.556, abs=0.001)
    assert "from 19 to 33 °C" in finding.explanation


def test_setpoints_inside_the_agm_windows_with_a_tolerance_band_that_is_not():
    found = findings_by_code(charger(absorption_voltage="28.8 V", float_voltage="27.2 V", output={"tolerance": "2 %"}))
    # AGM (VRLA cyclic) 2.40-2.45 V and float 2.25-2.30 V per cell at 25 degC: BU-403 'Charging Lead Acid'
    # (Battery University, Cadex Electronics); a 2 % band around 28.8 V reaches from 28.2 V to 29.4 V.
    assert found["CHG-SETPOINT"].verdict is Verdict.MARGINAL
    assert found["CHG-FLOAT"].verdict is Verdict.MARGINAL
    assert "28.2 V to 29.4 V" in found["CHG-SETPOINT"].explanation


def test_the_demo_setpoints_pass_with_and_without_their_tolerance():
    for output in ({}, {"tolerance": DROP}):
        found = findings_by_code(charger(output=output))
        assert found["CHG-SETPOINT"].verdict is Verdict.PASS
        assert found["CHG-FLOAT"].verdict is Verdict.PASS


@pytest.mark.parametrize("setpoint, word", [("28.0 V", "below"), ("30.0 V", "above")])
def test_agm_setpoint_outside_the_window_fails(setpoint, word):
    finding = findings_by_code(charger(absorption_voltage=setpoint, float_voltage="27.3 V"))["CHG-SETPOINT"]
    # AGM window 28.8-29.4 V for twelve cells at 25 degC (2.40-2.45 V per cell, BU-403, Battery University).
    assert finding.verdict is Verdict.FAIL
    assert f"is {word} the window" in finding.explanation


def test_gel_takes_a_lower_absorption_voltage_than_agm():
    # Gel 2.35-2.40 V/cell (Handbook for Gel-VRLA-Batteries Part 2, GNB/Exide; from memory): 28.2-28.8 V for
    # twelve cells, so 29.4 V is too high and 28.4 V is inside.
    found = findings_by_code(charger(chemistry="gel", absorption_voltage="29.4 V", output={"tolerance": DROP}))
    assert found["CHG-SETPOINT"].verdict is Verdict.FAIL
    assert findings_by_code(charger(chemistry="gel", absorption_voltage="28.4 V", output={"tolerance": DROP}))["CHG-SETPOINT"].verdict is Verdict.PASS


def test_a_warm_battery_moves_the_window_down_and_a_cold_one_up():
    # -3 mV per cell per kelvin (BU-403), -36 mV/K for twelve cells: at 35 degC the AGM window is
    # 28.44-29.04 V, at 0 degC 29.70-30.30 V.
    warm = findings_by_code(charger(temperature="35 degC", output={"tolerance": DROP}))["CHG-SETPOINT"]
    cold = findings_by_code(charger(temperature="0 degC", output={"tolerance": DROP}))["CHG-SETPOINT"]
    assert warm.verdict is Verdict.PASS
    assert cold.verdict is Verdict.FAIL
    assert cold.limit.quantity.to("V").magnitude == pytest.approx(29.70)


def test_compensation_follows_a_cold_battery_into_its_window():
    # -36 mV/K for a 24 V battery is the BU-403 figure (-3 mV per cell per kelvin): 29.0 + 25 x 0.036 = 29.9 V.
    found = findings_by_code(charger(temperature="0 degC", compensation="-36 mV/K", output={"tolerance": DROP}))
    assert found["CHG-SETPOINT"].verdict is Verdict.PASS
    assert found["CHG-SETPOINT"].value.quantity.to("V").magnitude == pytest.approx(29.9)
    assert found["CHG-COMPENSATION"].verdict is Verdict.PASS


def test_compensation_with_the_wrong_sign_fails():
    finding = findings_by_code(charger(compensation="36 mV/K"))["CHG-COMPENSATION"]
    assert finding.verdict is Verdict.FAIL
    assert "must be negative" in finding.explanation


def test_compensation_far_stronger_than_makers_quote_is_not_a_pass():
    # Makers quote up to -5 mV per cell per kelvin (Trojan Battery User's Guide; from memory);
    # -120 mV/K over twelve cells is -10 per cell, beyond it.
    finding = findings_by_code(charger(compensation="-120 mV/K", output={"tolerance": DROP}))["CHG-COMPENSATION"]
    assert finding.verdict is Verdict.MARGINAL
    assert finding.value.quantity.to("mV/K").magnitude == pytest.approx(-10)


def test_a_declared_cold_range_without_compensation_fails():
    finding = findings_by_code(charger(lowest_temperature="0 degC"))["CHG-COMPENSATION"]
    assert finding.verdict is Verdict.FAIL
    assert "0 to 25 °C" in finding.explanation


def test_a_fixed_setpoint_in_the_middle_of_the_window_is_information_only():
    # 29.1 V and 27.3 V sit 0.3 V from both AGM edges: 0.3 / 0.036 V/K = 8.3 K either way (BU-403 coefficient).
    found = findings_by_code(charger(absorption_voltage="29.1 V", float_voltage="27.3 V", output={"tolerance": DROP}))
    assert found["CHG-COMPENSATION"].verdict is Verdict.INFO
    assert found["CHG-COMPENSATION"].value.quantity.magnitude == pytest.approx(8.33, abs=0.01)


def test_no_float_stage_is_information_with_the_reason():
    finding = findings_by_code(charger(float_voltage=DROP))["CHG-FLOAT"]
    assert finding.verdict is Verdict.INFO
    assert "overcharges" in finding.explanation


@pytest.mark.parametrize("current, chemistry, verdict", [
    ("7 A", "agm", Verdict.PASS),       # 0.11 C of 65 Ah, inside 10-30 % of capacity (BU-403)
    ("20 A", "agm", Verdict.FAIL),      # 0.31 C, above the 0.3 C sealed types take (BU-403; makers' guides)
    ("4 A", "agm", Verdict.MARGINAL),   # 0.06 C, below 10 % of capacity (BU-403)
    ("15 A", "gel", Verdict.FAIL),      # 0.23 C, above gel's 0.2 C (GNB/Exide gel handbook; from memory)
    ("15 A", "flooded", Verdict.PASS),  # 0.23 C, inside 10-30 % (BU-403)
])
def test_charge_current_against_capacity(current, chemistry, verdict):
    record = charger(output={"current": current}, chemistry=chemistry, absorption_voltage="28.8 V", float_voltage="27.0 V")
    assert findings_by_code(record)["CHG-CURRENT"].verdict is verdict


def test_a_limit_set_above_the_chargers_rating_fails():
    found = findings_by_code(charger(charge_current="8 A"))
    assert found["CHG-RATING"].verdict is Verdict.FAIL
    assert found["CHG-RATING"].limit.quantity == Q_(7, "A")
    assert findings_by_code(charger(charge_current="6.5 A"))["CHG-RATING"].verdict is Verdict.PASS


def test_time_to_full_is_information_with_the_phases():
    finding = findings_by_code(load_demo("solar-bank-charger", "C"))["CHG-TIME"]
    # BU-403 model (docs/calcs/charge.md): CC (0.70 - 0.20) x 65 Ah / 0.85 / 7 A = 5.46 h; CV to 0.03 C = 1.95 A:
    # tau = 0.30 x 65 Ah / 0.85 / (7 - 1.95) A = 4.54 h, tau x ln(7 / 1.95) = 5.81 h; 11.27 h in all.
    assert finding.verdict is Verdict.INFO
    assert finding.value.quantity.to("h").magnitude == pytest.approx(11.27, abs=0.01)
    assert {m.label for m in finding.extra} >= {"constant-current phase", "constant-voltage phase", "charge efficiency"}


def test_the_demo_compensates_for_its_cold_solar_hut():
    found = findings_by_code(load_demo("solar-bank-charger", "C"))
    # -36 mV/K is -3 mV per cell per kelvin (BU-403); at 15 degC the setpoint is 29.0 + 10 x 0.036 = 29.36 V.
    assert found["CHG-COMPENSATION"].verdict is Verdict.PASS
    assert found["CHG-SETPOINT"].verdict is Verdict.PASS
    assert found["CHG-SETPOINT"].value.quantity.to("V").magnitude == pytest.approx(29.36)


def test_a_missing_battery_temperature_is_assumed_and_said():
    finding = findings_by_code(charger(temperature=DROP))["CHG-SETPOINT"]
    assert "25 °C is assumed" in finding.explanation


def test_the_calc_is_pure():
    record = load_demo("solar-bank-charger", "C")
    before = record.model_dump()
    assert run(record) == run(record)
    assert record.model_dump() == before


def test_every_charge_finding_names_a_source_or_is_the_rating_check():
    for finding in run(charger(charge_current="4 A")):
        assert finding.sources or finding.code == "CHG-RATING", finding.code
