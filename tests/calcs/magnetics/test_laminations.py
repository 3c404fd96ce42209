"""Laminated E-I, U-I and C cores: geometry by hand, steel loss, and the E-I test record's mains transformer."""

from __future__ import annotations

import pytest
from tests.calcs.magnetics.test_calc import extra, findings_of, one, variant
from tests.fixtures.demo import RECORDS, load_test_record

from dossier.calcs.shared.core_geometry import geometry
from dossier.calcs.shared.lamination import lamination_of, layers_of
from dossier.findings import Verdict
from dossier.record.magnetics import Core
from dossier.units import Q_

STEEL = {"saturation_flux": "1.7 T", "family": "silicon-steel"}


def core(**fields):
    return Core.model_validate({"material": STEEL, **fields})


def test_ei_48_by_hand():
    # Scrapless EI 48 (tongue a = 16 mm, window 8 x 24 mm, outer limbs and yokes 8 mm; McLyman, from memory), stack 16 mm,
    # stacking factor 0.95 (McLyman's table for 0.35-0.5 mm laminations; from memory). By hand:
    # A_e = 16 x 16 x 0.95 = 243.2 mm^2; l_e through the centre lines = 2 (8 + 24) + 8 + 8 + 16 = 96 mm (6 a);
    # iron = (48 x 40 - 2 x 8 x 24) x 16 x 0.95 = 1536 x 15.2 = 23 347.2 mm^3.
    found = geometry(core(shape="ei-lamination", lamination="EI 48", stack="16 mm"))
    assert found.effective_area.to("mm**2").magnitude == pytest.approx(243.2)
    assert found.path_length.to("mm").magnitude == pytest.approx(96)
    assert found.window_area.to("mm**2").magnitude == pytest.approx(192)
    assert found.volume.to("mm**3").magnitude == pytest.approx(23347.2)
    assert "scrapless" in found.method and "stacking factor 0.95 taken" in found.method


def test_ei_tongue_alone_is_the_same_as_the_size():
    by_name = geometry(core(shape="ei-lamination", lamination="EI 48", stack="16 mm"))
    by_tongue = geometry(core(shape="ei-lamination", limb_width="16 mm", stack="16 mm"))
    assert by_name.volume == by_tongue.volume and by_name.path_length == by_tongue.path_length


def test_ui_core_by_hand():
    # U-I, limbs and yokes a = 20 mm, window 20 x 50 mm, stack 25 mm, stacking factor 0.9 declared. By hand:
    # A_e = 20 x 25 x 0.9 = 450 mm^2; l_e = 2 (20 + 50) + 4 x 20 = 220 mm;
    # iron = ((20 + 40) x (50 + 40) - 20 x 50) x 25 x 0.9 = (5400 - 1000) x 22.5 = 99 000 mm^3.
    found = geometry(core(shape="ui-lamination", limb_width="20 mm", stack="25 mm", window_width="20 mm",
                          window_height="50 mm", stacking_factor=0.9))
    assert found.effective_area.to("mm**2").magnitude == pytest.approx(450)
    assert found.path_length.to("mm").magnitude == pytest.approx(220)
    assert found.volume.to("mm**3").magnitude == pytest.approx(99000)


def test_declared_figures_override_the_computed_ones():
    found = geometry(core(shape="c-core", limb_width="15 mm", stack="30 mm", window_width="20 mm", window_height="50 mm",
                          effective_area="400 mm^2", mean_turn_length="130 mm"))
    assert found.effective_area == Q_(400, "mm**2") and found.mean_turn_length == Q_(130, "mm")
    assert "declared: effective_area, mean_turn_length" in found.method


def test_bobbin_winding_area_and_mean_turn_by_hand():
    # EI 48, stack 16 mm, bobbin wall 1 mm (common practice, from memory): winding area (8 - 1) x (24 - 2) = 154 mm^2;
    # inside of the bobbin 2 (16 + 16) + 8 x 1 = 72 mm; a winding 2 mm thick on 3 mm of others: 72 + 8 (3 + 1) = 104 mm.
    lam = lamination_of(core(shape="ei-lamination", lamination="EI 48", stack="16 mm"))
    assert lam.winding_area.to("mm**2").magnitude == pytest.approx(154)
    assert lam.mean_turn(Q_(3, "mm"), Q_(2, "mm")).to("mm").magnitude == pytest.approx(104)


def test_ui_core_wound_on_both_limbs_halves_each_winding():
    # 2 limbs: each carries half the turns, and each bobbin has half the window's width less its wall: (20/2 - 1) x 48.
    lam = lamination_of(core(shape="ui-lamination", limb_width="20 mm", stack="25 mm", window_width="20 mm", window_height="50 mm"))
    assert lam.limbs_wound == 2
    assert lam.winding_area.to("mm**2").magnitude == pytest.approx(2 * 9 * 48)
    # 1000 turns of 0.5 mm overall: 500 a limb, 96 to a 48 mm layer -> 6 layers.
    assert layers_of(1000, 2, Q_(0.5, "mm"), Q_(48, "mm")) == 6


# --- the E-I test record: T1, 230 V 50 Hz, EI 96 (tongue 32 mm), stack 32 mm --------------------------------------
# A_e = 32 x 32 x 0.95 = 972.8 mm^2. Faraday's law for a sine, B_pk = V / (4.44 f N A_e) with 4.44 = pi sqrt 2
# (McLyman, Transformer and Inductor Design Handbook, CRC Press; from memory): at high line 253 V, 840 turns:
# 253 / (222.144 x 840 x 972.8e-6) = 253 / 181.526 = 1.3937 T.

def test_test_record_flux_at_high_line_passes():
    flux = one(findings_of(load_test_record("linear-psu-ei")), "MAG-FLUX", "T1")
    assert flux.value.quantity.to("T").magnitude == pytest.approx(1.3937, abs=0.0002)
    assert flux.verdict is Verdict.PASS


def test_too_few_primary_turns_fail_on_flux_at_high_line(tmp_path):
    # 600 turns: 253 / (222.144 x 600 x 972.8e-6) = 253 / 129.662 = 1.9512 T, over the steel's 1.7 T saturation.
    record = variant(tmp_path, ("turns: 840,", "turns: 600,"), build="linear-psu-ei", revision="A", root=RECORDS)
    flux = one(findings_of(record), "MAG-FLUX", "T1")
    assert flux.value.quantity.to("T").magnitude == pytest.approx(1.9512, abs=0.0002)
    assert flux.verdict is Verdict.FAIL
    assert "More primary turns" in flux.explanation


def test_test_record_core_loss_from_its_grade_by_hand():
    # M400-50A: 4.00 W/kg at 1.5 T, 50 Hz (IEC 60404-8-4 grade name; from memory), as B^2 (common practice).
    # B at nominal line: 230 / 181.526 = 1.26704 T; 4 x (1.26704 / 1.5)^2 = 2.85403 W/kg.
    # Iron: 6 a^2 x s x k = 6 x 1024 x 32 x 0.95 = 186 777.6 mm^3, x 7800 kg/m^3 (non-oriented: the densest
    # conventional density, from memory) = 1.45687 kg; loss 2.85403 x 1.45687 = 4.1580 W.
    loss = one(findings_of(load_test_record("linear-psu-ei")), "MAG-CORE-LOSS", "T1")
    assert extra(loss, "loss per kilogram at the working flux").to("W/kg").magnitude == pytest.approx(2.85403, rel=1e-4)
    assert extra(loss, "iron mass").to("kg").magnitude == pytest.approx(1.45687, rel=1e-4)
    assert loss.value.quantity.to("W").magnitude == pytest.approx(4.1580, rel=1e-4)
    assert "M400-50A" in loss.explanation and "harsher" not in loss.explanation


def test_declared_loss_figure_and_mass_are_used(tmp_path):
    # 1.3 W/kg at 1.5 T, 50 Hz declared, 1.2 kg declared: 1.3 x (1.26704 / 1.5)^2 x 1.2 = 1.3 x 0.713497 x 1.2 = 1.11306 W.
    record = variant(tmp_path, ("        grade: M400-50A\n", "        specific_loss: {loss: 1.3 W/kg, flux: 1.5 T, frequency: 50 Hz}\n"),
                     ("      stack: 32 mm\n", "      stack: 32 mm\n      mass: 1.2 kg\n"),
                     build="linear-psu-ei", revision="A", root=RECORDS)
    loss = one(findings_of(record), "MAG-CORE-LOSS", "T1")
    assert loss.value.quantity.to("W").magnitude == pytest.approx(1.11306, rel=1e-4)


def test_no_loss_figure_takes_a_high_loss_grade_and_says_so(tmp_path):
    # Harsher reading: 10 W/kg at 1.5 T (as M1000-65A; from memory): 10 x 0.713497 x 1.45687 = 10.3947 W.
    record = variant(tmp_path, ("        grade: M400-50A\n", ""), build="linear-psu-ei", revision="A", root=RECORDS)
    loss = one(findings_of(record), "MAG-CORE-LOSS", "T1")
    assert loss.value.quantity.to("W").magnitude == pytest.approx(10.3947, rel=1e-4)
    assert "harsher" in loss.explanation and "core.material.specific_loss" in loss.explanation
    rise = one(findings_of(record), "MAG-TEMP-RISE", "T1")
    graded = one(findings_of(load_test_record("linear-psu-ei")), "MAG-TEMP-RISE", "T1")
    assert rise.value.quantity > graded.value.quantity


def test_test_record_fill_and_temperature_are_judged():
    findings = findings_of(load_test_record("linear-psu-ei"))
    fill = one(findings, "MAG-FILL", "T1")
    # Bobbin winding area of EI 96 with a 1 mm wall: (16 - 1) x (48 - 2) = 690 mm^2.
    assert extra(fill, "window area").to("mm**2").magnitude == pytest.approx(690)
    assert fill.verdict is Verdict.PASS
    assert one(findings, "MAG-TEMP-RISE", "T1").verdict is Verdict.PASS
    assert one(findings, "MAG-WINDING-TEMP", "T1").verdict is Verdict.PASS
    density = one(findings, "MAG-CURRENT-DENSITY", "T1 secondary")
    assert "lamination core (from the shape ei-lamination)" in density.method


def test_an_overfull_bobbin_fails(tmp_path):
    record = variant(tmp_path, ("wire: 1.25 mm", "wire: 2.0 mm"), build="linear-psu-ei", revision="A", root=RECORDS)
    assert one(findings_of(record), "MAG-FILL", "T1").verdict is Verdict.FAIL
