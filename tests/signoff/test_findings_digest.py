"""The findings digest a sign-off is bound to: blind to words, display units and rounding noise; moved by a verdict,
a figure that sets it, or a finding that comes to need a decision."""

from __future__ import annotations

from dataclasses import replace

from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.signoff.binding import findings_digest
from dossier.units import Q_

CLEARANCE = Finding(
    code="ISO-CLEARANCE", calc="isolation", subject="primary to output", title="Clearance", verdict=Verdict.FAIL,
    values=(Measure("declared", Q_(2.5, "mm")),), limit=Measure("required", Q_(3.0, "mm")),
    explanation="Made-up figures for the tests.", sources=(common_practice("for the tests"),),
)
TIMER = Finding(code="CHG-TIMER", calc="charge", subject="battery", title="Absorption timer", verdict=Verdict.MARGINAL,
                values=(Measure("declared", "none declared"),))
PASSING = Finding(code="MAG-FLUX", calc="magnetics", subject="T1", title="Peak flux", verdict=Verdict.PASS,
                  values=(Measure("peak", Q_(0.18, "T")),), limit=Measure("limit", Q_(0.3, "T")))
BASE = findings_digest([CLEARANCE, TIMER, PASSING])


def test_words_display_units_order_and_rounding_noise_leave_it_alone():
    reworded = replace(CLEARANCE, title="Air gap", explanation="Other words.", method="d >= d_min",
                       values=(Measure("as declared", Q_(0.25, "cm")),), limit=Measure("Table F.2", Q_(3.0000001, "mm")), sources=())
    assert findings_digest([PASSING, replace(TIMER, values=(Measure("declared", "not declared"),)), reworded]) == BASE


def test_only_findings_that_need_a_decision_count():
    info = Finding(code="STRESS-BUS", calc="stress", subject="DC bus", title="Bus", verdict=Verdict.INFO, values=(Measure("bus", Q_(358, "V")),))
    assert findings_digest([CLEARANCE, TIMER, replace(PASSING, values=(Measure("peak", Q_(0.2, "T")),)), info]) == BASE
    assert findings_digest([CLEARANCE, TIMER, replace(PASSING, verdict=Verdict.MARGINAL)]) != BASE


def test_a_verdict_a_figure_or_a_new_finding_moves_it():
    changed = [
        [replace(CLEARANCE, verdict=Verdict.MARGINAL), TIMER],
        [replace(CLEARANCE, values=(Measure("declared", Q_(2.6, "mm")),)), TIMER],
        [replace(CLEARANCE, limit=Measure("required", Q_(3.2, "mm"))), TIMER],
        [replace(CLEARANCE, relation="<="), TIMER],
        [replace(CLEARANCE, subject="primary to chassis"), TIMER],
        [CLEARANCE, replace(TIMER, values=(Measure("declared", Q_(10, "h")),))],
        [CLEARANCE, replace(TIMER, verdict=Verdict.NOT_ASSESSED)],
        [CLEARANCE],
        [CLEARANCE, TIMER, replace(TIMER, subject="second battery")],
    ]
    digests = [findings_digest(findings) for findings in changed]
    assert BASE not in digests and len(set(digests)) == len(digests)


def test_a_check_not_made_that_comes_to_guard_a_hazard_moves_it():
    unmade = replace(TIMER, verdict=Verdict.NOT_ASSESSED)
    assert findings_digest([unmade]) != findings_digest([replace(unmade, guards_hazard=True)])


def test_it_has_the_form_the_sign_off_file_takes():
    assert BASE.startswith("sha256:") and len(BASE) == len("sha256:") + 64
    assert findings_digest([]) == findings_digest([PASSING])
