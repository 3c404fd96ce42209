"""A shunt regulator: the series (dropping) resistor in the live rail, then the regulating element across
the rails (zener diodes, a shunt reference, a transistor or a gas regulator valve), then the capacitors."""

from __future__ import annotations

from dossier.drawing import parts as P
from dossier.drawing.drawers import StageDrawer, finish_stage, lacking
from dossier.drawing.parts import Picker
from dossier.drawing.stages.filter import BLEEDER
from dossier.drawing.stages.ladder import opened_ladder
from dossier.drawing.views import StageView

TOPOLOGY = "shunt"
DROPPING = P.either(P.kind_and_role(("resistor",), ("series", "dropping", "ballast", "feed")), P.kind("resistor"))
SHUNT_ELEMENT = P.either(P.kind("zener", "regulator", "reference", "valve", "tube", "neon"),
                         P.kind_and_role(P.SWITCHING_DEVICES + ("diode",), ("shunt", "zener", "reference", "regulat")))


def draw(view: StageView):
    drawing, picker, ladder = opened_ladder(view)
    bleeders = picker.take_all(BLEEDER)
    for part in picker.take_all(DROPPING):
        ladder.series(part)
    for part in picker.take_all(SHUNT_ELEMENT):
        ladder.shunt(part)
    for part in picker.take_all(P.CAPACITOR) + bleeders:
        ladder.shunt(part)
    if not bleeders:
        ladder.bleeders()
    ladder.outputs()
    return finish_stage(drawing, view, picker)


def handles(view: StageView) -> bool:
    return view.kind == "regulator" and view.topology.lower() == TOPOLOGY


def missing(view: StageView) -> list[str]:
    return lacking(Picker(view.parts), {"a shunt element (zener, shunt reference or regulator)": SHUNT_ELEMENT})


DRAWER = StageDrawer("shunt regulator", handles, missing, draw)
