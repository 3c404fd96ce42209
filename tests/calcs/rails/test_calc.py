"""The rails calc: worst case, hazards beyond the mains, stored energy and discharge, bleeders, X capacitors, ripple,
regulators and rectifiers, each formula checked against a published figure or a worked example named beside it."""

from __future__ import annotations

import math

import pytest

from dossier.calcs import rails
from dossier.calcs.rails.discharge import discharge_time, energy
from dossier.calcs.rails.supply import ripple_current
from dossier.standards.copper import winding_rise
from dossier.findings import Verdict
from dossier.record.model import Record
from dossier.units import Q_

HEAD = {"id": "case", "title": "Case", "revision": "A", "date": "2026-01-01", "authors": ["A. Tester"], "status": "design",
        "mains": {"nominal": "230 V", "frequency": "50 Hz"}}
STAGES = [
    {"id": "input", "kind": "mains-input", "name": "Input", "side": "mains", "topology": "direct"},
    {"id": "transformer", "kind": "magnetics", "name": "Transformer", "side": "isolated"},
    {"id": "ht", "kind": "rectifier", "name": "HT rectifier", "side": "isolated", "topology": "bridge",
     "parts": [{"ref": "C1", "kind": "capacitor"}]},
    {"id": "filter", "kind": "filter", "name": "HT filter", "side": "isolated", "topology": "clc"},
    {"id": "bias", "kind": "rectifier", "name": "Bias", "side": "isolated", "topology": "half-wave", "fed_from": ["transformer"]},
]


def unit(*rail_list, stages=STAGES, **more) -> Record:
    return Record(**HEAD, stages=stages, rails=list(rail_list), **more)


def b_plus(**more) -> dict:
    return {"name": "B+", "stage": "filter", "voltage": "350 V", "current": "120 mA", "no_load_voltage": "388 V",
            "capacitance": "45.5 uF", **more}


def by(findings, code, subject):
    return next(f for f in findings if f.code == code and f.subject == subject)


def volts(quantity) -> float:
    return quantity.to("V").magnitude


# --- formulas against published figures ---------------------------------------------------------------------

def test_energy_of_a_charged_capacitor():
    # E = 1/2 C V^2: 100 uF at 400 V holds 8 J (circuit theory; the ARRL Handbook's bleeder discussion uses the same law)
    assert energy(Q_(100, "uF"), Q_(400, "V")).to("J").magnitude == pytest.approx(8.0)


def test_rc_discharge_time():
    # t = R C ln(V0 / V): 220 kohm and 50 uF (tau 11 s) from 400 V to 60 V take 11 x ln(6.667) = 20.87 s
    # (the exponential discharge of circuit theory; common practice for bleeder sizing)
    assert discharge_time(Q_(220, "kohm"), Q_(50, "uF"), Q_(400, "V"), Q_(60, "V")).to("s").magnitude == pytest.approx(20.868, abs=1e-3)
    assert discharge_time(Q_(1, "kohm"), Q_(1, "uF"), Q_(50, "V"), Q_(60, "V")).magnitude == 0


def test_ripple_current_for_rectangular_pulses():
    # a 10 % trough: conduction angle arccos(0.9) = 25.8 deg, d = 0.1436, I_C = I sqrt(1/d - 1) = 2.62 I (common practice)
    assert ripple_current(Q_(1, "A"), Q_(10, "V"), Q_(100, "V")).magnitude == pytest.approx(math.sqrt(math.pi / math.acos(0.9) - 1))


def test_winding_rise_by_the_resistance_method():
    # IEC 60335-1 11.3 (from memory): dT = (R2 - R1)/R1 (234.5 + t1) - (t2 - t1); 10 ohm at 20 degC to 12 ohm with the
    # room at 22 degC: 0.2 x 254.5 - 2 = 48.9 K
    assert winding_rise(Q_(10, "ohm"), Q_(12, "ohm"), Q_(20, "degC"), Q_(22, "degC")).magnitude == pytest.approx(48.9)


# --- the worst case and the hazard -----------------------------------------------------------------------

def test_a_declared_no_load_voltage_is_carried_to_high_line_and_named_a_hazard():
    findings = rails.run(unit(b_plus()))
    worst = by(findings, "RAILS-VOLTAGE", "B+").value.quantity
    assert volts(worst) == pytest.approx(388 * 1.1)
    hazard = by(findings, "RAILS-HAZARD", "B+")
    # IEC 62368-1 Table 4 ES1 (from memory): 60 V DC
    assert hazard.verdict is Verdict.INFO and volts(hazard.limit.quantity) == 60
    assert [h.name for h in findings.products[rails.HAZARDS]] == ["B+"]


def test_without_a_no_load_figure_25_percent_is_assumed_and_said():
    finding = by(rails.run(unit(b_plus(no_load_voltage=None))), "RAILS-VOLTAGE", "B+")
    assert volts(finding.value.quantity) == pytest.approx(350 * 1.25 * 1.1)
    assert "assumed 25 %" in finding.explanation and ("rails", 0, "regulation") in finding.keys


def test_a_declared_regulation_gives_the_no_load_voltage():
    finding = by(rails.run(unit(b_plus(no_load_voltage=None, regulation="10 %"))), "RAILS-VOLTAGE", "B+")
    assert volts(finding.value.quantity) == pytest.approx(350 * 1.1 * 1.1)


def test_an_accessible_hazardous_rail_fails_and_a_safe_one_is_no_hazard():
    findings = rails.run(unit(b_plus(accessible=True), {"name": "heater", "stage": "input", "voltage": "6.3 V", "kind": "ac"}))
    assert by(findings, "RAILS-HAZARD", "B+").verdict is Verdict.FAIL
    assert not [f for f in findings if f.code == "RAILS-HAZARD" and f.subject == "heater"]


def test_an_ac_rail_over_30_volts_is_hazardous():
    # IEC 62368-1 Table 4 ES1 (from memory): 30 V RMS
    findings = rails.run(unit({"name": "HT AC", "stage": "transformer", "voltage": "28 V", "kind": "ac"}))
    assert by(findings, "RAILS-HAZARD", "HT AC").limit.quantity == Q_(30, "V")


def test_a_regulated_rail_holds_its_voltage():
    stages = STAGES + [{"id": "reg", "kind": "regulator", "name": "Regulator", "side": "isolated", "topology": "series-pass", "fed_from": ["filter"]}]
    findings = rails.run(unit(b_plus(), {"name": "screen", "stage": "reg", "voltage": "250 V", "current": "20 mA"}, stages=stages))
    assert by(findings, "RAILS-VOLTAGE", "screen").value.quantity == Q_(250, "V")
    regulator = by(findings, "RAILS-REGULATOR", "Regulator")
    # (V_in,max - V_out) I = (350 x 1.1 - 250) x 20 mA = 2.7 W (Mohan et al., linear regulators)
    assert regulator.value.quantity.to("W").magnitude == pytest.approx((385 - 250) * 0.02)


# --- discharge and bleeders --------------------------------------------------------------------------------

def test_a_hazardous_bank_without_a_bleeder_fails_and_blocks():
    finding = by(rails.run(unit(b_plus())), "RAILS-DISCHARGE", "B+")
    assert finding.verdict is Verdict.FAIL and finding.blocks_power_up and ("rails", 0, "bleeder") in finding.keys


@pytest.mark.parametrize("bleeder, verdict", [("47 kohm", Verdict.PASS), ("100 kohm", Verdict.FAIL)])
def test_the_bleeder_must_bring_the_rail_to_60_volts_within_5_seconds(bleeder, verdict):
    # IEC 60204-1:2016 6.2.4: 60 V within 5 s. 47 k x 45.5 uF x ln(426.8 / 60) = 4.20 s; 100 k: 8.93 s
    finding = by(rails.run(unit(b_plus(bleeder=bleeder))), "RAILS-DISCHARGE", "B+")
    ohms = {"47 kohm": 47e3, "100 kohm": 100e3}[bleeder]
    assert finding.value.quantity.to("s").magnitude == pytest.approx(ohms * 45.5e-6 * math.log(388 * 1.1 / 60))
    assert finding.verdict is verdict


def test_a_small_charge_is_exempt():
    # IEC 60204-1:2016 6.2.4: 60 uC or less stored needs no discharge time; 0.1 uF at 426.8 V holds 42.7 uC
    finding = by(rails.run(unit(b_plus(capacitance="0.1 uF"))), "RAILS-DISCHARGE", "B+")
    assert finding.verdict is Verdict.PASS


def test_a_hazardous_rail_without_capacitance_is_not_assessed_and_blocks():
    finding = by(rails.run(unit(b_plus(capacitance=None))), "RAILS-DISCHARGE", "B+")
    assert finding.verdict is Verdict.NOT_ASSESSED and finding.blocks_power_up


@pytest.mark.parametrize("rating, verdict", [("10 W", Verdict.PASS), ("5 W", Verdict.MARGINAL), ("2 W", Verdict.FAIL), (None, Verdict.NOT_ASSESSED)])
def test_the_bleeder_runs_at_half_its_rating(rating, verdict):
    # P = V^2 / R = 426.8^2 / 47 k = 3.88 W; half the rating is common practice (from memory)
    finding = by(rails.run(unit(b_plus(bleeder="47 kohm", bleeder_power_rating=rating))), "RAILS-BLEEDER", "B+ bleeder power")
    assert finding.value.quantity.to("W").magnitude == pytest.approx((388 * 1.1) ** 2 / 47e3)
    assert finding.verdict is verdict


def test_the_bleeder_voltage_is_judged_against_its_limiting_voltage():
    finding = by(rails.run(unit(b_plus(bleeder="47 kohm", bleeder_voltage_rating="350 V"))), "RAILS-BLEEDER", "B+ bleeder voltage")
    assert finding.verdict is Verdict.FAIL


# --- X capacitors at the plug -------------------------------------------------------------------------------

def x_cap(**more):
    return {"capacitors": [{"ref": "C9", "voltage_rating": "275 V", "position": "across-line", "safety_class": "X2", **more}]}


def test_x_capacitance_up_to_100_nanofarads_needs_no_discharge():
    # IEC 60335-1 22.5: capacitors of 0.1 uF or less need no test
    assert by(rails.run(unit(devices=x_cap(capacitance="100 nF"))), "RAILS-X-DISCHARGE", "X capacitors").verdict is Verdict.PASS


@pytest.mark.parametrize("resistor, verdict", [(None, Verdict.FAIL), ("1 Mohm", Verdict.PASS), ("4.7 Mohm", Verdict.FAIL)])
def test_x_capacitors_fall_below_34_volts_within_a_second(resistor, verdict):
    # IEC 60335-1 22.5: 34 V one second after unplugging at the crest of 253 V: 330 nF through 1 Mohm,
    # t = 0.33 s x ln(357.8 / 34) = 0.777 s; through 4.7 Mohm 3.65 s
    devices = x_cap(capacitance="330 nF", **({"discharge_resistor": resistor} if resistor else {}))
    finding = by(rails.run(unit(devices=devices)), "RAILS-X-DISCHARGE", "X capacitors")
    assert finding.verdict is verdict
    if resistor == "1 Mohm":
        assert finding.value.quantity.to("s").magnitude == pytest.approx(1e6 * 330e-9 * math.log(230 * 1.1 * math.sqrt(2) / 34))


def test_x_capacitors_without_capacitance_are_not_assessed_but_do_not_block():
    finding = by(rails.run(unit(devices=x_cap())), "RAILS-X-DISCHARGE", "X capacitors")
    assert finding.verdict is Verdict.NOT_ASSESSED and not finding.blocks_power_up


# --- ripple, rectifiers and the other stages -------------------------------------------------------------------

def test_full_wave_ripple_is_current_over_twice_the_mains_frequency_times_capacitance():
    # ARRL Handbook, power supplies chapter: V_r = I / (2 f C) full-wave: 0.12 / (100 x 45.5 uF) = 26.4 V
    finding = by(rails.run(unit(b_plus())), "RAILS-RIPPLE", "B+")
    assert volts(finding.value.quantity) == pytest.approx(0.12 / (100 * 45.5e-6))


def test_half_wave_ripple_is_at_the_mains_frequency():
    # ARRL Handbook: half-wave V_r = I / (f C): 2 mA / (50 x 47 uF) = 0.851 V
    bias = {"name": "bias", "stage": "bias", "voltage": "45 V", "current": "2 mA", "capacitance": "47 uF", "polarity": "negative"}
    assert volts(by(rails.run(unit(bias)), "RAILS-RIPPLE", "bias").value.quantity) == pytest.approx(0.002 / (50 * 47e-6))


def test_a_reservoir_is_judged_on_its_ripple_current():
    devices = {"capacitors": [{"ref": "C1", "voltage_rating": "250 V", "position": "bulk", "ripple_current": "0.1 A"}]}
    assert by(rails.run(unit(b_plus(), devices=devices)), "RAILS-RIPPLE-CURRENT", "C1").verdict is Verdict.FAIL


@pytest.mark.parametrize("topology, multiple", [("bridge", 1), ("centre-tapped", 2), ("half-wave", 2), ("doubler", 1),
                                                ("valve-centre-tapped", 2), ("valve-half-wave", 2)])
def test_each_rectifier_gives_its_peak_inverse_voltage(topology, multiple):
    # ARRL Handbook, power supplies chapter: PIV per diode for a capacitor-input filter, as a multiple of the output
    stages = [dict(s, topology=topology) if s["id"] == "ht" else s for s in STAGES]
    finding = by(rails.run(unit(b_plus(), stages=stages)), "RAILS-RECTIFIER", "HT rectifier")
    assert volts(finding.values[1].quantity) == pytest.approx(multiple * 388 * 1.1)
    assert ("devices.valves" in finding.explanation) == topology.startswith("valve")


@pytest.mark.parametrize("kind, topology", [("filter", "lc"), ("filter", "choke-input"), ("filter", "series-bank"), ("switch", "standby"),
                                            ("switch", "high-voltage"), ("mains-input", "variac"), ("mains-input", "isolating-transformer"),
                                            ("regulator", "switching"), ("filter", "")])
def test_every_other_stage_topology_says_what_dossier_checks(kind, topology):
    stages = [{"id": "x", "kind": kind, "name": "Under test", "side": "isolated", "topology": topology}]
    finding = by(rails.run(unit(stages=stages)), "RAILS-STAGE", "Under test")
    assert finding.verdict is Verdict.INFO and finding.explanation


# --- IEC 62368-1 energy-source classes -----------------------------------------------------------------------------

@pytest.mark.parametrize("volts, kind, named", [
    (60, "dc", "ES1"), (60.1, "dc", "ES2"), (120, "dc", "ES2"), (120.1, "dc", "ES3"),  # IEC 62368-1:2018 Table 4 (from memory)
    (30, "ac", "ES1"), (30.1, "ac", "ES2"), (50, "ac", "ES2"), (50.1, "ac", "ES3"),
])
def test_iec62368_energy_class_boundaries(volts, kind, named):
    from dossier.standards.iec62368 import energy_class
    assert energy_class(volts, kind) == named


def test_each_rail_names_its_class_only_under_iec62368():
    # B+ worst case 388 V x 1.1 high line: ES3; the hazard limit stays at ES1 (60 V d.c.)
    plain = rails.run(unit(b_plus()))
    assert "IEC 62368-1 energy source class" not in {m.label for m in by(plain, "RAILS-VOLTAGE", "B+").extra}
    classed = rails.run(unit(b_plus(), standard={"name": "iec-62368-1", "edition": 3}))
    voltage, hazard = by(classed, "RAILS-VOLTAGE", "B+"), by(classed, "RAILS-HAZARD", "B+")
    assert {m.label: m.quantity for m in voltage.extra}["IEC 62368-1 energy source class"] == "ES3"
    assert "ES3" in hazard.explanation and hazard.limit.quantity.to("V").magnitude == 60
