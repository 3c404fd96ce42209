"""The isolation calc under a product standard: the verdict, the required distances and the hi-pot figure follow
the standard a record or its archive names, and say why."""

from __future__ import annotations

import pytest

from tests.calcs.isolation.test_calc import IDENTITY, by_code, extra
from dossier.calcs.isolation import CALC, configured, run
from dossier.changes import finding_changes
from dossier.checklist.sheet import build_checklist
from dossier.findings import Verdict
from dossier.reading.settings import ArchiveSettings
from dossier.record.model import Record
from dossier.record.standard import StandardChoice
from dossier.review import Review

IEC_62368 = {"name": "iec-62368-1", "edition": 3}
IEC_60335 = {"name": "iec-60335-1", "edition": 5}
IEC_61558 = {"name": "iec-61558-1", "edition": 3}
IEC_61010 = {"name": "iec-61010-1", "edition": 3}
BOARD_BARRIER = {"name": "mains to relay coil", "between": ["mains", "output"], "grade": "basic", "material_group": "IIIa",
                 "printed_board": True, "creepage": "1.8 mm", "clearance": "2.0 mm"}


def record(barrier=None, standard=None, **sections) -> Record:
    data = {**IDENTITY, "mains": {"nominal": "230 V", "frequency": "50 Hz", "overvoltage_category": "II"},
            "barriers": [barrier or BOARD_BARRIER], **sections}
    if standard is not None:
        data["standard"] = standard
    return Record.model_validate(data)


def test_a_board_barrier_passes_iec60664_and_fails_iec62368():
    # IEC 60664-1:2020 Table F.5, 230 V -> 250 V row, printed-board PD2 column: 1.0 mm (confirmed), raised to the 1.5 mm
    # clearance, so 1.8 mm passes;
    # IEC 62368-1:2018 Table 17 has no printed-board column (from memory): PD2 group IIIa at 250 V, 2.5 mm (confirmed)
    basic = by_code(run(record()))
    product = by_code(run(record(standard=IEC_62368)))
    assert basic["ISO-CREEPAGE"].verdict is Verdict.PASS
    assert product["ISO-CREEPAGE"].verdict is Verdict.FAIL
    assert product["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(2.5)
    assert "Table 17, 250 V row" in product["ISO-CREEPAGE"].explanation
    assert "IEC 60664-1 alone would ask 1.5 mm" in product["ISO-CREEPAGE"].explanation  # floored at the 1.5 mm clearance
    assert extra(product["ISO-CREEPAGE"], "product standard").startswith("IEC 62368-1")


def test_iec60335_asks_more_clearance_at_low_impulse_voltages():
    # 48 V category I barrier to mains: Table F.1 330 V; IEC 60664-1 Table F.2 PD2 0.2 mm (confirmed) against
    # IEC 60335-1 Table 16 0.5 mm (from memory); 0.3 mm passes the first and fails the second
    barrier = {"name": "low-voltage barrier", "between": ["mains", "output"], "grade": "basic", "material_group": "I",
               "creepage": "2 mm", "clearance": "0.3 mm"}
    low = {"nominal": "48 V", "frequency": "50 Hz", "overvoltage_category": "I"}
    assert by_code(run(record(barrier, mains=low)))["ISO-CLEARANCE"].verdict is Verdict.PASS
    product = by_code(run(record(barrier, standard=IEC_60335, mains=low)))["ISO-CLEARANCE"]
    assert product.verdict is Verdict.FAIL and product.limit.quantity.to("mm").magnitude == pytest.approx(0.5)
    assert "from memory" in product.explanation and "Table 16, 330 V row" in product.explanation


def test_reinforced_clearance_follows_the_standards_own_rule_at_category_iii():
    # 230 V category III: Table F.1 4000 V. IEC 60664-1:2020 takes 160 % = 6400 V -> Table F.2 8000 V row, 8.0 mm;
    # IEC 62368-1:2018 Table 14 reinforced at 4000 V: 5.5 mm (from memory); the product standard's figure is taken
    barrier = {**BOARD_BARRIER, "grade": "reinforced", "printed_board": False, "creepage": "12 mm", "clearance": "6.5 mm"}
    three = {"nominal": "230 V", "frequency": "50 Hz", "overvoltage_category": "III"}
    assert by_code(run(record(barrier, mains=three)))["ISO-CLEARANCE"].verdict is Verdict.FAIL
    product = by_code(run(record(barrier, standard=IEC_62368, mains=three)))["ISO-CLEARANCE"]
    assert product.verdict is Verdict.PASS and product.limit.quantity.to("mm").magnitude == pytest.approx(5.5)
    assert "IEC 60664-1 alone would ask 8 mm" in product.explanation


def test_the_archive_default_applies_unless_the_record_names_its_own():
    settings = ArchiveSettings(standard=StandardChoice(**IEC_62368))
    calc = configured(settings)
    assert by_code(calc.run(record()))["ISO-STANDARD"].value.quantity.startswith("IEC 62368-1")
    own = by_code(calc.run(record(standard=IEC_60335)))["ISO-STANDARD"]
    assert own.value.quantity.startswith("IEC 60335-1") and "named in the record" in own.explanation
    assert by_code(CALC.run(record()))["ISO-STANDARD"].value.quantity.startswith("IEC 60664-1")


@pytest.mark.parametrize("standard, grade, volts", [
    (None, "basic", 1430),  # IEC 60664-1: U_n + 1200 V (from memory)
    (None, "reinforced", 2860),
    (IEC_62368, "basic", 2500),  # IEC 62368-1:2018 Table 25 at 2500 V (from memory)
    (IEC_62368, "reinforced", 4000),  # confirmed in a public test report: 4000 V d.c.
    (IEC_60335, "basic", 1250),  # IEC 60335-1:2010 Table 7, 151-250 V (from memory)
    (IEC_60335, "reinforced", 3000),
])
def test_the_hipot_figure_follows_the_standard(standard, grade, volts):
    findings = by_code(run(record({**BOARD_BARRIER, "grade": grade, "creepage": "8 mm", "clearance": "6 mm"}, standard=standard)))
    hipot = findings["ISO-HIPOT"]
    assert hipot.verdict is Verdict.INFO and hipot.value.quantity.to("V").magnitude == pytest.approx(volts)
    assert "no breakdown" in hipot.explanation and "trained people" in hipot.explanation


def test_the_hipot_is_a_checklist_item_for_a_qualified_person():
    rec = record({**BOARD_BARRIER, "grade": "reinforced", "creepage": "8 mm", "clearance": "6 mm"}, standard=IEC_62368)
    findings = run(rec)
    item = build_checklist(rec, Review(tuple(findings))).item("hipot-mains-to-relay-coil")
    assert "4000 V" in item.steps and "60 s" in item.steps and "no breakdown" in item.steps
    assert "qualified person" in item.title and "trained people" in item.note


def test_a_functional_barrier_gets_no_hipot():
    findings = run(record({**BOARD_BARRIER, "grade": "functional"}, standard=IEC_62368))
    assert "ISO-HIPOT" not in {f.code for f in findings}


def test_the_earth_limit_of_the_product_standard():
    # IEC 60335-1:2010 clause 27.5 (from memory): 0.1 ohm; a class I unit on the mains
    finding = by_code(run(record(standard=IEC_60335)))["ISO-PE-LIMIT"]
    assert finding.value.quantity.to("ohm").magnitude == pytest.approx(0.1) and "27.5" in finding.explanation
    class_ii = record(standard=IEC_60335, protection={"earth": {"protective_class": "II", "enclosure": "plastic"}})
    assert "ISO-PE-LIMIT" not in {f.code for f in run(class_ii)}


def test_board_spacing_is_functional_and_judged_by_ipc2221():
    # IPC-2221B Table 6-1, B2 (uncoated, the default): 31-100 V 0.6 mm; B4 (coated): 0.13 mm
    spacing = {"name": "rail to sense", "between": ["rail", "sense"], "voltage": "48 V", "spacing": "0.3 mm"}
    (uncoated,) = [f for f in run(record(board_spacings=[spacing])) if f.code == "ISO-BOARD-SPACING"]
    assert uncoated.verdict is Verdict.FAIL and uncoated.limit.quantity.to("mm").magnitude == pytest.approx(0.6)
    assert "no safety figure" in uncoated.explanation and not uncoated.guards_hazard
    (coated,) = [f for f in run(record(board_spacings=[{**spacing, "condition": "external-coated"}])) if f.code == "ISO-BOARD-SPACING"]
    assert coated.verdict is Verdict.PASS


def test_a_change_of_standard_is_named_beside_the_verdict_it_changed():
    before, after = run(record()), run(record(standard=IEC_62368))
    changes = {change.label: change for change in finding_changes(before, after)}
    creepage = changes["Creepage for basic insulation (mains to relay coil)"]
    assert creepage.before.verdict is Verdict.PASS and creepage.after.verdict is Verdict.FAIL
    assert "the product standard changed: IEC 60664-1 edition 3 (2020) -> IEC 62368-1 edition 3.0, 2018" in creepage.text


def test_a_standard_or_edition_not_held_is_refused():
    from pydantic import ValidationError

    with pytest.raises(ValidationError, match="one of the standards held"):
        record(standard={"name": "iec-62368-1", "edition": 2})
    with pytest.raises(ValidationError):
        record(standard={"name": "iec-61010-1", "edition": 2})


# --- IEC 61558-1 edition 3 (transformers) and IEC 61010-1 edition 3 (test gear) ---------------------------------


def test_iec61558_asks_more_creepage_than_iec60664_on_a_board():
    # 230 V mains -> 250 V (IEC 60664-1 Table F.3). IEC 60664-1:2020 Table F.5 board PD2 column 1.0 mm, raised to the
    # 1.5 mm clearance: 1.8 mm passes. IEC 61558-1:2017 Table 21 (one public transcription), 300 V row, group IIIa,
    # PD2: 3.0 mm, no printed-board column: 1.8 mm fails. Table 20, 300 V, category II, PD2: 1.5 mm; 2.0 mm passes.
    product = by_code(run(record(standard=IEC_61558)))
    assert by_code(run(record()))["ISO-CREEPAGE"].verdict is Verdict.PASS
    assert product["ISO-CREEPAGE"].verdict is Verdict.FAIL
    assert product["ISO-CREEPAGE"].limit.quantity.to("mm").magnitude == pytest.approx(3.0)
    assert "Table 21, 300 V row, material group IIIa" in product["ISO-CREEPAGE"].explanation
    assert "250 V lies between rows" in product["ISO-CREEPAGE"].explanation
    assert product["ISO-CLEARANCE"].verdict is Verdict.PASS
    assert product["ISO-CLEARANCE"].limit.quantity.to("mm").magnitude == pytest.approx(1.5)
    assert extra(product["ISO-CLEARANCE"], "table figure provenance") == "confirmed in public material"


def test_iec61558_clearance_steps_at_301_v():
    # A barrier off the mains at 300 V r.m.s. / 301 V r.m.s., category II, PD2, basic: IEC 61558-1:2017 Table 20 gives
    # 1.5 mm (300 V row) / 3.0 mm (600 V row); 2.0 mm declared passes the first and fails the second
    def barrier(volts):
        return {"name": "winding to core", "between": ["primary", "core"], "grade": "basic", "material_group": "I",
                "working_voltage": volts, "creepage": "8 mm", "clearance": "2.0 mm"}
    at_300 = by_code(run(record(barrier("300 V"), standard=IEC_61558)))["ISO-CLEARANCE"]
    at_301 = by_code(run(record(barrier("301 V"), standard=IEC_61558)))["ISO-CLEARANCE"]
    assert (at_300.verdict, at_301.verdict) == (Verdict.PASS, Verdict.FAIL)
    assert at_301.limit.quantity.to("mm").magnitude == pytest.approx(3.0)


@pytest.mark.parametrize("grade, volts", [("basic", 1500), ("reinforced", 3000)])
def test_iec61558_hipot_from_table14(grade, volts):
    # IEC 61558-1:2017 Table 14, 300 V row, category II: 1500 V basic, 3000 V reinforced, a.c. r.m.s.; 60 s from memory
    hipot = by_code(run(record({**BOARD_BARRIER, "grade": grade, "creepage": "8 mm", "clearance": "6 mm"}, standard=IEC_61558)))["ISO-HIPOT"]
    assert hipot.value.quantity.to("V").magnitude == pytest.approx(volts)
    assert "Table 14, 300 V row, overvoltage category II" in hipot.explanation and "60 s duration is from memory" in hipot.explanation


def test_iec61010_clearance_and_creepage_are_not_assessed_and_block_power_up():
    # IEC 61010-1:2010 Table 4 / Annex K not found in public material: not assessed, blocking on a safety barrier,
    # with what IEC 60664-1:2020 alone asks (Table F.2 PD2 at 2500 V: 1.5 mm) shown as guidance
    findings = by_code(run(record(standard=IEC_61010)))
    for code in ("ISO-CLEARANCE", "ISO-CREEPAGE"):
        assert findings[code].verdict is Verdict.NOT_ASSESSED and findings[code].guards_hazard
        assert "Table 4" in findings[code].explanation and "blocks power-up" in findings[code].explanation
    assert "IEC 60664-1 alone would ask 1.5 mm" in findings["ISO-CLEARANCE"].explanation
    assert "Not held: Table 4 and Annex K" in findings["ISO-STANDARD"].explanation
    functional = by_code(run(record({**BOARD_BARRIER, "grade": "functional"}, standard=IEC_61010)))
    assert functional["ISO-CLEARANCE"].verdict is Verdict.INFO


def test_iec61010_hipot_and_earth_are_given_from_memory():
    # IEC 61010-1:2010 Table 5 (from memory): 230 V mains, reinforced: 3000 V a.c. r.m.s. for 5 s; clause 6.5.2.4: 0.1 ohm
    findings = by_code(run(record({**BOARD_BARRIER, "grade": "reinforced"}, standard=IEC_61010)))
    hipot = findings["ISO-HIPOT"]
    assert hipot.value.quantity.to("V").magnitude == pytest.approx(3000) and "for 5 s" in hipot.explanation
    assert "(from memory)" in hipot.explanation
    assert findings["ISO-PE-LIMIT"].value.quantity.to("ohm").magnitude == pytest.approx(0.1)
    assert "6.5.2.4" in findings["ISO-PE-LIMIT"].explanation


def test_the_verdict_changes_with_the_standard_across_all_held():
    # The same board barrier (1.8 mm creepage, group IIIa, PD2, 230 V): passes IEC 60664-1 (printed-board column),
    # fails IEC 62368-1 (2.5 mm) and IEC 61558-1 (3.0 mm), and is not assessed under IEC 61010-1
    verdicts = {str(standard): by_code(run(record(standard=standard)))["ISO-CREEPAGE"].verdict
                for standard in (None, IEC_62368, IEC_61558, IEC_61010)}
    assert list(verdicts.values()) == [Verdict.PASS, Verdict.FAIL, Verdict.FAIL, Verdict.NOT_ASSESSED]
