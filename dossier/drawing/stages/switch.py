"""A switch stage, standby or high-voltage: the switch (and any fuse) in the live rail, any indicator,
snubber or bleeder across the rails, then the outputs. A standby switch breaks the high-voltage rail
while the heaters stay lit, so the note under it says what it leaves live."""

from __future__ import annotations

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage, lacking
from dossier.drawing.parts import Picker
from dossier.drawing.stages.filter import BLEEDER
from dossier.drawing.stages.ladder import opened_ladder
from dossier.drawing.views import StageView

TOPOLOGIES = ("standby", "high-voltage")
IN_LINE = P.either(P.SWITCH, P.FUSE, P.kind("relay", "contact"))
ACROSS = P.either(P.kind("neon", "indicator", "lamp", "led", "capacitor", "resistor", "varistor"), BLEEDER)
NOTES = {
    "standby": "standby: opening the switch removes the high voltage from the load only;\n"
               "the rail before it stays charged and the heaters stay lit",
    "high-voltage": "high-voltage switch: its contact rating must cover the full rail voltage\n"
                    "and the current it breaks",
}


def draw(view: StageView):
    drawing, picker, ladder = opened_ladder(view)
    for part in picker.take_all(IN_LINE):
        ladder.series(part)
    bleeders = picker.take_all(ACROSS)
    for part in bleeders:
        ladder.shunt(part)
    if not any(BLEEDER(part) for part in bleeders):
        ladder.bleeders()
    ladder.outputs()
    note = NOTES.get(view.topology.lower())
    if note:
        sheet.note(drawing, (0, ladder.ret - 0.6), note)
    return finish_stage(drawing, view, picker)


def handles(view: StageView) -> bool:
    return view.kind == "switch"


def missing(view: StageView) -> list[str]:
    return lacking(Picker(view.parts), {"a switch": P.either(P.SWITCH, P.kind("relay", "contact"))})


DRAWER = StageDrawer("switch", handles, missing, draw)
