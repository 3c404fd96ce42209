"""A sign-off bound to the findings it judged: when the checks change them the review is outdated (nothing is
cleared, and no build breaks); when the record changes it is stale; a current one is still held to every rule."""

from __future__ import annotations

import datetime
import json
from dataclasses import replace

import pytest

from dossier.collect.archive import configured_calcs
from dossier.commands.build import build_site
from dossier.findings import Verdict
from dossier.plugins import load_calcs
from dossier.reading.archive import RevisionFile, load_revision
from dossier.reading.settings import load_settings
from dossier.signoff.binding import content_digest, findings_digest
from dossier.signoff.model import Choice
from dossier.signoff.state import ReviewState
from dossier.wording import signoff_line
from tests.fixtures.signoffs import (
    LATER_CALC, accept_all, findings_of, problems_of, run, save, started, state_of, with_later_check,
)
from tests.fixtures.site_kit import write_record


@pytest.fixture
def record(tmp_path):
    # fails ISO-CLEARANCE (2.5 mm where IEC 60664-1:2020 Table F.2 asks 3.0 mm reinforced) and PROT-FUSE-RATING
    return write_record(tmp_path / "archive", "amp", "A")


def cleared(record, drop_findings_digest: bool = False):
    """A sign-off started with `dossier sign-off`, every finding accepted, cleared for first power-up."""
    path, data = started(record)
    data["clearance"] = "first-power-up"
    if drop_findings_digest:
        del data["reviewed_findings"]  # as a sign-off written before the key existed
    save(path, accept_all(data))
    assert state_of(record).state is ReviewState.CLEARED_FOR_POWER_UP
    return path, data


def later_check_in_check_command(monkeypatch):
    monkeypatch.setattr("dossier.commands.check.load_plugins", with_later_check)


def test_a_started_sign_off_is_bound_to_the_findings_it_lists(record):
    _, data = started(record)
    assert data["reviewed_findings"] == findings_digest(findings_of(record))
    assert data["reviewed_findings"] != findings_digest(findings_of(record, with_later_check()))


def test_checks_added_after_a_clearance_make_the_review_outdated_and_clear_nothing(record):
    path, _ = cleared(record)
    state = state_of(record, with_later_check())
    assert state.state is ReviewState.REVIEW_OUTDATED and not state.cleared_for_power_up
    assert state.deciding is None and state.outdated.signoff.path == path
    assert [f.identity for f in state.outdated.outdated.unnamed] == [("LATER-GUARD", "mains input")]
    clearance = next(f for f in findings_of(record) if f.code == "ISO-CLEARANCE")
    assert state.accepted(clearance) is None, "an outdated review's acceptances no longer count"


def test_an_outdated_review_breaks_no_build_and_its_pages_ask_for_a_re_review(record, tmp_path):
    cleared(record)
    built = build_site(record.parent.parent, tmp_path / "site", pages_only=True, calcs=with_later_check())
    checklist = (built.output / "builds" / "amp" / "checklist.md").read_text(encoding="utf-8")
    assert "Not cleared for first power-up" in checklist and "Signed off" not in checklist
    assert "review outdated: the checks changed after signoff-A.yaml" in checklist
    assert "new since that review, needing a decision: LATER-GUARD (mains input, fail)" in checklist
    overview = (built.output / "builds" / "amp" / "index.md").read_text(encoding="utf-8")
    assert "(**outdated**: the checks changed the findings after it)" in overview


def test_check_reports_the_outdated_review_as_findings_not_as_an_input_error(record, monkeypatch):
    cleared(record)
    later_check_in_check_command(monkeypatch)
    result = run("check", record)
    assert result.exit_code == 1, result.output  # LATER-GUARD fails: a finding blocks, the files are valid
    assert "sign-off: review outdated" in result.output and "LATER-GUARD (mains input, fail)" in result.output
    body = json.loads(run("check", "--format", "json", record).output)["records"][0]["signoff"]
    assert body["state"] == "review-outdated" and body["signoffs"][0]["outdated"] is True
    assert body["since_review"]["new"] == [{"code": "LATER-GUARD", "subject": "mains input", "verdict": "fail"}]


def test_the_same_with_the_record_changed_is_stale_as_before(record):
    cleared(record)
    record.write_text(record.read_text(encoding="utf-8").replace("club's winder", "club's coil winder"), encoding="utf-8")
    state = state_of(record, with_later_check())
    assert state.state is ReviewState.STALE and not state.cleared_for_power_up
    assert state.signoffs[0].stale and state.outdated is None


def test_a_matching_findings_digest_still_refuses_a_clearance_over_a_blocker_at_its_key(record):
    loaded = load_revision(RevisionFile("amp", "A", record))
    path = record.parent / "signoff-A.yaml"
    path.write_text(
        "build: amp\nrevision: A\nreviewer: By Hand\ndate: 2026-05-10\n"
        f"reviewed_content: {content_digest(loaded.path, loaded.record.attachments)}\n"
        f"reviewed_findings: {findings_digest(findings_of(record))}\n"
        "decisions: []\nclearance: first-power-up\n",
        encoding="utf-8",
    )
    (line,) = problems_of(record)
    assert line.startswith(f"{path}:8:12: clearance:"), line  # line 8, the value after 'clearance: '
    assert "ISO-CLEARANCE (primary to output)" in line and "PROT-FUSE-RATING (mains input)" in line
    assert run("check", record).exit_code == 2


def test_an_outdated_review_skips_the_rules_a_current_one_is_held_to(record):
    path, data = started(record)
    data["decisions"][0].update(decision="accept")  # no reason, no one responsible: broken while current
    data["clearance"] = "first-power-up"
    save(path, data)
    assert any("decisions[0].reason" in line for line in problems_of(record))
    assert state_of(record, with_later_check()).state is ReviewState.REVIEW_OUTDATED


def test_a_change_an_outdated_review_asked_for_still_stands(record):
    path, data = started(record)
    data["decisions"][0].update(decision="fix", reason="widen the slot")
    save(path, data)
    fixed = next(f for f in findings_of(record) if (f.code, f.subject) == (data["decisions"][0]["code"], data["decisions"][0]["subject"]))
    state = state_of(record, with_later_check())
    assert state.state is ReviewState.REVIEW_OUTDATED
    assert state.decided(fixed).decision is Choice.FIX and state.accepted(fixed) is None


def test_findings_that_no_longer_need_a_decision_are_named(record):
    cleared(record)
    state = state_of(record, [])  # no calc at all: every finding the sign-off named has gone
    assert state.state is ReviewState.REVIEW_OUTDATED
    assert {(d.code, d.subject) for d in state.outdated.outdated.settled} == {("ISO-CLEARANCE", "primary to output"), ("PROT-FUSE-RATING", "mains input")}
    assert "named in it but no longer needing a decision: " in signoff_line(state)


def test_a_newer_current_sign_off_decides_over_an_older_outdated_one(record):
    path, data = cleared(record)
    newer = record.parent / "signoff-A-2.yaml"
    save(newer, dict(data, reviewed_findings=findings_digest(findings_of(record, with_later_check())), date=datetime.date(2099, 1, 1),
                     clearance="not-cleared", decisions=[*data["decisions"], {"code": "LATER-GUARD", "subject": "mains input", "decision": "fix"}]))
    state = state_of(record, with_later_check())
    assert state.state is ReviewState.CHANGES_REQUESTED and state.deciding.signoff.path == newer
    assert {j.signoff.path.name: j.outdated is not None for j in state.signoffs} == {path.name: True, newer.name: False}


def test_a_started_sign_off_uses_the_archive_settings_as_check_does(tmp_path):
    # at 280 V working, 4 mm of reinforced creepage fails on the next row up of IEC 60664-1:2020 Table F.5
    # (320 V, 2 x 2.2 mm) and is marginal when the archive allows interpolation between rows (2 x about 1.97 mm)
    barrier = {"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced", "material_group": "II",
               "creepage": "4 mm", "clearance": "2.5 mm", "working_voltage": "280 V"}
    record = write_record(tmp_path / "archive", "amp", "A", barriers=[barrier])
    (tmp_path / "archive" / "archive.yaml").write_text("table_interpolation: {allowed: true, clause: 'for the tests'}\n", encoding="utf-8")
    configured = configured_calcs(load_calcs(), load_settings(tmp_path / "archive"))
    assert findings_digest(findings_of(record, configured)) != findings_digest(findings_of(record))
    started(record)
    assert state_of(record, configured).state is ReviewState.CHANGES_REQUESTED
    assert "sign-off: reviewed, changes requested" in run("check", record).output


# Sign-offs written before reviewed_findings existed: held to what they name; a clearance over blocking findings
# they do not name is outdated, never a clearance and never an input error.

def test_an_older_sign_off_whose_clearance_the_new_checks_overtake_is_outdated(record, tmp_path):
    cleared(record, drop_findings_digest=True)
    state = state_of(record, with_later_check())
    assert state.state is ReviewState.REVIEW_OUTDATED and not state.cleared_for_power_up
    assert state.outdated.outdated.without_digest
    assert "it does not name LATER-GUARD (mains input, fail), which block power-up now" in signoff_line(state)
    build_site(record.parent.parent, tmp_path / "site", pages_only=True, calcs=with_later_check())


def test_an_older_sign_off_without_new_blockers_still_clears(record):
    cleared(record, drop_findings_digest=True)
    marginal_later = replace(LATER_CALC, run=lambda rec: [replace(f, verdict=Verdict.MARGINAL) for f in LATER_CALC.run(rec)])
    assert state_of(record, [*load_calcs(), marginal_later]).state is ReviewState.CLEARED_FOR_POWER_UP


def test_an_older_sign_off_is_still_refused_for_a_blocker_it_names_and_left_open(record):
    path, data = started(record)
    del data["reviewed_findings"]
    data["clearance"] = "first-power-up"
    save(path, data)  # the reviewer saw ISO-CLEARANCE and PROT-FUSE-RATING, decided nothing, and cleared
    (line,) = [line for line in problems_of(record, with_later_check()) if "clearance:" in line]
    assert line.startswith(f"{path}:") and "ISO-CLEARANCE (primary to output)" in line and "LATER-GUARD" not in line


def test_an_older_sign_off_is_still_held_to_its_own_decisions(record):
    path, data = started(record)
    del data["reviewed_findings"]
    data["decisions"][0].update(decision="accept", reason="measured")
    save(path, data)
    assert any("decisions[0].responsible" in line for line in problems_of(record, with_later_check()))


def test_an_older_sign_off_that_cleared_nothing_keeps_its_state(record):
    path, data = started(record)
    del data["reviewed_findings"]
    save(path, data)
    assert state_of(record, with_later_check()).state is ReviewState.CHANGES_REQUESTED
