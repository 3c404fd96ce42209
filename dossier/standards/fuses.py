"""Miniature fuses: the IEC 60127 rating series and the selection rules fuse makers publish.

Sources, named beside each table:
- IEC 60127-1, Annex A: preferred rated currents.
- Littelfuse, Fuseology Selection Guide: the 75 % running rule at 25 degC, the I^2 t of common pulse
  waveshapes, and the pulse-cycle withstand chart.
"""

from __future__ import annotations

import math

from dossier.units import Q_

# IEC 60127-1, Annex A, preferred rated currents in amperes. The confirmed part of the series runs from
# 315 mA to 10 A; the values below 315 mA repeat the same decade pattern (from memory).
PREFERRED_RATINGS_A = (
    0.032, 0.04, 0.05, 0.063, 0.08,
    0.1, 0.125, 0.16, 0.2, 0.25,
    0.315, 0.4, 0.5, 0.63, 0.8,
    1.0, 1.25, 1.6, 2.0, 2.5,
    3.15, 4.0, 5.0, 6.3, 8.0,
    10.0,
)

# Littelfuse, Fuseology Selection Guide: run a fuse at no more than 75 % of its rating at 25 degC.
RUNNING_FRACTION = 0.75
REFERENCE_AMBIENT_C = 25.0

# Linear approximation of a fuse maker's temperature re-rating curve (from memory, common practice):
# 100 % at 25 degC, less 0.5 % for every kelvin above it; no up-rating below 25 degC.
RERATING_PER_KELVIN = 0.005
RERATING_VALID_UP_TO_C = 100.0

# Littelfuse, Fuseology Selection Guide, pulse-cycle withstand chart: the largest share of a fuse's
# nominal melting I^2 t that one pulse may have, for a given number of pulses in the fuse's life.
PULSE_CYCLE_WITHSTAND = ((100, 0.48), (1_000, 0.38), (10_000, 0.29), (100_000, 0.22))

# High breaking capacity of IEC 60127-2 'H' fuse-links at 250 V; low-breaking glass types manage 35 A
# or ten times the rating (from memory, common practice).
HIGH_BREAKING_CAPACITY_A = 1500.0


def preferred_ratings() -> list:
    """The series as quantities, smallest first."""
    return [Q_(value, "A") for value in PREFERRED_RATINGS_A]


def next_preferred(minimum):
    """The smallest preferred rating at or above `minimum`; None beyond the top of the series."""
    needed = minimum.to("A").magnitude
    for value in PREFERRED_RATINGS_A:
        if value >= needed * (1 - 1e-9):
            return Q_(value, "A")
    return None


def ambient_factor(ambient) -> float:
    """Share of the rating usable at this air temperature (linear approximation, see RERATING_PER_KELVIN)."""
    celsius = ambient.to("degC").magnitude
    rise = max(0.0, celsius - REFERENCE_AMBIENT_C)
    return 1.0 - RERATING_PER_KELVIN * rise


def ambient_in_range(ambient) -> bool:
    return ambient.to("degC").magnitude <= RERATING_VALID_UP_TO_C


def minimum_rating(running_current, ambient):
    """Smallest rating that carries `running_current` within the 75 % rule, re-rated for ambient."""
    return (running_current / (RUNNING_FRACTION * ambient_factor(ambient))).to("A")


def rectangular_i2t(peak, duration):
    return (peak**2 * duration).to("A**2*s")


def triangular_i2t(peak, duration):
    return (peak**2 * duration / 3).to("A**2*s")


def half_sine_i2t(peak, duration):
    return (peak**2 * duration / 2).to("A**2*s")


def exponential_i2t(peak, time_constant):
    """I^2 t of i(t) = I_pk e^(-t / tau), integrated to infinity: I_pk^2 tau / 2."""
    return (peak**2 * time_constant / 2).to("A**2*s")


def pulse_fraction(pulses: int) -> float:
    """Share of melting I^2 t a pulse may use, for this many pulses; log-linear between chart points.

    Below 100 pulses the 100-pulse figure is used; above 100 000 the 100 000-pulse figure (the chart ends there).
    """
    points = PULSE_CYCLE_WITHSTAND
    if pulses <= points[0][0]:
        return points[0][1]
    for (n0, f0), (n1, f1) in zip(points, points[1:]):
        if pulses <= n1:
            share = (math.log10(pulses) - math.log10(n0)) / (math.log10(n1) - math.log10(n0))
            return f0 + share * (f1 - f0)
    return points[-1][1]


def pulses_in_chart(pulses: int) -> bool:
    return pulses <= PULSE_CYCLE_WITHSTAND[-1][0]


def marking(rating, speed: str) -> str:
    """The marking printed on a fuse-link: 'T2A', 'F500mA', 'T3.15A'."""
    letter = "T" if speed == "time-lag" else "F"
    amperes = rating.to("A").magnitude
    if amperes < 1:
        return f"{letter}{amperes * 1000:g}mA"
    return f"{letter}{amperes:g}A"


# A single nominal melting I^2 t is usually measured at about ten times the rated current (makers' data; from
# memory), where a time-lag miniature fuse takes roughly 10 ms or more to melt. A shorter pulse melts the link at
# less; without the maker's I^2 t-t curve the figure is halved for pulses shorter than that (from memory).
SINGLE_FIGURE_TIME_S = 0.010
SHORT_PULSE_SHARE = 0.5


def single_figure_share(pulse_time) -> float:
    """Share of a single nominal melting I^2 t to rely on for a pulse of this duration."""
    return SHORT_PULSE_SHARE if pulse_time.to("s").magnitude < SINGLE_FIGURE_TIME_S else 1.0


def melting_i2t_at(points, time):
    """Melting I^2 t at `time` from (time, I^2 t) points, interpolated on log-log axes.

    Outside the points the nearest end is held: below the shortest time the curve of a miniature fuse flattens
    towards its adiabatic minimum, so the shortest point is the closest published figure.
    """
    ordered = sorted(points, key=lambda point: point[0].to("s").magnitude)
    t = time.to("s").magnitude
    if t <= ordered[0][0].to("s").magnitude:
        return ordered[0][1].to("A**2*s")
    for (t0, e0), (t1, e1) in zip(ordered, ordered[1:]):
        a, b = t0.to("s").magnitude, t1.to("s").magnitude
        if t <= b:
            share = (math.log(t) - math.log(a)) / (math.log(b) - math.log(a))
            low, high = e0.to("A**2*s").magnitude, e1.to("A**2*s").magnitude
            return Q_(math.exp(math.log(low) + share * (math.log(high) - math.log(low))), "A**2*s")
    return ordered[-1][1].to("A**2*s")
