"""The isolation calc: worked cases from tests/calcs/isolation/cases/, the demo builds, and what every finding carries."""

from __future__ import annotations

from pathlib import Path

import pytest
import yaml

from tests.fixtures.demo import load_demo
from dossier.calcs.isolation import CALC, run
from dossier.findings import Verdict
from dossier.record.model import Record
from dossier.units import Q_, parse_quantity

CASES_DIR = Path(__file__).parent / "cases"
IDENTITY = {"id": "case", "title": "worked case", "revision": "A", "date": "2026-01-01", "authors": ["tests"], "status": "design"}


def load_cases() -> list:
    cases = []
    for path in sorted(CASES_DIR.glob("*.yaml")):
        for case in yaml.safe_load(path.read_text(encoding="utf-8"))["cases"]:
            cases.append(pytest.param(case, id=f"{path.stem}: {case['name']}"))
    return cases


def case_record(case: dict) -> Record:
    data = dict(IDENTITY)
    if "mains" in case:
        data["mains"] = {"frequency": "50 Hz", **case["mains"]}
    data["environment"] = case.get("environment", {})
    data["barriers"] = [{"name": "case barrier", "between": ["mains", "output"], **case["barrier"]}]
    return Record.model_validate(data)


def record_with(barrier: dict, mains: dict | None = None, **sections) -> Record:
    case = {"barrier": barrier, **sections}
    if mains is not False:
        case["mains"] = mains or {"nominal": "230 V", "overvoltage_category": "II"}
    return case_record(case)


def by_code(findings) -> dict:
    return {finding.code: finding for finding in findings}


def extra(finding, label: str):
    return next(measure.quantity for measure in finding.extra if measure.label == label)


def value(finding, label: str):
    return next(measure.quantity for measure in finding.values if measure.label == label)


def close(quantity, expected_text: str) -> bool:
    expected = parse_quantity(expected_text, "[length]" if expected_text.endswith("mm") else "[electric_potential]")
    return quantity.to(expected.units).magnitude == pytest.approx(expected.magnitude, abs=1e-3)


# Every check below compares with the source the case file names beside the case (its `source:` key).
EXPECTATIONS = {
    "rated_impulse": lambda f: value(f["ISO-INPUTS"], "rated impulse voltage"),
    "clearance": lambda f: f["ISO-CLEARANCE"].limit.quantity,
    "creepage": lambda f: f["ISO-CREEPAGE"].limit.quantity,
    "edition2_clearance": lambda f: extra(f["ISO-CLEARANCE"], "edition 2 clearance (next impulse step)"),
    "off_board_creepage": lambda f: extra(f["ISO-CREEPAGE"], "required without the printed-board column"),
    "slot_minimum": lambda f: f["ISO-SLOT"].limit.quantity,
}


@pytest.mark.parametrize("case", load_cases())
def test_worked_case(case):
    assert case["source"].startswith("IEC 60664-1"), "every worked case names its published source"
    from dossier.calcs.isolation.inputs import NEXT_ROW_UP, Reading

    reading = Reading(True, case["interpolate_on"]) if "interpolate_on" in case else NEXT_ROW_UP
    findings = by_code(run(case_record(case), reading))
    for key, expected in case["expect"].items():
        if key == "altitude_factor":
            assert extra(findings["ISO-CLEARANCE"], "altitude factor").magnitude == pytest.approx(expected)
            continue
        assert close(EXPECTATIONS[key](findings), expected), f"{key}: expected {expected}"
    for code, verdict in case.get("verdicts", {}).items():
        assert findings[code].verdict is Verdict(verdict), f"{code}: {findings[code].verdict.value}, expected {verdict}"


def test_cases_cover_every_expectation_key():
    used = {key for param in load_cases() for key in param.values[0]["expect"]}
    assert used == set(EXPECTATIONS) | {"altitude_factor"}


# --- the demo builds ---------------------------------------------------------------------------


def demo_findings(build: str, revision: str = "A"):
    return CALC.run(load_demo(build, revision))


def test_charger_rev_a_fails_clearance_and_creepage():
    findings = by_code(demo_findings("solar-bank-charger", "A"))
    clearance, creepage = findings["ISO-CLEARANCE"], findings["ISO-CREEPAGE"]
    # IEC 60664-1:2020 Tables F.1 and F.2: 230 V, OVC II, reinforced -> 160 % of 2.5 kV = 4.0 kV -> 3.0 mm
    assert clearance.verdict is Verdict.FAIL
    assert clearance.value.quantity == Q_(2.6, "mm")
    assert clearance.limit.quantity.to("mm").magnitude == pytest.approx(3.0)
    # IEC 60664-1:2020 Table F.5 printed-board PD2 column 1.0 mm, twice for reinforced, raised to the 3.0 mm
    # clearance; the general PD2 group III column (2.5 mm, twice) would give 5.0 mm
    assert creepage.verdict is Verdict.FAIL
    assert creepage.value.quantity == Q_(2.6, "mm")
    assert creepage.limit.quantity.to("mm").magnitude == pytest.approx(3.0)
    assert extra(creepage, "required without the printed-board column").to("mm").magnitude == pytest.approx(5.0)
    assert "ISO-SLOT" not in findings  # rev A has no slot


def test_a_slot_too_narrow_for_a_small_clearance_is_bridged():
    barrier = {"grade": "reinforced", "material_group": "IIIa", "printed_board": True, "creepage": "3.6 mm",
               "clearance": "2.7 mm", "slots": [{"width": "0.7 mm"}]}
    findings = by_code(CALC.run(record_with(barrier)))
    # IEC 60664-1:2020 clause 6.8: PD2 1.0 mm, reduced to a third of the 2.7 mm clearance, 0.9 mm; 0.7 mm is too
    # narrow, so the creepage the record counts on it cannot be credited
    slot = findings["ISO-SLOT"]
    assert slot.verdict is Verdict.FAIL
    assert slot.limit.quantity.to("mm").magnitude == pytest.approx(2.7 / 3)
    assert "bridged" in slot.title
    assert findings["ISO-CREEPAGE"].verdict is Verdict.FAIL and "bridged" in findings["ISO-CREEPAGE"].explanation


def test_charger_rev_b_passes():
    findings = by_code(demo_findings("solar-bank-charger", "B"))
    for code in ("ISO-CLEARANCE", "ISO-CREEPAGE", "ISO-SLOT"):
        assert findings[code].verdict is Verdict.PASS, code
    assert findings["ISO-SLOT"].limit.quantity.to("mm").magnitude == pytest.approx(1.0)  # clause 6.8, PD2


def test_bench_supply_on_120_v():
    findings = demo_findings("bench-psu-13v8")
    reinforced = by_code(f for f in findings if f.subject == "primary to secondary (transformer)")
    basic = by_code(f for f in findings if f.subject == "mains to chassis")
    # IEC 60664-1:2020 Table F.1: 120 V, category II -> 1500 V
    assert value(reinforced["ISO-INPUTS"], "rated impulse voltage") == Q_(1500, "V")
    # IEC 60664-1:2020 Table F.2 case A: 1.5 kV at PD2 -> 0.5 mm for basic insulation
    assert basic["ISO-CLEARANCE"].limit.quantity.to("mm").magnitude == pytest.approx(0.5)
    # IEC 60664-1:2020 Table F.5, 125 V row (Table F.3, from memory): PD2 group III 1.5 mm; group II 1.05 mm twice
    assert basic["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(1.5)
    assert reinforced["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(2.1)
    assert all(f.verdict in (Verdict.PASS, Verdict.INFO) for f in findings)


def test_rotator_control_passes_with_its_transformer_gap():
    findings = by_code(demo_findings("rotator-control"))
    # IEC 60664-1:2020: 230 V OVC II reinforced 3.0 mm clearance; Table F.5 PD2 group II 1.8 mm, twice = 3.6 mm
    assert findings["ISO-CLEARANCE"].limit.quantity.to("mm").magnitude == pytest.approx(3.0)
    assert findings["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(3.6)
    assert findings["ISO-CLEARANCE"].verdict is Verdict.PASS
    assert findings["ISO-CREEPAGE"].verdict is Verdict.PASS


# --- what every finding carries ----------------------------------------------------------------


@pytest.mark.parametrize("build, revision", [("solar-bank-charger", "A"), ("solar-bank-charger", "B"), ("bench-psu-13v8", "A"), ("rotator-control", "A")])
def test_findings_name_their_barrier_keys_and_source(build, revision):
    record = load_demo(build, revision)
    names = [barrier.name for barrier in record.barriers]
    findings = CALC.run(record)
    assert {f.code for f in findings} <= set(CALC.codes)
    # the record-level findings (which standard, its earth limit) name no barrier
    assert [f.code for f in findings if f.subject not in names] in (["ISO-STANDARD"], ["ISO-STANDARD", "ISO-PE-LIMIT"])
    for finding in (f for f in findings if f.subject in names):
        assert finding.keys and finding.keys[0][0] in ("barriers", "mains")
        assert finding.sources and finding.sources[0].clause
    per_barrier = {(f.subject, f.code) for f in findings}
    for name in names:
        assert {(name, "ISO-INPUTS"), (name, "ISO-CLEARANCE"), (name, "ISO-CREEPAGE")} <= per_barrier


def test_keys_point_at_the_declared_values():
    findings = by_code(demo_findings("solar-bank-charger", "A"))
    assert findings["ISO-CLEARANCE"].keys[0] == ("barriers", 0, "clearance")
    assert findings["ISO-CREEPAGE"].keys[0] == ("barriers", 0, "creepage")
    assert by_code(demo_findings("solar-bank-charger", "C"))["ISO-SLOT"].keys[0] == ("barriers", 0, "slots", 0, "width")
    assert ("barriers", 0, "cti") in findings["ISO-INPUTS"].keys


def test_reinforced_clearance_names_the_edition():
    findings = by_code(CALC.run(record_with({"grade": "reinforced", "material_group": "II", "creepage": "8 mm", "clearance": "8 mm"},
                                            {"nominal": "230 V", "overvoltage_category": "III"})))
    text = findings["ISO-CLEARANCE"].explanation
    assert "160 %" in text and "Edition 2 (2007)" in text and "5.5 mm" in text


def test_no_mains_and_no_working_voltage_says_what_to_add():
    findings = CALC.run(record_with({"grade": "basic", "material_group": "I", "creepage": "2 mm", "clearance": "2 mm"}, mains=False))
    assert [f.code for f in findings] == ["ISO-STANDARD", "ISO-NO-VOLTAGE"]
    findings = findings[1:]
    # docs/verdicts.md: what cannot be assessed on a mains barrier blocks power-up like a fail
    assert findings[0].verdict is Verdict.NOT_ASSESSED and findings[0].blocks_power_up
    assert "mains" in findings[0].explanation and "working_voltage" in findings[0].explanation
    assert findings[0].subject == "case barrier"


def test_no_mains_but_a_working_voltage_assumes_category_ii():
    barrier = {"grade": "basic", "material_group": "I", "working_voltage": "230 V", "creepage": "2 mm", "clearance": "2 mm"}
    findings = by_code(CALC.run(record_with(barrier, mains=False)))
    # IEC 60664-1:2020 Table F.1: 230 V at category II (assumed) -> 2500 V -> Table F.2 case A 1.5 mm
    assert findings["ISO-CLEARANCE"].limit.quantity.to("mm").magnitude == pytest.approx(1.5)
    assert "assumed" in findings["ISO-INPUTS"].explanation


def test_functional_insulation_gives_guidance_without_a_verdict():
    barrier = {"grade": "functional", "material_group": "II", "creepage": "0.5 mm", "clearance": "0.5 mm", "slots": [{"width": "0.3 mm"}]}
    findings = by_code(CALC.run(record_with(barrier)))
    for code in ("ISO-CLEARANCE", "ISO-CREEPAGE", "ISO-SLOT"):
        assert findings[code].verdict is Verdict.INFO, code
    # the basic values as guidance: IEC 60664-1:2020 Table F.2 case A 1.5 mm; Table F.5 PD2 group II 1.8 mm
    assert findings["ISO-CLEARANCE"].limit.quantity.to("mm").magnitude == pytest.approx(1.5)
    assert findings["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(1.8)
    assert "guidance" in findings["ISO-CREEPAGE"].explanation


def test_cti_below_100_fails_creepage():
    findings = by_code(CALC.run(record_with({"grade": "basic", "cti": 80, "creepage": "5 mm", "clearance": "3 mm"})))
    assert findings["ISO-CREEPAGE"].verdict is Verdict.FAIL
    assert "CTI 80" in findings["ISO-CREEPAGE"].explanation
    assert findings["ISO-CLEARANCE"].verdict is Verdict.PASS


def test_declared_group_that_contradicts_the_cti_takes_the_worse():
    findings = by_code(CALC.run(record_with({"grade": "basic", "material_group": "I", "cti": 175, "creepage": "5 mm", "clearance": "3 mm"})))
    assert "the worse of the two, group IIIa" in findings["ISO-INPUTS"].explanation
    # IEC 60664-1:2020 clause 4.8.1.3 (from memory): CTI 175 is group IIIa; Table F.5 PD2 group III at 250 V: 2.5 mm
    assert findings["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(2.5)
    assert extra(findings["ISO-CREEPAGE"], "material group") == "IIIa"


def test_beyond_the_tables_is_not_assessed_rather_than_guessed():
    findings = by_code(CALC.run(record_with({"grade": "basic", "material_group": "I", "creepage": "5 mm", "clearance": "3 mm"},
                                            environment={"altitude": "9000 m"})))
    # IEC 60664-1:2020 Table A.2 ends at 8000 m: nothing is extrapolated, and the barrier blocks power-up
    assert findings["ISO-CLEARANCE"].verdict is Verdict.NOT_ASSESSED and findings["ISO-CLEARANCE"].blocks_power_up
    assert "not assessed" in findings["ISO-CLEARANCE"].title
    assert "Table A.2" in findings["ISO-CLEARANCE"].explanation


def test_a_working_voltage_above_the_table_is_not_assessed():
    barrier = {"grade": "basic", "material_group": "I", "working_voltage": "1200 V", "creepage": "5 mm", "clearance": "3 mm"}
    findings = by_code(CALC.run(record_with(barrier)))
    # IEC 60664-1:2020 Table F.5 ends at 1000 V (the rows held here)
    assert findings["ISO-CREEPAGE"].verdict is Verdict.NOT_ASSESSED and findings["ISO-CREEPAGE"].blocks_power_up
    assert "not assessed" in findings["ISO-CREEPAGE"].title
    assert "Table F.5" in findings["ISO-CREEPAGE"].explanation


def test_a_reading_between_rows_is_named_with_the_key_to_change_it():
    findings = by_code(CALC.run(record_with({"grade": "reinforced", "material_group": "II", "creepage": "8 mm", "clearance": "8 mm"},
                                            {"nominal": "120 V", "overvoltage_category": "II"})))
    assert "next row up" in findings["ISO-CLEARANCE"].explanation
    assert "table_interpolation" in findings["ISO-CLEARANCE"].explanation
    assert extra(findings["ISO-CLEARANCE"], "Table F.2 reading") == "next row up"


def test_altitude_above_2000_m_is_stated():
    findings = by_code(CALC.run(record_with({"grade": "basic", "material_group": "I", "creepage": "5 mm", "clearance": "3 mm"},
                                            environment={"altitude": "2500 m"})))
    # IEC 60664-1:2020 Table A.2: 2500 m lies between 2000 m (1.00) and 3000 m (1.14); the next row up is taken
    assert "factor 1.14" in findings["ISO-CLEARANCE"].explanation
    assert extra(findings["ISO-CLEARANCE"], "Table A.2 reading") == "next row up"


def test_the_narrowest_credited_slot_is_judged():
    slots = [{"width": "2 mm"}, {"width": "0.5 mm", "credited": False}, {"width": "1.2 mm"}]
    findings = by_code(CALC.run(record_with({"grade": "basic", "material_group": "II", "creepage": "5 mm", "clearance": "4 mm", "slots": slots})))
    assert findings["ISO-SLOT"].keys[0] == ("barriers", 0, "slots", 2, "width")
    assert findings["ISO-SLOT"].verdict is Verdict.PASS
    assert findings["ISO-CREEPAGE"].verdict is Verdict.PASS


def test_the_calc_is_registered(calcs):
    assert CALC in calcs
    assert set(CALC.codes) == {"ISO-INPUTS", "ISO-CLEARANCE", "ISO-CREEPAGE", "ISO-SLOT", "ISO-NO-VOLTAGE", "ISO-STANDARD",
                               "ISO-HIPOT", "ISO-PE-LIMIT", "ISO-BOARD-SPACING"}


def test_printed_board_at_pollution_degree_3_uses_the_general_column():
    barrier = {"grade": "basic", "material_group": "I", "printed_board": True, "creepage": "4 mm", "clearance": "2 mm"}
    findings = by_code(CALC.run(record_with(barrier, environment={"pollution_degree": 3})))
    # IEC 60664-1:2020 Table F.5: no printed-board column at PD3; PD3 group I 3.2 mm at 250 V
    assert findings["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(3.2)
    assert "no printed-board column at pollution degree 3" in findings["ISO-CREEPAGE"].explanation


@pytest.mark.parametrize("revision", ["A", "B"])
def test_a_mains_barriers_distances_guard_a_hazard_whatever_their_verdict(revision):
    # the charger's primary-to-output barrier is reinforced insulation between mains and the battery leads: its
    # clearance and creepage findings guard a hazard when they fail (rev A) and when they pass (rev B), as
    # check --format json reports them (docs/reference/json.md, guards_hazard)
    findings = [f for f in CALC.run(load_demo("solar-bank-charger", revision)) if f.code in ("ISO-CLEARANCE", "ISO-CREEPAGE", "ISO-SLOT")]
    assert {f.code for f in findings} >= {"ISO-CLEARANCE", "ISO-CREEPAGE"}
    assert all(f.guards_hazard for f in findings)
    assert {f.verdict for f in findings} == ({Verdict.FAIL} if revision == "A" else {Verdict.PASS})
