"""Winding limits: the primary current the protection calc uses, McLyman's core-size current density, the
insulation class, and every measure in the JSON."""

from __future__ import annotations

import math

import pytest
from tests.fixtures.magnetics_records import FERRITE, load, magnetic, measure, one

from dossier.calcs.magnetics import run
from dossier.calcs.shared.input_current import input_current
from dossier.findings import Verdict

STEEL = {"name": "test steel", "family": "silicon-steel", "saturation_flux": "1.6 T", "max_temperature": "120 degC"}
BIG_TOROID = {"shape": "toroid", "outer_diameter": "80 mm", "inner_diameter": "40 mm", "height": "30 mm"}
MAINS_STAGES = [
    {"kind": "mains-input", "name": "Mains input", "side": "mains", "parts": [{"ref": "F1", "kind": "fuse", "value": "T1A", "role": "mains fuse"}]},
    {"kind": "rectifier", "name": "Rectifier", "side": "isolated", "topology": "bridge", "parts": []},
]
OUTPUT = {"voltage": "13.8 V", "current": "5 A", "efficiency": "80 %", "power_factor": "0.7"}


def mains_transformer(wire="0.355 mm"):
    return magnetic(role="mains-transformer", excitation=None, core=dict(BIG_TOROID, material=STEEL), windings=[
        {"name": "primary", "role": "primary", "turns": 1500, "wire": wire},
        {"name": "secondary", "role": "secondary", "turns": 90, "wire": "1.5 mm", "current": "5 A"},
    ])


def test_mains_transformer_primary_carries_the_protection_calcs_input_current(tmp_path):
    # The primary is in series with the mains, so it carries the mains input current, power factor included.
    # Power factor 0.7 declared (a transformer feeding a capacitor-input rectifier).
    # I = P_out / eta / (V_low PF) = 69 / 0.8 / (207 x 0.7) = 0.5952 A (IEC 60050-131: PF = P / S), not the
    # 69 / 0.8 / 207 = 0.4167 A of a power factor of 1. In 0.355 mm wire (0.09898 mm^2): 6.01 A/mm^2.
    record = load(tmp_path, magnetics=[mains_transformer()], stages=MAINS_STAGES, output=OUTPUT,
                  mains={"nominal": "230 V", "frequency": "50 Hz", "tolerance": "10 %"})
    finding = one(run(record), "MAG-CURRENT-DENSITY", "T1 primary")
    current = measure(finding, "RMS current").to("A").magnitude
    assert current == pytest.approx(69 / 0.8 / (207 * 0.7), rel=1e-6)
    assert current == pytest.approx(input_current(record).rms.to("A").magnitude, rel=1e-9)
    assert finding.value.quantity.to("A/mm**2").magnitude == pytest.approx(current / (math.pi * 0.355**2 / 4), rel=1e-6)
    assert finding.verdict is Verdict.FAIL
    assert "mains input current" in finding.method


def test_current_density_limit_from_the_core_size(tmp_path):
    # McLyman, Transformer and Inductor Design Handbook, 3rd ed. 2004, chapter 5, table of K_j by core configuration
    # (from memory): ferrite toroid -> 'powder' row, K_j 590 at a 50 degC rise, x = -0.12 (100 degC core limit - 40 degC
    # default ambient = 60 K allowed). 80 x 40 x 30 mm toroid: A_e = 30 ln^2(2) / (1/20 - 1/40) = 576.5 mm^2
    # (IEC 60205 ed. 4.0 ring core), W_a = pi 40^2 / 4 = 1256.6 mm^2, A_p = 72.44 cm^4;
    # J = 590 x 72.44^-0.12 = 352.9 A/cm^2 = 3.53 A/mm^2. 3.4 A in 1.0 mm wire is 4.33 A/mm^2: it passed the flat
    # 5 A/mm^2, it fails the core-size limit.
    windings = [{"name": "primary", "role": "primary", "turns": 40, "wire": "0.5 mm", "current": "0.5 A"},
                {"name": "secondary", "role": "secondary", "turns": 6, "wire": "1.0 mm", "current": "3.4 A"}]
    record = load(tmp_path, magnetics=[magnetic(core=dict(BIG_TOROID, material=FERRITE), windings=windings)])
    finding = one(run(record), "MAG-CURRENT-DENSITY", "T1 secondary")
    area = 30 * math.log(2) ** 2 / (1 / 20 - 1 / 40)
    product_cm4 = math.pi * 40**2 / 4 * area / 1e4
    assert measure(finding, "area product").to("cm**4").magnitude == pytest.approx(product_cm4, rel=1e-6)
    assert finding.limit.quantity.to("A/mm**2").magnitude == pytest.approx(590 * product_cm4**-0.12 / 100, rel=1e-6)
    assert finding.verdict is Verdict.FAIL


def test_core_of_unknown_size_is_held_at_marginal(tmp_path):
    # A declared core with no window area: K_j A_p^x cannot be worked out; the flat 5 A/mm^2 (upper end of the
    # usual band, common practice) with the verdict held at marginal, naming core.window_area.
    core = {"shape": "declared", "effective_area": "95 mm^2", "path_length": "90 mm", "material": FERRITE}
    record = load(tmp_path, magnetics=[magnetic(core=core)])
    finding = one(run(record), "MAG-CURRENT-DENSITY", "T1 secondary")
    assert finding.verdict is Verdict.MARGINAL and "core.window_area" in finding.explanation


@pytest.mark.parametrize("declared, verdict", [(None, Verdict.FAIL), ("B", Verdict.MARGINAL), ("F", Verdict.PASS)])
def test_winding_temperature_against_the_insulation_class(tmp_path, declared, verdict):
    # IEC 60085 ed. 4.0 (2007), Table 1: class A 105, B 130, F 155 degC. The test transformer at 14 A in its
    # secondary (its copper loss raised by Dowell's F_R at 50 kHz) runs the winding at 40 degC ambient + rise
    # (McLyman's T_r = 450 psi^0.826, about 82 K); no class declared takes class A (harsher).
    material = dict(FERRITE, max_temperature="180 degC")
    windings = [{"name": "primary", "role": "primary", "turns": 40, "wire": "0.5 mm", "current": "2.1 A"},
                {"name": "secondary", "role": "secondary", "turns": 6, "wire": "1.0 mm", "current": "14 A"}]
    extra = {} if declared is None else {"insulation_class": declared}
    record = load(tmp_path, magnetics=[magnetic(core=dict(magnetic()["core"], material=material), windings=windings, **extra)])
    findings = run(record)
    rise = one(findings, "MAG-TEMP-RISE", "T1").value.quantity.to("K").magnitude
    finding = one(findings, "MAG-WINDING-TEMP", "T1")
    assert finding.value.quantity.to("degC").magnitude == pytest.approx(40 + rise)
    assert 120 < 40 + rise < 130  # the case sits between class A and B, within 10 K of class B
    assert finding.limit.quantity.to("degC").magnitude == {None: 105, "B": 130, "F": 155}[declared]
    assert finding.verdict is verdict
    assert ("harsher" in finding.method) is (declared is None)


def test_every_measure_is_a_measure_of_its_finding(tmp_path):
    # skin depth, hot resistance, loss density, loss per volume and flux swing each as a measure of its finding,
    # so `check --format json` carries them (issue 14, item 7), not only the prose
    record = load(tmp_path, magnetics=[magnetic()])
    labels = {m.label for f in run(record) for m in (*f.values, *f.extra)}
    for start in ("skin depth at", "resistance at 100", "loss density", "loss per volume", "flux swing", "area product"):
        assert any(label.startswith(start) for label in labels), start
