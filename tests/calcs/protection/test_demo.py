"""The protection calc on the demo archive: the fail-then-fix story of the charger, and the rotator's earth bond."""

from __future__ import annotations

import math

import pytest

from dossier.calcs.protection import CALC, recommended_fuse
from dossier.findings import Verdict
from dossier.review import review
from tests.fixtures.demo import load_demo

DEMOS = [("sw-charger-12v", "A"), ("sw-charger-12v", "B"), ("sw-charger-12v", "C"), ("bench-psu-13v8", "A"), ("rotator-control", "A")]


def findings_of(build: str, revision: str):
    return list(CALC.run(load_demo(build, revision)))


def one(findings, code: str):
    matches = [f for f in findings if f.code == code]
    assert len(matches) == 1, f"{code}: {len(matches)} findings"
    return matches[0]


@pytest.mark.parametrize("build, revision", DEMOS)
def test_every_demo_runs_without_a_calc_error(build, revision):
    findings = review(load_demo(build, revision), [CALC])
    assert findings
    assert all(f.code in CALC.codes for f in findings)


@pytest.mark.parametrize("build, revision", DEMOS)
def test_every_finding_names_its_sources_and_explains_non_passes(build, revision):
    for finding in findings_of(build, revision):
        assert finding.sources, finding.code
        if finding.verdict is not Verdict.PASS:
            assert finding.explanation, finding.code


def test_rev_a_fuse_blows_at_every_switch_on():
    inrush = one(findings_of("sw-charger-12v", "A"), "PROT-INRUSH")
    assert inrush.verdict is Verdict.FAIL
    assert "blows at every switch-on" in inrush.explanation
    # Exponential pulse through 0.5 ohm source + 0.3 ohm ESR into 235 uF from 230 V + 10 %:
    # I^2 t = I_pk^2 tau / 2 (Littelfuse, Fuseology Selection Guide, waveshape chart), far above F1's 0.9 A^2 s.
    crest = 230 * 1.1 * math.sqrt(2)
    peak, tau = crest / 0.8, 0.8 * 235e-6
    assert inrush.value.quantity.to("A**2*s").magnitude == pytest.approx(peak**2 * tau / 2, rel=1e-6)
    assert inrush.value.quantity.to("A**2*s").magnitude > 0.9


def test_rev_a_says_what_the_unlimited_peak_is_and_why_it_matters():
    # I_pk = crest of high line / path resistance = 253 x sqrt 2 / (0.5 + 0.3 ohm) = 447 A (Ohm's law); an
    # unlimited capacitor-input unit is marginal: common practice fits an inrush limiter
    peak = one(findings_of("sw-charger-12v", "A"), "PROT-INRUSH-PEAK")
    assert peak.verdict is Verdict.MARGINAL
    assert peak.value.quantity.to("A").magnitude == pytest.approx(230 * 1.1 * math.sqrt(2) / 0.8, rel=1e-6)
    assert "No inrush limiter" in peak.explanation and "surge rating" in peak.explanation


def test_rev_a_glass_fuse_is_marginal_with_its_reason():
    findings = findings_of("sw-charger-12v", "A")
    breaking = one(findings, "PROT-FUSE-BREAKING")
    assert breaking.verdict is Verdict.MARGINAL
    assert "glass" in breaking.explanation
    assert any(source.is_common_practice for source in breaking.sources)
    assert one(findings, "PROT-FUSE-SPEED").verdict is Verdict.MARGINAL


def test_rev_a_lacks_battery_side_protection():
    findings = findings_of("sw-charger-12v", "A")
    for code in ("PROT-OUTPUT-FUSE", "PROT-REVERSE-POLARITY"):
        finding = one(findings, code)
        assert finding.verdict is Verdict.FAIL
        assert "hundreds of amperes" in finding.explanation or "reversed battery" in finding.explanation


@pytest.mark.parametrize("revision", ["B", "C"])
def test_later_revisions_fix_the_protection(revision):
    findings = findings_of("sw-charger-12v", revision)
    assert not [f.code for f in findings if f.verdict is Verdict.FAIL]
    assert one(findings, "PROT-INRUSH").verdict in (Verdict.PASS, Verdict.MARGINAL)
    assert one(findings, "PROT-OUTPUT-FUSE").verdict is Verdict.PASS
    assert one(findings, "PROT-REVERSE-POLARITY").verdict is Verdict.PASS


def test_rev_b_ntc_energy_and_cool_down_caveat():
    findings = findings_of("sw-charger-12v", "B")
    energy = one(findings, "PROT-NTC-ENERGY")
    # NTC makers' selection guides: E = 1/2 C V_peak^2; 235 uF at the crest of 253 V.
    assert energy.value.quantity.to("J").magnitude == pytest.approx(0.5 * 235e-6 * (253 * math.sqrt(2)) ** 2, rel=1e-6)
    assert energy.verdict is Verdict.PASS
    cool = one(findings, "PROT-NTC-COOLDOWN")
    assert cool.verdict is Verdict.INFO
    assert "cooled" in cool.explanation
    assert cool.value.quantity.to("A").magnitude == pytest.approx(253 * math.sqrt(2) / (0.4 + 0.5 + 0.3), rel=1e-6)


def test_rev_b_ntc_dissipation_from_hot_resistance():
    # P = I_rms^2 R_hot: 0.870 A at low line through the NTC's 0.4 ohm residual resistance (makers' selection guides)
    dissipation = one(findings_of("sw-charger-12v", "B"), "PROT-NTC-DISSIPATION")
    running = 14.4 * 6 / 0.8 / (207 * 0.6)
    assert dissipation.values[1].quantity.to("W").magnitude == pytest.approx(running**2 * 0.4, rel=1e-6)
    assert dissipation.verdict is Verdict.PASS


def test_rotator_metal_enclosure_without_bonding_is_a_finding():
    earth = one(findings_of("rotator-control", "A"), "PROT-EARTH-BOND")
    assert earth.verdict is Verdict.FAIL
    assert "protection.earth.bonding" in earth.explanation
    assert earth.keys == (("protection", "earth", "bonding"),)


def test_bench_supply_has_no_protection_failure():
    findings = findings_of("bench-psu-13v8", "A")
    assert not [f.code for f in findings if f.verdict is Verdict.FAIL]
    assert one(findings, "PROT-EARTH-BOND").verdict is Verdict.PASS
    # 13.8 V x 3 A / 0.55 = 75.27 W at 108 V and power factor 0.65: 1.072 A; / (0.75 x 0.975 at 30 degC) = 1.466 A
    # (Littelfuse, Fuseology Selection Guide: 75 % at 25 degC; the 0.5 %/K re-rating line is from memory) -> T1.6A
    rating = one(findings, "PROT-FUSE-RATING")
    assert rating.limit.quantity.to("A").magnitude == pytest.approx(1.466, abs=0.001)
    assert rating.verdict is Verdict.PASS


def test_rotator_fuse_rating_by_hand():
    # 24 V x 2 A / 0.85 = 56.47 W at 207 V and power factor 0.95: 0.2872 A; / (0.75 x 0.975) = 0.3927 A; the next
    # IEC 60127-1 Annex A rating is 400 mA, the fuse the record declares.
    findings = findings_of("rotator-control", "A")
    assert one(findings, "PROT-FUSE-RATING").limit.quantity.to("A").magnitude == pytest.approx(0.3927, abs=0.0001)
    assert one(findings, "PROT-FUSE-RECOMMENDED").title == "Fit T400mA"


def test_recommended_fuse_for_the_checklist():
    choice = recommended_fuse(load_demo("sw-charger-12v", "B"))
    # 86.4 W / 0.8 / (207 V x 0.6) = 0.870 A; / (0.75 x 0.95 at 35 degC) = 1.22 A -> 1.25 A,
    # the next value of IEC 60127-1 Annex A; time-lag for a capacitor-input unit (common practice).
    assert choice.rating.to("A").magnitude == pytest.approx(1.25)
    assert choice.speed == "time-lag"
    assert choice.marking == "T1.25A"
    # Melting I^2 t needed: pulse I^2 t / 29 % for 10 000 pulses (Littelfuse, Fuseology Selection Guide, pulse-cycle chart).
    pulse = (253 * math.sqrt(2) / 10.8) ** 2 * 10.8 * 235e-6 / 2
    assert choice.minimum_melting_i2t.to("A**2*s").magnitude == pytest.approx(pulse / 0.29, rel=1e-6)


def test_recommendation_says_whether_the_declared_fuse_fits():
    assert not recommended_fuse(load_demo("sw-charger-12v", "A")).declared_fits
    assert recommended_fuse(load_demo("sw-charger-12v", "B")).declared_fits
    finding = one(findings_of("sw-charger-12v", "B"), "PROT-FUSE-RECOMMENDED")
    assert "T2A" in finding.explanation and "also passes" in finding.explanation


def test_recommendation_is_a_finding_value():
    # 0.870 A / (0.75 x 0.95) = 1.22 A -> 1.25 A, the next IEC 60127-1 Annex A rating
    finding = one(findings_of("sw-charger-12v", "A"), "PROT-FUSE-RECOMMENDED")
    assert finding.value.quantity.to("A").magnitude == pytest.approx(1.25)
    assert finding.title == "Fit T1.25A"

