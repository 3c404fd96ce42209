"""A controller-driven half-bridge: the split capacitors on the left, the two switches on the
right with the transformer primary between their midpoints, a gate winding of the gate-drive
transformer for each switch, and the controller driving that transformer's primary."""

from __future__ import annotations

from dataclasses import dataclass

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage, lacking
from dossier.drawing.parts import Picker
from dossier.drawing.symbols import Box, Winding
from dossier.drawing.stages.split_bus import BOTTOM, CAP_X, MID, TOP, bus_inputs, split_capacitors
from dossier.drawing.views import PartView, StageView

TOPOLOGY = "half-bridge"
CONTROLLER = P.either(P.kind("controller", "ic"), P.role("controller", "pwm"))
NEEDS = {
    "an upper switch": P.UPPER_SWITCH,
    "a lower switch": P.LOWER_SWITCH,
    "two split capacitors": P.either(P.SPLIT, P.BULK),
    "a second split capacitor": P.either(P.SPLIT, P.BULK),
    "a gate-drive transformer": P.DRIVE_TRANSFORMER,
}


@dataclass(frozen=True)
class GateWindings:
    primary: str
    upper: str
    lower: str


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    bus_inputs(drawing, view)
    split_capacitors(drawing, picker.take(P.either(P.SPLIT, P.BULK)), picker.take(P.either(P.SPLIT, P.BULK)), polar=False)
    upper, lower = picker.take(P.UPPER_SWITCH), picker.take(P.LOWER_SWITCH)
    switch_x = _primary(drawing, view, room=max(sheet.text_width(upper.label), sheet.text_width(lower.label)) + 1.4)
    gates = _switches(drawing, switch_x, upper, lower)
    windings = gate_windings(view, picker.take(P.DRIVE_TRANSFORMER))
    primary_x, winding_x = _gate_windings(drawing, switch_x, gates, windings)
    _controller(drawing, primary_x, windings, picker.take(CONTROLLER))
    _rails(drawing, switch_x, winding_x)
    return finish_stage(drawing, view, picker)


def _primary(drawing, view: StageView, room: float) -> float:
    """The transformer primary from the capacitor midpoint to the switch node; returns the switches' x.

    room is the width the switches' labels need left of the switches."""
    words = view.load or "transformer primary"
    length = max(2.4, sheet.text_width(words) + 0.4)
    sheet.dot(drawing, (CAP_X, MID))
    sheet.add(drawing, Winding(humps=4, core=True).at((CAP_X, MID)).right(length))
    sheet.text(drawing, (CAP_X + length / 2, MID + 0.55), words, halign="center", valign="bottom")
    end = max(CAP_X + length + 0.7, CAP_X + room)
    sheet.wire(drawing, (CAP_X + length, MID), (end, MID))
    sheet.dot(drawing, (end, MID))
    return end


def _switches(drawing, x: float, upper: PartView, lower: PartView) -> tuple[tuple, tuple]:
    """Upper switch from the positive rail to the switch node, lower from there to the negative rail.

    Returns each switch's (gate, source) points."""
    found = []
    for part, (drain_y, rail_y, source_to) in ((upper, (TOP - 1.2, TOP, MID)), (lower, (MID - 1.2, MID, BOTTOM))):
        switch = sheet.add(drawing, elm.NFet().anchor("drain").at((x, drain_y)))
        sheet.wire(drawing, (x, rail_y), switch.drain)
        sheet.wire(drawing, switch.source, (x, source_to))
        sheet.text(drawing, (x - 0.45, switch.gate[1]), part.label, halign="right")
        found.append((tuple(switch.gate), (x, source_to)))
    return found[0], found[1]


def gate_windings(view: StageView, drive: PartView) -> GateWindings:
    """Labels for the gate-drive transformer's windings, with turns and wire when recorded."""
    magnetic = view.magnetic(drive.ref)
    caption = drive.label.replace("\n", " ")
    if magnetic is None:
        return GateWindings(f"{caption}\nprimary", f"{drive.ref} upper gate", f"{drive.ref} lower gate")
    primary = next((w for w in magnetic.windings if w.role == "primary"), None)
    gates = [w for w in magnetic.windings if w is not primary]
    upper = next((w for w in gates if "upper" in w.name.lower() or "high" in w.name.lower()), gates[0] if gates else None)
    lower = next((w for w in gates if w is not upper), None)
    primary_text, upper_text, lower_text = (f"{drive.ref} {w.label}" if w else drive.ref for w in (primary, upper, lower))
    return GateWindings(f"{caption}\n{primary_text}", upper_text, lower_text)


def _gate_windings(drawing, switch_x: float, gates: tuple[tuple, tuple], windings: GateWindings) -> tuple[float, float]:
    """Each gate winding runs from its switch's gate down to that switch's source.

    Returns the x of the gate-drive primary and of the gate windings."""
    winding_x = gates[0][0][0] + 0.8
    for (gate, source), words in zip(gates, (windings.upper, windings.lower)):
        bottom = source[1] + (0.7 if source[1] == MID else 0.0)
        sheet.wire(drawing, gate, (winding_x, gate[1]))
        sheet.add(drawing, Winding(humps=3, core=True).at((winding_x, gate[1])).to((winding_x, bottom)))
        if source[1] == MID:
            sheet.wire(drawing, (winding_x, bottom), (switch_x, bottom))
            sheet.dot(drawing, (switch_x, bottom))
        sheet.text(drawing, (winding_x + 0.55, (gate[1] + bottom) / 2), words)
    widest = max(sheet.text_width(windings.upper), sheet.text_width(windings.lower))
    return winding_x + 0.55 + widest + 0.9, winding_x


def _controller(drawing, x: float, windings: GateWindings, controller: PartView | None) -> None:
    """The gate-drive primary, fed from the controller's two outputs."""
    top, bottom = MID + 2.0, MID - 2.0
    sheet.add(drawing, Winding(humps=4, core=True).at((x, top)).to((x, bottom)).reverse())
    sheet.text(drawing, (x, top + 0.35), windings.primary, halign="center", valign="bottom")
    words = controller.label if controller is not None else "controller\n(not in the record)"
    if controller is not None and controller.role:
        words = f"{controller.ref}\n{controller.role}\n{controller.value}".rstrip()
    box_x, height = x + 1.4, max(sheet.text_height(words) + 0.6, 2.0)
    sheet.add(drawing, Box(sheet.text_width(words) + 1.2, height, words).at((box_x, MID + height / 2)))
    for y, pin in ((top, MID + height / 2 - 0.4), (bottom, MID - height / 2 + 0.4)):
        sheet.wire(drawing, (x, y), (x + 0.7, y), (x + 0.7, pin), (box_x, pin))


def _rails(drawing, switch_x: float, winding_x: float) -> None:
    """Both rails; the negative one runs on to the lower gate winding, which returns to the lower source."""
    sheet.wire(drawing, (0, TOP), (switch_x, TOP))
    sheet.wire(drawing, (0, BOTTOM), (winding_x, BOTTOM))
    for point in ((CAP_X, TOP), (CAP_X, BOTTOM), (switch_x, BOTTOM)):
        sheet.dot(drawing, point)


def handles(view: StageView) -> bool:
    return view.kind == "converter" and view.topology == TOPOLOGY


def missing(view: StageView) -> list[str]:
    return lacking(Picker(view.parts), NEEDS)


DRAWER = StageDrawer("controller-driven half-bridge", handles, missing, draw)
