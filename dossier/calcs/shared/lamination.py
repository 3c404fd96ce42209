"""Laminated E-I and U-I cores and C cores: effective parameters, bobbin and windings from the geometry.

A shell-type E-I core carries the windings on its tongue (width a); the flux splits at the yoke, half round each
window, so the outer limbs and the yokes are a/2 wide. A core-type U-I or C core carries the whole flux round one
window through limbs and yokes of width a, with the windings on one limb or split over both.

  A_e = a s k (net iron: limb width x stack x stacking factor)
  l_e = the mean path through the centre line of each limb and yoke:
        E-I 2 (w + h) + a/2 + c + 2 y (outer limb c, yoke y), U-I and C 2 (w + h) + 4 a
  A_w = w h (an E-I's one window: every turn passes through each window once)
  V   = (outline - windows) x s x k, the iron itself
Those are approximations named in the findings (common practice); a maker's declared A_e, l_e, window, mean turn
or surface replaces the computed figure.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

from dossier.citations import IEC_60740_1, MCLYMAN
from dossier.findings import common_practice
from dossier.standards.laminations import BOBBIN_WALL, STACKING_FACTOR, scrapless, tongue_of
from dossier.units import Q_

LAMINATION_SOURCES = (
    replace(MCLYMAN, edition="3rd edition, 2004", clause=(
        "laminations and C cores: scrapless E-I proportions (window a/2 by 3a/2), stacking factor 0.95 for 0.35-0.64 mm "
        "laminations, mean magnetic path and mean turn from the core's dimensions (from memory)")),
    replace(IEC_60740_1, clause="E-I lamination sizes named by overall width, scrapless series (from memory)"),
    common_practice("mean path through the centre lines of limbs and yokes; a bobbin's wall and flanges about 1 mm"),
)
SHAPE_WORDS = {"ei-lamination": "E-I lamination", "ui-lamination": "U-I lamination", "c-core": "C core"}


@dataclass(frozen=True)
class Lamination:
    """The dimensions of one laminated or C core, each found or declared, and the words saying how."""

    shape: str
    limb: object
    stack: object
    window_width: object
    window_height: object
    outer_limb: object
    yoke: object
    stacking_factor: float
    limbs_wound: int
    wall: object
    basis: tuple

    @property
    def shell(self) -> bool:
        return self.shape == "ei-lamination"

    @property
    def net_area(self):
        return (self.limb * self.stack * self.stacking_factor).to("mm**2")

    @property
    def path_length(self):
        w, h, a = self.window_width, self.window_height, self.limb
        if self.shell:
            return (2 * (w + h) + a / 2 + self.outer_limb + 2 * self.yoke).to("mm")
        return (2 * (w + h) + 4 * a).to("mm")

    @property
    def window_area(self):
        return (self.window_width * self.window_height).to("mm**2")

    @property
    def outline(self) -> tuple:
        """(width, height) of the assembled stack seen face on."""
        if self.shell:
            return self.limb + 2 * self.window_width + 2 * self.outer_limb, self.window_height + 2 * self.yoke
        return self.window_width + 2 * self.limb, self.window_height + 2 * self.limb

    @property
    def iron_volume(self):
        width, height = self.outline
        windows = (2 if self.shell else 1) * self.window_area
        return ((width * height - windows) * self.stack * self.stacking_factor).to("mm**3")

    @property
    def bobbin_inside(self):
        """Perimeter of the bobbin's tube round the limb: 2 (a + s) + 8 t (square corners, the longer turn)."""
        return (2 * (self.limb + self.stack) + 8 * self.wall).to("mm")

    @property
    def winding_height(self):
        return max(self.window_height - 2 * self.wall, Q_(0, "mm")).to("mm")

    @property
    def winding_width(self):
        """Room for the windings on one wound limb, from its bobbin wall outwards."""
        share = self.window_width if self.shell or self.limbs_wound == 1 else self.window_width / 2
        return max(share - self.wall, Q_(0, "mm")).to("mm")

    @property
    def winding_area(self):
        """The bobbins' winding area inside the window."""
        return (self.limbs_wound * self.winding_width * self.winding_height).to("mm**2")

    def mean_turn(self, below, build):
        """A turn at half this winding's build, on top of what lies below it: inside + 8 (below + build / 2)."""
        return (self.bobbin_inside + 8 * (below + build / 2)).to("mm")

    def surface(self, build):
        """Outside of the box round core and coil: the coil's ends stand out of the stack front and back by its build,
        and a core-type coil out past its limb's outer edge too."""
        width, height = self.outline
        depth = self.stack + 2 * build
        if not self.shell:
            width = width + self.limbs_wound * build
        return (2 * (width * height + width * depth + height * depth)).to("cm**2")


def lamination_of(core) -> Lamination:
    basis = []
    limb = core.limb_width
    if limb is None:
        limb = tongue_of(core.lamination)
        basis.append(f"tongue {limb.magnitude:g} mm from the size {core.lamination}")
    ratios = scrapless(limb)
    width, height = core.window_width, core.window_height
    if core.shape == "ei-lamination" and (width is None or height is None):
        width = width if width is not None else ratios["window_width"]
        height = height if height is not None else ratios["window_height"]
        basis.append("window from the scrapless E-I proportions (a/2 by 3a/2)")
    factor = core.stacking_factor if core.stacking_factor is not None else STACKING_FACTOR
    if core.stacking_factor is None:
        basis.append(f"stacking factor {STACKING_FACTOR:g} taken (declare core.stacking_factor)")
    wall = core.bobbin_wall if core.bobbin_wall is not None else BOBBIN_WALL
    if core.bobbin_wall is None:
        basis.append(f"bobbin wall {BOBBIN_WALL.magnitude:g} mm taken (declare core.bobbin_wall)")
    shell = core.shape == "ei-lamination"
    limbs = 1 if shell else (core.wound_limbs or 2)
    return Lamination(
        shape=core.shape, limb=limb.to("mm"), stack=core.stack.to("mm"), window_width=width.to("mm"), window_height=height.to("mm"),
        outer_limb=ratios["outer_limb"] if shell else limb.to("mm"), yoke=ratios["yoke"] if shell else limb.to("mm"),
        stacking_factor=float(factor), limbs_wound=limbs, wall=wall.to("mm"), basis=tuple(basis),
    )


def layers_of(passes: int, limbs: int, overall, height) -> int:
    """Layers of one winding on each wound limb, as many turns to a layer as fit across the winding height."""
    per_layer = math.floor((height / overall).to("").magnitude)
    if per_layer < 1:
        return passes
    return math.ceil(math.ceil(passes / limbs) / per_layer)
