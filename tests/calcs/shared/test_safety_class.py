"""X and Y capacitors: rated AC voltage and the class each position needs (IEC 60384-14)."""

from __future__ import annotations

import pytest

from dossier.calcs import stress
from dossier.calcs.shared import safety_class
from dossier.findings import Verdict
from dossier.record.model import Record

BASE = {"id": "unit", "title": "Test unit", "revision": "A", "date": "2026-01-01", "authors": ["Tester"], "status": "design"}


def unit(position: str, klass: str, category: str = "II", rating: str = "275 V", barriers=()) -> Record:
    return Record.model_validate({
        **BASE,
        "mains": {"nominal": "230 V", "frequency": "50 Hz", "overvoltage_category": category},
        "barriers": list(barriers),
        "devices": {"capacitors": [{"ref": "C9", "voltage_rating": rating, "position": position, "safety_class": klass}]},
    })


def finding(record, code):
    found = [f for f in stress.run(record) if f.code == code]
    assert len(found) == 1
    return found[0]


def barrier(grade: str, parts=("C9",)) -> dict:
    return {"name": "primary to output", "between": ["mains", "output"], "grade": grade, "material_group": "II",
            "creepage": "6.4 mm", "clearance": "4.0 mm", "parts": list(parts)}


def test_rated_impulse_follows_iec_60664_1_table_f1():
    # IEC 60664-1 ed. 3 (2020), Table F.1: 300 V line-to-neutral, category II 2.5 kV, III 4 kV; 150 V, II 1.5 kV.
    assert safety_class.rated_impulse_kv(230, "II") == 2.5
    assert safety_class.rated_impulse_kv(230, "III") == 4.0
    assert safety_class.rated_impulse_kv(120, "II") == 1.5


def test_x2_across_the_line_of_socket_equipment_passes():
    # IEC 60384-14: X2 is tested to a 2.5 kV impulse (from memory), enough for category II at 230 V.
    assert finding(unit("across-line", "X2"), "STRESS-SAFETY-CLASS").verdict is Verdict.PASS


def test_x2_is_not_enough_in_category_iii():
    # Category III at 230 V needs 4 kV (Table F.1); X1 is tested to 4 kV, X2 only 2.5 kV (IEC 60384-14, from memory).
    assert finding(unit("across-line", "X2", "III"), "STRESS-SAFETY-CLASS").verdict is Verdict.FAIL
    assert finding(unit("across-line", "X1", "III"), "STRESS-SAFETY-CLASS").verdict is Verdict.PASS


def test_an_unclassed_capacitor_across_the_line_fails():
    found = finding(unit("across-line", ""), "STRESS-SAFETY-CLASS")
    assert found.verdict is Verdict.FAIL and found.value.quantity == "none given"


@pytest.mark.parametrize("klass, verdict", [("Y2", Verdict.PASS), ("Y1", Verdict.PASS), ("X2", Verdict.FAIL)])
def test_line_to_earth_needs_a_y_class(klass, verdict):
    # Line to protective earth bridges basic insulation: Y2 or better (IEC 60384-14, from memory).
    assert finding(unit("line-to-earth", klass), "STRESS-SAFETY-CLASS").verdict is verdict


@pytest.mark.parametrize("grade, klass, verdict", [
    ("reinforced", "Y2", Verdict.FAIL),
    ("reinforced", "Y1", Verdict.PASS),
    ("basic", "Y2", Verdict.PASS),
])
def test_across_the_barrier_the_grade_sets_the_class(grade, klass, verdict):
    # Y1 may bridge reinforced or double insulation, Y2 only basic or supplementary (IEC 60384-14, from memory).
    assert finding(unit("across-barrier", klass, barriers=[barrier(grade)]), "STRESS-SAFETY-CLASS").verdict is verdict


def test_a_barrier_capacitor_no_barrier_names_is_taken_as_reinforced():
    found = finding(unit("across-barrier", "Y2"), "STRESS-SAFETY-CLASS")
    assert found.verdict is Verdict.FAIL and "reinforced is assumed" in found.explanation


def test_functional_insulation_needs_no_class():
    assert not [f for f in stress.run(unit("across-barrier", "", barriers=[barrier("functional")])) if f.code == "STRESS-SAFETY-CLASS"]


def test_safety_capacitor_rating_refers_to_the_nominal_supply():
    # IEC 60384-14 ed. 4.0 (2013) + A1 (2016): the rated voltage of an X or Y capacitor is the r.m.s. of the nominal
    # supply it may be connected to; the endurance and impulse tests of its class carry the tolerance and the
    # spikes (from memory). So a 250 V AC X2 part on 230 V mains passes; 230 V + 10 % = 253 V is not the limit.
    ok = finding(unit("across-line", "X2", rating="250 V"), "STRESS-CAPACITOR")
    assert ok.verdict is Verdict.PASS
    assert float(ok.limit.quantity.to("V").magnitude) == pytest.approx(230)
    assert "edition 4.0" in ok.sources[0].edition and "rated voltage" in ok.sources[0].clause
    assert finding(unit("across-line", "X2", rating="200 V"), "STRESS-CAPACITOR").verdict is Verdict.FAIL


def test_y1_across_reinforced_insulation_names_its_confirmed_source():
    # IEC 62368-1 ed. 3 (2018), clause G.11.3 and Table G.12: one Y1 capacitor may bridge reinforced insulation on a
    # mains up to 300 V in overvoltage category II (confirmed in a test house's public answer on the standard).
    found = finding(unit("across-barrier", "Y1", barriers=[barrier("reinforced")]), "STRESS-SAFETY-CLASS")
    assert found.verdict is Verdict.PASS
    assert any("Table G.12" in source.clause and "confirmed" in source.clause for source in found.sources)


def test_barrier_working_voltage_is_used_when_declared():
    # a capacitor across a barrier holds the barrier's declared working voltage, 400 V, above its 300 V rating
    declared = dict(barrier("reinforced"), working_voltage="400 V")
    found = finding(unit("across-barrier", "Y1", rating="300 V", barriers=[declared]), "STRESS-CAPACITOR")
    assert found.verdict is Verdict.FAIL and float(found.limit.quantity.to("V").magnitude) == pytest.approx(400)
