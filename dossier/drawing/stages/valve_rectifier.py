"""Valve (vacuum-tube) rectifiers: a twin-diode valve across a centre-tapped secondary (full wave) or a
single diode valve (half wave), each with its heater and the winding that heats it. The valve is drawn
on its side, anodes to the left facing the secondary, the cathode to the live rail, the heater on the
right. A directly heated valve (its value or role says so) takes the live rail from its filament."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.stages.ladder import Ladder
from dossier.drawing.stages.rectifier import secondary, smoothing
from dossier.drawing.symbols import Winding
from dossier.drawing.views import PartView, StageView

TOPOLOGIES = ("valve-centre-tapped", "valve-half-wave")
TOP, BOTTOM, RAIL = 4.6, 0.0, -1.6
VALVE = P.either(P.kind("valve", "tube", "vacuum tube", "rectifier valve"), P.role("valve", "tube"))
TUBE_X, TUBE_Y = 2.6, 2.3  # where the valve's anode end sits


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    valve = picker.take(VALVE)
    full_wave = view.topology.lower() == "valve-centre-tapped"
    tube = _valve(drawing, valve, full_wave)
    ret = _secondary(drawing, view, tube, full_wave)
    right = max(_heater(drawing, view, tube, valve), TUBE_X - 0.45 + sheet.text_width(valve.label) + 0.3)
    live_from = tube.heat1 if directly_heated(valve) else (tube.cathodeB_R if full_wave else tube.cathode_R)
    sheet.wire(drawing, live_from, (live_from[0], TOP), (right, TOP))
    sheet.wire(drawing, (TUBE_X, ret), (right, ret))
    ladder = Ladder(drawing, view, TOP, ret)
    ladder.x = right
    smoothing(ladder, picker)
    ladder.outputs(*((None, None) if view.rails else ("+", "\u2212")))
    return finish_stage(drawing, view, picker)


def directly_heated(valve: PartView) -> bool:
    return any(words in f"{valve.value} {valve.role}".lower() for words in ("directly heated", "directly-heated", "filament"))


def _valve(drawing, valve: PartView, full_wave: bool):
    cathode = "none" if directly_heated(valve) else "heated"
    if full_wave:
        symbol = elm.DualVacuumTube(grids_left=0, grids_right=0, heater=True, cathode=cathode)
    else:
        symbol = elm.VacuumTube(grids=0, heater=True, cathode=cathode)
    tube = sheet.add(drawing, symbol.theta(90).at((TUBE_X, TUBE_Y)))
    sheet.text(drawing, (TUBE_X - 0.45, TUBE_Y - 1.55), valve.label, valign="top")
    return tube


def _secondary(drawing, view: StageView, tube, full_wave: bool) -> float:
    """The secondary on the left, its ends to the anodes (full wave, the centre tap to the return) or its
    top to the anode and its bottom to the return (half wave); returns the return rail's y."""
    if full_wave:
        coil = secondary(drawing, view, TOP, BOTTOM, humps=8)
        for end, anode in ((TOP, tube.anodeB), (BOTTOM, tube.anodeA)):
            sheet.wire(drawing, (0, end), (TUBE_X - 0.7, end), (TUBE_X - 0.7, anode[1]), anode)
        sheet.wire(drawing, coil.tap, (-0.9, coil.tap[1]), (-0.9, RAIL), (TUBE_X, RAIL))
        sheet.text(drawing, (-0.75, coil.tap[1] + 0.05), "CT", halign="left", valign="bottom")
        return RAIL
    secondary(drawing, view, TOP, BOTTOM, humps=6)
    sheet.wire(drawing, (0, TOP), (TUBE_X - 0.7, TOP), (TUBE_X - 0.7, tube.anode[1]), tube.anode)
    sheet.wire(drawing, (0, BOTTOM), (0, RAIL), (TUBE_X, RAIL))
    return RAIL


def _heater(drawing, view: StageView, tube, valve: PartView) -> float:
    """The heater winding beside the valve's heater pins, labelled; returns the x past its label."""
    x = tube.heat1[0] + 0.9
    top, bottom = max(tube.heat1[1], tube.heat2[1]), min(tube.heat1[1], tube.heat2[1])
    sheet.add(drawing, Winding(humps=3).at((x, top + 0.45)).to((x, bottom - 0.45)))
    for pin, y in ((tube.heat1 if tube.heat1[1] > tube.heat2[1] else tube.heat2, top + 0.45),
                   (tube.heat2 if tube.heat1[1] > tube.heat2[1] else tube.heat1, bottom - 0.45)):
        sheet.wire(drawing, pin, (pin[0] + 0.4, pin[1]), (pin[0] + 0.4, y), (x, y))
    words = view.heater or "heater winding\n(not recorded)"
    sheet.text(drawing, (x + 0.55, (top + bottom) / 2), words, size=sheet.SMALL_FONT)
    return x + 0.55 + sheet.text_width(words, sheet.SMALL_FONT) + 0.4


def handles(view: StageView) -> bool:
    return view.kind == "rectifier" and view.topology.lower() in TOPOLOGIES


def missing(view: StageView) -> list[str]:
    return [] if Picker(view.parts).peek(VALVE) else ["a rectifier valve (kind valve)"]


DRAWER = StageDrawer("valve rectifier", handles, missing, draw)
