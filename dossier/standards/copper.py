"""Annealed copper as IEC 60028 defines it: resistivity at 20 degC and its temperature coefficient."""

from __future__ import annotations

import math

from dossier.units import Q_

REFERENCE_TEMPERATURE = Q_(20, "degC")
# IEC 60028: the international annealed copper standard, 1/58 ohm mm^2/m at 20 degC.
RESISTIVITY_20 = Q_(1 / 58, "ohm * mm ** 2 / m")
# IEC 60028: constant-mass temperature coefficient of resistance at 20 degC.
TEMPERATURE_COEFFICIENT_20 = Q_(0.00393, "1 / K")
MU_0 = Q_(4e-7 * math.pi, "H / m")


def resistivity(temperature=REFERENCE_TEMPERATURE):
    """rho(T) = rho_20 (1 + alpha_20 (T - 20 degC)), linear as IEC 60028 gives it."""
    rise = temperature.to("degC").magnitude - REFERENCE_TEMPERATURE.magnitude
    return RESISTIVITY_20 * (1 + TEMPERATURE_COEFFICIENT_20.to("1/K").magnitude * rise)


def resistance(length, area, temperature=REFERENCE_TEMPERATURE):
    """DC resistance of a conductor of this length and copper cross-section."""
    return (resistivity(temperature) * length / area).to("ohm")


def skin_depth(frequency, temperature=REFERENCE_TEMPERATURE):
    """delta = sqrt(rho / (pi f mu_0)), copper's relative permeability taken as 1."""
    return ((resistivity(temperature) / (math.pi * frequency * MU_0)) ** 0.5).to("mm")
