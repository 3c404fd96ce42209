"""The output: the series parts in the positive lead (reverse-polarity diode, fuse, switch) and a diode
whose role says it sits across the output, in the record's order, then the output terminals and, for a
charger, the battery."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.stages.ladder import Ladder
from dossier.drawing.views import PartView, StageView

POSITIVE, NEGATIVE = 2.4, 0.0
SERIES = P.either(P.FUSE, P.SWITCH, P.DIODE, P.kind("resistor", "ntc", "thermistor", "shunt"))
ACROSS = P.kind_and_role(("diode", "schottky", "rectifier"), ("across", "shunt"))


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    ladder = Ladder(drawing, view, POSITIVE, NEGATIVE)
    ladder.inputs()
    for part in picker.take_all(P.either(ACROSS, SERIES)):
        if ACROSS(part):
            ladder.shunt(part)
        else:
            ladder.series(part)
    ladder.bleeders()
    x = _terminals(drawing, ladder.x, picker.take(P.TERMINAL), view)
    if view.output is not None and view.output.battery:
        _battery(drawing, x, view.output.battery)
    return finish_stage(drawing, view, picker)


def _terminals(drawing, x: float, terminal: PartView | None, view: StageView) -> float:
    """The output terminals as connection points, named with the terminal part when there is one and
    with the rails the stage delivers."""
    end = x + 0.8
    for y in (POSITIVE, NEGATIVE):
        sheet.wire(drawing, (x, y), (end, y))
        sheet.add(drawing, elm.Dot(open=True, radius=0.11).at((end + 0.11, y)))
    words = terminal.label if terminal is not None else "output"
    sheet.text(drawing, (end + 0.11, POSITIVE + 0.45), words, halign="center", valign="bottom")
    if view.rails and not (view.output is not None and view.output.battery):
        sheet.text(drawing, (end + 0.5, POSITIVE), ", ".join(rail.label for rail in view.rails))
        sheet.text(drawing, (end + 0.5, NEGATIVE), "0 V" if all(rail.direct for rail in view.rails) else "~")
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
