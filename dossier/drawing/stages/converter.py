"""A self-oscillating half-bridge: the split capacitors on the left, the two switches on the
right, the transformer primary and the current-feedback winding of the base-drive transformer
between their midpoints, a base winding for each switch, and the start-up trigger network."""

from __future__ import annotations

from dataclasses import dataclass

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage, lacking
from dossier.drawing.parts import Picker
from dossier.drawing.symbols import Winding
from dossier.drawing.stages.split_bus import BOTTOM, CAP_X, MID, TOP, bus_inputs, split_capacitors
from dossier.drawing.views import PartView, StageView

TOPOLOGY = "self-oscillating-half-bridge"
NEEDS = {
    "an upper switch": P.UPPER_SWITCH,
    "a lower switch": P.LOWER_SWITCH,
    "two split capacitors": P.either(P.SPLIT, P.BULK),
    "a second split capacitor": P.either(P.SPLIT, P.BULK),
    "a base-drive transformer": P.DRIVE_TRANSFORMER,
}


@dataclass(frozen=True)
class DriveWindings:
    feedback: str
    upper: str
    lower: str


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    bus_inputs(drawing, view)
    split_capacitors(drawing, picker.take(P.either(P.SPLIT, P.BULK)), picker.take(P.either(P.SPLIT, P.BULK)), polar=True)
    drive = picker.take(P.DRIVE_TRANSFORMER)
    windings = drive_windings(view, drive)
    switch_x = _bridge_path(drawing, view, windings)
    base_x = _switches(drawing, switch_x, picker.take(P.UPPER_SWITCH), picker.take(P.LOWER_SWITCH))
    labels_end = _base_windings(drawing, switch_x, base_x, windings)
    network = _start_up_parts(picker)
    taps = (switch_x, base_x + 0.8)  # where the switches and the lower base winding meet the rails
    if network is None:
        _rails(drawing, taps[0], taps[1], taps)
    else:
        start_x = _start_up(drawing, base_x, labels_end, network)
        _rails(drawing, start_x, start_x, taps)
    return finish_stage(drawing, view, picker)


def drive_windings(view: StageView, drive: PartView) -> DriveWindings:
    """Labels for the base-drive transformer's three windings, with turns and wire when recorded;
    the feedback winding's label also names the part."""
    caption = drive.label.replace("\n", " ")
    magnetic = view.magnetic(drive.ref)
    if magnetic is None:
        return DriveWindings(f"{caption}\n{drive.ref} feedback", f"{drive.ref} upper base", f"{drive.ref} lower base")
    feedback = next((w for w in magnetic.windings if w.role == "feedback"), None)
    bases = [w for w in magnetic.windings if w.role != "feedback"]
    upper = next((w for w in bases if "upper" in w.name.lower()), bases[0] if bases else None)
    lower = next((w for w in bases if w is not upper), None)
    feedback_text, upper_text, lower_text = (f"{drive.ref} {w.label}" if w else drive.ref for w in (feedback, upper, lower))
    return DriveWindings(f"{caption}\n{feedback_text}", upper_text, lower_text)


def _bridge_path(drawing, view: StageView, windings: DriveWindings) -> float:
    """From the capacitor midpoint through the transformer primary and the feedback winding to the switch node."""
    load = view.load or "transformer primary"
    x = CAP_X
    sheet.dot(drawing, (x, MID))
    for words in (load, windings.feedback):
        x = _horizontal_winding(drawing, x, words)
    sheet.wire(drawing, (x, MID), (x + 0.7, MID))
    return x + 0.7


def _horizontal_winding(drawing, x: float, words: str) -> float:
    length = max(2.2, sheet.text_width(words) + 0.4)
    sheet.add(drawing, Winding(humps=4, core=True).at((x, MID)).right(length))
    sheet.text(drawing, (x + length / 2, MID + 0.55), words, halign="center", valign="bottom")
    return x + length


def _switches(drawing, x: float, upper: PartView, lower: PartView) -> float:
    """Upper switch from the positive rail to the switch node, lower from there to the negative rail."""
    top = sheet.add(drawing, elm.BjtNpn().reverse().anchor("collector").at((x, TOP - 1.2)))
    bottom = sheet.add(drawing, elm.BjtNpn().reverse().anchor("collector").at((x, MID - 1.4)))
    sheet.wire(drawing, (x, TOP), top.collector)
    sheet.wire(drawing, top.emitter, bottom.collector)
    sheet.wire(drawing, bottom.emitter, (x, BOTTOM))
    for device, part in ((top, upper), (bottom, lower)):
        sheet.text(drawing, (x - 0.45, device.base[1]), part.label, halign="right")
    sheet.dot(drawing, (x, MID))
    return top.base[0]


def _base_windings(drawing, switch_x: float, base_x: float, windings: DriveWindings) -> float:
    """Each base winding runs from its switch's base down to that switch's emitter."""
    upper_base, lower_base = TOP - 1.2 - 0.7, MID - 1.4 - 0.7
    winding_x = base_x + 0.8
    joins = MID + 0.7
    sheet.wire(drawing, (base_x, upper_base), (winding_x, upper_base))
    sheet.add(drawing, Winding(humps=3, core=True).at((winding_x, upper_base)).to((winding_x, joins)))
    sheet.wire(drawing, (winding_x, joins), (switch_x, joins))
    sheet.dot(drawing, (switch_x, joins))
    sheet.wire(drawing, (base_x, lower_base), (winding_x, lower_base))
    sheet.add(drawing, Winding(humps=3, core=True).at((winding_x, lower_base)).to((winding_x, BOTTOM)))
    sheet.text(drawing, (winding_x + 0.55, (upper_base + joins) / 2), windings.upper)
    sheet.text(drawing, (winding_x + 0.55, lower_base / 2), windings.lower)
    widest = max(sheet.text_width(windings.upper), sheet.text_width(windings.lower))
    return winding_x + 0.55 + widest


def _start_up_parts(picker: Picker) -> tuple[PartView, PartView, PartView] | None:
    """Start-up resistor, capacitor and trigger, taken only when all three are there."""
    tests = (P.START_RESISTOR, P.START_CAPACITOR, P.TRIGGER)
    if any(picker.peek(test) is None for test in tests):
        return None
    return tuple(picker.take(test) for test in tests)


def _start_up(drawing, base_x: float, labels_end: float, network) -> float:
    """Resistor and capacitor charge to the trigger's breakover voltage; the trigger fires the lower base."""
    resistor, capacitor, trigger = network
    node, joint = MID - 1.4 - 0.7, base_x + 0.8
    x = max(labels_end, joint + sheet.text_width(trigger.label) + 0.6) + 0.8
    sheet.add(drawing, elm.ResistorIEC().at((x, TOP)).to((x, node)))
    sheet.add(drawing, elm.Capacitor().at((x, node)).to((x, BOTTOM)))
    sheet.add(drawing, elm.Diac().at((x, node)).to((joint, node)))
    for point in ((x, node), (joint, node)):
        sheet.dot(drawing, point)
    sheet.text(drawing, ((x + joint) / 2, node + 0.7), trigger.label, halign="center", valign="bottom")
    sheet.text(drawing, (x + 0.45, (TOP + node) / 2), resistor.label)
    sheet.text(drawing, (x + 0.45, node / 2), capacitor.label)
    return x


def _rails(drawing, top_end: float, bottom_end: float, taps: tuple[float, float]) -> None:
    """Both rails, with a junction dot wherever a tap joins a rail that runs on past it."""
    sheet.wire(drawing, (0, TOP), (top_end, TOP))
    sheet.wire(drawing, (0, BOTTOM), (bottom_end, BOTTOM))
    joins = {TOP: (CAP_X, taps[0]), BOTTOM: (CAP_X, *taps)}
    for y, end in ((TOP, top_end), (BOTTOM, bottom_end)):
        for x in joins[y]:
            if x < end:
                sheet.dot(drawing, (x, y))


def handles(view: StageView) -> bool:
    return view.kind == "converter" and view.topology == TOPOLOGY


def missing(view: StageView) -> list[str]:
    return lacking(Picker(view.parts), NEEDS)


DRAWER = StageDrawer("self-oscillating half-bridge", handles, missing, draw)
