"""A rail's no-load rise worked out from the resistances of the transformer winding that feeds it: the formulas
against a numerical simulation and hand calculations (sources named beside each check), and whole records."""

from __future__ import annotations

import math

import pytest
from pydantic import ValidationError

from dossier.calcs import magnetics, rails
from dossier.calcs.shared.regulation import WindingFigures, capacitor_input_peak, choke_input_peak, conduction_angle, referred_resistance
from dossier.record.model import Record
from dossier.units import Q_

HEAD = {"id": "case", "title": "Case", "revision": "A", "date": "2026-01-01", "authors": ["A. Tester"], "status": "design",
        "mains": {"nominal": "230 V", "frequency": "50 Hz", "tolerance": "10 %"}}
STAGES = [
    {"id": "input", "kind": "mains-input", "name": "Input", "side": "mains", "topology": "direct"},
    {"id": "transformer", "kind": "magnetics", "name": "Transformer", "side": "isolated",
     "parts": [{"ref": "T1", "kind": "transformer"}]},
    {"id": "ht", "kind": "rectifier", "name": "HT rectifier", "side": "isolated", "topology": "bridge"},
    {"id": "filter", "kind": "filter", "name": "HT filter", "side": "isolated", "topology": "clc"},
    {"id": "heater", "kind": "output", "name": "Heaters", "side": "isolated", "fed_from": ["transformer"]},
]
MEAN_TURN = 0.170  # m, declared
HOT = 100  # degC: the material declares no maximum temperature


def transformer(*secondaries) -> dict:
    return {
        "ref": "T1", "role": "mains-transformer",
        "core": {"shape": "declared", "effective_area": "900 mm^2", "path_length": "180 mm", "window_area": "1000 mm^2",
                 "mean_turn_length": "170 mm", "surface_area": "300 cm^2",
                 "material": {"family": "silicon-steel", "saturation_flux": "1.5 T"}},
        "windings": [{"name": "primary", "role": "primary", "turns": 1100, "wire": "0.45 mm"}, *secondaries],
    }


HT = {"name": "HT", "role": "secondary", "turns": 1319, "wire": "0.35 mm"}
HEATER = {"name": "heater", "role": "secondary", "turns": 33, "wire": "1.25 mm"}


def unit(rail_list, windings=(HT, HEATER), stages=STAGES) -> Record:
    return Record(**HEAD, stages=stages, rails=rail_list, magnetics=[transformer(*windings)])


def b_plus(**more) -> dict:
    return {"name": "B+", "stage": "filter", "voltage": "350 V", "current": "120 mA", "winding": "T1 HT", **more}


def by(findings, code, subject):
    return next(f for f in findings if f.code == code and f.subject == subject)


def copper(turns, diameter_mm, celsius=HOT) -> float:
    # IEC 60028: 1/58 ohm mm^2/m at 20 degC, 0.00393 per K
    area = math.pi * diameter_mm**2 / 4
    return turns * MEAN_TURN / 58 / area * (1 + 0.00393 * (celsius - 20))


def source_resistance(turns) -> float:
    # The ARRL Handbook, power supplies chapter (from memory): R_p (N_s / N_p)^2 + R_s
    return copper(1100, 0.45) * (turns / 1100) ** 2 + copper(turns, 0.35 if turns == 1319 else 1.25)


# --- the formulas ---------------------------------------------------------------------------------------

def simulated_output(source: float, load: float, pulses: int) -> float:
    """Average output of an ideal-diode rectifier (full-wave for 2 pulses, half-wave for 1) from a 1 V peak sine
    through `source` ohms into a reservoir of omega C R_L = 2000 and `load` ohms, stepped in time to steady state."""
    frequency, steps, cycles = 50.0, 1000, 400
    capacitance = 2000 / (2 * math.pi * frequency * load)
    dt, v, total, count = 1 / (frequency * steps), 0.7, 0.0, 0
    for k in range(cycles * steps):
        e = math.sin(2 * math.pi * frequency * k * dt)
        e = abs(e) if pulses == 2 else max(e, 0.0)
        v += dt * (max(e - v, 0.0) / source - v / load) / capacitance
        if k >= (cycles - 10) * steps:
            total, count = total + v, count + 1
    return total / count


@pytest.mark.parametrize("ratio", [0.003, 0.03, 0.1])
@pytest.mark.parametrize("pulses", [1, 2])
def test_the_capacitor_input_relation_matches_a_simulated_rectifier(ratio, pulses):
    # O. H. Schade, "Analysis of rectifier operation", Proc. IRE 1943 (from memory): V_dc / V_pk = cos theta with
    # tan theta - theta = pi R_s / (n R_L), the large-capacitance limit of his curves; checked here against a direct
    # time-step simulation of the circuit (circuit theory), within 0.2 %
    theta = conduction_angle(math.pi * ratio / pulses)
    assert simulated_output(ratio * 1000, 1000, pulses) == pytest.approx(math.cos(theta), rel=2e-3)


def test_schade_full_wave_figure():
    # Schade's full-wave curve for R_s / R_L = 1 % and a large reservoir reads about 0.93-0.94 of the peak (from memory)
    assert math.cos(conduction_angle(math.pi * 0.01 / 2)) == pytest.approx(0.9376, abs=1e-3)


def test_the_primary_is_referred_through_the_square_of_the_turns_ratio():
    # The ARRL Handbook, power supplies chapter (from memory): 20 ohm primary, 1:2 step-up, 40 ohm secondary: 80 + 40
    def figures(name, turns, ohms):
        return WindingFigures("T1", 0, 0, name, "primary", turns, False, Q_(ohms, "ohm"), Q_(ohms, "ohm"), Q_(20, "degC"), None, ())
    primary, secondary = figures("p", 100, 20), figures("s", 200, 40)
    assert referred_resistance(primary, secondary, half=False).magnitude == pytest.approx(120)
    # one half of a centre-tapped winding: 100 turns and 20 ohm, the primary referred 1:1
    assert referred_resistance(primary, secondary, half=True).magnitude == pytest.approx(40)


def test_a_choke_input_filter_rises_to_the_peak():
    # The ARRL Handbook, power supplies chapter: a choke-input filter gives 2 / pi of the peak (0.9 V_RMS), less the
    # I R drop; with no load it charges to the peak: 300 V loaded with 0.1 A through 100 ohm -> pi / 2 x 310 V
    assert choke_input_peak(Q_(300, "V"), Q_(0.1, "A"), Q_(100, "ohm")).magnitude == pytest.approx(math.pi / 2 * 310)


def test_ripple_lifts_the_peak_by_half_its_height():
    without, _ = capacitor_input_peak(Q_(300, "V"), Q_(0.1, "A"), Q_(50, "ohm"), 2.0)
    with_ripple, _ = capacitor_input_peak(Q_(300, "V"), Q_(0.1, "A"), Q_(50, "ohm"), 2.0, Q_(20, "V"))
    assert (with_ripple - without).magnitude == pytest.approx(10 / math.cos(conduction_angle(math.pi * 50 / (2 * 3000))))


# --- whole records --------------------------------------------------------------------------------------

def test_a_named_winding_gives_the_rise_from_its_resistances():
    findings = rails.run(unit([b_plus()]))
    finding = by(findings, "RAILS-VOLTAGE", "B+")
    source = source_resistance(1319)
    theta = conduction_angle(math.pi * source / (2 * 350 / 0.12))
    assert finding.value.quantity.to("V").magnitude == pytest.approx(350 / math.cos(theta) * 1.1, rel=1e-6)
    assert "resistances of the transformer winding" in finding.explanation and "rails[].winding names T1 HT" in finding.explanation
    assert ("rails", 0, "no_load_voltage") in finding.keys and ("magnetics", 0, "windings", 1, "wire") in finding.keys
    assert by(findings, "RAILS-VOLTAGE", "B+").extra[2].quantity.to("ohm").magnitude == pytest.approx(source)


def test_the_worked_out_rise_replaces_the_assumed_one_and_a_declared_figure_wins():
    worked = by(rails.run(unit([b_plus()])), "RAILS-VOLTAGE", "B+").value.quantity
    assumed = by(rails.run(unit([b_plus(winding=None)], windings=(HT, HEATER))), "RAILS-VOLTAGE", "B+")
    assert "assumed 25 %" in assumed.explanation and ("rails", 0, "winding") in assumed.keys
    assert worked != assumed.value.quantity
    declared = by(rails.run(unit([b_plus(regulation="10 %")])), "RAILS-VOLTAGE", "B+").value.quantity
    assert declared.to("V").magnitude == pytest.approx(350 * 1.1 * 1.1)


def test_the_one_secondary_of_the_transformer_above_the_rail_is_taken_without_naming_it():
    finding = by(rails.run(unit([b_plus(winding=None)], windings=(HT,))), "RAILS-VOLTAGE", "B+")
    assert "the one secondary of the transformer above the rail" in finding.explanation


def test_an_ac_rail_rises_by_its_current_times_the_source_resistance():
    heater = {"name": "heater", "stage": "heater", "voltage": "6.3 V", "kind": "ac", "current": "3 A", "winding": "T1 heater"}
    finding = by(rails.run(unit([heater])), "RAILS-VOLTAGE", "heater")
    # V + I R_s (ARRL Handbook, from memory); the turns give 230 x 33 / 1100 = 6.9 V, below it here
    source = copper(1100, 0.45) * (33 / 1100) ** 2 + copper(33, 1.25)
    assert finding.value.quantity.to("V").magnitude == pytest.approx(max(6.3 + 3 * source, 230 * 33 / 1100) * 1.1, rel=1e-6)


def test_the_turns_give_the_no_load_peak_when_it_is_higher():
    # 350 V claimed from a winding whose no-load peak is 230 sqrt 2 x 1500 / 1100 = 443.5 V: the turns win
    finding = by(rails.run(unit([b_plus()], windings=({**HT, "turns": 1500}, HEATER))), "RAILS-VOLTAGE", "B+")
    assert finding.value.quantity.to("V").magnitude == pytest.approx(230 * math.sqrt(2) * 1500 / 1100 * 1.1, rel=1e-6)
    assert "no-load peak from the turns" in finding.explanation


def test_rails_on_one_winding_share_its_drop():
    second = {"name": "screen", "stage": "filter", "voltage": "340 V", "current": "60 mA", "winding": "T1 HT"}
    alone = by(rails.run(unit([b_plus()])), "RAILS-VOLTAGE", "B+").value.quantity
    shared = by(rails.run(unit([b_plus(), second])), "RAILS-VOLTAGE", "B+").value.quantity
    assert shared > alone


def test_a_choke_input_rail_without_its_winding_is_taken_to_the_peak():
    stages = [*STAGES[:3], {"id": "filter", "kind": "filter", "name": "Choke", "side": "isolated", "topology": "choke-input"}]
    finding = by(rails.run(unit([b_plus(winding=None)], stages=stages, windings=(HT, HEATER))), "RAILS-VOLTAGE", "B+")
    assert finding.value.quantity.to("V").magnitude == pytest.approx(350 * math.pi / 2 * 1.1)
    assert "choke-input" in finding.explanation and ("rails", 0, "winding") in finding.keys


def test_a_winding_the_record_does_not_have_is_refused_at_its_key():
    with pytest.raises(ValidationError) as raised:
        unit([b_plus(winding="T1 B+")])
    error = raised.value.errors()[0]
    assert error["loc"] == ("rails", 0, "winding") and "T1 HT" in error["msg"]


def test_the_magnetics_calc_hands_on_each_winding_hot_and_cold():
    figures = magnetics.run(unit([b_plus()])).products[magnetics.WINDINGS]
    ht = next(f for f in figures if f.name == "HT")
    assert ht.resistance.to("ohm").magnitude == pytest.approx(copper(1319, 0.35))
    assert ht.cold.to("ohm").magnitude == pytest.approx(copper(1319, 0.35, 20))
    assert ht.peak.to("V").magnitude == pytest.approx(230 * math.sqrt(2) * 1319 / 1100)
