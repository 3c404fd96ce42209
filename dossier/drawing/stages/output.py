"""The output: the series parts in the positive lead (reverse-polarity diode, fuse, switch) and a diode
whose role says it sits across the output, in the record's order, then the output terminals and, for a
charger, the battery."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.views import PartView, StageView

POSITIVE, NEGATIVE = 2.4, 0.0
SERIES = P.either(P.FUSE, P.SWITCH, P.DIODE, P.kind("resistor", "ntc", "thermistor", "shunt"))
ACROSS = P.kind_and_role(("diode", "schottky", "rectifier"), ("across", "shunt"))


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    _inputs(drawing, view)
    x = 0.0
    for part in picker.take_all(P.either(ACROSS, SERIES)):
        x = _across(drawing, x, part) if ACROSS(part) else _series(drawing, x, part)
    x = _terminals(drawing, x, picker.take(P.TERMINAL))
    if view.output is not None and view.output.battery:
        _battery(drawing, x, view.output.battery)
    return finish_stage(drawing, view, picker)


def _inputs(drawing, view: StageView) -> None:
    origin = f" from {view.came_from}" if view.came_from else ""
    sheet.terminal(drawing, (-0.11, POSITIVE), f"{view.pole(True)}{origin}", side="left")
    sheet.terminal(drawing, (-0.11, NEGATIVE), f"{view.pole(False)}{origin}", side="left")


def _series(drawing, x: float, part: PartView) -> float:
    length = max(sheet.UNIT, sheet.text_width(part.label) + 0.5)
    sheet.add(drawing, _symbol(part).at((x, POSITIVE)).right(length))
    sheet.text(drawing, (x + length / 2, POSITIVE + 0.45), part.label, halign="center", valign="bottom")
    sheet.wire(drawing, (x, NEGATIVE), (x + length, NEGATIVE))
    return x + length


def _across(drawing, x: float, part: PartView) -> float:
    """A diode across the rails, cathode to the positive one: it conducts only when the battery is reversed."""
    at = x + 0.8
    sheet.add(drawing, _symbol(part).at((at, NEGATIVE)).to((at, POSITIVE)))
    sheet.text(drawing, (at + 0.45, (POSITIVE + NEGATIVE) / 2), part.label)
    end = at + sheet.text_width(part.label) + 0.9
    for y in (POSITIVE, NEGATIVE):
        sheet.wire(drawing, (x, y), (end, y))
        sheet.dot(drawing, (at, y))
    return end


def _symbol(part: PartView):
    if P.FUSE(part):
        return elm.FuseIEC()
    if P.SWITCH(part):
        return elm.Switch()
    if P.DIODE(part):
        return elm.Schottky() if "schottky" in f"{part.kind} {part.value}".lower() else elm.Diode()
    return elm.ResistorIEC()


def _terminals(drawing, x: float, terminal: PartView | None) -> float:
    """The output terminals as connection points, named with the terminal part when there is one."""
    end = x + 0.8
    for y in (POSITIVE, NEGATIVE):
        sheet.wire(drawing, (x, y), (end, y))
        sheet.add(drawing, elm.Dot(open=True, radius=0.11).at((end + 0.11, y)))
    words = terminal.label if terminal is not None else "output"
    sheet.text(drawing, (end + 0.11, POSITIVE + 0.45), words, halign="center", valign="bottom")
    return end + 0.22


def _battery(drawing, x: float, words: str) -> None:
    """The battery on its leads, drawn beyond the terminals."""
    cell_x = x + 1.6
    sheet.wire(drawing, (x, POSITIVE), (cell_x, POSITIVE))
    sheet.wire(drawing, (x, NEGATIVE), (cell_x, NEGATIVE))
    sheet.add(drawing, elm.Battery().at((cell_x, POSITIVE)).to((cell_x, NEGATIVE)))
    sheet.text(drawing, (cell_x + 0.6, (POSITIVE + NEGATIVE) / 2), words)


def handles(view: StageView) -> bool:
    return view.kind == "output"


def missing(view: StageView) -> list[str]:
    return []


DRAWER = StageDrawer("output", handles, missing, draw)
