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


# The resistance method for the temperature rise of a copper winding, as the appliance standards give it
# (IEC 60335-1, edition 5.0, clause 11.3): k = 234.5 for copper, 225 for aluminium. 234.5 K is the temperature
# below 0 degC at which copper's resistance would extrapolate to zero; IEC 60028's coefficient gives the same
# (1 / 0.00393 - 20 = 234.5). IEC 60076-2 (power transformers) rounds it to 235.
COPPER_CONSTANT = Q_(234.5, "K")


def _celsius(temperature) -> float:
    return temperature.to("degC").magnitude


def winding_rise(cold_resistance, hot_resistance, start_ambient, end_ambient, constant=COPPER_CONSTANT):
    """Temperature rise of a winding above the ambient at the end, by the resistance method.

    dT = (R2 - R1) / R1 x (k + t1) - (t2 - t1): R1 cold at the start, with the winding at the room temperature t1;
    R2 hot at the end, the room then at t2; k = 234.5 K for copper.
    """
    ratio = ((hot_resistance - cold_resistance) / cold_resistance).to("").magnitude
    k = constant.to("K").magnitude
    t1, t2 = _celsius(start_ambient), _celsius(end_ambient)
    return Q_(ratio * (k + t1) - (t2 - t1), "K")


def winding_temperature(cold_resistance, hot_resistance, start_ambient, constant=COPPER_CONSTANT):
    """Mean temperature of the winding when hot: T2 = R2 / R1 x (k + t1) - k."""
    ratio = (hot_resistance / cold_resistance).to("").magnitude
    k = constant.to("K").magnitude
    return Q_(ratio * (k + _celsius(start_ambient)) - k, "degC")


def resistance_at_rise(cold_resistance, start_ambient, rise, end_ambient=None, constant=COPPER_CONSTANT):
    """The hot resistance R2 at which the winding shows this rise: the formula above solved for R2."""
    t1 = _celsius(start_ambient)
    t2 = t1 if end_ambient is None else _celsius(end_ambient)
    k = constant.to("K").magnitude
    return (cold_resistance * (1 + (rise.to("K").magnitude + t2 - t1) / (k + t1))).to(cold_resistance.units)
