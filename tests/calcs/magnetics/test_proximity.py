"""Proximity loss in multilayer windings by Dowell's method.

P. L. Dowell, 'Effects of eddy currents in transformer windings', Proc. IEE vol. 113 no. 8, 1966:
F_R = D [(sinh 2D + sin 2D)/(cosh 2D - cos 2D) + 2 (m^2 - 1)/3 (sinh D - sin D)/(cosh D + cos D)].
No worked table value could be confirmed, so the closed form is checked against the same result written in
complex form as published by Encyclopedia Magnetica (S. Zurek, 'Calculator of proximity effect from Dowell curves'):
F_R = Re{a coth a} + (m^2 - 1)/3 Re{2 a tanh(a/2)}, a = (1 + j) D; and against its limits as properties: F_R -> 1
for small D, the low-D series 1 + (5 m^2 - 1) D^4 / 45 (from memory), and growth with m^2 at large D.
"""

from __future__ import annotations

import cmath

import pytest

from dossier.calcs.magnetics import run
from dossier.calcs.magnetics.formulas import dowell_factor, dowell_delta_round
from dossier.findings import Verdict
from dossier.units import Q_
from tests.fixtures.magnetics_records import load, magnetic, one


def complex_form(delta: float, layers: int) -> float:
    a = (1 + 1j) * delta
    return (a / cmath.tanh(a)).real + (layers**2 - 1) / 3 * (2 * a * cmath.tanh(a / 2)).real


@pytest.mark.parametrize("delta", [0.05, 0.3, 0.7, 1.0, 1.7, 3.0, 8.0])
@pytest.mark.parametrize("layers", [1, 2, 3, 5, 10])
def test_the_closed_form_matches_the_published_complex_form(delta, layers):
    assert dowell_factor(delta, layers) == pytest.approx(complex_form(delta, layers), rel=1e-9)


def test_small_delta_tends_to_one_and_follows_the_series():
    # property: F_R -> 1 as D -> 0; series 1 + (5 m^2 - 1) D^4 / 45 (from memory), checked where both forms hold
    assert dowell_factor(1e-4, 5) == pytest.approx(1.0, abs=1e-12)
    for layers in (1, 4):
        assert dowell_factor(0.1, layers) == pytest.approx(1 + (5 * layers**2 - 1) * 0.1**4 / 45, rel=1e-6)
    # across the switch from series to closed form the factor is continuous
    assert dowell_factor(0.00999, 3) == pytest.approx(dowell_factor(0.01001, 3), rel=1e-6)


def test_large_delta_grows_with_m_squared():
    # property: for large D both ratios tend to 1, F_R -> D (1 + 2 (m^2 - 1)/3) = D (2 m^2 + 1)/3
    for layers in (1, 2, 6):
        assert dowell_factor(25.0, layers) == pytest.approx(25.0 * (2 * layers**2 + 1) / 3, rel=1e-9)
        assert dowell_factor(31.0, layers) == pytest.approx(complex_form(31.0, layers), rel=1e-9)
    assert dowell_factor(2.0, 6) / dowell_factor(2.0, 3) > 3  # quadrupling of the proximity term with twice the layers


def test_round_wire_delta():
    # (pi/4)^(3/4) (d / delta) sqrt(d / p): 1 mm wire at a 1 mm pitch, 0.5 mm skin depth: 0.8340 x 2 = 1.668
    assert dowell_delta_round(Q_(1, "mm"), Q_(1, "mm"), Q_(0.5, "mm")) == pytest.approx((3.141592653589793 / 4) ** 0.75 * 2)


def test_more_layers_raise_the_copper_loss_and_the_rise(tmp_path):
    # The test transformer at 50 kHz: the secondary declared in 1 layer, then in 4; the copper loss is I^2 R_hot F_R.
    def findings(layers):
        windings = [{"name": "primary", "role": "primary", "turns": 40, "wire": "0.5 mm", "current": "0.5 A"},
                    {"name": "secondary", "role": "secondary", "turns": 6, "wire": "1.0 mm", "current": "3 A", "layers": layers}]
        return run(load(tmp_path, magnetics=[magnetic(windings=windings)]))
    one_layer, four = findings(1), findings(4)
    f1 = one(one_layer, "MAG-PROXIMITY", "T1 secondary")
    f4 = one(four, "MAG-PROXIMITY", "T1 secondary")
    delta = next(m.quantity for m in f1.extra if m.label.startswith("Delta")).magnitude
    assert f1.value.quantity.magnitude == pytest.approx(dowell_factor(delta, 1))
    assert f4.value.quantity.magnitude == pytest.approx(dowell_factor(delta, 4))
    loss = {n: next(m.quantity for m in one(f, "MAG-RESISTANCE", "T1 secondary").extra if m.label.startswith("copper loss")).magnitude
            for n, f in ((1, one_layer), (4, four))}
    assert loss[4] / loss[1] == pytest.approx(dowell_factor(delta, 4) / dowell_factor(delta, 1))
    assert one(four, "MAG-TEMP-RISE", "T1").value.quantity > one(one_layer, "MAG-TEMP-RISE", "T1").value.quantity


def test_a_declared_core_without_layers_is_not_assessed_and_holds_the_rise_at_marginal(tmp_path):
    core = {"shape": "declared", "effective_area": "52 mm^2", "path_length": "57 mm", "window_area": "60 mm^2",
            "mean_turn_length": "50 mm", "surface_area": "30 cm^2",
            "material": {"name": "ferrite", "saturation_flux": "0.39 T", "max_temperature": "100 degC"}}
    findings = run(load(tmp_path, magnetics=[magnetic(core=core, insulation_class="F")]))
    proximity = one(findings, "MAG-PROXIMITY", "T1 secondary")
    assert proximity.verdict is Verdict.NOT_ASSESSED and "windings[].layers" in proximity.explanation
    assert not proximity.blocks_power_up  # not a mains barrier or the mains protection
    winding = one(findings, "MAG-WINDING-TEMP", "T1")
    assert winding.verdict is Verdict.MARGINAL and "layers" in winding.explanation
