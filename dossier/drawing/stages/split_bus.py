"""What both half-bridge drawers share: the DC bus coming in and the split capacitors that make its midpoint."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import sheet
from dossier.drawing.views import PartView, StageView

TOP, MID, BOTTOM = 8.0, 4.0, 0.0
CAP_X = 2.6


def bus_inputs(drawing, view: StageView) -> None:
    origin = f" from {view.came_from}" if view.came_from else ""
    sheet.terminal(drawing, (-0.11, TOP), f"+DC{origin}", side="left")
    sheet.terminal(drawing, (-0.11, BOTTOM), f"\u2212DC{origin}", side="left")


def split_capacitors(drawing, upper: PartView, lower: PartView, polar: bool) -> None:
    """Electrolytics (polar) or film capacitors from each rail to the midpoint, each with its label."""
    for part, (top, bottom) in ((upper, (TOP, MID)), (lower, (MID, BOTTOM))):
        sheet.add(drawing, elm.Capacitor(polar=polar).at((CAP_X, top)).to((CAP_X, bottom)))
        sheet.text(drawing, (CAP_X - 0.45, (top + bottom) / 2), part.label, halign="right")
