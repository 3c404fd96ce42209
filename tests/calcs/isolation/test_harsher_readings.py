"""Record-level cases where the isolation calc must take the harsher reading, and what it must say about it.

Each test builds a small record, runs the calc (and, where a power-up is at stake, the checklist), and names
the published figure beside each check.
"""

from __future__ import annotations

import json

import pytest

from dossier.calcs import isolation
from dossier.calcs.isolation import CALC
from dossier.checklist.sheet import build_checklist
from dossier.review import Review
from dossier.commands.check import run_check
from dossier.report.json_report import check_json
from dossier.findings import Verdict
from dossier.reading.settings import ArchiveSettings
from tests.calcs.isolation.test_calc import by_code, extra, record_with, value
from tests.fixtures.site_kit import write_record


def mm(quantity) -> float:
    return quantity.to("mm").magnitude


def findings_for(barrier: dict, mains: dict | None = None, **sections):
    record = record_with(barrier, mains, **sections)
    return record, CALC.run(record)


# --- 14.1: a clearance that cannot be assessed leaves no creepage to pass ------------------------


def test_creepage_is_not_passed_when_the_clearance_cannot_be_assessed():
    # IEC 60664-1:2020 Table F.1: 600 V, overvoltage category IV -> 8000 V; reinforced 160 % = 12 800 V, above
    # the last row of Table F.2 (12 kV). Creepage is never less than the clearance (clause 5.2), so with no
    # clearance there is no creepage requirement either.
    barrier = {"grade": "reinforced", "material_group": "I", "creepage": "40 mm", "clearance": "30 mm"}
    record, findings = findings_for(barrier, {"nominal": "600 V", "overvoltage_category": "IV"})
    found = by_code(findings)
    assert "not assessed" in found["ISO-CLEARANCE"].title
    assert found["ISO-CREEPAGE"].verdict is not Verdict.PASS
    assert "not assessed" in found["ISO-CREEPAGE"].title
    assert "never less than the clearance" in found["ISO-CREEPAGE"].explanation
    # docs/verdicts.md: not assessed on a mains barrier blocks power-up like a fail
    checklist = build_checklist(record, Review(tuple(findings)))
    assert checklist.blocked
    assert {f.code for f in checklist.blockers} >= {"ISO-CLEARANCE", "ISO-CREEPAGE"}


def test_functional_insulation_not_assessed_stays_guidance():
    barrier = {"grade": "functional", "material_group": "I", "creepage": "40 mm", "clearance": "30 mm"}
    record, findings = findings_for(barrier, {"nominal": "600 V", "overvoltage_category": "IV"}, environment={"altitude": "9000 m"})
    assert all(f.verdict is Verdict.INFO for f in findings)
    assert not build_checklist(record, Review(tuple(findings))).blocked


# --- 14.2: between table rows, the next row up unless the archive names its clause ----------------


REINFORCED_120 = {"grade": "reinforced", "material_group": "II", "creepage": "8 mm", "clearance": "1.45 mm"}
MAINS_120 = {"nominal": "120 V", "overvoltage_category": "II"}


def test_reinforced_clearance_between_rows_takes_the_next_row_up():
    # IEC 60664-1:2020 Table F.1: 120 V, category II -> 1500 V; reinforced 160 % = 2400 V, between the 2.0 kV
    # (1.0 mm) and 2.5 kV (1.5 mm) rows of Table F.2 case A: the next row up gives 1.5 mm (interpolation 1.4 mm)
    record, findings = findings_for(REINFORCED_120, MAINS_120)
    clearance = by_code(findings)["ISO-CLEARANCE"]
    assert mm(clearance.limit.quantity) == pytest.approx(1.5)
    assert clearance.verdict is Verdict.FAIL
    assert extra(clearance, "Table F.2 reading") == "next row up"
    assert "next row up" in clearance.explanation and "table_interpolation" in clearance.explanation


def test_interpolation_only_where_the_archive_allows_it_and_names_its_clause():
    clause = "IEC 60664-1:2020, note to Table F.2, as the club reads it"
    settings = ArchiveSettings.model_validate({"table_interpolation": {"allowed": True, "clause": clause}})
    record = record_with(REINFORCED_120, MAINS_120)
    clearance = by_code(isolation.configured(settings).run(record))["ISO-CLEARANCE"]
    # linear interpolation between the Table F.2 rows (from memory that the standard allows it): 1.4 mm
    assert mm(clearance.limit.quantity) == pytest.approx(1.4)
    assert extra(clearance, "Table F.2 reading") == "interpolated"
    assert extra(clearance, "interpolation relies on") == clause
    assert clause in clearance.explanation
    assert isolation.configured(ArchiveSettings()) is CALC


def test_interpolation_cannot_be_allowed_without_a_clause():
    with pytest.raises(ValueError, match="name the clause"):
        ArchiveSettings.model_validate({"table_interpolation": {"allowed": True}})


def test_creepage_between_rows_takes_the_next_row_up():
    # IEC 60664-1:2020 Table F.5, PD2 group II: 360 V lies between 320 V (2.2 mm) and 400 V (2.8 mm)
    barrier = {"grade": "basic", "material_group": "II", "working_voltage": "360 V", "creepage": "2.6 mm", "clearance": "2 mm"}
    _, findings = findings_for(barrier)
    creepage = by_code(findings)["ISO-CREEPAGE"]
    assert mm(creepage.limit.quantity) == pytest.approx(2.8)
    assert creepage.verdict is Verdict.FAIL
    assert extra(creepage, "Table F.5 reading") == "next row up"


# --- 14.4 / 23.14: DC, AC r.m.s. and recurring peaks, each as the standard uses it ----------------


def test_a_dc_rail_is_not_multiplied_by_root_two():
    # IEC 60664-1:2020 Table F.5 is entered with the working voltage r.m.s. or d.c.: 400 V DC -> 400 V row,
    # PD2 group I 2.0 mm; the peak for Table F.8 is the DC itself, 400 V (not 566 V)
    barrier = {"grade": "basic", "between": ["HV rail", "chassis"], "material_group": "I", "working_dc": "400 V",
               "creepage": "3 mm", "clearance": "2 mm"}
    _, findings = findings_for(barrier)
    found = by_code(findings)
    assert value(found["ISO-INPUTS"], "peak working voltage").to("V").magnitude == pytest.approx(400)
    assert value(found["ISO-INPUTS"], "working voltage, r.m.s. or d.c.").to("V").magnitude == pytest.approx(400)
    assert mm(found["ISO-CREEPAGE"].limit.quantity) == pytest.approx(2.0)
    assert "d.c." in found["ISO-INPUTS"].explanation


def test_a_recurring_peak_is_judged_against_the_steady_state_table():
    # a flyback's reset peak of 2000 V across reinforced insulation: 160 % = 3200 V (clause 5.1.6, from memory),
    # IEC 60664-1:2020 Table F.8 case A next row up 4.0 kV -> 3.8 mm, above Table F.2's 3.0 mm for 4.0 kV
    barrier = {"grade": "reinforced", "material_group": "I", "working_peak": "2000 V", "creepage": "8 mm", "clearance": "3.5 mm"}
    record, findings = findings_for(barrier)
    clearance = by_code(findings)["ISO-CLEARANCE"]
    assert mm(clearance.limit.quantity) == pytest.approx(3.8)
    assert clearance.verdict is Verdict.FAIL
    assert mm(extra(clearance, "Table F.2 clearance")) == pytest.approx(3.0)
    assert mm(extra(clearance, "Table F.8 clearance")) == pytest.approx(3.8)
    assert extra(clearance, "peak voltage for Table F.8").to("V").magnitude == pytest.approx(3200)
    assert build_checklist(record, Review(tuple(findings))).blocked


def test_a_mains_barrier_with_no_working_voltage_defaults_to_the_mains_and_says_so():
    # IEC 60664-1:2020 Table F.3: a 230 V supply uses the 250 V row of Table F.5
    barrier = {"grade": "basic", "between": ["mains", "chassis"], "material_group": "I", "creepage": "3 mm", "clearance": "2 mm"}
    _, findings = findings_for(barrier)
    inputs = by_code(findings)["ISO-INPUTS"]
    assert "mains nominal" in inputs.explanation
    assert ("barriers", 0, "working_voltage") in inputs.keys


def test_a_dc_rail_barrier_with_no_working_voltage_is_not_assessed_and_blocks():
    barrier = {"grade": "basic", "between": ["HV rail", "chassis"], "material_group": "I", "creepage": "3 mm", "clearance": "2 mm"}
    record, findings = findings_for(barrier)
    assert [f.code for f in findings] == ["ISO-STANDARD", "ISO-NO-VOLTAGE"]
    finding = findings[1]
    assert finding.verdict is Verdict.NOT_ASSESSED and finding.blocks_power_up and "not assessed" in finding.title
    assert ("barriers", 0, "working_dc") in finding.keys
    assert "working_dc" in finding.explanation
    assert build_checklist(record, Review(tuple(findings))).blocked


# --- 23.5: a declared group never overrides a worse CTI -------------------------------------------


def test_a_declared_group_does_not_override_a_contradicting_cti():
    # IEC 60664-1:2020: CTI 175 is group IIIa; Table F.5 PD2 group III at 250 V 2.5 mm, twice for reinforced = 5.0 mm
    # (group I would give 2 x 1.25 mm = 2.5 mm, raised to the 3.0 mm clearance)
    barrier = {"grade": "reinforced", "material_group": "I", "cti": 175, "creepage": "4 mm", "clearance": "4 mm"}
    _, findings = findings_for(barrier)
    found = by_code(findings)
    assert mm(found["ISO-CREEPAGE"].limit.quantity) == pytest.approx(5.0)
    assert found["ISO-CREEPAGE"].verdict is Verdict.FAIL
    assert "worse of the two" in found["ISO-INPUTS"].explanation
    assert ("barriers", 0, "cti") in found["ISO-CREEPAGE"].keys and ("barriers", 0, "material_group") in found["ISO-CREEPAGE"].keys


# --- 14.8: sentences true for this record only ------------------------------------------------------


def test_the_editions_are_compared_for_this_record_only():
    # IEC 60664-1:2020 and :2007 both give 3.0 mm at 230 V, category II (4.0 kV); at category III edition 3 takes
    # 160 % of 4.0 kV = 6.4 kV -> next row up 8.0 mm, edition 2 the next step, 6.0 kV -> 5.5 mm (from memory)
    barrier = {"grade": "reinforced", "material_group": "II", "creepage": "8 mm", "clearance": "8 mm"}
    _, category_ii = findings_for(barrier)
    text_ii = by_code(category_ii)["ISO-CLEARANCE"].explanation
    assert "category III" not in text_ii and "the same 3 mm" in text_ii
    _, category_iii = findings_for(barrier, {"nominal": "230 V", "overvoltage_category": "III"})
    text_iii = by_code(category_iii)["ISO-CLEARANCE"].explanation
    assert "gives 5.5 mm here where edition 3 gives 8 mm" in text_iii


# --- 14 traceable limits: every citation names edition and table or clause -----------------------


@pytest.mark.parametrize("mains, barrier", [
    ({"nominal": "230 V", "overvoltage_category": "II"},
     {"grade": "reinforced", "cti": 175, "printed_board": True, "creepage": "4 mm", "clearance": "4 mm", "slots": [{"width": "1 mm"}]}),
    ({"nominal": "600 V", "overvoltage_category": "IV"}, {"grade": "reinforced", "material_group": "I", "creepage": "4 mm", "clearance": "4 mm"}),
])
def test_every_source_names_edition_and_table_or_clause(mains, barrier):
    _, findings = findings_for(barrier, mains)
    for finding in findings:
        for source in finding.sources:
            assert source.edition and source.clause, (finding.code, source.title)
            assert "Table" in source.clause or "clause" in source.clause


# --- 19.6 / 14.7: every measure in the JSON at full precision --------------------------------------


def test_check_json_holds_every_isolation_measure(tmp_path):
    path = write_record(tmp_path, "unit", environment={"altitude": "2500 m"})
    body = json.loads(check_json(run_check([path]), 0))
    (record,) = body["records"]
    clearance = next(f for f in record["findings"] if f["code"] == "ISO-CLEARANCE")
    measures = {m["label"]: m for m in clearance["extra"]}
    # IEC 60664-1:2020 Table A.2: 2500 m takes the 3000 m factor, 1.14; Table F.2 case A 4.0 kV -> 3.0 mm
    assert measures["altitude factor"]["value"] == pytest.approx(1.14)
    assert measures["Table F.2 clearance"]["value"] == pytest.approx(3.0)
    assert measures["Table F.2 reading"]["value"] == "on a row"
    assert measures["Table A.2 reading"]["value"] == "next row up"
    assert "edition 2 clearance (next impulse step)" in measures
    assert clearance["limit"]["value"] == pytest.approx(3.42)


def test_an_archive_that_allows_interpolation_gets_it_in_its_site(tmp_path):
    from dossier.collect.archive import open_archive

    write_record(tmp_path, "unit")
    (tmp_path / "archive.yaml").write_text("table_interpolation:\n  allowed: true\n  clause: IEC 60664-1:2020, Table F.2 note\n", encoding="utf-8")
    archive, problems = open_archive(tmp_path)
    assert not problems
    (calc,) = [c for c in archive.calcs if c.name == "isolation"]
    record = record_with(REINFORCED_120, MAINS_120)
    # IEC 60664-1:2020 Table F.2 case A, 2400 V interpolated between 2.0 kV (1.0 mm) and 2.5 kV (1.5 mm)
    assert mm(by_code(calc.run(record))["ISO-CLEARANCE"].limit.quantity) == pytest.approx(1.4)


def test_check_applies_the_archive_settings_as_the_site_build_does(tmp_path):
    from dossier.commands.check import run_check

    barrier = dict(REINFORCED_120, name="primary to output", between=["mains", "output"])
    path = write_record(tmp_path, "unit", barriers=[barrier], mains=dict(MAINS_120, frequency="60 Hz"))

    def clearance_limit():
        (record,) = run_check([path]).records
        (finding,) = [f for f in record.findings if f.code == "ISO-CLEARANCE"]
        return mm(finding.limit.quantity)

    # IEC 60664-1:2020 Table F.2 case A: 1.5 mm on the next row up, 1.4 mm interpolated (2400 V between 2.0 and 2.5 kV)
    assert clearance_limit() == pytest.approx(1.5)
    (tmp_path / "archive.yaml").write_text("table_interpolation:\n  allowed: true\n  clause: IEC 60664-1:2020, Table F.2 note\n", encoding="utf-8")
    assert clearance_limit() == pytest.approx(1.4)
