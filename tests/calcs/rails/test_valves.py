"""A rectifier valve's maker ratings against its stage: peak inverse voltage, peak anode current and reservoir
(RCA Receiving Tube Manual, rectifier ratings, from memory: each a maximum not to be exceeded)."""

from __future__ import annotations

import math

import pytest

from dossier.calcs import rails
from dossier.calcs.shared.regulation import conduction_angle
from dossier.findings import Verdict
from dossier.record.model import Record
from tests.calcs.rails.test_regulation import HEAD, copper, transformer

STAGES = [
    {"id": "input", "kind": "mains-input", "name": "Input", "side": "mains", "topology": "direct"},
    {"id": "pt", "kind": "magnetics", "name": "Transformer", "side": "isolated", "parts": [{"ref": "T1", "kind": "transformer"}]},
    {"id": "rect", "kind": "rectifier", "name": "Valve rectifier", "side": "isolated", "topology": "valve-centre-tapped",
     "parts": [{"ref": "V1", "kind": "valve"}, {"ref": "C1", "kind": "capacitor"}]},
    {"id": "filter", "kind": "filter", "name": "Filter", "side": "isolated", "topology": "clc"},
]
HT = {"name": "HT", "role": "secondary", "turns": 2640, "wire": "0.25 mm", "centre_tap": True}


def unit(valve: dict | None = None, rail: dict | None = None, capacitors=None) -> Record:
    rail = {"name": "B+", "stage": "filter", "voltage": "300 V", "current": "100 mA", "capacitance": "64 uF", "winding": "T1 HT", **(rail or {})}
    devices = {"valves": [valve] if valve else [],
               "capacitors": capacitors if capacitors is not None else [{"ref": "C1", "voltage_rating": "450 V", "position": "bulk", "capacitance": "32 uF"}]}
    return Record(**HEAD, stages=STAGES, rails=[rail], magnetics=[transformer(HT)], devices=devices)


def by(findings, subject):
    return next(f for f in findings if f.code == "RAILS-VALVE" and f.subject == subject)


def test_without_ratings_the_rectifier_finding_stays_info_and_names_the_keys():
    findings = rails.run(unit())
    rectifier = next(f for f in findings if f.code == "RAILS-RECTIFIER")
    assert rectifier.verdict is Verdict.INFO and ("devices", "valves") in rectifier.keys
    assert "devices.valves" in rectifier.explanation and not [f for f in findings if f.code == "RAILS-VALVE"]


def test_the_peak_inverse_voltage_is_judged_against_the_makers_rating():
    findings = rails.run(unit({"ref": "V1", "peak_inverse_voltage": "1400 V"}))
    finding = by(findings, "V1 peak inverse voltage")
    worst = next(f for f in findings if f.code == "RAILS-VOLTAGE").value.quantity
    # a centre-tapped rectifier's anode blocks twice the output (ARRL Handbook, power supplies chapter)
    assert finding.value.quantity == 2 * worst
    assert finding.verdict is (Verdict.PASS if 2 * worst.to("V").magnitude < 1400 / 1.1 else Verdict.FAIL)
    low = by(rails.run(unit({"ref": "V1", "peak_inverse_voltage": "500 V"})), "V1 peak inverse voltage")
    assert low.verdict is Verdict.FAIL and ("devices", "valves", 0, "peak_inverse_voltage") in low.keys


def test_the_reservoir_is_the_bulk_capacitor_in_the_stage_else_the_whole_rail():
    assert by(rails.run(unit({"ref": "V1", "max_reservoir": "40 uF"})), "V1 reservoir capacitance").verdict is Verdict.PASS
    whole = by(rails.run(unit({"ref": "V1", "max_reservoir": "40 uF"}, capacitors=[])), "V1 reservoir capacitance")
    assert whole.value.quantity.to("uF").magnitude == pytest.approx(64) and whole.verdict is Verdict.FAIL
    assert "harsher reading" in whole.explanation


def test_the_peak_anode_current_comes_from_the_windings_source_resistance():
    finding = by(rails.run(unit({"ref": "V1", "peak_current": "1 A"})), "V1 peak current")
    # Schade (Proc. IRE 1943, from memory): I_pk = V_pk (1 - cos theta) / R_s, one half of the winding conducting
    source = copper(1100, 0.45) * (1320 / 1100) ** 2 + copper(2640, 0.25) / 2
    theta = conduction_angle(math.pi * source / (2 * 3000))
    worst = 300 / math.cos(theta)
    turns = 230 * math.sqrt(2) * 1320 / 1100
    expected = max(worst, turns) * 1.1 * (1 - math.cos(theta)) / source
    assert finding.value.quantity.to("A").magnitude == pytest.approx(expected, rel=1e-3)


def test_a_peak_current_rating_without_the_winding_is_not_assessed_naming_it():
    finding = by(rails.run(unit({"ref": "V1", "peak_current": "1 A"}, rail={"winding": None, "no_load_voltage": "340 V"})), "V1 peak current")
    assert finding.verdict is Verdict.NOT_ASSESSED and ("rails", 0, "winding") in finding.keys and not finding.blocks_power_up


def test_a_clc_filters_first_capacitor_is_the_reservoir():
    stages = [*STAGES[:2], {**STAGES[2], "parts": [{"ref": "V1", "kind": "valve"}]},
              {**STAGES[3], "parts": [{"ref": "C1", "kind": "capacitor"}, {"ref": "L1", "kind": "choke"}, {"ref": "C2", "kind": "capacitor"}]}]
    capacitors = [{"ref": "C1", "voltage_rating": "450 V", "position": "bulk", "capacitance": "32 uF"},
                  {"ref": "C2", "voltage_rating": "450 V", "position": "bulk", "capacitance": "32 uF"}]
    record = Record(**HEAD, stages=stages, rails=[{"name": "B+", "stage": "filter", "voltage": "300 V", "capacitance": "64 uF"}],
                    devices={"valves": [{"ref": "V1", "max_reservoir": "40 uF"}], "capacitors": capacitors})
    finding = by(rails.run(record), "V1 reservoir capacitance")
    assert finding.value.quantity.to("uF").magnitude == pytest.approx(32) and finding.verdict is Verdict.PASS
