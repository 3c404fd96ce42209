"""Silicon (electrical) steel for laminated and tape-wound cores: grades, density and specific total loss.

IEC 60404-8-4 (non-oriented, fully processed) and IEC 60404-8-7 (grain-oriented) name a grade by its guaranteed
maximum specific total loss and thickness: M400-50A loses at most 4.00 W/kg at 1.5 T and 50 Hz in 0.50 mm sheet;
a grain-oriented grade (letter S, or P for high permeability) is rated at 1.7 T and 50 Hz (designation scheme from
memory). A maker's figure is at one flux density and frequency; at mains frequency the loss is scaled as B^2
(common practice for silicon steel).
"""

from __future__ import annotations

import re
from dataclasses import dataclass

from dossier.units import Q_

NON_ORIENTED, GRAIN_ORIENTED = "non-oriented", "grain-oriented"

# Conventional densities used for the loss measurement (IEC 60404-2; the grade tables of IEC 60404-8-4 list
# 7.60-7.80 kg/dm^3 for non-oriented grades, IEC 60404-8-7 7.65 kg/dm^3 for grain-oriented; from memory).
# Unknown or non-oriented steel takes the densest (more iron, more loss: the harsher reading).
DENSITY = {GRAIN_ORIENTED: Q_(7650, "kg/m**3"), NON_ORIENTED: Q_(7800, "kg/m**3")}

FLUX_EXPONENT = 2.0  # loss as B^2 at mains frequency (common practice for silicon steel)
# Frequency exponent between hysteresis (f^1) and eddy current (f^2) loss; when not declared the harsher end is taken.
FREQUENCY_EXPONENTS = (1.0, 2.0)


@dataclass(frozen=True)
class RatedLoss:
    """A specific total loss at one peak flux density and frequency, and where it came from."""

    loss: object
    flux: object
    frequency: object
    basis: str


# No loss figure: the highest-loss fully processed grade of each family taken (harsher reading; grades from memory):
# non-oriented M1000-65A, 10 W/kg at 1.5 T; grain-oriented about 2 W/kg at 1.7 T, above the conventional grades.
DEFAULT_LOSS = {
    NON_ORIENTED: RatedLoss(Q_(10.0, "W/kg"), Q_(1.5, "T"), Q_(50, "Hz"),
                            "no loss figure: 10 W/kg at 1.5 T, 50 Hz taken, as the highest-loss non-oriented grade (M1000-65A)"),
    GRAIN_ORIENTED: RatedLoss(Q_(2.0, "W/kg"), Q_(1.7, "T"), Q_(50, "Hz"),
                              "no loss figure: 2.0 W/kg at 1.7 T, 50 Hz taken, above the conventional grain-oriented grades"),
}

_GRADE = re.compile(r"^M(?P<loss>\d{3,4})-(?P<thickness>\d{2,3})(?P<kind>[ASP])$")
_RATED_AT = {"A": (NON_ORIENTED, Q_(1.5, "T")), "S": (GRAIN_ORIENTED, Q_(1.7, "T")), "P": (GRAIN_ORIENTED, Q_(1.7, "T"))}


def is_grade(name: str) -> bool:
    return _GRADE.match(name.strip()) is not None


def grade_family(name: str) -> str:
    return _RATED_AT[_GRADE.match(name.strip())["kind"]][0]


def grade_thickness(name: str):
    return Q_(int(_GRADE.match(name.strip())["thickness"]) / 100, "mm")


def grade_loss(name: str) -> RatedLoss:
    """The guaranteed maximum loss a grade's name carries: M400-50A -> 4.00 W/kg at 1.5 T, 50 Hz."""
    match = _GRADE.match(name.strip())
    _, flux = _RATED_AT[match["kind"]]
    return RatedLoss(Q_(int(match["loss"]) / 100, "W/kg"), flux, Q_(50, "Hz"), f"grade {name.strip()}: its guaranteed maximum")


def frequency_exponent(frequency, rated_at, declared: float | None) -> tuple[float, str]:
    """(exponent, how): declared; else f^2 above the rated frequency and f^1 below (the loss falling least)."""
    if declared is not None:
        return declared, "declared"
    if frequency.to("Hz").magnitude == rated_at.to("Hz").magnitude:
        return 1.0, "at the rated frequency"
    low, high = FREQUENCY_EXPONENTS
    chosen = high if frequency > rated_at else low
    return chosen, f"{chosen:g} taken (the harsher end of 1-2; declare the exponent to make it exact)"


def specific_loss(rated: RatedLoss, flux, frequency, flux_exponent: float = FLUX_EXPONENT, frequency_exponent_value: float = 1.0):
    """P = P_rated (B / B_rated)^beta (f / f_rated)^alpha, in W/kg."""
    b = (flux / rated.flux).to("").magnitude
    f = (frequency / rated.frequency).to("").magnitude
    return (rated.loss * b**flux_exponent * f**frequency_exponent_value).to("W/kg")
