"""Insulation between windings across a double or reinforced barrier (MAG-BARRIER-INSULATION).

Rules checked (IEC 62368-1 ed. 3 clause 5.4.4.6 thin sheet material and Annex J insulated winding wire; IEC 61558-1
on insulation between windings; the three-layer rule confirmed in public quotations of IEC 60950-1 clause 2.10.5.7,
the 62368-1 clause number from memory): enamel counts for nothing; triple-insulated wire on one side, or at least
three layers of tape between the windings, or a split bobbin; the core is conductive (MnZn ferrite, steel) and
belongs to the winding nearest it; end margins along a bobbin (margin-tape practice, from memory).
"""

from __future__ import annotations

import pytest

from dossier.calcs.magnetics import run
from dossier.findings import Verdict
from dossier.problems import InputError
from tests.fixtures.demo import load_demo
from tests.fixtures.magnetics_records import load, magnetic, one

BARRIER = {"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced", "material_group": "IIIa",
           "creepage": "6.4 mm", "clearance": "4 mm", "parts": ["T1"]}
BOBBIN = {"shape": "declared", "effective_area": "52 mm^2", "path_length": "57 mm", "window_area": "60 mm^2",
          "mean_turn_length": "50 mm", "surface_area": "30 cm^2",
          "material": {"name": "MnZn ferrite", "saturation_flux": "0.39 T", "max_temperature": "100 degC"}}


def windings(primary=None, secondary=None):
    return [{"name": "primary", "role": "primary", "turns": 40, "wire": "0.5 mm", "current": "0.5 A", **(primary or {})},
            {"name": "secondary", "role": "secondary", "turns": 6, "wire": "1.0 mm", "current": "3 A", **(secondary or {})}]


def insulation(tmp_path, barriers=(BARRIER,), **changes):
    record = load(tmp_path, magnetics=[magnetic(**changes)], barriers=list(barriers))
    found = [f for f in run(record) if f.code == "MAG-BARRIER-INSULATION"]
    return found[0] if found else None


def test_enamel_alone_across_a_reinforced_barrier_fails(tmp_path):
    finding = insulation(tmp_path, windings=windings())
    assert finding.verdict is Verdict.FAIL and finding.guards_hazard
    assert "Enamel is not insulation" in finding.explanation
    assert "windings[].side" in finding.explanation  # sides read harshly where not declared


@pytest.mark.parametrize("layers, verdict", [(2, Verdict.FAIL), (3, Verdict.PASS)])
def test_three_layers_of_tape_between_the_windings_pass_two_do_not(tmp_path, layers, verdict):
    finding = insulation(tmp_path, windings=windings(primary={"tape_layers": layers}))
    assert finding.verdict is verdict
    assert finding.value.quantity.magnitude == layers and finding.limit.quantity.magnitude == 3


def test_triple_insulated_wire_on_one_side_passes(tmp_path):
    finding = insulation(tmp_path, windings=windings(secondary={"triple_insulated": True}))
    assert finding.verdict is Verdict.PASS


def test_windings_on_the_same_side_need_no_barrier_insulation(tmp_path):
    # a gate-drive transformer whose windings are all on the mains side, though listed in the barrier
    both_mains = windings(secondary={"side": "mains"})
    assert insulation(tmp_path, windings=both_mains) is None


def test_a_transformer_no_barrier_lists_is_not_judged_unless_it_is_a_mains_transformer(tmp_path):
    assert insulation(tmp_path, barriers=(), windings=windings()) is None
    finding = insulation(tmp_path, barriers=(), role="mains-transformer", windings=windings())
    assert finding.verdict is Verdict.FAIL and "reinforced one is assumed" in finding.explanation


def test_a_layered_mains_transformer_on_a_bobbin_without_its_construction_is_not_assessed(tmp_path):
    finding = insulation(tmp_path, role="mains-transformer", core=BOBBIN, windings=windings(primary={"tape_layers": 2}))
    assert finding.verdict is Verdict.NOT_ASSESSED and finding.blocks_power_up
    assert "construction" in finding.explanation


def test_a_split_bobbin_passes_and_a_toroid_cannot_be_split(tmp_path):
    finding = insulation(tmp_path, role="mains-transformer", core=BOBBIN, construction="split-bobbin", windings=windings())
    assert finding.verdict is Verdict.PASS
    with pytest.raises(InputError) as caught:
        load(tmp_path, magnetics=[magnetic(construction="split-bobbin")])
    assert "construction" in str(caught.value.problems[0])


def test_the_core_faces_the_outer_winding_on_a_bobbin(tmp_path):
    # MnZn ferrite conducts: the core is part of the primary (first wound); the secondary, outermost, faces the
    # core's outer limbs across only its own wrap. Three layers over the primary but none over the secondary: fail.
    taped = windings(primary={"tape_layers": 3, "end_margin": "3.2 mm"}, secondary={"end_margin": "3.2 mm"})
    finding = insulation(tmp_path, core=BOBBIN, construction="layered", windings=taped)
    assert finding.verdict is Verdict.FAIL and "the core to secondary: 0 layers" in finding.explanation
    isolated = insulation(tmp_path, core={**BOBBIN, "isolated": True}, construction="layered", windings=taped)
    assert isolated.verdict is Verdict.PASS


@pytest.mark.parametrize("margin, verdict", [(None, Verdict.NOT_ASSESSED), ("3.0 mm", Verdict.FAIL), ("3.2 mm", Verdict.PASS)])
def test_end_margins_on_a_bobbin_must_reach_the_barriers_declared_creepage(tmp_path, margin, verdict):
    # 3.0 + 3.0 = 6.0 mm < 6.4 mm declared; 3.2 + 3.2 = 6.4 mm reaches it.
    extra = {"end_margin": margin} if margin else {}
    taped = windings(primary={"tape_layers": 3, **extra}, secondary={"tape_layers": 3, **extra})
    finding = insulation(tmp_path, core=BOBBIN, construction="layered", windings=taped)
    assert finding.verdict is verdict


def test_demo_verdicts():
    # The charger's T1: three layers of tape over the primary, on a toroid: pass. The bench supply's mains toroid:
    # two layers: fail. The rotator's laminated mains transformer: construction not declared: not assessed.
    def verdict(build, revision):
        return one(run(load_demo(build, revision)), "MAG-BARRIER-INSULATION", "T1").verdict
    assert verdict("solar-bank-charger", "D") is Verdict.PASS
    assert verdict("bench-psu-13v8", "B") is Verdict.FAIL
    assert verdict("rotator-control", "A") is Verdict.NOT_ASSESSED
