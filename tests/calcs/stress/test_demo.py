"""The demo charger's stress story, the demo records through every calc, and bad margin input."""

from __future__ import annotations

import math
from pathlib import Path

import pytest

from tests.fixtures.demo import DEMO, load_demo, load_test_record
from dossier.calcs import stress
from dossier.findings import Verdict
from dossier.problems import InputError
from dossier.reading.record import load_record
from dossier.review import review
from dossier.wording import problem_line

# Half-bridge from 230 V + 10 %: the primary sees plus and minus half the bus (Mohan, Undeland, Robbins,
# Power Electronics, half-bridge converter), sqrt(2) x 253 / 2 = 178.9 V. Each diode of a bridge blocks the
# secondary's peak (ARRL Handbook, power supplies chapter): 178.9 x 10 / 36 = 49.7 V in rev C, x 4 / 14 = 51.1 V before.
HALF_BUS = math.sqrt(2) * 253 / 2
BRIDGE_PIV = {"A": HALF_BUS * 4 / 14, "B": HALF_BUS * 4 / 14, "C": HALF_BUS * 10 / 36}


def finding_for(revision: str, code: str, subject: str, build=None):
    record = build if build is not None else load_demo("solar-bank-charger", revision)
    return next(f for f in stress.run(record) if f.code == code and f.subject == subject)


@pytest.mark.parametrize("revision", ["A", "B", "C"])
def test_each_diode_of_the_output_bridge_blocks_the_secondary_peak(revision):
    for ref in ("D5", "D6", "D7", "D8"):
        finding = finding_for(revision, "STRESS-RECTIFIER", ref)
        assert finding.verdict is Verdict.PASS
        assert float(finding.values[1].quantity.to("V").magnitude) == pytest.approx(BRIDGE_PIV[revision], rel=1e-6)
        # rectifier margin 1.5 x PIV: common practice (from memory)
        assert float(finding.limit.quantity.to("V").magnitude) == pytest.approx(1.5 * BRIDGE_PIV[revision], rel=1e-6)
        assert "ARRL" in finding.sources[0].title and finding.sources[-1].is_common_practice


@pytest.mark.parametrize("revision", ["A", "B"])
def test_100_volt_split_capacitors_fail_under_half_the_bus(revision):
    for ref in ("C5", "C6"):
        finding = finding_for(revision, "STRESS-CAPACITOR", ref)
        assert finding.verdict is Verdict.FAIL
        assert float(finding.values[1].quantity.to("V").magnitude) == pytest.approx(HALF_BUS, rel=1e-6)
        assert "below even that" in finding.explanation


def test_250_volt_split_capacitors_of_rev_c_pass_with_the_common_practice_margin():
    # Two in series with 220 kohm across each and up to 1 uA leakage: the worse share is V / n + (n - 1) / n x R x I_leak
    # (capacitors in series with balancing resistors; the formula from memory) = 178.90 + 0.5 x 220e3 x 1e-6 = 179.01 V.
    # A capacitor run at no more than about 90 % of its rating: 1.1 x 179.01 V = 196.91 V (common practice, from memory),
    # under the 250 V rating.
    for ref in ("C5", "C6"):
        finding = finding_for("C", "STRESS-CAPACITOR", ref)
        assert finding.verdict is Verdict.PASS
        assert float(finding.values[1].quantity.to("V").magnitude) == pytest.approx(HALF_BUS + 0.5 * 220e3 * 1e-6, rel=1e-6)
        assert float(finding.limit.quantity.to("V").magnitude) == pytest.approx(1.1 * (HALF_BUS + 0.11), rel=1e-6)
        assert float(finding.limit.quantity.to("V").magnitude) == pytest.approx(196.91, abs=0.005)


@pytest.mark.parametrize("revision, verdict", [("A", Verdict.MARGINAL), ("B", Verdict.MARGINAL), ("C", Verdict.PASS)])
def test_switches_block_the_whole_bus(revision, verdict):
    # each switch of a half-bridge blocks the whole bus, sqrt 2 x 253 V = 357.8 V (Mohan et al.); 1.25 x that is
    # 447.2 V (common practice, from memory): 400 V covers the stress but not the spike allowance, 600 V does.
    finding = finding_for(revision, "STRESS-SWITCH", "Q1")
    assert finding.verdict is verdict
    assert float(finding.values[1].quantity.to("V").magnitude) == pytest.approx(2 * HALF_BUS, rel=1e-6)
    assert float(finding.limit.quantity.to("V").magnitude) == pytest.approx(1.25 * 2 * HALF_BUS, rel=1e-6)


@pytest.mark.parametrize("revision, verdict", [("A", Verdict.FAIL), ("B", Verdict.PASS), ("C", Verdict.PASS)])
def test_only_a_y1_capacitor_may_bridge_the_reinforced_barrier(revision, verdict):
    # IEC 60384-14: Y1 for reinforced insulation, Y2 for basic (from memory); rev A fitted a Y2
    assert finding_for(revision, "STRESS-SAFETY-CLASS", "C4").verdict is verdict


def test_a_centre_tapped_rectifier_blocks_twice_the_half_winding():
    # test record: one 7-turn half of a 72-turn primary's secondary peaks at 178.9 x 7 / 72 = 17.4 V; a centre-tapped
    # full-wave rectifier blocks twice that (ARRL Handbook, power supplies chapter): 34.8 V; 60 V covers 1.5 x that.
    finding = finding_for("", "STRESS-RECTIFIER", "D5", build=load_test_record("selfosc-psu"))
    assert float(finding.values[1].quantity.to("V").magnitude) == pytest.approx(2 * HALF_BUS * 7 / 72, rel=1e-6)
    assert finding.verdict is Verdict.PASS


def test_demo_records_run_through_stress_and_thermal_without_calc_errors(calcs):
    chosen = [c for c in calcs if c.name in ("stress", "thermal")]
    for build, revision in [("solar-bank-charger", "A"), ("solar-bank-charger", "B"), ("solar-bank-charger", "C"), ("bench-psu-13v8", "A"), ("rotator-control", "A")]:
        findings = review(load_demo(build, revision), chosen)
        assert not [f for f in findings if f.code == "CALC-ERROR"], (build, revision)


def test_every_rated_finding_names_its_formula_and_a_source():
    for finding in stress.run(load_demo("solar-bank-charger", "C")):
        if finding.verdict is not Verdict.INFO or finding.code == "STRESS-BUS":
            assert finding.method and finding.sources, finding


def with_margins(tmp_path: Path, margins_line: str) -> Path:
    text = (DEMO / "solar-bank-charger" / "rev-C.yaml").read_text(encoding="utf-8")
    target = tmp_path / "solar-bank-charger" / "rev-C.yaml"
    target.parent.mkdir()
    target.write_text(text.replace("  heatsinks:\n", f"  margins: {margins_line}\n  heatsinks:\n", 1), encoding="utf-8")
    return target


def test_a_voltage_margin_below_one_is_a_located_error(tmp_path):
    with pytest.raises(InputError) as raised:
        load_record(with_margins(tmp_path, "{rectifier_voltage: 0.8}"), shown_as="rev-C.yaml")
    line = problem_line(raised.value.problems[0])
    assert line.startswith("rev-C.yaml:") and "devices.margins.rectifier_voltage" in line and "at least 1" in line


def test_a_junction_margin_must_be_a_difference(tmp_path):
    with pytest.raises(InputError) as raised:
        load_record(with_margins(tmp_path, "{junction: 25 degC}"), shown_as="rev-C.yaml")
    assert "temperature difference in K" in problem_line(raised.value.problems[0])


def test_a_record_margin_changes_the_demo_verdict(tmp_path):
    record = load_record(with_margins(tmp_path, "{capacitor_voltage: 1.3, basis: club practice sheet}")).record
    finding = next(f for f in stress.run(record) if f.subject == "C10")
    assert finding.verdict is Verdict.MARGINAL  # 63 V covers 49.7 V but not 1.3 x 49.7 V = 64.6 V
