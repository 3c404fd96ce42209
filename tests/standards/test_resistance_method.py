"""The resistance method for a winding's temperature rise (IEC 60335-1, edition 5.0, clause 11.3; copper k = 234.5)."""

from __future__ import annotations

import pytest

from dossier.standards import copper
from dossier.units import Q_


def test_the_constant_is_the_standards_234_5_for_copper():
    # IEC 60335-1, edition 5.0, clause 11.3: k = 234.5 for copper, 225 for aluminium (the same constant appears in
    # the product standards' resistance method; confirmed in a public reproduction of such a clause; clause number from memory).
    assert copper.COPPER_CONSTANT == Q_(234.5, "K")


def test_the_constant_agrees_with_iec_60028s_temperature_coefficient():
    # IEC 60028: alpha_20 = 0.00393 /K, so resistance extrapolates to zero at 20 - 1 / 0.00393 = -234.5 degC.
    zero_at = 1 / copper.TEMPERATURE_COEFFICIENT_20.to("1/K").magnitude - 20
    assert zero_at == pytest.approx(copper.COPPER_CONSTANT.magnitude, abs=0.1)


def test_worked_example_by_hand():
    # Worked by hand from the clause 11.3 formula: R1 = 10.00 ohm at t1 = 20 degC, R2 = 12.50 ohm, t2 = 25 degC.
    # dT = (12.5 - 10) / 10 x (234.5 + 20) - (25 - 20) = 0.25 x 254.5 - 5 = 63.625 - 5 = 58.625 K.
    rise = copper.winding_rise(Q_(10.0, "ohm"), Q_(12.5, "ohm"), Q_(20, "degC"), Q_(25, "degC"))
    assert rise.to("K").magnitude == pytest.approx(58.625)
    # The winding itself: 12.5 / 10 x 254.5 - 234.5 = 318.125 - 234.5 = 83.625 degC = t2 + dT.
    hot = copper.winding_temperature(Q_(10.0, "ohm"), Q_(12.5, "ohm"), Q_(20, "degC"))
    assert hot.to("degC").magnitude == pytest.approx(83.625)


def test_a_second_hand_worked_example_with_the_room_cooling():
    # By hand: R1 = 4.20 ohm at 22 degC, R2 = 5.04 ohm, the room at 21 degC at the end.
    # dT = 0.84 / 4.2 x 256.5 - (21 - 22) = 0.2 x 256.5 + 1 = 51.3 + 1 = 52.3 K.
    rise = copper.winding_rise(Q_(4.2, "ohm"), Q_(5.04, "ohm"), Q_(22, "degC"), Q_(21, "degC"))
    assert rise.to("K").magnitude == pytest.approx(52.3)


def test_no_change_in_resistance_and_room_is_no_rise():
    assert copper.winding_rise(Q_(3, "ohm"), Q_(3, "ohm"), Q_(20, "degC"), Q_(20, "degC")).magnitude == pytest.approx(0)


def test_resistance_at_a_rise_inverts_the_formula():
    # From the hand example above: a rise of 58.625 K with the room going from 20 to 25 degC is R2 = 12.5 ohm.
    found = copper.resistance_at_rise(Q_(10, "ohm"), Q_(20, "degC"), Q_(58.625, "K"), Q_(25, "degC"))
    assert found.to("ohm").magnitude == pytest.approx(12.5)


def test_agrees_with_iec_60028_linear_resistance():
    # A copper conductor warmed from 20 to 80 degC by IEC 60028's linear law reads back as a 60 K rise.
    cold = copper.resistance(Q_(100, "m"), Q_(0.5, "mm**2"), Q_(20, "degC"))
    hot = copper.resistance(Q_(100, "m"), Q_(0.5, "mm**2"), Q_(80, "degC"))
    rise = copper.winding_rise(cold, hot, Q_(20, "degC"), Q_(20, "degC"))
    assert rise.to("K").magnitude == pytest.approx(60, abs=0.05)
