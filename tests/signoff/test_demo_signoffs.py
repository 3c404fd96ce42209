"""The demo's sign-off story: rev C of the charger was cleared and powered up, then checks added since found what its
record never said, so that review is outdated (its file untouched); rev D declares it and is cleared."""

from __future__ import annotations

import pytest
import yaml

from dossier.collect.archive import configured_calcs
from dossier.plugins import load_calcs
from dossier.reading.archive import RevisionFile, load_revision
from dossier.reading.settings import load_settings
from dossier.review import review
from dossier.signoff.model import Choice
from dossier.signoff.revision import revision_signoffs
from dossier.signoff.state import ReviewState
from dossier.wording import signoff_line
from tests.fixtures.demo import DEMO

NEW_CHECKS = [("CHG-HOT-CUTOFF", "battery"), ("PROT-TOUCH-CURRENT", "touch current"), ("RAILS-X-DISCHARGE", "X capacitors"), ("CHG-TIMER", "battery")]


@pytest.fixture(scope="module")
def demo_calcs():
    return configured_calcs(load_calcs(), load_settings(DEMO))


def judged(build: str, letter: str, calcs):
    loaded = load_revision(RevisionFile(build, letter, DEMO / build / f"rev-{letter}.yaml"))
    findings = review(loaded.record, calcs)
    return revision_signoffs(loaded, findings), findings


def test_rev_c_was_cleared_once_and_its_review_is_outdated_by_the_new_checks(demo_calcs):
    state, _ = judged("solar-bank-charger", "C", demo_calcs)
    assert state.state is ReviewState.REVIEW_OUTDATED and not state.cleared_for_power_up
    entry = state.outdated.entry
    assert (entry.clearance.value, entry.date.isoformat(), entry.decisions) == ("first-power-up", "2026-06-20", [])
    assert entry.notes.startswith("Every finding passes."), "the reviewer's own record of the review stays as written"
    assert [f.identity for f in state.outdated.outdated.unnamed] == NEW_CHECKS
    assert "cleared for first power-up), so it no longer counts" in signoff_line(state)


def test_rev_b_sent_back_before_the_new_checks_keeps_its_requests_to_fix(demo_calcs):
    state, findings = judged("solar-bank-charger", "B", demo_calcs)
    assert state.state is ReviewState.REVIEW_OUTDATED
    assert sorted(f.identity for f in state.outdated.outdated.unnamed) == sorted(NEW_CHECKS)
    flux = next(f for f in findings if f.identity == ("MAG-FLUX", "T1"))
    assert state.decided(flux).decision is Choice.FIX


def test_rev_d_is_the_charger_s_current_cleared_revision(demo_calcs):
    state, _ = judged("solar-bank-charger", "D", demo_calcs)
    assert state.state is ReviewState.CLEARED_FOR_POWER_UP and state.deciding.signoff.path.name == "signoff-D.yaml"


def test_the_bench_supply_s_sign_off_is_stale_after_the_edit(demo_calcs):
    state, _ = judged("bench-psu-13v8", "B", demo_calcs)
    assert state.state is ReviewState.STALE


def test_every_demo_sign_off_is_bound_to_the_findings_it_judged():
    paths = sorted(DEMO.glob("*/signoff-*.yaml"))
    assert len(paths) == 4
    for path in paths:
        assert yaml.safe_load(path.read_text(encoding="utf-8"))["reviewed_findings"].startswith("sha256:"), path
