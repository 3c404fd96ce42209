"""A switching (buck) regulator: input capacitors, the controller with its switch in the live rail, the
freewheel diode from the switch node to the return, the inductor, then the output capacitors."""

from __future__ import annotations

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage, lacking
from dossier.drawing.parts import Picker
from dossier.drawing.stages.filter import BLEEDER
from dossier.drawing.stages.ladder import Ladder, opened_ladder
from dossier.drawing.symbols import Box
from dossier.drawing.views import PartView, StageView

TOPOLOGY = "switching"
CONTROLLER = P.either(P.kind("regulator", "controller", "ic"), P.role("regulator", "controller", "pwm"))
SWITCH_DEVICE = P.kind(*P.SWITCHING_DEVICES)
FREEWHEEL = P.either(P.kind_and_role(("diode", "schottky"), ("freewheel", "catch", "flywheel")), P.kind("diode", "schottky"))
INPUT_CAPACITOR = P.kind_and_role(P.CAPACITORS, ("input",))


def draw(view: StageView):
    drawing, picker, ladder = opened_ladder(view)
    for part in picker.take_all(INPUT_CAPACITOR):
        ladder.shunt(part)
    _switch_block(ladder, [picker.take(CONTROLLER), picker.take(SWITCH_DEVICE)])
    diode = picker.take(FREEWHEEL)
    if diode is not None:
        ladder.shunt(diode)
    for choke in picker.take_all(P.CHOKE):
        ladder.series(choke)
    bleeders = picker.take_all(BLEEDER)
    for part in picker.take_all(P.CAPACITOR) + bleeders:
        ladder.shunt(part)
    if not bleeders:
        ladder.bleeders()
    ladder.outputs()
    return finish_stage(drawing, view, picker)


def _switch_block(ladder: Ladder, found: list[PartView | None]) -> None:
    """The controller and its switch as one block in the live rail, with the return tied to it."""
    lines = [f"{p.ref} {p.value}".strip() + (f"\n({p.role})" if p.role else "") for p in found if p is not None]
    words = "\n".join(lines)
    width, height = sheet.text_width(words) + 0.8, sheet.text_height(words) + 0.5
    top = ladder.live + height / 2
    ladder.run(0.6)
    box = sheet.add(ladder.drawing, Box(width, height, words).at((ladder.x, top)))
    sheet.wire(ladder.drawing, box.S, (box.S[0], ladder.ret))
    sheet.dot(ladder.drawing, (box.S[0], ladder.ret))
    sheet.wire(ladder.drawing, (ladder.x, ladder.ret), (ladder.x + width, ladder.ret))
    ladder.x += width


def handles(view: StageView) -> bool:
    return view.kind == "regulator" and view.topology.lower() == TOPOLOGY


def missing(view: StageView) -> list[str]:
    return lacking(Picker(view.parts), {"a controller or switching regulator": P.either(CONTROLLER, SWITCH_DEVICE),
                                        "an inductor": P.CHOKE})


DRAWER = StageDrawer("switching regulator", handles, missing, draw)
