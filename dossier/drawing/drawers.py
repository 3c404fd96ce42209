"""The contract every stage drawer keeps, and the finishing touches all stage drawings share."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Callable

import schemdraw

from dossier.drawing import sheet
from dossier.drawing.parts import Picker, leftover_text
from dossier.drawing.views import StageView


@dataclass(frozen=True)
class StageDrawer:
    """Draws one kind of stage.

    handles(view)  whether this drawer knows the stage's kind and topology
    missing(view)  what the stage lacks for this drawer, as phrases; empty when it can be drawn
    draw(view)     the finished drawing
    """

    name: str
    handles: Callable[[StageView], bool]
    missing: Callable[[StageView], list[str]]
    draw: Callable[[StageView], schemdraw.Drawing]


def lacking(picker: Picker, needs: dict[str, Callable]) -> list[str]:
    """The phrases in needs whose test matches no part (each test may take one part)."""
    return [phrase for phrase, test in needs.items() if picker.take(test) is None]


def finish_stage(drawing, view: StageView, picker: Picker, drawn_barriers=()) -> schemdraw.Drawing:
    """List parts the drawer did not place and barriers it did not draw, then mark a hazardous stage."""
    _list_leftovers(drawing, picker)
    for barrier in view.barriers:
        if barrier.name not in drawn_barriers:
            _barrier_note(drawing, view, barrier)
    mark_stage(drawing, view)
    return drawing


def mark_stage(drawing, view: StageView) -> None:
    """Shade a mains stage, or an isolated one above the extra-low-voltage limits, each its own way."""
    if view.on_mains:
        mark_hazardous(drawing)
    elif view.hazardous_dc:
        mark_high_voltage(drawing, view.hazard)


def _barrier_note(drawing, view: StageView, barrier) -> None:
    """A barrier a part of this stage forms or bridges, where the drawing has no line for it."""
    refs = ", ".join(p.ref for p in view.parts if p.ref in barrier.parts)
    xmin, ymin, _, _ = sheet.extent(drawing)
    words = f"{refs} is listed as forming or bridging this barrier:"
    sheet.text(drawing, (xmin, ymin - 0.4), words, valign="top", size=sheet.SMALL_FONT, colour=sheet.BARRIER_INK)
    sheet.barrier_label(drawing, (xmin, ymin - 0.4 - sheet.text_height(words, sheet.SMALL_FONT)), barrier)


def _list_leftovers(drawing, picker: Picker) -> None:
    words = leftover_text(picker.leftover())
    if words:
        xmin, ymin, _, _ = sheet.extent(drawing)
        sheet.note(drawing, (xmin, ymin - 0.4), words)


def mark_hazardous(drawing, right: float | None = None) -> None:
    """Shade the drawing (or the part left of x = right) and head it with the hazard mark."""
    xmin, ymin, xmax, ymax = sheet.extent(drawing)
    sheet.hazard_heading(drawing, (xmin, ymax + 0.55))
    edge = xmax + 0.25 if right is None else right
    sheet.shade(drawing, (xmin - 0.25, ymax + 1.0), (edge, ymin - 0.25))


def mark_high_voltage(drawing, rails, left: float | None = None) -> None:
    """Hatch the drawing (or the part right of x = left) and head it with the rails that make it hazardous."""
    xmin, ymin, xmax, ymax = sheet.extent(drawing)
    edge = xmin - 0.25 if left is None else left
    sheet.hazard_heading(drawing, (edge + 0.25, ymax + 0.55), sheet.high_voltage_heading(rails), sheet.HIGH_VOLTAGE_INK)
    _, _, right, top = sheet.extent(drawing)
    sheet.shade_high_voltage(drawing, (edge, top + 0.2), (max(xmax, right) + 0.25, ymin - 0.25))
