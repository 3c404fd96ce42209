"""Windings on the bobbin of a laminated or C core: layers, build, mean turn and fill of the bobbin's winding area.

Each winding is wound over the one before, in layers across the bobbin's winding height; on a core-type core
wound on both limbs, half of every winding sits on each. A winding's mean turn is the bobbin's inside perimeter
grown by the build beneath it and half its own (square corners: the longer turn). The fill is the insulated wire
and tape over the bobbin's winding area, the window less the bobbin's wall and flanges.
"""

from __future__ import annotations

from dossier.calcs.shared.winding_fill import TAPE_LAYER, Fill, Layout, overall_of, passes, window_share
from dossier.calcs.shared.lamination import lamination_of, layers_of
from dossier.standards.wire import copper_area
from dossier.units import Q_


def lay_bobbin(core, windings) -> Fill:
    lam = lamination_of(core)
    height = lam.winding_height
    below, layouts = Q_(0, "mm"), []
    for winding in windings:
        overall, basis = overall_of(winding)
        layers = layers_of(passes(winding), lam.limbs_wound, overall, height)
        build = (layers * overall + winding.tape_layers * TAPE_LAYER).to("mm")
        share = window_share(winding, overall, lam.limbs_wound * height)
        turn = core.mean_turn_length if core.mean_turn_length is not None else lam.mean_turn(below, build)
        layouts.append(Layout(winding.name, copper_area(winding.wire, winding.strands), overall, basis, share, build, turn, layers))
        below = below + build
    area = _winding_area(core, lam)
    occupied = sum((layout.window_share for layout in layouts), Q_(0, "mm**2"))
    return Fill(tuple(layouts), area, occupied, None)


def _winding_area(core, lam):
    """The bobbins' winding area; a declared window keeps the same share of it for the bobbin."""
    if core.window_area is None:
        return lam.winding_area
    return (core.window_area * (lam.winding_area / lam.window_area)).to("mm**2")
