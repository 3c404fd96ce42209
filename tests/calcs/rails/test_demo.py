"""The demo's valve amplifier supply: rev A fails for the hazards of its HT rail, rev B fixes them."""

from __future__ import annotations

from pathlib import Path

import pytest

from dossier.calcs import rails
from dossier.checklist.sheet import build_checklist
from dossier.findings import Verdict
from dossier.plugins import load_calcs
from dossier.reading.record import load_record
from dossier.review import run_review

BUILD = Path(__file__).resolve().parents[3] / "demo" / "archive" / "valve-amp-supply"


def reviewed(letter: str):
    record = load_record(BUILD / f"rev-{letter}.yaml").record
    return record, run_review(record, load_calcs())


def test_rev_a_fails_for_no_bleeder_and_an_unbalanced_series_reservoir():
    _, review = reviewed("A")
    blocking = sorted((f.code, f.subject) for f in review.findings if f.blocks_power_up)
    assert blocking == [("RAILS-DISCHARGE", "B+"), ("STRESS-CAPACITOR", "C1")]


def test_rev_b_blocks_nothing_and_discharges_in_about_four_seconds():
    _, review = reviewed("B")
    assert [f for f in review.findings if f.blocks_power_up] == []
    discharge = next(f for f in review.findings if f.code == "RAILS-DISCHARGE")
    # 47 kohm x 45.5 uF x ln(388 x 1.1 / 60) = 4.20 s, the worked figure in the record's notes
    assert discharge.verdict is Verdict.PASS and discharge.value.quantity.to("s").magnitude == pytest.approx(4.196, abs=0.01)


@pytest.mark.parametrize("letter", ["A", "B"])
def test_the_hazardous_rail_is_named_in_the_caution_and_the_checklist(letter):
    record, review = reviewed(letter)
    assert [h.name for h in review.product("rails", rails.HAZARDS)] == ["B+"]
    checklist = build_checklist(record, review)
    assert "B+ (up to 427 V DC)" in checklist.caution
    keys = {item.key for item in checklist.items}
    assert {"staged-power-up", "rail-b", "rail-heater", "rail-bias", "discharge-b", "winding-t1-cold", "soak-t1"} <= keys
    assert "thermocouple" not in checklist.item("soak-t1").steps.replace("No thermocouple", "")
