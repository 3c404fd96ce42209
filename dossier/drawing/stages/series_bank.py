"""A series capacitor bank: capacitors stacked in series across the rail, each with the balancing resistor
that shares the voltage between them beside it. A capacitor with no balancing resistor is named under the
drawing, since without one the voltage splits by leakage current, not equally."""

from __future__ import annotations

from dossier.drawing import parts as P
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.stages.filter import BLEEDER, SERIES_ELEMENT
from dossier.drawing.stages.ladder import opened_ladder
from dossier.drawing.views import PartView, StageView

TOPOLOGY = "series-bank"
BALANCING = P.kind_and_role(("resistor",), ("balanc", "shar", "equalis", "equaliz"))


def draw(view: StageView):
    drawing, picker, ladder = opened_ladder(view)
    for part in picker.take_all(SERIES_ELEMENT):
        ladder.series(part)
    capacitors = picker.take_all(P.CAPACITOR)
    pairs = balancing_pairs(capacitors, picker.take_all(BALANCING))
    ladder.stack(capacitors, pairs)
    bleeders = picker.take_all(BLEEDER)
    for part in bleeders:
        ladder.shunt(part)
    if not bleeders:
        ladder.bleeders()
    ladder.outputs()
    return finish_stage(drawing, view, picker)


def balancing_pairs(capacitors: list[PartView], resistors: list[PartView]) -> list[PartView | None]:
    """The resistor across each capacitor: the one whose role names it, else the next one unnamed."""
    free = [r for r in resistors if not any(c.ref in r.role.split() for c in capacitors)]
    pairs = []
    for capacitor in capacitors:
        named = next((r for r in resistors if capacitor.ref in r.role.replace(",", " ").split()), None)
        pairs.append(named or (free.pop(0) if free else None))
    return pairs


def handles(view: StageView) -> bool:
    return view.kind == "filter" and view.topology.lower() == TOPOLOGY


def missing(view: StageView) -> list[str]:
    count = len(Picker(view.parts).take_all(P.CAPACITOR))
    return [] if count >= 2 else ["two or more capacitors in series"]


DRAWER = StageDrawer("series capacitor bank", handles, missing, draw)
