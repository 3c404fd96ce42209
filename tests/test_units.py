"""Parsing values as people write them, with the package's one registry."""

from __future__ import annotations

import pytest

from dossier.units import Q_, UnitProblem, awg_diameter, fmt, fmt_apart, parse_quantity, parse_wire, registry


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


# What a practitioner writes for each (common practice): SI prefixes in steps of 1000 for electrical units,
# the record's own unit where its number reads well, never exponent notation.
PRINTED = [
    (Q_(3000.0, "m"), "3000 m"),  # an altitude, not 3e+03 m
    (Q_(1000.0, "V"), "1000 V"),  # an impulse voltage, not 1e+03 V
    (Q_(0.035, "kA"), "35 A"),  # not 0.035 kA
    (Q_(5e6, "uH"), "5 H"),  # not 5e+06 µH
    (Q_(2000.0, "mm**2"), "2000 mm²"),  # not 2e+03 mm²
    (Q_(12345.0, "V"), "12300 V"),
    (Q_(250000.0, "ohm"), "250 kΩ"),
    (Q_(0.5, "kV"), "500 V"),
    (Q_(0.0005, "A"), "500 µA"),
    (Q_(4.7e-9, "F"), "4.7 nF"),
    (Q_(10000.0, "uF"), "10000 µF"),  # as the record wrote it
    (Q_(0.04, "ohm"), "0.04 Ω"),  # an earth-continuity reading stays in ohms
    (Q_(0.55, "mm"), "0.55 mm"),  # a wire stays in mm
    (Q_(0.0021, "mm"), "0.0021 mm"),
    (Q_(14.4, "V"), "14.4 V"),
    (Q_(230, "V"), "230 V"),
    (Q_(-18.0, "mV/K"), "-18 mV/K"),
    (Q_(0.0, "V"), "0 V"),
    (Q_(99.96, "mm"), "100 mm"),
    (Q_(1.23e-7, "m"), "0.000000123 m"),
]


@pytest.mark.parametrize("quantity,text", PRINTED, ids=[text for _, text in PRINTED])
def test_printed_numbers_read_as_a_practitioner_writes_them(quantity, text):
    assert fmt(quantity) == text
    assert "e+" not in fmt(quantity) and "e-" not in fmt(quantity)


APART = [
    (Q_(14.85, "V"), Q_(14.8, "V"), ("14.85 V", "14.8 V")),  # 0 degC absorption window: short by 0.05 V must show
    (Q_(2.499, "mm"), Q_(2.5, "mm"), ("2.499 mm", "2.5 mm")),
    (Q_(3.0, "mm"), Q_(3.0, "mm"), ("3 mm", "3 mm")),
    (Q_(1.5, "A"), Q_(1500.4, "mA"), ("1.5 A", "1500.4 mA")),
    (Q_(1.5, "A"), Q_(1.6, "A"), ("1.5 A", "1.6 A")),
]


@pytest.mark.parametrize("value,limit,texts", APART, ids=[texts[0] for *_, texts in APART])
def test_a_value_and_a_limit_that_differ_never_print_alike(value, limit, texts):
    assert fmt_apart(value, limit) == texts


def test_a_finding_s_comparison_shows_the_digits_its_verdict_needs():
    from dossier.findings import Finding, Measure, Verdict
    from dossier.wording import comparison_text, limit_text, measure_text

    # the 0 degC absorption window case: 14.85 V set against a window from 14.8 V
    finding = Finding(code="T", calc="t", subject="battery", title="Absorption", verdict=Verdict.PASS,
                      values=(Measure("setpoint at 0 °C", Q_(14.85, "V")),), limit=Measure("window low end", Q_(14.8, "V")), relation=">=")
    assert comparison_text(finding) == "14.85 V vs at least 14.8 V (window low end)"
    assert measure_text(finding.value, finding.limit) == "setpoint at 0 °C 14.85 V"
    assert limit_text(finding) == "at least 14.8 V (window low end)"
