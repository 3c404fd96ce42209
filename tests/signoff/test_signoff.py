"""Sign-offs: started from the findings, bound to the content reviewed, stale after an edit, never clearing over a fail."""

from __future__ import annotations

import datetime
import json

import pytest

from dossier.plugins import load_calcs
from dossier.reading.archive import RevisionFile, load_revision
from dossier.review import review
from dossier.signoff.state import ReviewState
from dossier.wording import problem_line
from tests.fixtures.bad_input import tried
from tests.fixtures.demo import ROOT
from tests.fixtures.signoffs import accept_all, problems_of, run, save, started, state_of
from tests.fixtures.site_kit import write_record


@pytest.fixture
def record(tmp_path):
    # 2.5 mm of reinforced clearance at 230 V, OVC II fails: IEC 60664-1:2020 Table F.2 asks 3.0 mm (4 kV row)
    return write_record(tmp_path / "archive", "amp", "A")


def test_a_started_sign_off_lists_every_finding_that_blocks_and_clears_nothing(record):
    path, data = started(record)
    blocking = {f.identity for f in review(load_revision(RevisionFile("amp", "A", record)).record, load_calcs()) if f.blocks_power_up}
    assert ("ISO-CLEARANCE", "primary to output") in blocking
    assert blocking <= {(d["code"], d["subject"]) for d in data["decisions"]}
    assert all(d["decision"] is None for d in data["decisions"])
    assert data["clearance"] == "not-cleared" and data["reviewed_content"].startswith("sha256:")
    assert state_of(record).state is ReviewState.CHANGES_REQUESTED


def test_starting_again_never_overwrites(record):
    path, _ = started(record)
    path.write_text(path.read_text(encoding="utf-8") + "# mine\n", encoding="utf-8")
    again = run("sign-off", record, "--reviewer", "Third Member")
    assert again.exit_code == 0 and (record.parent / "signoff-A-2.yaml").is_file()
    assert path.read_text(encoding="utf-8").endswith("# mine\n")


def test_clearing_over_an_open_fail_is_refused_at_the_clearance_key(record):
    path, data = started(record)
    data["clearance"] = "first-power-up"
    save(path, data)
    (line,) = [p for p in problems_of(record) if "clearance:" in p]
    assert line.startswith(f"{path}:") and "ISO-CLEARANCE (primary to output)" in line
    assert run("check", record).exit_code == 2


def test_accepting_a_fail_needs_a_reason_and_who_takes_responsibility(record):
    path, data = started(record)
    first = data["decisions"][0]
    first.update(decision="accept")
    save(path, data)
    lines = problems_of(record)
    assert any("decisions[0].reason" in line for line in lines)
    assert any("decisions[0].responsible" in line for line in lines)


def test_accepted_with_reasons_the_revision_is_cleared(record):
    path, data = started(record)
    data["clearance"] = "first-power-up"
    save(path, accept_all(data))
    state = state_of(record)
    assert state.state is ReviewState.CLEARED_FOR_POWER_UP
    clearance = next(f for f in review(load_revision(RevisionFile("amp", "A", record)).record, load_calcs()) if f.code == "ISO-CLEARANCE")
    assert state.accepted(clearance).reason == "measured on the bench"
    assert "cleared for first power-up, by Second Member" in run("check", record).output


def test_an_edit_after_the_sign_off_makes_it_stale_and_drops_its_clearance(record):
    path, data = started(record)
    data["clearance"] = "first-power-up"
    save(path, accept_all(data))
    record.write_text(record.read_text(encoding="utf-8").replace("club's winder", "club's coil winder"), encoding="utf-8")
    state = state_of(record)
    assert state.state is ReviewState.STALE and not state.cleared_for_power_up
    assert "sign-off: stale" in run("check", record).output


def test_a_changed_attachment_makes_the_sign_off_stale(tmp_path):
    folder = tmp_path / "archive" / "amp"
    folder.mkdir(parents=True)
    (folder / "winding.txt").write_text("24 turns", encoding="utf-8")
    record = write_record(tmp_path / "archive", "amp", "A", attachments=[{"path": "winding.txt", "kind": "datasheet", "caption": "winding sheet"}])
    started(record)
    assert state_of(record).state is ReviewState.CHANGES_REQUESTED
    (folder / "winding.txt").write_text("25 turns", encoding="utf-8")
    assert state_of(record).state is ReviewState.STALE


def test_the_newest_current_sign_off_decides(record):
    path, data = started(record)
    data["clearance"] = "first-power-up"
    save(path, accept_all(data))
    second = record.parent / "signoff-A-2.yaml"
    save(second, dict(data, reviewer="Third Member", date=datetime.date(2099, 1, 1), clearance="not-cleared"))
    state = state_of(record)
    assert state.state is ReviewState.CHANGES_REQUESTED and state.deciding.signoff.path == second


def test_a_decision_for_no_such_finding_is_located(record):
    path, data = started(record)
    data["decisions"].append({"code": "ISO-CLEARANCE", "subject": "secondary to nowhere", "decision": "fix"})
    save(path, data)
    assert any("decisions[" in line and "secondary to nowhere" in line for line in problems_of(record))


HOSTILE = {
    "misspelt key": ("reviewr: x\n", "unknown key"),
    "wrong build": (None, "build"),
    "bad clearance": (None, "clearance"),
    "not a mapping": ("- a\n- b\n", "mapping"),
    "bad digest": (None, "reviewed_content"),
}


@pytest.mark.parametrize("case", sorted(HOSTILE))
def test_broken_sign_off_files_give_located_problems(record, case):
    tried("broken sign-off files")
    path, data = started(record)
    extra, expected = HOSTILE[case]
    if case == "misspelt key":
        path.write_text(path.read_text(encoding="utf-8") + extra, encoding="utf-8")
    elif case == "not a mapping":
        path.write_text(extra, encoding="utf-8")
    else:
        data.update({"wrong build": {"build": "psu"}, "bad clearance": {"clearance": "maybe"}, "bad digest": {"reviewed_content": "abc"}}[case])
        save(path, data)
    result = run("check", record)
    assert result.exit_code == 2
    located = [line for line in result.output.splitlines() if line.startswith(str(path) + ":")]
    assert located and expected in located[0], result.output


def test_a_linked_sign_off_file_is_refused(record, tmp_path):
    tried("broken sign-off files")
    elsewhere = tmp_path / "elsewhere.yaml"
    elsewhere.write_text("build: amp\n", encoding="utf-8")
    (record.parent / "signoff-A.yaml").symlink_to(elsewhere)
    assert run("check", record).exit_code == 2


def test_the_sign_off_schema_describes_the_file(tmp_path):
    body = json.loads(run("schema", "--of", "signoff").output)
    assert body["$schema"].endswith("2020-12/schema")
    assert set(body["required"]) >= {"build", "revision", "reviewer", "date", "reviewed_content", "clearance"}
    assert json.loads((ROOT / "docs" / "signoff.schema.json").read_text(encoding="utf-8")) == body, "regenerate docs/signoff.schema.json"


def test_the_checklist_opens_with_not_cleared_or_names_the_sign_off_that_cleared(record, tmp_path):
    from dossier.collect.archive import collect
    from dossier.checklist.page import checklist_html, checklist_markdown

    def sheets():
        revision = collect(record.parent.parent).builds[0].current
        return checklist_markdown(revision.loaded, revision.checklist), checklist_html(revision.loaded, revision.checklist)

    page, sheet = sheets()
    assert "Not cleared for first power-up" in page and "Sign-off: not reviewed" in page
    assert "Not cleared for first power-up." in sheet
    path, data = started(record)
    data["clearance"] = "first-power-up"
    save(path, accept_all(data))
    page, sheet = sheets()
    assert "Not cleared" not in page and "Signed off" in page
    assert "cleared for first power-up, by Second Member" in page and "cleared for first power-up, by Second Member" in sheet


def test_a_published_revision_keeps_its_sign_offs_frozen_with_it(record, monkeypatch):
    from dossier.calcs.isolation import CALC
    from dossier.ledger import frozen_problems, load_ledger

    path, data = started(record)
    monkeypatch.setattr("dossier.plugins.load_calcs", lambda: [CALC])
    assert run("publish", record.parent.parent, "--even-if-blocked").exit_code == 0
    archive = record.parent.parent
    assert frozen_problems(archive, load_ledger(archive)) == []
    path.write_text(path.read_text(encoding="utf-8").replace("Second Member", "Someone Else"), encoding="utf-8")
    problems = [problem_line(p) for p in frozen_problems(archive, load_ledger(archive))]
    assert any("signoff-A.yaml" in line for line in problems), problems


def test_the_printed_sheet_carries_the_ledger_head_once_something_is_published(record, monkeypatch):
    from dossier.calcs.isolation import CALC
    from dossier.checklist.page import checklist_html
    from dossier.collect.archive import collect
    from dossier.ledger import load_ledger

    archive = record.parent.parent

    def sheet() -> str:
        revision = collect(archive).builds[0].current
        return checklist_html(revision.loaded, revision.checklist)

    assert "ledger head" not in sheet()
    monkeypatch.setattr("dossier.plugins.load_calcs", lambda: [CALC])
    assert run("publish", archive, "--even-if-blocked").exit_code == 0
    assert f"<code>{load_ledger(archive).head}</code>" in sheet()
