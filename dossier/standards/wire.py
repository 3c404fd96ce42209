"""Round winding wire: AWG sizes (ASTM B258) and enamelled-wire overall diameters (IEC 60317-0-1 grades).

AWG diameters come from the formula of ASTM B258 (dossier.units.awg_diameter); the tests check it against the
standard's Table 1. ENAMEL_TABLE gives the maximum overall diameter of grade 1, 2 and 3
enamelled round copper wire by nominal conductor diameter, for fill-factor estimates.
"""

from __future__ import annotations

import math
from bisect import bisect_left
from dataclasses import dataclass

from dossier.units import Q_, awg_diameter

__all__ = ["ENAMEL_TABLE", "Overall", "awg_diameter", "copper_area", "overall_diameter"]

# IEC 60317-0-1, maximum overall diameter (mm) of enamelled round copper wire by nominal conductor diameter (mm),
# grade 1, 2, 3. Every value here is from memory: not seen in a copy of the standard; check before relying on it.
ENAMEL_TABLE = {
    0.100: (0.117, 0.125, 0.132),
    0.125: (0.144, 0.153, 0.162),
    0.160: (0.182, 0.194, 0.205),
    0.200: (0.226, 0.239, 0.252),
    0.250: (0.281, 0.297, 0.312),
    0.315: (0.349, 0.367, 0.384),
    0.400: (0.439, 0.459, 0.478),
    0.500: (0.544, 0.566, 0.587),
    0.630: (0.679, 0.704, 0.728),
    0.710: (0.762, 0.789, 0.814),
    0.800: (0.855, 0.884, 0.911),
    0.900: (0.959, 0.989, 1.018),
    1.000: (1.062, 1.094, 1.124),
    1.250: (1.316, 1.349, 1.381),
    1.600: (1.670, 1.706, 1.740),
    2.000: (2.074, 2.112, 2.148),
}
ENAMEL_TABLE_STATUS = "from memory"

# Triple-insulated wire: three extruded layers add about 0.2 mm to the diameter (makers' listings; from memory).
TRIPLE_INSULATED_BUILD = Q_(0.2, "mm")
DEFAULT_GRADE = 2


@dataclass(frozen=True)
class Overall:
    """Diameter over the insulation, and how it was found."""

    diameter: object
    basis: str


def copper_area(diameter, strands: int = 1):
    """Copper cross-section of round wire: strands x pi d^2 / 4."""
    return (strands * math.pi * diameter**2 / 4).to("mm**2")


def overall_diameter(copper, grade: int | None = None, triple_insulated: bool = False) -> Overall:
    """Diameter over the enamel (IEC 60317-0-1 grade; grade 2 when not given) or over triple insulation."""
    if triple_insulated:
        return Overall((copper + TRIPLE_INSULATED_BUILD).to("mm"), "triple-insulated: about 0.2 mm over the copper (from memory)")
    assumed = ", grade assumed" if grade is None else ""
    grade = DEFAULT_GRADE if grade is None else grade
    build, how = _enamel_build(copper.to("mm").magnitude, grade)
    return Overall(Q_(copper.to("mm").magnitude + build, "mm"), f"IEC 60317-0-1 grade {grade}, {how}{assumed}")


def _enamel_build(nominal: float, grade: int) -> tuple[float, str]:
    """Overall minus nominal diameter, interpolated linearly between table rows; the end rows outside them."""
    sizes = sorted(ENAMEL_TABLE)
    builds = [ENAMEL_TABLE[size][grade - 1] - size for size in sizes]
    if nominal in ENAMEL_TABLE:
        return builds[sizes.index(nominal)], "table value"
    if nominal <= sizes[0] or nominal >= sizes[-1]:
        end = 0 if nominal <= sizes[0] else -1
        return builds[end], "outside the table: build-up of the nearest size"
    upper = bisect_left(sizes, nominal)
    share = (nominal - sizes[upper - 1]) / (sizes[upper] - sizes[upper - 1])
    return builds[upper - 1] + share * (builds[upper] - builds[upper - 1]), "interpolated between table sizes"
