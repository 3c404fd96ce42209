"""The magnetics calc on the demo charger and on variants of it."""

from __future__ import annotations

import math

import pytest
from conftest import DEMO, load_demo

from dossier.calcs.magnetics import CALC, run
from dossier.findings import Verdict
from dossier.record.load import load_record
from dossier.wording import margin_text


def findings_of(record):
    return run(record)


def one(findings, code, subject):
    matches = [f for f in findings if f.code == code and f.subject == subject]
    assert len(matches) == 1, (code, subject, [(f.code, f.subject) for f in findings])
    return matches[0]


def extra(finding, label_start):
    return next(m.quantity for m in finding.extra if m.label.startswith(label_start))


def variant(tmp_path, *replacements, build="sw-charger-12v", revision="C"):
    text = (DEMO / build / f"rev-{revision}.yaml").read_text(encoding="utf-8")
    for old, new in replacements:
        assert old in text, old
        text = text.replace(old, new, 1)
    path = tmp_path / build / f"rev-{revision}.yaml"
    path.parent.mkdir(parents=True, exist_ok=True)
    path.write_text(text, encoding="utf-8")
    return load_record(path).record


@pytest.mark.parametrize("revision", ["A", "B"])
def test_early_secondary_runs_too_dense(revision):
    # 4.3 A in one 0.8 mm wire: 8.55 A/mm^2, above the 2-5 A/mm^2 band for natural cooling (common practice).
    finding = one(findings_of(load_demo("sw-charger-12v", revision)), "MAG-CURRENT-DENSITY", "T1 secondary")
    assert finding.verdict is Verdict.FAIL
    assert finding.value.quantity.to("A/mm**2").magnitude == pytest.approx(4.3 / (math.pi * 0.4**2), rel=1e-6)
    assert "3.55" in margin_text(finding) and "strands" in finding.explanation


def test_three_strands_fix_the_secondary_in_rev_c():
    finding = one(findings_of(load_demo("sw-charger-12v", "C")), "MAG-CURRENT-DENSITY", "T1 secondary")
    assert finding.verdict is Verdict.PASS
    assert finding.value.quantity.to("A/mm**2").magnitude == pytest.approx(4.3 / (3 * math.pi * 0.4**2), rel=1e-6)


@pytest.mark.parametrize("ref", ["T1", "T2", "L1"])
def test_every_demo_magnetic_has_a_full_summary(ref):
    findings = [f for f in findings_of(load_demo("sw-charger-12v", "C")) if f.subject.split()[0] == ref]
    codes = {f.code for f in findings}
    assert {"MAG-CORE", "MAG-FLUX", "MAG-CURRENT-DENSITY", "MAG-RESISTANCE", "MAG-FILL", "MAG-TEMP-RISE"} <= codes
    assert "MAG-INPUT" not in codes
    assert all(f.sources for f in findings if f.limit is not None)


def test_main_transformer_flux_at_high_line():
    # Faraday's law, square wave B = V / (4 f N A_e): 253 V x sqrt 2 / 2 across 60 turns at 40 kHz on the IEC 60205 A_e.
    findings = findings_of(load_demo("sw-charger-12v", "A"))
    area = one(findings, "MAG-CORE", "T1").value.quantity.to("m**2").magnitude
    flux = one(findings, "MAG-FLUX", "T1")
    assert flux.value.quantity.to("T").magnitude == pytest.approx(253 * math.sqrt(2) / 2 / (4 * 40e3 * 60 * area))
    assert flux.verdict is Verdict.PASS and flux.limit.quantity.to("T").magnitude == 0.39


def test_core_loss_by_steinmetz_at_nominal_line():
    findings = findings_of(load_demo("sw-charger-12v", "A"))
    loss = one(findings, "MAG-CORE-LOSS", "T1")
    flux = extra(loss, "peak flux").to("T").magnitude
    volume = one(findings, "MAG-CORE", "T1").values[2].quantity.to("m**3").magnitude
    assert loss.value.quantity.to("W").magnitude == pytest.approx(2.7 * 40e3**1.4 * flux**2.6 * volume)


def test_secondary_ratio_reports_both_halves():
    finding = one(findings_of(load_demo("sw-charger-12v", "A")), "MAG-RATIO", "T1 secondary")
    labels = [m.label for m in finding.values]
    assert labels[0] == "turns ratio primary : secondary" and finding.value.quantity.magnitude == pytest.approx(60 / 18)
    assert "each half, peak at high line" in labels


def test_secondary_wire_is_thicker_than_two_skin_depths():
    finding = one(findings_of(load_demo("sw-charger-12v", "C")), "MAG-SKIN", "T1 secondary")
    assert finding.verdict is Verdict.MARGINAL and "strands of" in finding.explanation
    assert one(findings_of(load_demo("sw-charger-12v", "C")), "MAG-SKIN", "T1 primary").verdict is Verdict.PASS


def test_copper_loss_uses_the_hot_resistance():
    finding = one(findings_of(load_demo("sw-charger-12v", "A")), "MAG-RESISTANCE", "T1 secondary")
    cold, hot = finding.value.quantity, extra(finding, "resistance at")
    assert (hot / cold).to("").magnitude == pytest.approx(1 + 80 * 0.00393)
    assert extra(finding, "copper loss").to("W").magnitude == pytest.approx(4.3**2 * hot.to("ohm").magnitude)


def test_output_choke_figures():
    # L = A_L N^2 = 70 nH x 24^2; ripple = V D / (f L); H = N I_pk / l_e.
    findings = findings_of(load_demo("sw-charger-12v", "C"))
    choke = one(findings, "MAG-CHOKE", "L1")
    inductance = extra(choke, "inductance").to("H").magnitude
    ripple = extra(choke, "ripple").to("A").magnitude
    path = one(findings, "MAG-CORE", "L1").values[1].quantity.to("m").magnitude
    assert inductance == pytest.approx(70e-9 * 24**2)
    assert ripple == pytest.approx(24 * 0.1 / (80e3 * inductance))
    assert choke.value.quantity.to("A/m").magnitude == pytest.approx(24 * (6 + ripple / 2) / path)
    assert extra(choke, "stored energy").to("J").magnitude == pytest.approx(inductance * (6 + ripple / 2) ** 2 / 2)
    assert choke.verdict is Verdict.PASS


def test_choke_over_its_field_limit_fails(tmp_path):
    record = variant(tmp_path, ("max_field: 4000 A/m", "max_field: 2000 A/m"))
    assert one(findings_of(record), "MAG-CHOKE", "L1").verdict is Verdict.FAIL


def test_temperature_rise_judged_against_the_material_limit():
    finding = one(findings_of(load_demo("sw-charger-12v", "A")), "MAG-TEMP-RISE", "T1")
    assert finding.limit.quantity.to("K").magnitude == pytest.approx(100 - 35)
    total = extra(finding, "total loss").to("W").magnitude
    surface = extra(finding, "outside surface").to("cm**2").magnitude
    assert finding.value.quantity.to("K").magnitude == pytest.approx(450 * (total / surface) ** 0.826)


def test_winding_that_does_not_fit_fails_with_by_how_much(tmp_path):
    record = variant(tmp_path, ("turns: 60, wire: 0.5 mm", "turns: 1500, wire: 0.5 mm"))
    finding = one(findings_of(record), "MAG-FILL", "T1")
    assert finding.verdict is Verdict.FAIL
    assert "short by" in margin_text(finding)
    assert "Does not fit" in finding.explanation and "mm²" in finding.explanation and "'primary'" in finding.explanation


def test_windings_that_close_the_hole_fail(tmp_path):
    record = variant(tmp_path, ("{name: choke, role: choke, turns: 24,", "{name: choke, role: choke, turns: 400,"))
    finding = one(findings_of(record), "MAG-FILL", "L1")
    assert finding.verdict is Verdict.FAIL and "close the hole" in finding.explanation


def test_missing_frequency_is_located(tmp_path):
    record = variant(tmp_path, ("    frequency: 40 kHz\n    core", "    core"))
    finding = one(findings_of(record), "MAG-INPUT", "T1")
    assert finding.verdict is Verdict.MARGINAL and "frequency" in finding.explanation
    assert finding.keys == (("magnetics", 0),)
    assert not [f for f in findings_of(record) if f.code == "MAG-FLUX" and f.subject == "T1"]


def test_currents_derived_from_the_output_rating(tmp_path):
    record = variant(tmp_path, (", current: 4.3 A}", "}"), (", tape_layers: 3, current: 0.7 A}", ", tape_layers: 3}"))
    findings = findings_of(record)
    secondary = one(findings, "MAG-CURRENT-DENSITY", "T1 secondary")
    assert extra(secondary, "RMS current").to("A").magnitude == pytest.approx(6 / math.sqrt(2))
    primary = one(findings, "MAG-CURRENT-DENSITY", "T1 primary")
    # output 14.4 V x 6 A at 80 % efficiency over the square-wave primary's 207 V x sqrt 2 / 2 at low line
    assert extra(primary, "RMS current").to("A").magnitude == pytest.approx(14.4 * 6 / 0.8 / (207 * math.sqrt(2) / 2))


def test_undeclared_current_is_reported_where_it_cannot_be_derived(tmp_path):
    record = variant(tmp_path, ("tape_layers: 1, current: 0.25 A}", "tape_layers: 1}"))
    finding = one(findings_of(record), "MAG-INPUT", "T2 upper base")
    assert finding.verdict is Verdict.INFO and finding.keys == (("magnetics", 1, "windings", 1),)


def test_mains_transformer_flux_by_the_sine_formula():
    # Sine: B_pk = V_rms / (4.44 f N A_e); 132 V at 60 Hz across 470 turns (bench supply at high line).
    findings = findings_of(load_demo("bench-psu-13v8", "A"))
    area = one(findings, "MAG-CORE", "T1").value.quantity.to("m**2").magnitude
    flux = one(findings, "MAG-FLUX", "T1").value.quantity.to("T").magnitude
    assert flux == pytest.approx(132 / (math.pi * math.sqrt(2) * 60 * 470 * area))


def test_declared_core_without_surface_asks_for_it():
    findings = findings_of(load_demo("rotator-control", "A"))
    assert one(findings, "MAG-INPUT", "T1").verdict is Verdict.INFO
    assert one(findings, "MAG-CORE", "T1").method == "effective parameters as declared"


def test_every_code_emitted_is_declared():
    for build, revisions in (("sw-charger-12v", "ABC"), ("bench-psu-13v8", "A"), ("rotator-control", "A")):
        for revision in revisions:
            assert {f.code for f in findings_of(load_demo(build, revision))} <= set(CALC.codes)


def test_calc_is_registered(calcs):
    registered = next(c for c in calcs if c.name == "magnetics")
    assert registered.codes == CALC.codes and "MAGNETICS-PENDING" not in registered.codes
