"""A series-pass (linear) regulator as a block with its setpoint, with the pass transistor it drives when
the stage has one. Shunt and switching regulators have drawers of their own."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.symbols import Box
from dossier.drawing.views import PartView, StageView

RAIL_Y, RETURN_Y = 3.2, -0.6
BOX_TOP = 1.9


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    regulator, pass_device = picker.take(P.REGULATOR), picker.take(P.PASS_DEVICE)
    words = block_text(view, regulator)
    box = sheet.add(drawing, Box(sheet.text_width(words) + 0.8, sheet.text_height(words) + 0.5, words).at((1.2, BOX_TOP)))
    if pass_device is None:
        out_x = _direct(drawing, box)
    else:
        out_x = _series_pass(drawing, box, pass_device)
    sheet.wire(drawing, box.S, (box.S[0], RETURN_Y))
    sheet.dot(drawing, (box.S[0], RETURN_Y))
    _terminals(drawing, view, out_x)
    return finish_stage(drawing, view, picker)


def block_text(view: StageView, regulator: PartView) -> str:
    """Designator, what it is, and its setpoint: the part's value, else the record's output rating."""
    what = regulator.role or view.topology or "regulator"
    setpoint = regulator.value or (view.output.setpoint if view.output else "not recorded")
    return f"{regulator.ref}\n{what}\nsetpoint {setpoint}"


def _direct(drawing, box) -> float:
    """The block in the positive rail: in on the left, out on the right."""
    sheet.wire(drawing, (0, RAIL_Y), (0.6, RAIL_Y), (0.6, box.W[1]), box.W)
    out_x = box.E[0] + 1.0
    sheet.wire(drawing, box.E, (box.E[0] + 0.6, box.E[1]), (box.E[0] + 0.6, RAIL_Y), (out_x, RAIL_Y))
    return out_x


def _series_pass(drawing, box, device: PartView) -> float:
    """The pass transistor in the positive rail, its base driven from the block, the output sensed."""
    middle = box.N[0]
    transistor = sheet.add(drawing, elm.BjtNpn().theta(90).anchor("base").at((middle, BOX_TOP + 0.6)))
    sheet.wire(drawing, (0, RAIL_Y), (transistor.collector[0], RAIL_Y), transistor.collector)
    sheet.wire(drawing, (middle, BOX_TOP + 0.6), box.N)
    out_x = box.E[0] + 1.0
    sheet.wire(drawing, transistor.emitter, (transistor.emitter[0], RAIL_Y), (out_x, RAIL_Y))
    sheet.wire(drawing, (box.E[0] + 0.6, RAIL_Y), (box.E[0] + 0.6, box.E[1]), box.E)
    sheet.dot(drawing, (box.E[0] + 0.6, RAIL_Y))
    sheet.text(drawing, (box.E[0] + 0.75, (RAIL_Y + box.E[1]) / 2), "sense", size=sheet.SMALL_FONT, colour=sheet.NOTE_INK)
    sheet.text(drawing, (middle, RAIL_Y + 0.5), device.label, halign="center", valign="bottom")
    return out_x


def _terminals(drawing, view: StageView, out_x: float) -> None:
    sheet.wire(drawing, (0, RETURN_Y), (out_x, RETURN_Y))
    origin = f" from {view.came_from}" if view.came_from else ""
    onward = f" to {view.goes_to}" if view.goes_to else ""
    sheet.terminal(drawing, (-0.11, RAIL_Y), f"{view.pole(True)}{origin}", side="left")
    sheet.terminal(drawing, (-0.11, RETURN_Y), f"{view.pole(False)}{origin}", side="left")
    rails = ", ".join(rail.label for rail in view.rails)
    sheet.terminal(drawing, (out_x + 0.11, RAIL_Y), f"{rails or view.pole(True)}{onward}")
    sheet.terminal(drawing, (out_x + 0.11, RETURN_Y), f"{'0 V' if rails else view.pole(False)}{onward}")


OTHER_DRAWERS = ("shunt", "switching")


def handles(view: StageView) -> bool:
    return view.kind == "regulator" and view.topology.lower() not in OTHER_DRAWERS


def missing(view: StageView) -> list[str]:
    return [] if Picker(view.parts).peek(P.REGULATOR) else ["a regulator part (kind regulator)"]


DRAWER = StageDrawer("regulator", handles, missing, draw)
