"""A stage whose circuit no other drawer knows (kind other, or a converter of a topology with no drawing
of its own): the stage as a block between its input and output terminals, and under it each of its
parts with its symbol, designator and value. How the parts connect is not in the record, so it is not
drawn; the drawing says so."""

from __future__ import annotations

from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.stages.ladder import has_symbol, placed, symbol_for
from dossier.drawing.symbols import Box
from dossier.drawing.views import PartView, StageView

LIVE, RETURN = 2.4, 0.0
PART_SPACING = 0.7


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    kind = f"{view.kind}, {view.topology}" if view.topology else view.kind
    words = f"{view.name}\n({kind})"
    width, height = max(4.0, sheet.text_width(words) + 1.0), LIVE - RETURN + 1.2
    box = sheet.add(drawing, Box(width, height, words).at((1.0, LIVE + 0.6)))
    origin = f" from {view.came_from}" if view.came_from else ""
    onward = f" to {view.goes_to}" if view.goes_to else ""
    rails = ", ".join(rail.label for rail in view.rails)
    for y, pole in ((LIVE, True), (RETURN, False)):
        sheet.wire(drawing, (0, y), (1.0, y))
        sheet.terminal(drawing, (-0.11, y), f"{view.pole(pole)}{origin}", side="left")
        out = box.E[0] + 1.0
        sheet.wire(drawing, (box.E[0], y), (out, y))
        name = (rails if pole else ("0 V" if all(r.direct for r in view.rails) else "~")) if rails else view.pole(pole)
        sheet.terminal(drawing, (out + 0.11, y), f"{name}{onward}")
    _parts(drawing, picker.take_all(lambda part: True), RETURN - 1.4)
    return finish_stage(drawing, view, picker)


def _parts(drawing, found: list[PartView], top: float) -> None:
    """Each part upright with its label on its right, in a row; parts with no symbol as a labelled box."""
    if not found:
        sheet.note(drawing, (0, top), "The record lists no parts for this stage.")
        return
    sheet.note(drawing, (0, top), "Its parts (the record does not say how they connect):")
    x, upper = 0.3, top - 0.8
    for part in found:
        if has_symbol(part):
            sheet.add(drawing, placed(symbol_for(part), (x, upper), (x, upper - sheet.UNIT)))
            label_x = x + 0.45
        else:
            width = sheet.text_width(part.kind, sheet.SMALL_FONT) + 0.4
            sheet.add(drawing, Box(width, sheet.UNIT - 0.6, part.kind, fontsize=sheet.SMALL_FONT).at((x - 0.3, upper - 0.3)))
            label_x = x - 0.3 + width + 0.25
        words = part.label + (f"\n({part.role})" if part.role else "")
        sheet.text(drawing, (label_x, upper - sheet.UNIT / 2), words)
        x = label_x + sheet.text_width(words) + PART_SPACING


def handles(view: StageView) -> bool:
    return True


def missing(view: StageView) -> list[str]:
    return []


DRAWER = StageDrawer("block", handles, missing, draw)
