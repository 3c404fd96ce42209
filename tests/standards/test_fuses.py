"""The fuse tables and formulas in dossier.standards.fuses, against their published sources."""

from __future__ import annotations

import math

import pytest

from dossier.standards import fuses
from dossier.units import Q_, parse_quantity


def _integral_of_square(current, end: float, steps: int = 200_000) -> float:
    """Midpoint-rule integral of i(t)^2 from 0 to end, an independent check of the closed forms."""
    width = end / steps
    return sum(current((k + 0.5) * width) ** 2 for k in range(steps)) * width


def test_preferred_series_matches_iec_60127_annex_a():
    # IEC 60127-1 (ed. 2.0, 2006), Miniature fuses - Part 1, Annex A: preferred rated currents 315 mA ... 10 A.
    annex_a = [0.315, 0.4, 0.5, 0.63, 0.8, 1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8, 10]
    series = [q.to("A").magnitude for q in fuses.preferred_ratings()]
    assert [value for value in series if value >= 0.315] == pytest.approx(annex_a)
    assert series == sorted(series)


def test_ratings_below_315_ma_are_the_r10_steps_of_iec_60127_1_annex_a():
    # IEC 60127-1 (ed. 2.0, 2006), Annex A, preferred rated currents below 315 mA: 32, 40, 50, 63, 80, 100, 125, 160,
    # 200, 250 mA (from memory), the R10 preferred-number steps of ISO 3 (1.00, 1.25, 1.60, 2.00, 2.50, 3.15, 4.00,
    # 5.00, 6.30, 8.00) moved by decades; each step is about 10^(1/10) = 1.259 times the one before.
    below = [0.032, 0.04, 0.05, 0.063, 0.08, 0.1, 0.125, 0.16, 0.2, 0.25]
    series = [q.to("A").magnitude for q in fuses.preferred_ratings()]
    assert [value for value in series if value < 0.315] == pytest.approx(below)
    steps = [b / a for a, b in zip(series, series[1:])]
    assert all(step == pytest.approx(10 ** 0.1, rel=0.03) for step in steps)


def test_melting_curve_read_on_log_log_axes():
    # Two points of a maker's I^2 t-t curve, (1 ms, 1 A^2 s) and (100 ms, 4 A^2 s): a straight line on log-log axes
    # passes (10 ms, 2 A^2 s), the geometric middle; outside the points the nearest end is held.
    points = [(Q_(100, "ms"), Q_(4, "A**2*s")), (Q_(1, "ms"), Q_(1, "A**2*s"))]
    assert fuses.melting_i2t_at(points, Q_(10, "ms")).to("A**2*s").magnitude == pytest.approx(2.0)
    assert fuses.melting_i2t_at(points, Q_(0.1, "ms")).to("A**2*s").magnitude == pytest.approx(1.0)
    assert fuses.melting_i2t_at(points, Q_(1, "s")).to("A**2*s").magnitude == pytest.approx(4.0)


def test_single_figure_share_for_short_pulses():
    # A single melting I^2 t is measured at about 10 x I_n (tens of ms for a time-lag fuse); halved below 10 ms (from memory).
    assert fuses.single_figure_share(Q_(1, "ms")) == pytest.approx(0.5)
    assert fuses.single_figure_share(Q_(20, "ms")) == pytest.approx(1.0)


@pytest.mark.parametrize("needed, expected", [
    ("0.3 A", 0.315),   # IEC 60127-1 Annex A: the step above 300 mA is 315 mA
    ("1.22 A", 1.25),
    ("1.25 A", 1.25),   # a value on the series is its own recommendation
    ("3.2 A", 4.0),     # 3.15 A is the series value, not 3.2 A
    ("6 A", 6.3),
])
def test_next_preferred_rating(needed, expected):
    assert fuses.next_preferred(parse_quantity(needed, "[current]")).to("A").magnitude == pytest.approx(expected)


def test_next_preferred_beyond_the_series_is_none():
    # IEC 60127-1 Annex A ends at 10 A.
    assert fuses.next_preferred(Q_(10.5, "A")) is None


def test_running_rule_at_25_degc():
    # Littelfuse, Fuseology Selection Guide: operate at no more than 75 % of the rating at 25 degC,
    # so 0.75 A of running current needs at least a 1 A fuse.
    assert fuses.minimum_rating(Q_(0.75, "A"), Q_(25, "degC")).to("A").magnitude == pytest.approx(1.0)


def test_ambient_rerating_line():
    # Linear re-rating, 0.5 % per kelvin above 25 degC: from memory (common practice), not a published figure.
    assert fuses.ambient_factor(Q_(25, "degC")) == pytest.approx(1.0)
    assert fuses.ambient_factor(Q_(0, "degC")) == pytest.approx(1.0)
    assert fuses.ambient_factor(Q_(45, "degC")) == pytest.approx(0.9)
    assert fuses.ambient_factor(Q_(318.15, "K")) == pytest.approx(0.9)
    assert fuses.minimum_rating(Q_(0.9, "A"), Q_(45, "degC")).to("A").magnitude == pytest.approx(0.9 / 0.675)


def test_pulse_cycle_withstand_chart():
    # Littelfuse, Fuseology Selection Guide, pulse-cycle withstand chart:
    # 48 % / 38 % / 29 % / 22 % of melting I^2 t for 100 / 1 000 / 10 000 / 100 000 pulses.
    for pulses, share in [(100, 0.48), (1_000, 0.38), (10_000, 0.29), (100_000, 0.22)]:
        assert fuses.pulse_fraction(pulses) == pytest.approx(share)


def test_pulse_cycle_between_and_beyond_chart_points():
    # Log-linear between the chart's points (our interpolation); the chart's end figures are held beyond it.
    assert fuses.pulse_fraction(int(10 ** 3.5)) == pytest.approx((0.38 + 0.29) / 2, abs=1e-3)
    assert fuses.pulse_fraction(10) == pytest.approx(0.48)
    assert fuses.pulse_fraction(1_000_000) == pytest.approx(0.22)
    assert not fuses.pulses_in_chart(1_000_000)


def test_exponential_pulse_i2t_formula():
    # Littelfuse, Fuseology Selection Guide, waveshape chart: exponential decay i_p e^(-t/tau) has I^2 t = i_p^2 tau / 2.
    peak, tau = 33.0, 2.5e-3
    numeric = _integral_of_square(lambda t: peak * math.exp(-t / tau), 20 * tau)
    closed = fuses.exponential_i2t(Q_(peak, "A"), Q_(tau, "s")).to("A**2*s").magnitude
    assert closed == pytest.approx(numeric, rel=1e-4)
    assert closed == pytest.approx(peak**2 * tau / 2)


@pytest.mark.parametrize("shape, current, divisor", [
    # Littelfuse, Fuseology Selection Guide, waveshape chart: rectangular i_p^2 t, triangular i_p^2 t / 3, half-sine i_p^2 t / 2.
    ("rectangular", lambda ip, t, d: ip, 1),
    ("triangular", lambda ip, t, d: ip * (1 - t / d), 3),
    ("half_sine", lambda ip, t, d: ip * math.sin(math.pi * t / d), 2),
])
def test_waveshape_i2t_formulas(shape, current, divisor):
    peak, duration = 10.0, 1e-3
    formula = getattr(fuses, f"{shape}_i2t")
    closed = formula(Q_(peak, "A"), Q_(duration, "s")).to("A**2*s").magnitude
    assert closed == pytest.approx(peak**2 * duration / divisor)
    assert closed == pytest.approx(_integral_of_square(lambda t: current(peak, t, duration), duration), rel=1e-4)


@pytest.mark.parametrize("rating, speed, text", [
    ("2 A", "time-lag", "T2A"),
    ("500 mA", "fast-acting", "F500mA"),
    ("3.15 A", "time-lag", "T3.15A"),
])
def test_marking(rating, speed, text):
    # Marking letters T (time-lag) and F (fast-acting): IEC 60127-1, marking of fuse-links.
    assert fuses.marking(parse_quantity(rating, "[current]"), speed) == text
