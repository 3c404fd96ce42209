"""Record-level checks: a live tab's insulation grade from where its heatsink sits; a MOSFET's conduction loss
from its hot on-resistance; the touch limit's source."""

from __future__ import annotations

import pytest

from dossier.calcs import thermal
from dossier.findings import Verdict
from dossier.record.model import Record

BASE = {"id": "unit", "title": "Test unit", "revision": "A", "date": "2026-01-01", "authors": ["Tester"], "status": "design"}
REINFORCED_BARRIER = {"name": "Q1 tab to heatsink", "between": ["mains", "chassis"], "grade": "reinforced", "material_group": "IIIa",
                      "creepage": "6.0 mm", "clearance": "4.0 mm", "parts": ["Q1"]}


def unit(protective_class=None, touchable=True, earthed=False, barriers=(), **tab) -> Record:
    device = {"ref": "Q1", "kind": "mosfet", "max_junction": "150 degC", "rth_jc": "1.0 K/W", "loss": "2 W",
              "heatsink": "HS1", "pad": "1.5 K/W", "tab_live": True, "insulated": True, **tab}
    data = {**BASE, "barriers": list(barriers),
            "devices": {"semiconductors": [device], "heatsinks": [{"ref": "HS1", "rth_sa": "3 K/W", "touchable": touchable, "earthed": earthed}]}}
    if protective_class:
        data["protection"] = {"earth": {"protective_class": protective_class}}
    return Record.model_validate(data)


def pad(record):
    return next(f for f in thermal.run(record) if f.code == "THERM-PAD")


# IEC 61140 (ed. 4.0, 2016), class II: protection by double or reinforced insulation, no protective earth; a pad and
# bush are one layer, basic insulation (IEC 62368-1 ed. 3, clause 5.4). From memory, as the finding says.

def test_one_pad_to_a_touchable_unearthed_sink_in_a_class_ii_unit_fails():
    finding = pad(unit("II"))
    assert finding.verdict is Verdict.FAIL
    assert finding.value.quantity == "basic" and finding.limit.quantity == "reinforced"
    assert "protective earth" in finding.explanation and "insulation: reinforced" in finding.explanation


def test_reinforced_insulation_needs_a_barrier_that_checks_its_creepage():
    assert pad(unit("II", insulation="reinforced")).verdict is Verdict.FAIL
    passing = pad(unit("II", insulation="reinforced", barriers=[REINFORCED_BARRIER]))
    assert passing.verdict is Verdict.PASS and ("barriers", 0) in passing.keys


def test_a_touchable_sink_earthed_in_a_class_i_unit_takes_one_pad():
    assert pad(unit("I", earthed=True)).verdict is Verdict.PASS


@pytest.mark.parametrize("protective_class", ["II", None])
def test_an_earth_mark_without_a_class_i_unit_is_not_credited(protective_class):
    finding = pad(unit(protective_class, earthed=True))
    assert finding.verdict is Verdict.FAIL
    assert ("protection", "earth", "protective_class") in finding.keys


def test_an_earthed_sink_out_of_reach_takes_one_pad():
    assert pad(unit("II", touchable=False, earthed=True)).verdict is Verdict.PASS


# --- MOSFET conduction loss ---------------------------------------------------------------------------

def mosfet(**fields) -> Record:
    device = {"ref": "Q1", "kind": "mosfet", "max_junction": "150 degC", "rth_jc": "1.0 K/W", "heatsink": "HS1", "pad": "1.0 K/W", **fields}
    return Record.model_validate({**BASE, "devices": {"semiconductors": [device], "heatsinks": [{"ref": "HS1", "rth_sa": "3 K/W", "touchable": False}]}})


def junction(record):
    return next(f for f in thermal.run(record) if f.code == "THERM-JUNCTION")


def extra(finding, label) -> float:
    return next(float(m.quantity.magnitude) for m in finding.extra if m.label == label)


def test_mosfet_conduction_is_i_rms_squared_times_the_hot_on_resistance():
    # P = I_rms^2 R_DS(on) at the hot junction (Mohan, Undeland, Robbins, Power Electronics, 3rd ed., MOSFET on-state
    # loss): 1.2 A RMS, 0.85 ohm at 25 degC x 1.9 from the maker's curve = 1.615 ohm hot: 2.3256 W.
    finding = junction(mosfet(current_rms="1.2 A", rds_on="0.85 ohm", rds_on_rise=1.9))
    assert extra(finding, "conduction loss") == pytest.approx(1.2 ** 2 * 0.85 * 1.9)
    assert extra(finding, "hot on-resistance") == pytest.approx(0.85 * 1.9)
    assert "I_rms^2" in finding.method


def test_a_declared_hot_on_resistance_is_used_as_given():
    finding = junction(mosfet(current_rms="2 A", rds_on="0.5 ohm", rds_on_hot="1.1 ohm"))
    assert extra(finding, "conduction loss") == pytest.approx(4 * 1.1)


def test_a_silent_record_takes_the_top_of_the_usual_rise_and_says_so():
    # Silicon MOSFETs: R_DS(on) about 1.5-2.5 x from 25 to 150 degC (common practice, from memory); 2.5 x assumed.
    finding = junction(mosfet(current_rms="1 A", rds_on="1 ohm"))
    assert extra(finding, "conduction loss") == pytest.approx(2.5)
    assert "rds_on_rise" in finding.explanation and finding.sources[-1].is_common_practice


def test_a_mosfet_by_forward_voltage_and_average_current_is_not_assessed():
    finding = junction(mosfet(forward_voltage="1.0 V", current="0.7 A"))
    assert finding.verdict is Verdict.NOT_ASSESSED and "rds_on" in finding.explanation


# --- the touch limit's source ----------------------------------------------------------------------------

def test_the_touch_limit_names_its_standard_edition_and_table():
    # IEC 62368-1 ed. 3 (2018) Table 38, touch temperature limits (table confirmed; 60 degC for metal from memory).
    record = Record.model_validate({**BASE, "devices": {"semiconductors": [{"ref": "Q1", "kind": "bjt", "loss": "8 W", "heatsink": "HS1"}],
                                                        "heatsinks": [{"ref": "HS1", "rth_sa": "3 K/W", "touchable": True}]}})
    finding = next(f for f in thermal.run(record) if f.code == "THERM-HEATSINK")
    source = next(source for source in finding.sources if "62368-1" in source.title)
    assert "62368-1" in source.title and "2018" in source.edition and "Table 38" in source.clause
    assert "from memory" in source.clause and "from memory" in finding.explanation
