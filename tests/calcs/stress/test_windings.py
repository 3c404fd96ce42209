"""Stress per winding and per rail from the stage graph: the test-only split-rail amplifier supply (a 500 VA toroid
with two equal secondaries in series feeding one bridge for +/-35 V, and a small second transformer whose 10 V
winding feeds the relay supply's bridge), changed here one key at a time."""

from __future__ import annotations

import copy
import math

import pytest
import yaml

from dossier.calcs.protection import CALC as PROTECTION
from dossier.calcs.rails import CALC as RAILS
from dossier.calcs.stress import CALC as STRESS
from dossier.calcs.stress.voltages import Voltages
from dossier.findings import Verdict
from dossier.record.model import Record
from tests.fixtures.demo import RECORDS

BUILD = "split-rail-amp"
HIGH = 120 * 1.1  # V RMS at high line


def data() -> dict:
    return yaml.safe_load((RECORDS / BUILD / "rev-A.yaml").read_text(encoding="utf-8"))


def record(change=None) -> Record:
    found = copy.deepcopy(data())
    if change is not None:
        change(found)
    return Record.model_validate(found)


def one(calc, found_record, code: str, subject: str):
    found = [f for f in calc.run(found_record) if f.code == code and f.subject == subject]
    assert len(found) == 1
    return found[0]


def stress(finding) -> float:
    return finding.values[1].quantity.to("V").magnitude


def without_rails(names):
    def change(found):
        found["rails"] = [rail for rail in found["rails"] if rail["name"] not in names]
    return change


def test_a_capacitor_on_the_second_transformers_rail_is_judged_at_that_winding():
    # The +12 V relay rail names T2's secondary: the relay supply's rectified rail is that winding's peak at high line,
    # sqrt 2 x 132 V x 83 / 1000 = 15.49 V (turns ratio; a bridge's output is V_pk: ARRL Handbook, power supplies
    # chapter), not T1's 43 V that fails a 25 V part.
    rail = Voltages(record()).rectified("bridge", 5)
    assert rail.voltage.to("V").magnitude == pytest.approx(math.sqrt(2) * HIGH * 83 / 1000, rel=1e-9)
    assert one(STRESS, record(), "STRESS-CAPACITOR", "C3").verdict is Verdict.PASS


def test_without_a_rail_naming_the_winding_the_highest_transformer_above_is_taken():
    # Both transformers sit in one stage: with no rail to name T2's winding, the relay supply's reservoir is read at
    # the highest winding above it (T1's pair, 86 V), the harsher reading, and the finding says which key settles it.
    found = one(STRESS, record(without_rails({"+12 V relay"})), "STRESS-CAPACITOR", "C3")
    assert stress(found) == pytest.approx(2 * math.sqrt(2) * HIGH * 53 / 230, rel=1e-9)
    assert found.verdict is Verdict.FAIL and "rails[].winding" in found.explanation


def test_the_second_transformers_bridge_blocks_its_own_windings_peak():
    found = one(STRESS, record(), "STRESS-RECTIFIER", "BR2")
    assert stress(found) == pytest.approx(math.sqrt(2) * HIGH * 83 / 1000, rel=1e-9)
    assert found.verdict is Verdict.PASS


def test_a_bridge_across_a_split_rail_pair_blocks_both_windings():
    # A bridge across a centre-tapped winding (here two equal windings in series) whose centre is the 0 V of the
    # + and - rails: each diode blocks the whole winding's peak, 2 x V_pk of one half (ARRL Handbook, power supplies
    # chapter: a full-wave bridge's PIV is the secondary's peak; the reference values note: bridge = V_peak of the
    # secondary, confirmed). 2 x sqrt 2 x 132 V x 53 / 230 = 86.03 V.
    found = one(STRESS, record(), "STRESS-RECTIFIER", "BR1")
    assert stress(found) == pytest.approx(2 * math.sqrt(2) * HIGH * 53 / 230, rel=1e-9)
    low = record(lambda d: d["devices"]["semiconductors"][0].update(voltage_rating="80 V"))
    assert one(STRESS, low, "STRESS-RECTIFIER", "BR1").verdict is Verdict.FAIL  # 80 V < 86 V (it passed 1.5 x one winding's 43 V)


def test_equal_secondaries_no_rail_names_are_taken_in_series():
    found = one(STRESS, record(without_rails({"+35 V", "-35 V"})), "STRESS-RECTIFIER", "BR1")
    assert stress(found) == pytest.approx(2 * math.sqrt(2) * HIGH * 53 / 230, rel=1e-9)
    assert "taken in series" in found.explanation


def test_split_rail_capacitors_take_one_half_and_without_the_rails_the_whole_winding():
    # With the + and - rails declared from the bridge, each rail is one half's peak, sqrt 2 x 132 V x 53 / 230 = 43.0 V;
    # with no rails declared the centre is not known to be the 0 V, so each reservoir is taken at the whole winding
    # (the harsher reading), and a 63 V part fails.
    half = Voltages(record()).rectified("bridge", 3)
    assert half.voltage.to("V").magnitude == pytest.approx(math.sqrt(2) * HIGH * 53 / 230, rel=1e-9)
    bare = one(STRESS, record(without_rails({"+35 V", "-35 V"})), "STRESS-CAPACITOR", "C1")
    assert stress(bare) == pytest.approx(2 * math.sqrt(2) * HIGH * 53 / 230, rel=1e-9)
    assert bare.verdict is Verdict.FAIL and "centre is not known" in bare.explanation


def test_the_rails_calc_gives_a_split_rail_bridge_twice_each_rails_output():
    found = one(RAILS, record(), "RAILS-RECTIFIER", "Bridge and reservoir banks")
    output, piv = (m.quantity.to("V").magnitude for m in found.values)
    assert output == pytest.approx(39 * 1.1) and piv == pytest.approx(2 * 39 * 1.1)


def test_each_bridge_carries_only_its_own_banks_pulse():
    # Every bank charges in the primary pulse's time constant, so bank k draws C_k,ref / C_ref of it, referred to
    # its winding by V_pri,pk / V_k (equal energy: C_ref = C (V_k / V_pri,pk)^2; makers' NTC selection guides give the
    # energy 1/2 C V^2). BR1 charges the +35 V and -35 V banks through separate diode pairs: the worst diode carries one.
    crest = 120 * math.sqrt(2)
    referred = {name: c * (v / crest) ** 2 for name, c, v in (("+35", 20000, 41), ("-35", 20000, 41), ("+12", 2200, 14))}
    total = sum(referred.values())
    found = record()
    inrush = [f for f in PROTECTION.run(found) if f.code == "PROT-INRUSH"][0].value.quantity.to("A**2*s").magnitude
    for ref, bank, volts in (("BR1", "+35", 41), ("BR2", "+12", 14)):
        scale = referred[bank] / total * crest / volts
        bridge = one(PROTECTION, found, "PROT-BRIDGE-SURGE", ref)
        assert bridge.value.quantity.to("A**2*s").magnitude == pytest.approx(inrush * scale**2, rel=1e-3)
        assert bridge.verdict is Verdict.PASS
