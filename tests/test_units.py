"""Parsing values as people write them, with the package's one registry."""

from __future__ import annotations

import pytest

from dossier.units import Q_, UnitProblem, awg_diameter, fmt, parse_quantity, parse_wire, registry


@pytest.mark.parametrize(
    "text, dimension, expected, unit",
    [
        ("0.71 mm", "[length]", 0.71, "mm"),
        ("230 V", "[electric_potential]", 230, "V"),
        ("50 kHz", "[frequency]", 50_000, "Hz"),
        ("1.6 A", "[current]", 1.6, "A"),
        ("330 uF", "[capacitance]", 330e-6, "F"),
        ("2.5 K/W", "[thermal_resistance]", 2.5, "K/W"),
        ("3.2 A^2*s", "[i2t]", 3.2, "A**2*s"),
        ("60 Ah", "[charge]", 60, "A*h"),
        ("10 %", "[dimensionless]", 0.1, ""),
        ("1e3 ohm", "[resistance]", 1000, "ohm"),
    ],
)
def test_values_parse_with_units(text, dimension, expected, unit):
    assert parse_quantity(text, dimension).to(unit).magnitude == pytest.approx(expected)


def test_temperature_is_an_offset_unit_parsed_without_ambiguity():
    assert parse_quantity("40 degC", "[temperature]").to("K").magnitude == pytest.approx(313.15)


@pytest.mark.parametrize(
    "raw, kind",
    [(230, "missing_unit"), ("230 mm", "wrong_dimension"), ("abc", "not_a_quantity"), ("1.2 bogus", "unknown_unit"), (True, "not_a_quantity"), ("nan V", "not_a_quantity")],
)
def test_bad_values_name_the_expected_dimension(raw, kind):
    with pytest.raises(UnitProblem) as raised:
        parse_quantity(raw, "[electric_potential]")
    assert raised.value.kind == kind
    assert raised.value.expected == "voltage (e.g. 230 V)"


def test_a_bare_number_is_fine_for_a_ratio():
    assert parse_quantity(0.6, "[dimensionless]").magnitude == 0.6


# ASTM B258, Standard Specification for Standard Nominal Diameters and Cross-Sectional Areas of AWG Sizes
# (ASTM International): AWG 18 is 0.0403 in = 1.024 mm, AWG 26 is 0.0159 in = 0.404 mm, AWG 10 is 0.1019 in = 2.588 mm.
@pytest.mark.parametrize("gauge, mm", [(18, 1.024), (26, 0.404), (10, 2.588)])
def test_awg_diameters_match_astm_b258(gauge, mm):
    assert awg_diameter(gauge).to("mm").magnitude == pytest.approx(mm, abs=0.002)


def test_wire_accepts_awg_or_a_diameter():
    assert parse_wire("AWG 18").to("mm").magnitude == pytest.approx(1.024, abs=0.002)
    assert parse_wire("0.8 mm").to("mm").magnitude == pytest.approx(0.8)
    with pytest.raises(UnitProblem):
        parse_wire("AWG eighteen")


def test_one_registry_for_the_package():
    assert registry() is registry()
    assert Q_(1, "mm")._REGISTRY is registry()


def test_fmt_keeps_three_significant_digits():
    assert fmt(Q_(3.14159, "mm")) == "3.14 mm"
    assert fmt(Q_(0.5, "")) == "0.5"


def test_a_temperature_below_absolute_zero_is_refused():
    with pytest.raises(UnitProblem) as raised:
        parse_quantity("-40 K", "[temperature]")
    assert (raised.value.kind, raised.value.found) == ("below_absolute_zero", "-40.0 K")
