"""winding_voltages: peak volts across each winding at low, nominal and high line."""

from __future__ import annotations

import math

import pytest
from tests.fixtures.demo import load_demo

from dossier.calcs.magnetics.voltages import drive_of, winding_voltages
from dossier.calcs.shared.mains_lines import line_peaks


def magnetic(record, ref):
    return next(m for m in record.magnetics if m.ref == ref)


def volts(quantity):
    return quantity.to("V").magnitude


def test_half_bridge_primary_sees_half_the_rectified_peak():
    # A half-bridge primary sees plus and minus half the bus; the bus is the rectified mains peak (textbook).
    record = load_demo("sw-charger-12v", "A")
    found = winding_voltages(record, magnetic(record, "T1"))
    for line, factor in (("low", 0.9), ("nominal", 1.0), ("high", 1.1)):
        assert volts(found["primary"][line]) == pytest.approx(230 * factor * math.sqrt(2) / 2)


def test_centre_tapped_secondary_and_each_half():
    # the same volts per turn in every winding (Faraday's law): 18 of 60 turns, and 9 for each half
    record = load_demo("sw-charger-12v", "A")
    found = winding_voltages(record, magnetic(record, "T1"))
    primary = volts(found["primary"]["high"])
    assert volts(found["secondary"]["high"]) == pytest.approx(primary * 18 / 60)
    assert volts(found["secondary/half"]["high"]) == pytest.approx(primary * 9 / 60)
    assert set(found) == {"primary", "secondary", "secondary/half"}
    assert set(found["secondary"]) == {"low", "nominal", "high"}


def test_declared_excitation_follows_the_mains_when_its_supply_is_not_given():
    # a declared 1.2 V across the 4-turn base winding, no excitation.supply: taken as following the 230 V +-10 % mains
    # (harsher reading), 1.08 / 1.2 / 1.32 V; 0.33 V per turn at high line across the 1-turn feedback winding
    record = load_demo("sw-charger-12v", "C")
    found = winding_voltages(record, magnetic(record, "T2"))
    assert [volts(found["upper base"][line]) for line in ("low", "nominal", "high")] == pytest.approx([1.08, 1.2, 1.32])
    assert volts(found["current feedback"]["high"]) == pytest.approx(0.33)


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
    record = load_demo("sw-charger-12v", "A")
    choke = magnetic(record, "L1").model_copy(update={"excitation": None})
    assert winding_voltages(record, choke) == {}


def test_bus_is_the_rectified_peak():
    # 230 V x sqrt 2 = 325.27 V (peak of a sine)
    record = load_demo("sw-charger-12v", "A")
    assert volts(line_peaks(record.mains)["nominal"]) == pytest.approx(325.27, abs=0.01)
