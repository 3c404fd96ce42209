"""Thermal: junctions and heatsinks in the air they sit in, the enclosure's unless the sink stands outside."""

from __future__ import annotations

import pytest

from dossier.calcs import protection, thermal
from dossier.calcs.shared.enclosure_air import internal_ambient
from dossier.findings import Verdict
from tests.calcs.thermal.test_calc import by, degc, device, sink, unit

# Q1: loss 10 W given, R_jc 1.0 K/W, greased bare mount 0.5 K/W assumed, on a 2.0 K/W sink.
Q1 = device("Q1", loss="10 W", heatsink="HS1")


def test_a_sink_inside_is_worked_out_in_the_enclosure_air_taken_as_room_plus_20_k():
    # Room 40 degC, no internal_ambient: the enclosure's air is 40 + 20 = 60 degC (common practice, from memory).
    # T_sink = 60 + 10 x 2.0 = 80 degC; T_j = 80 + 10 x (1.0 + 0.5) = 95 degC (T_j = T_a + P sum R, Mohan et al.).
    findings = thermal.run(unit([Q1], [sink("HS1", "2.0 K/W")], ambient="40 degC", inside=None))
    junction, heatsink = by(findings, "THERM-JUNCTION", "Q1"), by(findings, "THERM-HEATSINK", "HS1")
    assert degc(heatsink.value.quantity) == pytest.approx(80)
    assert degc(junction.value.quantity) == pytest.approx(95)
    for finding in (junction, heatsink):
        assert "enclosure's air at 60" in finding.explanation and "protection.internal_ambient" in finding.explanation
        assert ("protection", "internal_ambient") in finding.keys
        assert any("20 K above the room" in source.title for source in finding.sources)


def test_a_declared_internal_ambient_is_used_as_it_stands():
    findings = thermal.run(unit([Q1], [sink("HS1", "2.0 K/W")], ambient="40 degC", inside="52 degC"))
    assert degc(by(findings, "THERM-HEATSINK", "HS1").value.quantity) == pytest.approx(52 + 20)
    assert "taken as" not in by(findings, "THERM-HEATSINK", "HS1").explanation


def test_a_touchable_sink_declared_outside_stays_in_room_air():
    # Outside in the room's 40 degC: 40 + 10 x 2.0 = 60 degC, at the 60 degC touch limit (IEC 62368-1 Table 38, from memory).
    outside = {**sink("HS1", "2.0 K/W", touchable=True), "outside": True}
    findings = thermal.run(unit([Q1], [outside], ambient="40 degC", inside=None))
    heatsink = by(findings, "THERM-HEATSINK", "HS1")
    assert degc(heatsink.value.quantity) == pytest.approx(60) and heatsink.verdict is Verdict.PASS
    assert "room's air" in heatsink.explanation
    # The same sink not declared outside is taken inside (harsher): 80 degC, over the touch limit.
    inside = thermal.run(unit([Q1], [sink("HS1", "2.0 K/W", touchable=True)], ambient="40 degC", inside=None))
    assert by(inside, "THERM-HEATSINK", "HS1").verdict is Verdict.FAIL


def test_a_device_in_free_air_is_inside():
    # BR-style part with R_ja 20 K/W and 2 W: 60 + 40 = 100 degC in the enclosure's assumed air.
    free = device("BR1", kind="bridge", loss="2 W", rth_ja="20 K/W")
    finding = by(thermal.run(unit([free], ambient="40 degC", inside=None)), "THERM-JUNCTION", "BR1")
    assert degc(finding.value.quantity) == pytest.approx(100)


def test_thermal_and_protection_read_the_same_enclosure_air():
    # One function in dossier/calcs/shared serves both calcs; protection no longer holds its own copy.
    record = unit([Q1], [sink("HS1", "2.0 K/W")], ambient="35 degC", inside=None)
    air, assumed = internal_ambient(record)
    assert degc(air) == pytest.approx(55) and assumed
    assert not hasattr(protection.common, "internal_ambient")
