"""winding_voltages: peak volts across each winding at low, nominal and high line."""

from __future__ import annotations

import math

import pytest
from tests.fixtures.demo import load_demo, load_test_record

from dossier.calcs.shared.winding_voltages import drive_of, winding_voltages
from dossier.calcs.shared.mains_lines import line_peaks


def magnetic(record, ref):
    return next(m for m in record.magnetics if m.ref == ref)


def volts(quantity):
    return quantity.to("V").magnitude


def test_half_bridge_primary_sees_half_the_rectified_peak():
    # A half-bridge primary sees plus and minus half the bus; the bus is the rectified mains peak (textbook).
    record = load_demo("solar-bank-charger", "A")
    found = winding_voltages(record, magnetic(record, "T1"))
    for line, factor in (("low", 0.9), ("nominal", 1.0), ("high", 1.1)):
        assert volts(found["primary"][line]) == pytest.approx(230 * factor * math.sqrt(2) / 2)


def test_bridge_secondary_has_no_halves():
    # the same volts per turn in every winding (Faraday's law): 4 of rev A's 14 turns
    record = load_demo("solar-bank-charger", "A")
    found = winding_voltages(record, magnetic(record, "T1"))
    assert volts(found["secondary"]["high"]) == pytest.approx(volts(found["primary"]["high"]) * 4 / 14)
    assert set(found) == {"primary", "secondary"}


def test_centre_tapped_secondary_and_each_half():
    # the same volts per turn in every winding (Faraday's law): 14 of 72 turns, and 7 for each half
    record = load_test_record("selfosc-psu")
    found = winding_voltages(record, magnetic(record, "T1"))
    primary = volts(found["primary"]["high"])
    assert volts(found["secondary"]["high"]) == pytest.approx(primary * 14 / 72)
    assert volts(found["secondary/half"]["high"]) == pytest.approx(primary * 7 / 72)
    assert set(found) == {"primary", "secondary", "secondary/half"}
    assert set(found["secondary"]) == {"low", "nominal", "high"}


def test_declared_excitation_follows_the_mains_unless_fixed():
    # a declared 1.5 V across the 5-turn base winding: 0.3 V per turn, so 0.45 V across the 1.5-turn feedback winding
    # at nominal line; taken as following the mains (harsher reading), so -10 % / +10 % at low and high line
    record = load_test_record("selfosc-psu")
    found = winding_voltages(record, magnetic(record, "T2"))
    assert [volts(v) for v in found["upper base"].values()] == pytest.approx([1.35, 1.5, 1.65])
    assert volts(found["current feedback"]["nominal"]) == pytest.approx(0.45)
    assert volts(found["current feedback"]["high"]) == pytest.approx(0.495)
    # the demo's gate-drive transformer: 12 V declared across its primary, 1 : 1 to each gate winding
    record = load_demo("solar-bank-charger", "C")
    t2 = magnetic(record, "T2")
    found = winding_voltages(record, t2)
    assert [volts(v) for v in found["upper gate"].values()] == pytest.approx([10.8, 12, 13.2])
    # supply: fixed keeps the one declared figure at every line
    fixed = t2.model_copy(update={"excitation": t2.excitation.model_copy(update={"supply": "fixed"})})
    found = winding_voltages(record, fixed)
    assert [volts(v) for v in found["upper gate"].values()] == pytest.approx([12, 12, 12])


def test_mains_transformer_sees_the_mains_sine():
    # peak of a sine = sqrt 2 x RMS; low line 120 V - 10 % = 108 V, scaled by 75 / 470 turns
    record = load_demo("bench-psu-13v8", "A")
    t1 = magnetic(record, "T1")
    found = winding_voltages(record, t1)
    assert volts(found["primary"]["nominal"]) == pytest.approx(120 * math.sqrt(2))
    assert volts(found["secondary"]["low"]) == pytest.approx(108 * math.sqrt(2) * 75 / 470)
    drive = drive_of(record, t1)
    assert drive.waveform == "sine" and drive.frequency.to("Hz").magnitude == 60


def test_a_choke_with_no_circuit_has_no_winding_voltages():
    record = load_demo("solar-bank-charger", "A")
    choke = magnetic(record, "L1").model_copy(update={"excitation": None})
    assert winding_voltages(record, choke) == {}


def test_bus_is_the_rectified_peak():
    # 230 V x sqrt 2 = 325.27 V (peak of a sine)
    record = load_demo("solar-bank-charger", "A")
    assert volts(line_peaks(record.mains)["nominal"]) == pytest.approx(325.27, abs=0.01)
