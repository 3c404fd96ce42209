"""The demo's voltage-doubler supply: rev A brings its 300 V rail out on touchable terminals and fails for it,
rev B takes it through a shrouded connector; both are drawn with the rail hatched as a hazard beyond the mains,
the doubler and the series bank with its balancing resistors drawn, and the bleeder across the rail."""

from __future__ import annotations

import pytest
from tests.drawing.test_schematics import svg_lines
from tests.fixtures.demo import load_demo

from dossier.calcs.rails import HAZARD
from dossier.drawing import schematics
from dossier.findings import Verdict
from dossier.review import load_plugins, run_review

BUILD = "doubler-ht-supply"


@pytest.fixture(scope="module")
def reviews():
    calcs = load_plugins()
    return {rev: run_review(load_demo(BUILD, rev), calcs) for rev in ("A", "B")}


def test_rev_a_fails_only_for_the_touchable_hazardous_rail(reviews):
    failing = [(f.code, f.subject) for f in reviews["A"].findings if f.verdict in (Verdict.FAIL, Verdict.NOT_ASSESSED)]
    assert failing == [(HAZARD, "HT")]


def test_rev_b_keeps_the_hazard_named_but_passes(reviews):
    hazard = next(f for f in reviews["B"].findings if f.code == HAZARD)
    assert hazard.verdict == Verdict.INFO and hazard.values[0].quantity.to("V").magnitude == pytest.approx(357.7, abs=0.5)
    assert not [f for f in reviews["B"].findings if f.verdict in (Verdict.FAIL, Verdict.NOT_ASSESSED)]


@pytest.mark.parametrize("rev", ["A", "B"])
def test_both_revisions_draw_the_doubler_the_bank_and_the_hatched_rail(reviews, rev):
    record = load_demo(BUILD, rev)
    result = schematics.draw(record, reviews[rev].findings)
    assert result.notes == ()
    by_key = {figure.key: svg_lines(figure.svg) for figure in result.figures}
    diagram = by_key["block-diagram"]
    assert "\u2192 HT 300 V DC" in diagram
    assert "isolated from the mains but above extra-low voltage: hazardous" in diagram
    bank = by_key["stage-4-filter"]
    assert "ABOVE EXTRA-LOW VOLTAGE (not mains): HT 300 V DC" in bank
    assert {"R2", "R3", "R4", "C3", "C4"} <= {line.split("\n")[0] for line in bank}
    assert not any("no balancing" in line for line in bank)
    assert "ABOVE EXTRA-LOW VOLTAGE (not mains): HT 300 V DC" in by_key["stage-3-rectifier"]
