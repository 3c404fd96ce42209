"""`dossier diff A B` and the comparison behind it (also used by the site's changes page)."""

from __future__ import annotations

from click.testing import CliRunner

from tests.fixtures.demo import DEMO, load_demo
from dossier.reading.archive import RevisionFile, load_revision
from dossier.cli import main
from dossier.commands.diff import diff_text
from dossier.review import review
from dossier.changes import finding_changes, record_changes
from tests.fixtures.site_kit import TEST_CALC, write_record


def _load(path):
    return load_revision(RevisionFile(path.parent.name, path.stem.removeprefix("rev-"), path)).record


def changes_between(tmp_path, old: dict, new: dict):
    a = write_record(tmp_path / "archive", "amp", "A", **old)
    b = write_record(tmp_path / "archive", "amp", "B", **new)
    return {c.key: c for c in record_changes(_load(a), _load(b))}


def test_values_show_old_and_new_with_units(tmp_path):
    changes = changes_between(tmp_path, {}, {"barriers": [{"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced", "material_group": "II", "creepage": "6 mm", "clearance": "4 mm"}]})
    change = changes["barriers[primary to output].clearance"]
    assert (change.kind, change.before, change.after) == ("changed", "2.5 mm", "4 mm")


def test_the_same_value_in_other_units_is_no_change(tmp_path):
    changes = changes_between(tmp_path, {}, {"barriers": [{"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced", "material_group": "II", "creepage": "6000 um", "clearance": "2.5 mm"}]})
    assert "barriers[primary to output].creepage" not in changes


def test_close_values_get_enough_digits_to_differ(tmp_path):
    changes = changes_between(tmp_path, {}, {"mains": {"nominal": "230.04 V", "frequency": "50 Hz"}})
    change = changes["mains.nominal"]
    assert change.before != change.after and change.before.startswith("230")


def test_parts_are_matched_by_designator_not_position(tmp_path):
    parts = [{"ref": "F1", "kind": "fuse", "value": "T1A"}]
    inserted = [{"ref": "RT1", "kind": "ntc", "value": "10 ohm"}, {"ref": "F1", "kind": "fuse", "value": "T2A"}]
    stage = {"kind": "mains-input", "name": "Mains input", "side": "mains"}
    changes = changes_between(tmp_path, {"stages": [dict(stage, parts=parts)]}, {"stages": [dict(stage, parts=inserted)]})
    assert changes["stages[Mains input].parts[F1].value"].after == "T2A"
    assert changes["stages[Mains input].parts[RT1]"].kind == "added"
    assert len(changes) == 2


def test_long_text_changes_come_as_a_line_diff(tmp_path):
    changes = changes_between(tmp_path, {"notes": "line one\nline two\n"}, {"notes": "line one\nline 2\n"})
    change = changes["notes"]
    assert change.kind == "text" and "-line two" in change.lines and "+line 2" in change.lines


def test_revision_bookkeeping_is_not_listed_as_a_change(tmp_path):
    changes = changes_between(tmp_path, {"changes": "first"}, {"changes": "second"})
    assert not {"revision", "date", "changes"} & set(changes)


def test_findings_that_changed_verdict_are_listed_worst_first(tmp_path):
    a = write_record(tmp_path / "archive", "amp", "A")
    b = write_record(tmp_path / "archive", "amp", "B", barriers=[{"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced", "material_group": "II", "creepage": "6 mm", "clearance": "5 mm"}])
    changes = finding_changes(review(_load(a), [TEST_CALC]), review(_load(b), [TEST_CALC]))
    assert [change.text for change in changes] == ["Clearance (primary to output): fail -> pass (2.5 mm -> 5 mm)"]


def test_unchanged_findings_are_not_listed(tmp_path):
    a = write_record(tmp_path / "archive", "amp", "A")
    b = write_record(tmp_path / "archive", "amp", "B", notes="other notes")
    assert finding_changes(review(_load(a), [TEST_CALC]), review(_load(b), [TEST_CALC])) == []


def test_demo_diff_lists_the_widened_barrier_and_its_findings(calcs):
    text = diff_text(DEMO / "solar-bank-charger" / "rev-A.yaml", DEMO / "solar-bank-charger" / "rev-B.yaml", calcs)
    assert text.splitlines()[0] == "solar-bank-charger rev A (2026-03-03) -> solar-bank-charger rev B (2026-04-28)"
    assert "barriers[primary to output].creepage: 2.6 mm -> 7.2 mm" in text
    assert "protection.fuse.rating: 2.5 A -> 3.15 A" in text
    old, new = (review(load_demo("solar-bank-charger", letter), calcs) for letter in "AB")
    expected = [change.text for change in finding_changes(old, new)]
    assert expected and all(line in text for line in expected)


def test_diff_command_prints_the_same(calcs):
    result = CliRunner().invoke(main, ["diff", str(DEMO / "solar-bank-charger" / "rev-B.yaml"), str(DEMO / "solar-bank-charger" / "rev-C.yaml")])
    assert result.exit_code == 0
    assert "magnetics[T1].windings[primary].turns: 14.0 -> 36.0" in result.output


def test_diff_command_refuses_a_folder_or_missing_file(tmp_path):
    result = CliRunner().invoke(main, ["diff", str(DEMO / "solar-bank-charger"), str(tmp_path / "rev-Z.yaml")])
    assert result.exit_code == 2 and "one record file" in result.output and "Traceback" not in result.output


def test_diff_of_mains_revisions_carries_the_caution():
    from dossier.caution import MAINS_CAUTION
    from dossier.commands.diff import diff_text
    from tests.fixtures.demo import DEMO

    build = DEMO / "solar-bank-charger"
    text = diff_text(build / "rev-A.yaml", build / "rev-B.yaml")
    assert text.endswith(f"Caution: {MAINS_CAUTION}")
