"""Formulas for wound components, each a small pure function of pint Quantities."""

from __future__ import annotations

import math

from dossier.units import Q_

SINE_FORM = math.pi * math.sqrt(2)  # the '4.44' of the transformer equation


def flux_square(amplitude, frequency, turns, area, duty: float = 1.0):
    """Faraday's law, bipolar square wave of amplitude V: B_pk = V D / (4 f N A_e)."""
    return (amplitude * duty / (4 * frequency * turns * area)).to("T")


def flux_sine(rms, frequency, turns, area):
    """Faraday's law, sine of RMS V: B_pk = V / (4.44 f N A_e), 4.44 being pi sqrt 2."""
    return (rms / (SINE_FORM * frequency * turns * area)).to("T")


def flux_unipolar_swing(amplitude, frequency, turns, area, duty: float):
    """Faraday's law, unipolar pulses (forward converter): delta-B = V t_on / (N A_e) = V D / (f N A_e)."""
    return (amplitude * duty / (frequency * turns * area)).to("T")


def steinmetz_density(k: float, alpha: float, beta: float, frequency, flux):
    """Core loss per volume P_v = k f^alpha B^beta (f in Hz, B in T, P_v in W/m^3)."""
    f = frequency.to("Hz").magnitude
    b = flux.to("T").magnitude
    return Q_(k * f**alpha * b**beta, "W / m ** 3")


def cosine_integral(alpha: float) -> float:
    """The integral of |cos theta|^alpha over 0..2 pi, in closed form: 2 sqrt(pi) Gamma((alpha + 1) / 2) / Gamma(alpha / 2 + 1)."""
    return 2 * math.sqrt(math.pi) * math.gamma((alpha + 1) / 2) / math.gamma(alpha / 2 + 1)


def igse_coefficient(k: float, alpha: float, beta: float) -> float:
    """iGSE k_i = k / ((2 pi)^(alpha - 1) integral_0^2pi |cos theta|^alpha 2^(beta - alpha) d theta)."""
    return k / ((2 * math.pi) ** (alpha - 1) * cosine_integral(alpha) * 2 ** (beta - alpha))


def igse_density(k: float, alpha: float, beta: float, frequency, swing, segments):
    """Core loss per volume by the improved generalised Steinmetz equation for piecewise-linear flux.

    P_v = (1/T) integral k_i |dB/dt|^alpha (delta-B)^(beta - alpha) dt, which for straight segments j, each taking
    the fraction d_j of the period and changing the flux by b_j delta-B, is
    P_v = k_i f^alpha (delta-B)^beta sum_j |b_j|^alpha d_j^(1 - alpha); flat segments lose nothing.
    segments: (d_j, b_j) pairs; swing: the peak-to-peak flux density delta-B.
    """
    f, swing_t = frequency.to("Hz").magnitude, swing.to("T").magnitude
    total = sum(abs(change) ** alpha * share ** (1 - alpha) for share, change in segments if share > 0 and change)
    return Q_(igse_coefficient(k, alpha, beta) * f**alpha * swing_t**beta * total, "W / m ** 3")


def current_density(current, area):
    return (current / area).to("A / mm ** 2")


def copper_loss(current, resistance):
    return (current**2 * resistance).to("W")


def temperature_rise(power, surface):
    """Temperature rise of a wound component from its dissipation per outside surface.

    Empirical relation T_r = 450 psi^0.826 K with psi in W/cm^2, from C. Wm. T. McLyman, Transformer and
    Inductor Design Handbook (CRC Press), chapter on efficiency, regulation and temperature rise (from memory).
    """
    psi = (power / surface).to("W / cm ** 2").magnitude
    return Q_(450 * psi**0.826, "K")


def inductance(al, turns):
    """L = A_L N^2."""
    return (al * turns**2).to("uH")


def stored_energy(inductance_value, current):
    """E = L I^2 / 2."""
    return (inductance_value * current**2 / 2).to("mJ")


def field_strength(turns, current, path):
    """Peak field strength H = N I / l_e."""
    return (turns * current / path).to("kA / m")


def choke_flux(inductance_value, current, turns, area):
    """B = L I / (N A_e), from N Phi = L I."""
    return (inductance_value * current / (turns * area)).to("T")


def ripple_current(voltage, frequency, duty: float, inductance_value):
    """Peak-to-peak ripple from the volt-seconds across the choke: dI = V D / (f L)."""
    return (voltage * duty / (frequency * inductance_value)).to("A")


# Dowell's factor: below this Delta the closed form loses digits to cancellation, above it sinh overflows; the
# series and the asymptote take over there.
_DOWELL_SERIES_BELOW = 1e-2
_DOWELL_ASYMPTOTE_ABOVE = 30.0


def dowell_factor(delta: float, layers: float) -> float:
    """AC-to-DC resistance factor of a winding of m layers (Dowell, Proc. IEE 1966):
    F_R = D [(sinh 2D + sin 2D)/(cosh 2D - cos 2D) + 2 (m^2 - 1)/3 (sinh D - sin D)/(cosh D + cos D)]."""
    m2 = layers * layers
    if delta < _DOWELL_SERIES_BELOW:
        return 1 + (5 * m2 - 1) / 45 * delta**4
    if delta > _DOWELL_ASYMPTOTE_ABOVE:
        return delta * (1 + 2 * (m2 - 1) / 3)
    skin = (math.sinh(2 * delta) + math.sin(2 * delta)) / (math.cosh(2 * delta) - math.cos(2 * delta))
    proximity = (math.sinh(delta) - math.sin(delta)) / (math.cosh(delta) + math.cos(delta))
    return delta * (skin + 2 * (m2 - 1) / 3 * proximity)


ROUND_WIRE_FACTOR = (math.pi / 4) ** 0.75  # a round wire as the square of equal area, times the root of its porosity


def dowell_delta_round(diameter, pitch, depth) -> float:
    """Delta for round wire: the square of equal area (side sqrt(pi)/2 d) over the skin depth, times the root of the
    layer's porosity (that side over the pitch): (pi/4)^(3/4) (d / delta) sqrt(d / p)."""
    d, p, s = diameter.to("mm").magnitude, pitch.to("mm").magnitude, depth.to("mm").magnitude
    return ROUND_WIRE_FACTOR * (d / s) * math.sqrt(d / p)
