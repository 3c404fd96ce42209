"""The checklist page for the site and the printable HTML: caution, blocking, items, and safe record text."""

from __future__ import annotations

import re

import markdown
import pytest
from tests.fixtures.checklists import DEMO_REVISIONS, checklist_of, commissioning_of, demo, with_record

from dossier.caution import POWER_UP_CAUTION
from dossier.checklist.outcome import outcomes, summarise
from dossier.checklist.page import checklist_html, checklist_markdown
from dossier.checklist.sheet import build_checklist
from dossier.findings import Verdict
from dossier.plugins import load_calcs
from dossier.record.insulation import Barrier
from dossier.review import run_review


def page(build, revision, commissioning=None, **kwargs) -> str:
    loaded, _ = demo(build, revision)
    return checklist_markdown(loaded, checklist_of(build, revision), commissioning, **kwargs)


@pytest.mark.parametrize("build, revision", DEMO_REVISIONS)
def test_every_page_opens_with_the_caution_and_lists_every_item(build, revision):
    text = page(build, revision)
    assert text.index(POWER_UP_CAUTION) < text.index("## Before the mains is connected")
    for entry in checklist_of(build, revision).items:
        assert f"id `{entry.key}`" in text


@pytest.mark.parametrize("build, revision", DEMO_REVISIONS)
def test_a_failing_finding_blocks_the_power_up(build, revision):
    _, reviewed = demo(build, revision)
    failing = [f for f in reviewed.findings if f.verdict is Verdict.FAIL]
    checklist = checklist_of(build, revision)
    assert checklist.blocked == bool(failing)
    text, sheet = page(build, revision), checklist_html(demo(build, revision)[0], checklist)
    if failing:
        assert "Do not power up" in text and "Do not power up" in sheet
        for finding in failing:
            assert f"<strong>{finding.code}</strong> {finding.subject}:" in text
            assert f"<b>{finding.code}</b> {finding.subject}:" in sheet
        assert sheet.index("Do not power up") < sheet.index(">First power-up<")
    else:
        assert "Do not power up" not in text and "Do not power up" not in sheet


def test_the_demo_archive_has_both_a_blocked_and_a_clear_revision():
    assert checklist_of("solar-bank-charger", "A").blocked
    assert checklist_of("solar-bank-charger", "C").blocked  # no battery cut-off declared: CHG-HOT-CUTOFF fails
    assert not checklist_of("solar-bank-charger", "D").blocked


def test_a_blocked_revision_cannot_pass_commissioning_even_with_every_value_in_range():
    checklist = checklist_of("solar-bank-charger", "D")
    blocked = checklist.__class__(**{**checklist.__dict__, "blockers": checklist_of("solar-bank-charger", "A").blockers})
    summary = summarise(blocked, outcomes(blocked, commissioning_of("solar-bank-charger", "D")))
    assert not summary.out_of_range and not summary.incomplete
    assert summary.blocked and not summary.passed


def test_the_page_is_markdown_that_renders_to_tables_and_headings():
    html = markdown.markdown(page("solar-bank-charger", "C"), extensions=["tables", "attr_list", "md_in_html"])  # as the site has them
    assert html.count("<table>") == len([i for i in checklist_of("solar-bank-charger", "C").items if i.measured])
    assert "<h2>Before the mains is connected</h2>" in html
    assert "<h2>Temperature soak</h2>" in html
    assert "data-search-exclude }" not in html, "an attribute list shown as text"


def test_print_links_are_offered_when_given():
    text = page("solar-bank-charger", "C", print_links={"A4 PDF": "checklist-a4.pdf", "US Letter PDF": "checklist-letter.pdf"})
    assert "Printable sheet: [A4 PDF](checklist-a4.pdf) · [US Letter PDF](checklist-letter.pdf)" in text


def test_record_text_cannot_inject_markup():
    loaded, _ = demo("solar-bank-charger", "C")
    barrier = loaded.record.barriers[0].model_dump()
    hostile = Barrier.model_validate({**barrier, "name": "<script>alert(1)</script> *gap*"})
    changed = with_record(loaded, barriers=[hostile], title="<b>bold</b> title")
    checklist = build_checklist(changed.record, run_review(changed.record, load_calcs()))
    text = checklist_markdown(changed, checklist)
    assert "<script>" not in text and "<b>bold</b>" not in text
    assert "&lt;script&gt;" in text
    sheet = checklist_html(changed, checklist)
    assert "<script>" not in sheet and "&lt;script&gt;alert(1)&lt;/script&gt;" in sheet


def test_the_printable_sheet_has_no_site_navigation_and_sets_the_paper():
    loaded, _ = demo("bench-psu-13v8", "A")
    checklist = checklist_of("bench-psu-13v8", "A")
    a4, letter = checklist_html(loaded, checklist, "a4"), checklist_html(loaded, checklist, "letter")
    assert "@page { size: A4; }" in a4 and "@page { size: letter; }" in letter
    for sheet in (a4, letter):
        assert not re.search(r"<(nav|script|link|iframe)\b", sheet)
        assert "break-inside: avoid" in sheet
        assert sheet.count('<section class="item') == len(checklist_of("bench-psu-13v8", "A").items)
    with pytest.raises(ValueError, match="paper must be one of a4, letter"):
        checklist_html(loaded, checklist, "legal")


def test_the_blank_sheet_has_sign_off_lines_for_every_item():
    loaded, _ = demo("rotator-control", "A")
    sheet = checklist_html(loaded, checklist_of("rotator-control", "A"))
    items = len(checklist_of("rotator-control", "A").items)
    assert sheet.count("Done by <span class=\"line\"></span> date") == items
    assert sheet.count("Witness <span class=\"line\"></span> date") == items
    assert "Sign-off" in sheet
