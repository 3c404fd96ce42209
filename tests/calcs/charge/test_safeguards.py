"""A charger's safeguards: the absorption timer, the high-temperature cut-off and where its sensor sits."""

from __future__ import annotations

import pytest
from tests.fixtures.chargers import charger, findings_by_code
from tests.fixtures.demo import load_demo

from dossier.calcs.charge import run
from dossier.findings import Verdict
from dossier.units import Q_

SAFE = {"absorption_timer": "8 h", "high_temperature_cutoff": "45 degC", "temperature_sensor": "battery"}


def safeguards(**battery):
    found = findings_by_code(charger(**battery))
    return found["CHG-TIMER"], found["CHG-HOT-CUTOFF"]


def test_no_absorption_timer_is_marginal_and_says_why():
    # A failed cell keeps the current from tapering, so the charger stays in absorption (makers' charging
    # guides, e.g. the NP valve-regulated battery manual on cyclic charging; from memory).
    timer, _ = safeguards()
    assert timer.verdict is Verdict.MARGINAL
    assert "failed cell" in timer.explanation and "absorption_timer" in timer.explanation
    assert ("output", "battery", "absorption_timer") in timer.keys


def test_a_declared_timer_passes():
    timer, _ = safeguards(**SAFE)
    assert timer.verdict is Verdict.PASS and timer.value.quantity == Q_(8, "h")


@pytest.mark.parametrize("changes, found", [
    ({}, ("no high-temperature cut-off", "taken as not on the battery")),
    ({**SAFE, "temperature_sensor": "charger"}, ("reads the charger's air",)),
    ({**SAFE, "temperature_sensor": "none"}, ("no temperature sensor",)),
    ({**SAFE, "high_temperature_cutoff": "55 degC"}, ("above the top of the charging range",)),
])
def test_a_valve_regulated_battery_without_a_cutoff_read_on_the_battery_fails(changes, found):
    # AGM is valve-regulated: charged hot it runs away thermally (BU-403 'Charging Lead Acid', Battery University,
    # and the makers' VRLA manuals; the runaway mechanism from memory). The charging range ends at 50 degC
    # (BU-410, lead-acid -20 to 50 degC, from memory).
    _, cutoff = safeguards(**changes)
    assert cutoff.verdict is Verdict.FAIL and cutoff.guards_hazard
    assert "thermal runaway" in cutoff.explanation
    for words in found:
        assert words in cutoff.explanation


def test_a_cutoff_read_on_the_battery_inside_the_range_passes():
    _, cutoff = safeguards(**SAFE)
    assert cutoff.verdict is Verdict.PASS
    assert cutoff.limit.quantity.to("degC").magnitude == pytest.approx(50)


def test_a_flooded_battery_without_a_cutoff_is_marginal_not_failed():
    _, cutoff = safeguards(chemistry="flooded", absorption_voltage="29.4 V", float_voltage="26.8 V")
    assert cutoff.verdict is Verdict.MARGINAL and not cutoff.guards_hazard


def test_demo_rev_c_shows_the_missing_safeguards_and_rev_d_declares_them():
    rev_c = {f.code: f for f in run(load_demo("solar-bank-charger", "C"))}
    assert rev_c["CHG-TIMER"].verdict is Verdict.MARGINAL
    assert rev_c["CHG-HOT-CUTOFF"].verdict is Verdict.FAIL
    rev_d = {f.code: f for f in run(load_demo("solar-bank-charger", "D"))}
    assert rev_d["CHG-TIMER"].verdict is Verdict.PASS
    assert rev_d["CHG-HOT-CUTOFF"].verdict is Verdict.PASS
