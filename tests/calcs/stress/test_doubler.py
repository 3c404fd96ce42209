"""Record-level checks: a voltage doubler's capacitors judged at the share the circuit puts on each (The ARRL
Handbook, power supplies chapter, voltage multipliers: a full-wave doubler's two capacitors each charge to the
winding's peak; a half-wave doubler's input capacitor to the peak and its output capacitor to twice it)."""

from __future__ import annotations

import pytest

from dossier.calcs import stress
from dossier.findings import Verdict
from tests.calcs.stress.test_calc import by, record, volts

WORST = 325 * 1.1  # the rail's declared no-load 325 V carried to 230 V + 10 %: 357.5 V


def doubler(*capacitors, topology="doubler", mains=False):
    stages = [{"id": "input", "kind": "mains-input", "name": "Input", "side": "mains", "topology": "direct"},
              {"id": "pt", "kind": "magnetics", "name": "Transformer", "side": "isolated"},
              {"id": "doubler", "kind": "rectifier", "name": "Doubler", "side": "isolated", "topology": topology,
               "parts": [{"ref": "C1", "kind": "capacitor"}, {"ref": "C2", "kind": "capacitor"}]}]
    return record(stages=stages, rails=[{"name": "HT", "stage": "doubler", "voltage": "300 V", "no_load_voltage": "325 V"}],
                  devices={"capacitors": list(capacitors)})


def cap(ref, rating="250 V", **more) -> dict:
    return {"ref": ref, "voltage_rating": rating, **more}


def test_a_full_wave_doublers_capacitors_each_hold_half_the_output():
    findings = stress.run(doubler(cap("C1", doubler="full-wave"), cap("C2", doubler="full-wave")))
    for ref in ("C1", "C2"):
        finding = by(findings, "STRESS-CAPACITOR", ref)
        assert volts(finding.values[1].quantity) == pytest.approx(WORST / 2)
        assert finding.verdict is Verdict.PASS and ("devices", "capacitors", 0, "doubler") in by(findings, "STRESS-CAPACITOR", "C1").keys


def test_a_half_wave_doublers_output_capacitor_holds_the_whole_output():
    findings = stress.run(doubler(cap("C1", doubler="half-wave-input"), cap("C2", doubler="half-wave-output")))
    assert volts(by(findings, "STRESS-CAPACITOR", "C1").values[1].quantity) == pytest.approx(WORST / 2)
    output = by(findings, "STRESS-CAPACITOR", "C2")
    assert volts(output.values[1].quantity) == pytest.approx(WORST) and output.verdict is Verdict.FAIL


def test_a_capacitor_in_a_doubler_stage_with_no_place_given_takes_the_whole_output_and_says_which_key():
    finding = by(stress.run(doubler(cap("C1"))), "STRESS-CAPACITOR", "C1")
    assert volts(finding.values[1].quantity) == pytest.approx(WORST) and finding.verdict is Verdict.FAIL
    assert "devices.capacitors[].doubler" in finding.explanation


def test_a_declared_doubler_capacitor_outside_a_doubler_stage_still_gets_its_share():
    findings = stress.run(doubler(cap("C1", doubler="full-wave"), topology="bridge"))
    assert volts(by(findings, "STRESS-CAPACITOR", "C1").values[1].quantity) == pytest.approx(WORST / 2)


def test_without_its_output_a_doubler_capacitor_is_not_assessed_naming_what_to_add():
    bare = record(stages=[{"id": "doubler", "kind": "rectifier", "name": "Doubler", "side": "isolated", "topology": "doubler",
                           "parts": [{"ref": "C1", "kind": "capacitor"}]}], devices={"capacitors": [cap("C1", doubler="full-wave")]})
    finding = by(stress.run(bare), "STRESS-CAPACITOR", "C1")
    assert finding.verdict is Verdict.NOT_ASSESSED and "rails[]" in finding.explanation
