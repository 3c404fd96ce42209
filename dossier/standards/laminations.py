"""Laminations for mains transformers: the scrapless E-I proportions, the series of E-I sizes, the stacking factor.

A scrapless E-I lamination is cut so that two I pieces come out of the windows of two E pieces facing each other:
with the tongue (centre limb) of width a, the windows are a/2 wide and 3a/2 high, the outer limbs and the yokes
a/2 wide, and the whole lamination 3a wide and 5a/2 high. The usual series names a size by that overall width in
millimetres: EI 48 has a 16 mm tongue. Proportions and series as McLyman's handbook and IEC 60740-1 give them
(from memory; check the sheet of the laminations in hand).
"""

from __future__ import annotations

import re

from dossier.units import Q_

# Ratios to the tongue width a of a scrapless E-I lamination (from memory).
SCRAPLESS = {"window_width": 0.5, "window_height": 1.5, "outer_limb": 0.5, "yoke": 0.5}

# The scrapless series, by overall width in mm (3 a); only sizes whose width is a whole multiple of 3 mm (from memory).
EI_SIZES = (30, 42, 48, 54, 60, 66, 78, 84, 96, 120, 150)

# Net iron over the stack's gross section for 0.35-0.5 mm laminations, tightly stacked (McLyman's table of stacking
# factors by lamination thickness; from memory). A hand stack reaches less, which the record may declare.
STACKING_FACTOR = 0.95

# A moulded bobbin's wall and flanges; the window's winding area lies inside them (common practice; from memory).
BOBBIN_WALL = Q_(1.0, "mm")

_NAME = re.compile(r"^\s*EI[\s-]*(?P<width>\d{2,3})\s*$", re.IGNORECASE)


def size_names() -> tuple[str, ...]:
    return tuple(f"EI {width}" for width in EI_SIZES)


def tongue_of(name: str):
    """The tongue width of a named scrapless E-I size ('EI 48' -> 16 mm); None when the name is not in the series."""
    match = _NAME.match(name)
    if match is None or int(match["width"]) not in EI_SIZES:
        return None
    return Q_(int(match["width"]) / 3, "mm")


def scrapless(tongue) -> dict:
    """Window, outer limb and yoke of a scrapless E-I lamination from its tongue width."""
    return {name: (tongue * ratio).to("mm") for name, ratio in SCRAPLESS.items()}
