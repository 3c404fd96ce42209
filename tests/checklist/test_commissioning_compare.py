"""Measured values against their expected ranges, the outcome as a whole, and the status shown."""

from __future__ import annotations

import datetime

import pytest
from tests.fixtures.checklists import checklist_of, commissioning_of, demo, with_record

from dossier.checklist.commissioning import Result
from dossier.checklist.items import Item, Origin, Phase, at_least, at_most, within
from dossier.checklist.outcome import Judgement, judge_item, outcomes, summarise
from dossier.checklist.overview import commissioning_state
from dossier.checklist.page import checklist_markdown
from dossier.checklist.status import effective_status
from dossier.units import Q_

INSULATION = Item("ir", Phase.UNPOWERED, Origin.GENERAL, "insulation", "test it", unit="megaohm", expected=at_least(Q_(1, "megaohm")))
EARTH = Item("pe", Phase.UNPOWERED, Origin.GENERAL, "earth", "measure it", unit="ohm", expected=at_most(Q_(0.1, "ohm")))
SETTING = Item("v", Phase.SETTINGS, Origin.BUILD, "volts", "measure it", unit="V", expected=within(Q_(14.4, "V"), 0.02))
READING = Item("room", Phase.SOAK, Origin.BUILD, "room", "measure it", unit="degC")
TICK = Item("look", Phase.UNPOWERED, Origin.GENERAL, "look", "look at it")
DONE = Result()


@pytest.mark.parametrize("entry, value, expected", [
    (INSULATION, Q_(1.5, "megaohm"), Judgement.IN_RANGE),
    (INSULATION, Q_(1, "megaohm"), Judgement.IN_RANGE),  # the limit itself meets "at least"
    (INSULATION, Q_(999, "kiloohm"), Judgement.OUT_OF_RANGE),  # units are converted before comparing
    (INSULATION, Q_(1500, "kiloohm"), Judgement.IN_RANGE),
    (EARTH, Q_(0.1, "ohm"), Judgement.IN_RANGE),
    (EARTH, Q_(120, "milliohm"), Judgement.OUT_OF_RANGE),
    (SETTING, Q_(14.1, "V"), Judgement.OUT_OF_RANGE),  # below 14.112 V
    (SETTING, Q_(14.5, "V"), Judgement.IN_RANGE),
    (SETTING, Q_(14.7, "V"), Judgement.OUT_OF_RANGE),  # above 14.688 V
    (READING, Q_(21, "degC"), Judgement.NO_RANGE),
    (SETTING, None, Judgement.MISSING),
])
def test_measured_against_expected(entry, value, expected):
    assert judge_item(entry, DONE, value) is expected


def test_items_not_recorded_not_done_or_only_ticked():
    assert judge_item(SETTING, None, None) is Judgement.MISSING
    assert judge_item(SETTING, Result(done=False, note="no load to hand"), None) is Judgement.SKIPPED
    assert judge_item(TICK, DONE, None) is Judgement.DONE
    assert judge_item(TICK, Result(done=False), None) is Judgement.SKIPPED
    assert Judgement.DONE.passed and Judgement.NO_RANGE.passed
    assert not Judgement.MISSING.passed and not Judgement.OUT_OF_RANGE.passed


def test_the_charger_rev_d_commissioning_passes_in_full():
    # rev C's commissioning (2026-06-23) predates the protective-conductor current item and rev C now has a failing
    # finding; rev D (the same hardware, its safeguards declared) was commissioned in full on 2026-07-18.
    checklist = checklist_of("solar-bank-charger", "D")
    results = outcomes(checklist, commissioning_of("solar-bank-charger", "D"))
    assert len(results) == len(checklist.items)
    assert all(result.judgement.passed for result in results), [r.item.key for r in results if not r.judgement.passed]
    assert summarise(checklist, results).passed


def test_the_bench_supply_has_one_value_out_of_range():
    checklist = checklist_of("bench-psu-13v8", "A")
    summary = summarise(checklist, outcomes(checklist, commissioning_of("bench-psu-13v8", "A")))
    assert [o.item.key for o in summary.out_of_range] == ["soak-hs1"]
    assert summary.out_of_range[0].value == Q_(33.5, "K")
    # the protective-conductor current item came after this power-up: not recorded
    assert [o.item.key for o in summary.incomplete] == ["pe-current"] and not summary.passed


def test_a_passed_commissioning_advances_an_early_status_and_keeps_a_later_one():
    checklist = checklist_of("solar-bank-charger", "D")
    summary = summarise(checklist, outcomes(checklist, commissioning_of("solar-bank-charger", "D")))
    day = datetime.date(2026, 7, 18)
    bench = effective_status("on-bench", summary, day)
    assert (bench.code, bench.advanced, bench.title) == ("commissioned", True, "Commissioned 2026-07-18")
    assert effective_status("design", summary, day).code == "commissioned"
    boxed = effective_status("in-enclosure", summary, day)
    assert (boxed.code, boxed.advanced, boxed.title) == ("in-enclosure", False, "In its enclosure, commissioned 2026-07-18")
    assert effective_status("on-bench").title == "On the bench"


def test_a_commissioning_that_did_not_pass_leaves_the_status_alone():
    checklist = checklist_of("bench-psu-13v8", "A")
    summary = summarise(checklist, outcomes(checklist, commissioning_of("bench-psu-13v8", "A")))
    shown = effective_status("on-bench", summary, datetime.date(2025, 11, 20))
    assert (shown.code, shown.title) == ("on-bench", "On the bench")


def test_the_overview_says_who_powered_it_up_and_when():
    loaded, _ = demo("solar-bank-charger", "D")
    state = commissioning_state(loaded, checklist_of("solar-bank-charger", "D"), commissioning_of("solar-bank-charger", "D"))
    assert state.overview_markdown() == (
        "Powered up on **2026-07-18** by **Ilse Varga-Mbeki**, witnessed by **Rhodri Castellanos**. "
        "Every checklist item was done and in range. Status shown: **In its enclosure, commissioned 2026-07-18**.")
    loaded, _ = demo("bench-psu-13v8", "A")
    state = commissioning_state(loaded, checklist_of("bench-psu-13v8", "A"), commissioning_of("bench-psu-13v8", "A"))
    # the bench supply's rev A also has failing findings now (its fuse and transformer): both are said
    assert "1 value out of range" in state.overview_markdown() and "failing findings block the revision" in state.overview_markdown()
    assert commissioning_state(demo("rotator-control", "A")[0], checklist_of("rotator-control", "A")).overview_markdown() == ""


def test_the_page_shows_the_checklist_as_filled_in_and_flags_the_value_out_of_range():
    loaded, _ = demo("bench-psu-13v8", "A")
    text = checklist_markdown(loaded, checklist_of("bench-psu-13v8", "A"), commissioning_of("bench-psu-13v8", "A"))
    assert "Powered up on **2025-11-20** by **Desmond Achterberg**, witnessed by **Priya Vanterpool**" in text
    assert "Commissioning not passed" in text
    assert "<strong>soak-hs1</strong>: Temperature rise of heatsink HS1, measured 33.5 K, expected at most 30 K" in text
    assert "| at most 30 K | 33.5 K | **OUT OF RANGE** |" in text
    assert "Temperature rise of heatsink HS1" in text and "### ☒ " in text
    assert "| 13.7 V to 13.9 V | 13.82 V | in range |" in text
    assert "### ☑ 1. Visual inspection" in text


def test_a_status_advanced_on_the_page_names_the_records_own():
    loaded, _ = demo("solar-bank-charger", "D")
    changed = with_record(loaded, status="on-bench")  # the status is not read by any calc: the same checklist applies
    text = checklist_markdown(changed, checklist_of("solar-bank-charger", "D"), commissioning_of("solar-bank-charger", "D"))
    assert "Status shown: **Commissioned 2026-07-18** (the record says on-bench; a passed commissioning advances it)." in text
    assert "Commissioning passed" in text
