"""Voltage doublers. The full-wave (bridge) doubler: the secondary between the diodes' midpoint and the
midpoint of two capacitors in series, each capacitor charging to the peak on its own half-cycle. The
half-wave doubler, chosen when a capacitor's role says it is the pump (series) capacitor: that capacitor
in series with the secondary, a clamp diode to the return, then a peak rectifier into the reservoir."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage, lacking
from dossier.drawing.parts import Picker
from dossier.drawing.stages.ladder import Ladder, polarised
from dossier.drawing.stages.rectifier import diode_symbol, secondary, smoothing
from dossier.drawing.symbols import Winding
from dossier.drawing.views import PartView, StageView

TOPOLOGY = "doubler"
TOP, MIDDLE, BOTTOM = 5.0, 2.0, -1.0
PUMP = P.kind_and_role(P.CAPACITORS, ("pump", "series capacitor", "coupling"))
RECTIFIER = P.either(P.RECTIFIER_DIODE, P.DIODE)


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    diodes = [picker.take(RECTIFIER), picker.take(RECTIFIER)]
    pump = picker.take(PUMP)
    if pump is None:
        x = _full_wave(drawing, view, diodes, [picker.take(P.CAPACITOR), picker.take(P.CAPACITOR)])
        live, ret = TOP, BOTTOM
    else:
        x = _half_wave(drawing, view, diodes, pump)
        live, ret = TOP, MIDDLE - 1.0
    ladder = Ladder(drawing, view, live, ret)
    ladder.x = x
    smoothing(ladder, picker)
    ladder.outputs(*((None, None) if view.rails else ("+", "\u2212")))
    return finish_stage(drawing, view, picker)


def _full_wave(drawing, view: StageView, diodes: list[PartView], capacitors: list[PartView]) -> float:
    """Diodes in a column on the left, capacitors in a column on the right, the secondary across between."""
    diode_x = 0.0
    sheet.add(drawing, diode_symbol(diodes[0]).at((diode_x, MIDDLE)).to((diode_x, TOP)))
    sheet.add(drawing, diode_symbol(diodes[1]).at((diode_x, BOTTOM)).to((diode_x, MIDDLE)))
    for diode, y in zip(diodes, ((MIDDLE + TOP) / 2, (MIDDLE + BOTTOM) / 2)):
        sheet.text(drawing, (diode_x - 0.45, y), diode.label, halign="right")
    source = view.supply or "transformer secondary"
    length = max(3.0, sheet.text_width(source) + 0.6)
    sheet.add(drawing, Winding(humps=6).at((diode_x, MIDDLE)).right(length))
    sheet.text(drawing, (diode_x + length / 2, MIDDLE + 0.55), source, halign="center", valign="bottom")
    cap_x = diode_x + length
    for capacitor, (top, bottom) in zip(capacitors, ((TOP, MIDDLE), (MIDDLE, BOTTOM))):
        sheet.add(drawing, elm.Capacitor(polar=polarised(capacitor)).at((cap_x, top)).to((cap_x, bottom)))
        sheet.text(drawing, (cap_x + 0.45, (top + bottom) / 2), capacitor.label)
    for x, y in ((diode_x, MIDDLE), (cap_x, MIDDLE)):
        sheet.dot(drawing, (x, y))
    right = cap_x + max(sheet.text_width(c.label) for c in capacitors) + 0.9
    for y in (TOP, BOTTOM):
        sheet.wire(drawing, (diode_x, y), (right, y))
        sheet.dot(drawing, (cap_x, y))
    return right


def _half_wave(drawing, view: StageView, diodes: list[PartView], pump: PartView) -> float:
    """The pump capacitor from the top of the secondary, the clamp diode from the return up to it, then
    the peak rectifier along the live rail."""
    ret = MIDDLE - 1.0
    secondary(drawing, view, TOP, ret, humps=6)
    length = max(sheet.UNIT, sheet.text_width(pump.label) + 0.4)
    sheet.add(drawing, elm.Capacitor(polar=polarised(pump)).at((0, TOP)).right(length))
    sheet.text(drawing, (length / 2, TOP + 0.55), pump.label, halign="center", valign="bottom")
    node = length
    sheet.add(drawing, diode_symbol(diodes[0]).at((node, ret)).to((node, TOP)))
    sheet.text(drawing, (node - 0.45, (TOP + ret) / 2), diodes[0].label, halign="right")
    sheet.dot(drawing, (node, TOP))
    sheet.dot(drawing, (node, ret))
    run = max(sheet.UNIT, sheet.text_width(diodes[1].label) + 0.4)
    sheet.add(drawing, diode_symbol(diodes[1]).at((node, TOP)).right(run))
    sheet.text(drawing, (node + run / 2, TOP + 0.45), diodes[1].label, halign="center", valign="bottom")
    sheet.wire(drawing, (0, ret), (node + run, ret))
    return node + run


def handles(view: StageView) -> bool:
    return view.kind == "rectifier" and view.topology.lower() == TOPOLOGY


def missing(view: StageView) -> list[str]:
    return lacking(Picker(view.parts), {"a diode": RECTIFIER, "a second diode": RECTIFIER,
                                        "a capacitor": P.CAPACITOR, "a second capacitor": P.CAPACITOR})


DRAWER = StageDrawer("voltage doubler", handles, missing, draw)
