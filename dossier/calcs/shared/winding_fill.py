"""How the windings sit in the window: overall diameters, build at a toroid's hole, fill, mean turn lengths.

On a toroid the windings are taken as wound one after another, each in layers round the inner hole, where
room is shortest; each winding's mean turn is the core's section perimeter grown by the build beneath it
and half its own. Those are approximations named in the findings, not results of a standard.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.calcs.shared.core_geometry import hole_area, section_perimeter, toroid_surface
from dossier.calcs.shared.lamination import lamination_of
from dossier.standards.wire import copper_area, overall_diameter
from dossier.units import Q_

# Insulating tape at a toroid's hole, half-overlapped polyester: about 0.1 mm per layer (common practice; from memory).
TAPE_LAYER = Q_(0.1, "mm")
# Insulated-wire-and-tape fill that can still be wound by hand (common practice): a toroid needs room for the shuttle.
# A laminated or C core's limit is of its bobbin's winding area (the window less the bobbin).
HAND_FILL_LIMIT = {"toroid": 0.40, "declared": 0.55, "ei-lamination": 0.55, "ui-lamination": 0.55, "c-core": 0.55}


@dataclass(frozen=True)
class Layout:
    """One winding as laid on the core."""

    name: str
    copper_area: object
    overall: object
    overall_basis: str
    window_share: object
    build: object
    mean_turn_length: object
    layers: int | None


@dataclass(frozen=True)
class Fill:
    layouts: tuple
    window_area: object
    occupied: object
    hole_left: object

    @property
    def factor(self):
        return (self.occupied / self.window_area).to("")


def passes(winding) -> int:
    """Conductors through the window: a fraction of a turn still passes through once."""
    return math.ceil(winding.turns - 1e-9) * winding.strands


def overall_of(winding):
    if winding.overall_diameter is not None:
        return winding.overall_diameter.to("mm"), "declared overall diameter"
    found = overall_diameter(winding.wire, winding.enamel_grade, winding.triple_insulated)
    return found.diameter, found.basis


def window_share(winding, overall, tape_length):
    """Window area one winding takes: its insulated conductors, plus its tape across the given length."""
    wire = passes(winding) * math.pi * overall**2 / 4
    return (wire + winding.tape_layers * TAPE_LAYER * tape_length).to("mm**2")


def lay_toroid(core, windings) -> Fill:
    radius = core.inner_diameter / 2
    base = section_perimeter(core.outer_diameter, core.inner_diameter, core.height)
    below, layouts = Q_(0, "mm"), []
    for winding in windings:
        overall, basis = overall_of(winding)
        hole = max(radius - below, Q_(0, "mm"))
        layers = _layers(passes(winding), overall, hole)
        build = (layers * overall + winding.tape_layers * TAPE_LAYER).to("mm")
        share = window_share(winding, overall, 2 * math.pi * max(hole - build, Q_(0, "mm")))
        mlt = (base + 8 * below + 4 * build).to("mm")
        layouts.append(Layout(winding.name, copper_area(winding.wire, winding.strands), overall, basis, share, build, mlt, layers))
        below = below + build
    window = hole_area(core.inner_diameter)
    occupied = sum((l.window_share for l in layouts), Q_(0, "mm**2"))
    return Fill(tuple(layouts), window, occupied, (core.inner_diameter - 2 * below).to("mm"))


def lay_declared(core, windings) -> Fill | None:
    """A declared core: area fill only; every winding takes the declared mean turn length."""
    if core.window_area is None:
        return None
    side = math.sqrt(core.window_area.to("mm**2").magnitude)
    layouts = []
    for winding in windings:
        overall, basis = overall_of(winding)
        share = window_share(winding, overall, Q_(side, "mm"))
        layouts.append(Layout(winding.name, copper_area(winding.wire, winding.strands), overall, basis, share, None, core.mean_turn_length, None))
    occupied = sum((l.window_share for l in layouts), Q_(0, "mm**2"))
    return Fill(tuple(layouts), core.window_area.to("mm**2"), occupied, None)


def lay(core, windings) -> Fill | None:
    return lay_toroid(core, windings) if core.shape == "toroid" else lay_declared(core, windings)


def wound_surface(core, fill: Fill | None):
    """Outside surface of a wound toroid: the core grown on every side by the winding build at the hole.

    A laminated or C core's: declared, else the box round core and coil (lamination.py).
    """
    if core.shape not in ("toroid", "declared"):
        return core.surface_area if core.surface_area is not None else _bobbin_surface(core, fill)
    if core.shape != "toroid":
        return core.surface_area
    build = (core.inner_diameter - fill.hole_left) / 2 if fill else Q_(0, "mm")
    inner = max(core.inner_diameter - 2 * build, Q_(0, "mm"))
    return toroid_surface(core.outer_diameter + 2 * build, inner, core.height + 2 * build)


def _bobbin_surface(core, fill: Fill | None):
    lam = lamination_of(core)
    build = sum((layout.build for layout in fill.layouts), Q_(0, "mm")) if fill else lam.winding_width
    return lam.surface(build)


def _layers(count: int, overall, hole_radius) -> int:
    """Layers needed round a hole of this radius, the circumference shrinking by one wire per layer."""
    layers, left, radius = 0, count, hole_radius
    while left > 0:
        per_layer = math.floor((2 * math.pi * (radius - overall / 2) / overall).to("").magnitude)
        if per_layer < 1:
            return layers + math.ceil(left)  # no room: counted as a stack, the fill finding then fails
        left -= per_layer
        layers += 1
        radius = radius - overall
    return layers
