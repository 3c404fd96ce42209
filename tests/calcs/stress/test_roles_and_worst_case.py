"""Record-level checks: diodes judged by their role, capacitors at high line and no load and by their share of a
series string, and switches by the rating the record says it gives."""

from __future__ import annotations

import math

import pytest
from pydantic import ValidationError

from dossier.calcs import stress
from dossier.findings import Verdict
from tests.calcs.stress.test_calc import HIGH_LINE_PEAK, by, record, volts

LINE_PEAK = HIGH_LINE_PEAK  # 230 V + 10 %: 357.8 V


# --- diodes by role ----------------------------------------------------------------------------------

def forward(diode: dict, part_role: str = "", topology: str = "forward"):
    return record(
        stages=[{"kind": "mains-input", "name": "Input", "side": "mains", "parts": [{"ref": "BR1", "kind": "bridge"}]},
                {"kind": "converter", "name": "Forward", "side": "mains", "topology": topology,
                 "parts": [{"ref": "Q1", "kind": "transistor"}, {"ref": "D3", "kind": "diode", "role": part_role}]}],
        devices={"semiconductors": [{"ref": "BR1", "kind": "bridge", "voltage_rating": "600 V"},
                                    {"ref": "D3", "kind": "diode", "voltage_rating": "600 V", **diode}]},
    )


def test_forward_reset_diode_blocks_twice_the_bus_and_600_volts_fails():
    # Mohan, Undeland, Robbins, Power Electronics (Wiley, 3rd ed.), forward converter: with a 1:1 reset winding the
    # reset diode blocks V_d + V_d = 2 x 357.8 V = 715.6 V at 230 V + 10 %.
    finding = by(stress.run(forward({"role": "reset"})), "STRESS-RECTIFIER", "D3")
    assert volts(finding.values[1].quantity) == pytest.approx(2 * LINE_PEAK)
    assert finding.verdict is Verdict.FAIL


def test_a_role_on_the_stage_part_is_read():
    finding = by(stress.run(forward({}, part_role="reset diode")), "STRESS-RECTIFIER", "D3")
    assert volts(finding.values[1].quantity) == pytest.approx(2 * LINE_PEAK)


def test_a_clamp_diode_blocks_what_its_switch_blocks():
    # A clamp across a forward converter's switch blocks what the switch does: 2 V_d (Mohan et al., from memory).
    assert volts(by(stress.run(forward({"role": "clamp"})), "STRESS-RECTIFIER", "D3").values[1].quantity) == pytest.approx(2 * LINE_PEAK)
    half_bridge = forward({"role": "clamp"}, topology="half-bridge")
    assert volts(by(stress.run(half_bridge), "STRESS-RECTIFIER", "D3").values[1].quantity) == pytest.approx(LINE_PEAK)


def test_a_diode_of_unknown_role_on_the_mains_side_takes_the_harshest_reading():
    finding = by(stress.run(forward({})), "STRESS-RECTIFIER", "D3")
    assert volts(finding.values[1].quantity) == pytest.approx(2 * LINE_PEAK)
    assert finding.verdict is Verdict.FAIL and "Set role" in finding.explanation


def test_the_mains_bridge_still_blocks_the_line_peak():
    # ARRL Handbook, power supplies chapter: a bridge's diodes each block the peak of the AC it rectifies.
    finding = by(stress.run(forward({"role": "reset"})), "STRESS-RECTIFIER", "BR1")
    assert volts(finding.values[1].quantity) == pytest.approx(LINE_PEAK)


@pytest.mark.parametrize("topology", ["half-wave", "voltage-doubler"])
def test_half_wave_and_doubler_diodes_on_the_mains_block_twice_the_peak(topology):
    # ARRL Handbook, power supplies chapter: a capacitor-input half-wave rectifier, and each diode of a doubler,
    # block twice the peak of the AC (2.83 x V_RMS).
    unit = record(stages=[{"kind": "mains-input", "name": "Input", "side": "mains", "topology": topology,
                           "parts": [{"ref": "D1", "kind": "diode"}]}],
                  devices={"semiconductors": [{"ref": "D1", "kind": "diode", "voltage_rating": "600 V"}]})
    finding = by(stress.run(unit), "STRESS-RECTIFIER", "D1")
    assert volts(finding.values[1].quantity) == pytest.approx(2 * LINE_PEAK)
    assert finding.verdict is Verdict.FAIL


# --- capacitors at no load ---------------------------------------------------------------------------

def linear(capacitor: dict):
    return record(
        stages=[{"kind": "rectifier", "name": "Rectifier", "side": "isolated", "topology": "bridge",
                 "parts": [{"ref": "BR1", "kind": "bridge"}, {"ref": "C1", "kind": "capacitor"}]}],
        magnetics=[{"ref": "T1", "role": "mains-transformer",
                    "core": {"shape": "declared", "effective_area": "900 mm^2", "path_length": "180 mm", "material": {"saturation_flux": "1.5 T"}},
                    "windings": [{"name": "primary", "role": "primary", "turns": 1150, "wire": "0.3 mm"},
                                 {"name": "secondary", "role": "secondary", "turns": 90, "wire": "1.0 mm"}],
                    "excitation": {"waveform": "sine", "voltage": "18 V", "frequency": "50 Hz", "winding": "secondary"}}],
        devices={"capacitors": [{"ref": "C1", "position": "bulk", **capacitor}]},
    )


def test_a_declared_secondary_voltage_is_carried_to_high_line_and_no_load():
    # 18 V RMS is the rated (loaded) secondary at nominal line: sqrt 2 x 18 V x 253/230 = 28.0 V, plus the no-load
    # rise of a small mains transformer, 25 % (common practice, from memory): 35.0 V. A 35 V capacitor fails.
    finding = by(stress.run(linear({"voltage_rating": "35 V"})), "STRESS-CAPACITOR", "C1")
    assert volts(finding.values[1].quantity) == pytest.approx(math.sqrt(2) * 18 * 1.1 * 1.25)
    assert finding.verdict is Verdict.FAIL
    assert "no_load_voltage" in finding.explanation and any(s.is_common_practice and "no-load" in s.title for s in finding.sources)


def test_a_declared_no_load_voltage_makes_it_exact():
    # 26 V measured at no load at nominal line: 26 x 253/230 = 28.6 V at high line; 35 V >= 1.1 x 28.6 V.
    finding = by(stress.run(linear({"voltage_rating": "35 V", "no_load_voltage": "26 V"})), "STRESS-CAPACITOR", "C1")
    assert volts(finding.values[1].quantity) == pytest.approx(26 * 1.1)
    assert finding.verdict is Verdict.PASS


# --- capacitors in series ----------------------------------------------------------------------------

def bus_pair(**capacitor):
    return record(
        stages=[{"kind": "mains-input", "name": "Input", "side": "mains", "parts": [{"ref": "BR1", "kind": "bridge"}, {"ref": "C2", "kind": "capacitor"}]}],
        devices={"capacitors": [{"ref": "C2", "position": "bulk", "voltage_rating": "200 V", "in_series": 2, **capacitor}]},
    )


def test_a_series_pair_without_balancing_is_judged_as_if_one_held_the_whole_string():
    # without balancing resistors the leakage currents share the voltage (makers' electrolytic application guides,
    # balancing; common practice): the harsher reading puts all 357.8 V on one 200 V capacitor
    finding = by(stress.run(bus_pair()), "STRESS-CAPACITOR", "C2")
    assert volts(finding.values[1].quantity) == pytest.approx(LINE_PEAK)
    assert finding.verdict is Verdict.FAIL and "balancing_resistor" in finding.explanation


@pytest.mark.parametrize("resistor, verdict", [("100 kohm", Verdict.FAIL), ("47 kohm", Verdict.MARGINAL), ("10 kohm", Verdict.PASS)])
def test_the_worst_share_adds_the_leakage_through_the_balancing_resistor(resistor, verdict):
    # Kirchhoff: V_max = V/2 + R I_leak / 2 when one leaks 0.5 mA and the other nothing (makers' electrolytic
    # application guides, balancing; from memory). 100 k: 178.9 + 25 = 203.9 V > 200 V.
    finding = by(stress.run(bus_pair(balancing_resistor=resistor, leakage="0.5 mA")), "STRESS-CAPACITOR", "C2")
    ohms = {"100 kohm": 100e3, "47 kohm": 47e3, "10 kohm": 10e3}[resistor]
    assert volts(finding.values[1].quantity) == pytest.approx(LINE_PEAK / 2 + ohms * 0.5e-3 / 2)
    assert finding.verdict is verdict


def test_without_a_leakage_figure_the_makers_usual_limit_is_taken():
    # 0.01 C V_R = 0.01 x 470 uF x 200 V = 0.94 mA (makers' usual limit at 20 degC; common practice, from memory).
    finding = by(stress.run(bus_pair(balancing_resistor="10 kohm", capacitance="470 uF")), "STRESS-CAPACITOR", "C2")
    assert volts(finding.values[1].quantity) == pytest.approx(LINE_PEAK / 2 + 10e3 * 0.94e-3 / 2)
    assert "give leakage" in finding.explanation


def test_split_half_bridge_capacitors_need_balancing_resistors():
    unit = record(
        stages=[{"kind": "mains-input", "name": "Input", "side": "mains", "parts": [{"ref": "BR1", "kind": "bridge"}]},
                {"kind": "converter", "name": "Converter", "side": "mains", "topology": "half-bridge", "parts": [{"ref": "C5", "kind": "capacitor"}]}],
        devices={"capacitors": [{"ref": "C5", "voltage_rating": "250 V", "position": "split"}]},
    )
    assert by(stress.run(unit), "STRESS-CAPACITOR", "C5").verdict is Verdict.MARGINAL


# --- which rating a switch's voltage_rating is ----------------------------------------------------------

def half_bridge(**switch):
    return record(
        stages=[{"kind": "mains-input", "name": "Input", "side": "mains", "parts": [{"ref": "BR1", "kind": "bridge"}]},
                {"kind": "converter", "name": "Converter", "side": "mains", "topology": "half-bridge", "parts": [{"ref": "Q1", "kind": "transistor"}]}],
        devices={"semiconductors": [{"ref": "Q1", "kind": "bjt", "voltage_rating": "700 V", **switch}]},
    )


# A BJT's V_CEO (base open) is its lowest collector-emitter rating; V_CES holds only with the base held off;
# V_CBO is collector-base (makers' datasheets; Mohan et al., power semiconductor devices; from memory).
@pytest.mark.parametrize("fields, verdict", [
    ({}, Verdict.MARGINAL),
    ({"voltage_rating_kind": "V_CEO"}, Verdict.PASS),
    ({"voltage_rating_kind": "V_CES"}, Verdict.MARGINAL),
    ({"voltage_rating_kind": "V_CES", "base_held_off": True}, Verdict.PASS),
    ({"voltage_rating_kind": "V_CBO"}, Verdict.MARGINAL),
])
def test_a_bjt_rating_is_compared_like_with_like(fields, verdict):
    # 700 V against 1.25 x 357.8 V = 447 V: a pass only when it is a rating that applies.
    finding = by(stress.run(half_bridge(**fields)), "STRESS-SWITCH", "Q1")
    assert finding.verdict is verdict
    if verdict is Verdict.MARGINAL:
        assert ("devices", "semiconductors", 0, "voltage_rating_kind") in finding.keys


def test_a_mosfet_cannot_be_given_a_bipolar_rating():
    with pytest.raises(ValidationError, match="V_DSS"):
        half_bridge(kind="mosfet", voltage_rating_kind="V_CEO")
