"""Smoothing filters after a rectifier, drawn as a ladder: capacitor-input (C), LC, CLC and choke-input
filters (the capacitors across the rails, the chokes or series resistors in the live rail, in the order
the topology gives), then a bleeder across the output where the stage has one or its rail declares one."""

from __future__ import annotations

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage, lacking
from dossier.drawing.parts import Picker
from dossier.drawing.stages.ladder import opened_ladder
from dossier.drawing.views import StageView

SERIES_ELEMENT = P.either(P.CHOKE, P.kind_and_role(("resistor",), ("series", "dropping", "filter resistor")))
BLEEDER = P.either(P.role("bleed"), P.kind("bleeder"))
FILTER_CAPACITOR = P.CAPACITOR
# how many capacitors come before the series elements, by topology; None: every capacitor first
CAPACITORS_FIRST = {"capacitor-input": None, "c": None, "lc": 0, "choke-input": 0, "clc": 1, "crc": 1}
NEEDS = {
    "capacitor-input": ("a capacitor",),
    "c": ("a capacitor",),
    "lc": ("a choke", "a capacitor"),
    "choke-input": ("a choke", "a capacitor"),
    "clc": ("a capacitor", "a choke or series resistor"),
    "crc": ("a capacitor", "a choke or series resistor"),
}
TESTS = {"a capacitor": FILTER_CAPACITOR, "a second capacitor": FILTER_CAPACITOR, "a choke": P.CHOKE,
         "a choke or series resistor": SERIES_ELEMENT, "a capacitor or a choke": P.either(FILTER_CAPACITOR, P.CHOKE)}


def draw(view: StageView):
    drawing, picker, ladder = opened_ladder(view)
    bleeders = picker.take_all(BLEEDER)
    capacitors, series = picker.take_all(FILTER_CAPACITOR), picker.take_all(SERIES_ELEMENT)
    first = CAPACITORS_FIRST.get(view.topology.lower())
    if first and len(capacitors) <= first:  # a CLC whose input capacitor sits in the stage before (the rectifier's reservoir)
        first = 0
        sheet.note(drawing, (0, ladder.ret - 0.6), f"{view.topology}: its input capacitor is in the stage feeding this one")
    leading = capacitors if first is None else capacitors[:first]
    for part in leading:
        ladder.shunt(part)
    for part in series:
        ladder.series(part)
    for part in capacitors[len(leading):]:
        ladder.shunt(part)
    for part in bleeders:
        ladder.shunt(part)
    if not bleeders:
        ladder.bleeders()
    if view.topology.lower() == "choke-input":
        sheet.note(drawing, (0, ladder.ret - 0.6), "choke input: the choke comes before the first capacitor, so the output\n"
                   "sits near the rectified average (0.9 x RMS full-wave), not the peak")
    ladder.outputs()
    return finish_stage(drawing, view, picker)


def handles(view: StageView) -> bool:
    return view.kind == "filter" and view.topology.lower() in (*CAPACITORS_FIRST, "")


def missing(view: StageView) -> list[str]:
    needs = NEEDS.get(view.topology.lower(), ("a capacitor or a choke",))
    return lacking(Picker(view.parts), {need: TESTS[need] for need in needs})


DRAWER = StageDrawer("filter", handles, missing, draw)
