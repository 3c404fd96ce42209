"""Touch current through the Y capacitors against the limit for the unit's protective class."""

from __future__ import annotations

import math

import pytest

from dossier.checklist.general import protective_conductor_current
from dossier.findings import Verdict
from tests.calcs.protection.test_inputs import codes, record_with
from tests.fixtures.demo import load_demo

HIGH_LINE = 230 * 1.1  # 230 V + 10 %


def y_caps(*capacitances, position="line-to-earth"):
    return [{"ref": f"C{i + 1}", "voltage_rating": "300 V", "position": position, "safety_class": "Y1",
             **({"capacitance": c} if c else {})} for i, c in enumerate(capacitances)]


def touch(**changes):
    return codes(record_with(**changes))["PROT-TOUCH-CURRENT"]


def expected_ma(nanofarads: float) -> float:
    # I = 2 pi f C V (circuit theory) at high line, 50 Hz
    return 2 * math.pi * 50 * nanofarads * 1e-9 * HIGH_LINE * 1e3


def test_two_4n7_y_caps_in_a_class_ii_unit_fail_the_quarter_milliampere():
    # 2 x 4.7 nF = 9.4 nF: 2 pi x 50 x 9.4 nF x 253 V = 0.747 mA, over 0.25 mA for class II
    # (IEC 60335-1 ed. 5 clause 16.2: class II 0.25 mA, class I portable 0.75 mA; confirmed in a public quotation).
    finding = touch(devices={"capacitors": y_caps("4.7 nF", "4.7 nF")}, protection__earth={"protective_class": "II", "enclosure": "plastic"})
    assert finding.value.quantity.to("mA").magnitude == pytest.approx(expected_ma(9.4), rel=1e-9)
    assert finding.limit.quantity.to("mA").magnitude == pytest.approx(0.25)
    assert finding.verdict is Verdict.FAIL and finding.guards_hazard


def test_the_same_capacitance_in_a_class_i_unit_is_marginal_between_es1_and_the_appliance_limit():
    # 0.747 mA: under 0.75 mA (IEC 60335-1 class I portable) but over 0.5 mA (IEC 62368-1 ES1, from memory).
    finding = touch(devices={"capacitors": y_caps("4.7 nF", "4.7 nF")})
    assert finding.verdict is Verdict.MARGINAL
    assert "62368-1" in finding.explanation


def test_a_small_y_cap_in_a_class_i_unit_passes():
    finding = touch(devices={"capacitors": y_caps("2.2 nF", position="across-barrier")})
    assert finding.value.quantity.to("mA").magnitude == pytest.approx(expected_ma(2.2), rel=1e-9)  # 0.175 mA
    assert finding.verdict is Verdict.PASS


def test_an_undeclared_class_takes_the_class_ii_limit_and_names_the_key():
    # 2 nF: 0.159 mA, under 0.25 mA less the Y capacitors' usual 20 % tolerance (0.2 mA; from memory): pass;
    # 2.7 nF: 0.215 mA, inside that band: marginal. A class I unit would pass both (0.5 mA).
    finding = touch(devices={"capacitors": y_caps("1 nF", "1 nF")}, protection__earth=None)
    assert finding.limit.quantity.to("mA").magnitude == pytest.approx(0.25)
    assert finding.verdict is Verdict.PASS
    assert "protection.earth.protective_class" in finding.explanation
    assert touch(devices={"capacitors": y_caps("1.35 nF", "1.35 nF")}, protection__earth=None).verdict is Verdict.MARGINAL


def test_a_y_cap_without_capacitance_is_not_assessed_and_blocks_power_up():
    finding = touch(devices={"capacitors": y_caps("2.2 nF", None)})
    assert finding.verdict is Verdict.NOT_ASSESSED and finding.blocks_power_up
    assert "C2" in finding.explanation and ("devices", "capacitors", 1, "capacitance") in finding.keys


def test_no_y_capacitor_no_touch_current_finding():
    assert "PROT-TOUCH-CURRENT" not in codes(record_with())


def test_demo_charger_rev_c_leaves_c4_out_and_rev_d_passes():
    from dossier.calcs.protection import CALC
    rev_c = next(f for f in CALC.run(load_demo("solar-bank-charger", "C")) if f.code == "PROT-TOUCH-CURRENT")
    rev_d = next(f for f in CALC.run(load_demo("solar-bank-charger", "D")) if f.code == "PROT-TOUCH-CURRENT")
    assert rev_c.verdict is Verdict.NOT_ASSESSED and "C4" in rev_c.explanation
    assert rev_d.verdict is Verdict.PASS
    assert rev_d.value.quantity.to("mA").magnitude == pytest.approx(expected_ma(2.2), rel=1e-9)


def test_a_class_i_unit_gets_the_protective_conductor_current_item_with_its_caution():
    (item,) = protective_conductor_current(record_with())
    assert item.key == "pe-current" and item.unit == "mA"
    assert "qualified person" in item.steps and "Never lift or break the earth" in item.steps
    assert item.expected.high.to("mA").magnitude == pytest.approx(0.75)  # IEC 60335-1 clause 16.2, class I portable
    assert protective_conductor_current(record_with(protection__earth={"protective_class": "II", "enclosure": "plastic"})) == []


def _repair_station_with(capacitors: list[dict]):
    """The repair-station test record (a variac VR1 up to 260 V in its last stage) with these capacitors and parts."""
    import yaml

    from tests.fixtures.demo import RECORDS, load_record_text

    data = yaml.safe_load((RECORDS / "repair-station" / "rev-A.yaml").read_text(encoding="utf-8"))
    data.setdefault("devices", {})["capacitors"] = capacitors
    stages = {0: data["stages"][0]["parts"], 2: data["stages"][2]["parts"]}
    for capacitor, stage in zip(capacitors, (0, 2)):
        stages[stage].append({"ref": capacitor["ref"], "kind": "capacitor", "value": "2.2 nF Y1", "role": "suppression"})
    return load_record_text(yaml.safe_dump(data, sort_keys=False), "repair-station/with-caps.yaml")


def test_a_y_cap_behind_a_variac_is_taken_at_its_top_of_scale():
    from dossier.calcs.protection import CALC

    # C1 at the inlet sees the mains at high line, 253 V; C2 in the variac's stage sees its top of scale at high
    # line, 260 V x 1.1 = 286 V (common practice: a variac's top of scale sets the voltage of what it feeds).
    # I = 2 pi f (C1 V1 + C2 V2) (circuit theory).
    record = _repair_station_with(y_caps("2.2 nF", "2.2 nF"))
    finding = next(f for f in CALC.run(record) if f.code == "PROT-TOUCH-CURRENT")
    expected = 2 * math.pi * 50 * 2.2e-9 * (HIGH_LINE + 260 * 1.1) * 1e3
    assert finding.value.quantity.to("mA").magnitude == pytest.approx(expected, rel=1e-9)
    assert "C2 sits behind the variac VR1" in finding.explanation and ("protection", "variac", "top_voltage") in finding.keys
    inlet_only = _repair_station_with(y_caps("2.2 nF"))
    plain = next(f for f in CALC.run(inlet_only) if f.code == "PROT-TOUCH-CURRENT")
    assert plain.value.quantity.to("mA").magnitude == pytest.approx(expected_ma(2.2), rel=1e-9)
    assert "variac" not in plain.explanation


def test_an_x_cap_behind_a_variac_discharges_from_its_top_of_scale():
    from dossier.calcs.rails import CALC

    # t = R C ln(V_peak / 34 V) (IEC 60335-1 22.5: 34 V one second after unplugging). From the variac's crest at
    # high line, 286 V x sqrt 2 = 404.5 V, instead of the mains' 253 V x sqrt 2 = 357.8 V.
    x_cap = {"ref": "C2", "position": "across-line", "capacitance": "470 nF", "voltage_rating": "275 V", "safety_class": "X2", "discharge_resistor": "1 Mohm"}
    record = _repair_station_with([{**x_cap, "ref": "C1", "capacitance": "1 nF", "discharge_resistor": None}, x_cap])
    finding = next(f for f in CALC.run(record) if f.code == "RAILS-X-DISCHARGE")
    peak = 260 * 1.1 * math.sqrt(2)
    assert finding.value.quantity.to("s").magnitude == pytest.approx(1e6 * 471e-9 * math.log(peak / 34), rel=1e-6)
    assert "behind the variac VR1" in finding.explanation
