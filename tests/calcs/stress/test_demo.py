"""The demo charger's rectifier story, the demo records through every calc, and bad margin input."""

from __future__ import annotations

import math
from pathlib import Path

import pytest

from tests.fixtures.demo import DEMO, load_demo
from dossier.calcs import stress
from dossier.findings import Verdict
from dossier.problems import InputError
from dossier.reading.record import load_record
from dossier.review import review
from dossier.wording import problem_line

# Half-bridge from 230 V + 10 %: the primary sees plus and minus half the bus (Mohan, Undeland, Robbins,
# Power Electronics, half-bridge converter), so one 9-turn half of the secondary on a 60-turn primary peaks at
# sqrt(2) x 253 / 2 x 9 / 60 = 26.8 V, and a centre-tapped rectifier blocks twice that (ARRL Handbook,
# power supplies chapter): 53.7 V.
CHARGER_PIV = math.sqrt(2) * 253 / 2 * 9 / 60 * 2


def d5(revision: str):
    return next(f for f in stress.run(load_demo("sw-charger-12v", revision)) if f.code == "STRESS-RECTIFIER" and f.subject == "D5")


@pytest.mark.parametrize("revision", ["A", "B"])
def test_45_volt_schottky_fails_on_the_centre_tapped_winding(revision):
    finding = d5(revision)
    assert finding.verdict is Verdict.FAIL
    assert float(finding.values[1].quantity.to("V").magnitude) == pytest.approx(CHARGER_PIV, rel=1e-6)
    assert "ARRL" in finding.sources[0].title


def test_100_volt_schottky_of_rev_c_passes_with_the_common_practice_margin():
    finding = d5("C")
    assert finding.verdict is Verdict.PASS
    # Schottky margin 1.5 x PIV: common practice (from memory).
    assert float(finding.limit.quantity.to("V").magnitude) == pytest.approx(1.5 * CHARGER_PIV, rel=1e-6)
    assert finding.sources[-1].is_common_practice


def test_demo_records_run_through_stress_and_thermal_without_calc_errors(calcs):
    chosen = [c for c in calcs if c.name in ("stress", "thermal")]
    for build, revision in [("sw-charger-12v", "A"), ("sw-charger-12v", "B"), ("sw-charger-12v", "C"), ("bench-psu-13v8", "A"), ("rotator-control", "A")]:
        findings = review(load_demo(build, revision), chosen)
        assert not [f for f in findings if f.code == "CALC-ERROR"], (build, revision)


def test_every_rated_finding_names_its_formula_and_a_source():
    for finding in stress.run(load_demo("sw-charger-12v", "C")):
        if finding.verdict is not Verdict.INFO or finding.code == "STRESS-BUS":
            assert finding.method and finding.sources, finding


def with_margins(tmp_path: Path, margins_line: str) -> Path:
    text = (DEMO / "sw-charger-12v" / "rev-C.yaml").read_text(encoding="utf-8")
    target = tmp_path / "sw-charger-12v" / "rev-C.yaml"
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
    record = load_record(with_margins(tmp_path, "{rectifier_voltage: 2.0, basis: club practice sheet}")).record
    finding = next(f for f in stress.run(record) if f.subject == "D5")
    assert finding.verdict is Verdict.MARGINAL  # 100 V covers 53.7 V but not 2 x 53.7 V
