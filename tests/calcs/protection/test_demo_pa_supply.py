"""The demo's split-rail PA amplifier supply: rev A's soft-start leaves the toroid's switch-on surge wearing out its T2A
and has no thermal cut-off; rev B's larger resistor and cut-off fix both. The figures are worked in the record's notes."""

from __future__ import annotations

import math

import pytest

from dossier.findings import Verdict
from dossier.plugins import load_calcs
from dossier.review import run_review
from tests.fixtures.demo import load_demo

BUILD = "pa-amp-supply"


def reviewed(revision: str):
    return run_review(load_demo(BUILD, revision), load_calcs())


def found(review, code: str):
    return next(f for f in review.findings if f.code == code)


def values(finding) -> dict:
    return {m.label: m.quantity for m in finding.values}


def test_rev_a_blocks_for_the_soft_start_only():
    review = reviewed("A")
    blocking = sorted((f.code, f.subject, f.verdict.value) for f in review.findings if f.verdict not in (Verdict.PASS, Verdict.INFO))
    assert blocking == [("PROT-SOFTSTART-BYPASS", "R1", "fail"), ("PROT-SURGE-TRANSFORMER", "T1", "marginal")]


def test_rev_a_surge_bound_is_the_high_line_crest_over_the_path():
    # Elliott Sound Products, Project 39 (the worst switch-on is limited only by the resistance in the path):
    # sqrt 2 x 253 V / (10 ohm R1 + 0.5 ohm supply + the 1.70 ohm primary) = 29.3 A.
    surge = found(reviewed("A"), "PROT-SURGE-TRANSFORMER")
    got = values(surge)
    path = got["resistance in the path"].to("ohm").magnitude
    assert got["primary resistance (cold)"].to("ohm").magnitude == pytest.approx(1.70, abs=0.01)
    assert got["peak current (upper bound)"].to("A").magnitude == pytest.approx(math.sqrt(2) * 253 / path, rel=1e-9)
    # Littelfuse Fuseology Selection Guide, pulse-cycle withstand: 29 % of the melting I^2 t (10 A^2 s) for 10 000 pulses.
    assert surge.limit.quantity.to("A**2*s").magnitude == pytest.approx(2.9, rel=1e-9)
    assert surge.value.quantity > surge.limit.quantity


def test_rev_a_soft_start_burns_if_the_relay_never_closes():
    # P = I^2 R with the running current: 1.261 A^2 x 10 ohm = 15.9 W in a 10 W part, and no thermal cut-off.
    bypass = found(reviewed("A"), "PROT-SOFTSTART-BYPASS")
    current = values(bypass)["current through it"].to("A").magnitude
    assert values(bypass)["dissipation with the relay open"].to("W").magnitude == pytest.approx(current**2 * 10, rel=1e-9)
    assert bypass.verdict is Verdict.FAIL


def test_rev_b_passes_with_the_larger_resistor_and_its_cut_off():
    review = reviewed("B")
    assert [f.code for f in review.findings if f.verdict not in (Verdict.PASS, Verdict.INFO)] == []
    surge = values(found(review, "PROT-SURGE-TRANSFORMER"))
    assert surge["peak current (upper bound)"].to("A").magnitude == pytest.approx(math.sqrt(2) * 253 / 35.2, rel=1e-2)


def test_the_split_rail_bridge_blocks_both_windings():
    # ARRL Handbook, power supplies chapter: a bridge's PIV is the whole secondary's peak; here two 60-turn windings in
    # series: 2 x sqrt 2 x 253 V x 60 / 570 = 75.3 V.
    rectifier = found(reviewed("B"), "STRESS-RECTIFIER")
    assert rectifier.values[1].quantity.to("V").magnitude == pytest.approx(2 * math.sqrt(2) * 253 * 60 / 570, rel=1e-9)
