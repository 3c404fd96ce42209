"""Each result is computed once: the review hands the calcs' products on, the checklist is built once per
revision, and the later stages never run a calc again (so a calc that crashes cannot crash the build)."""

from __future__ import annotations

from pathlib import Path

from click.testing import CliRunner

from tests.fixtures.site_kit import write_record

from dossier.calcs import charge as charge_calc
from dossier.calcs.charge import curve as charge_curve_module
from dossier.calcs.protection import FUSE, NAME as PROTECTION
from dossier.checklist import sheet
from dossier.cli import main
from dossier.collect.archive import collect
from dossier.drawing.charts.charge import draw
from dossier.review import CALC_ERROR

CHARGER_OUTPUT = {
    "voltage": "14.4 V", "current": "6 A", "efficiency": "80 %", "tolerance": "2 %",
    "battery": {"chemistry": "agm", "capacity": "40 Ah", "absorption_voltage": "14.4 V", "float_voltage": "13.6 V"},
}


def charger_archive(root: Path, letters: str = "AB") -> Path:
    for letter in letters:
        write_record(root, "charger", letter, output=CHARGER_OUTPUT)
    return root


def counted(monkeypatch, module, name: str) -> list:
    """Replace module.name with a wrapper that records each call; the list grows by one per call."""
    calls, original = [], getattr(module, name)

    def wrapper(*args, **kwargs):
        calls.append(args)
        return original(*args, **kwargs)

    monkeypatch.setattr(module, name, wrapper)
    return calls


def test_the_charge_curve_is_computed_once_per_revision_and_the_chart_draws_the_reviews_curve(tmp_path, monkeypatch):
    plans = counted(monkeypatch, charge_curve_module, "plan_for")  # every charge curve starts from its plan
    archive = collect(charger_archive(tmp_path / "archive"))
    revisions = archive.builds[0].revisions
    assert len(revisions) == 2
    assert len(plans) == len(revisions), f"the charge curve was computed {len(plans)} times for {len(revisions)} revisions"
    for revision in revisions:
        curve = revision.review.product(charge_calc.NAME, charge_calc.CURVE)
        [chart] = [figure for figure in revision.extras.figures if figure.key == "charge-curve"]
        assert curve is not None and chart.svg == draw(revision.record, curve)


def test_the_checklist_is_built_once_per_revision_and_every_page_shows_that_one(tmp_path, monkeypatch):
    builds = counted(monkeypatch, sheet, "all_items")
    archive = collect(charger_archive(tmp_path / "archive"))
    revisions = archive.builds[0].revisions
    assert len(builds) == len(revisions)
    for revision in revisions:
        assert set(revision.extras.sheets) == {"a4", "letter"}
        for item in revision.checklist.items:
            assert f"id `{item.key}`" in revision.extras.checklist
            assert all(f'id="item-{item.key}"' in sheet_html for sheet_html in revision.extras.sheets.values())


def test_the_fuse_item_uses_the_protection_calcs_recommendation(tmp_path):
    archive = collect(charger_archive(tmp_path / "archive", "A"))
    [revision] = archive.builds[0].revisions
    choice = revision.review.product(PROTECTION, FUSE)
    assert choice is not None and choice.rating is not None
    assert revision.checklist.item("mains-fuse").title.endswith(choice.marking)


def test_a_record_whose_calc_crashes_still_builds_with_a_calc_error_finding(tmp_path, monkeypatch):
    from dossier.calcs.protection import fuse

    def crash(record):
        raise ZeroDivisionError("float division by zero")

    monkeypatch.setattr(fuse, "input_current", crash)  # the protection calc, and the fuse choice, fail on this record
    archive = charger_archive(tmp_path / "archive", "A")
    result = CliRunner().invoke(main, ["build", str(archive), "-o", str(tmp_path / "site"), "--pages-only", "--no-cache", "--no-pdf", "-q"])
    assert result.exception is None or isinstance(result.exception, SystemExit), result.output
    assert result.exit_code == 0, result.output
    checklist = next((tmp_path / "site").rglob("checklist.md")).read_text(encoding="utf-8")
    assert CALC_ERROR in checklist and "Do not power up" in checklist
    assert "Mains fuse: none recorded" in checklist  # no fuse declared, and the crashed calc recommended none
