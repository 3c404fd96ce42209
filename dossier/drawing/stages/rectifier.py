"""Output rectifier: a centre-tapped pair of diodes (one dual part or two), a bridge (one part or four
diodes) or a single half-wave diode, fed from the transformer secondary, then the output choke, capacitors
and bleeder when the stage has them (drawn as a ladder, see ladder.py)."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.stages.filter import BLEEDER
from dossier.drawing.stages.ladder import Ladder
from dossier.drawing.symbols import BridgeRectifier, Winding
from dossier.drawing.views import PartView, StageView

TOP, BOTTOM, RAIL = 4.0, 0.0, -1.6
CENTRE_TAPPED = ("centre-tapped", "center-tapped", "centre-tap", "center-tap")
BRIDGE = ("bridge", "full-wave-bridge")
HALF_WAVE = ("half-wave",)


def topology(view: StageView) -> str:
    """'centre-tapped', 'bridge' or 'half-wave' from the record, or guessed from the parts when not given; else ''."""
    named = view.topology.lower()
    if named in HALF_WAVE:
        return "half-wave"
    if named in CENTRE_TAPPED or (not named and Picker(view.parts).peek(P.DIODE) and not _has_bridge(view)):
        return "centre-tapped"
    if named in BRIDGE or (not named and _has_bridge(view)):
        return "bridge"
    return ""


def _rectifier_diodes(picker: Picker) -> list[PartView]:
    """One dual diode or two diodes, those with a rectifying role first."""
    found = [picker.take(P.RECTIFIER_DIODE) or picker.take(P.DIODE) for _ in range(2)]
    return [d for d in found if d is not None]


def _has_bridge(view: StageView) -> bool:
    return Picker(view.parts).peek(P.BRIDGE) is not None


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    shape = topology(view)
    if shape == "bridge":
        x, positive, negative = _bridge(drawing, view, _bridge_label(picker))
    elif shape == "half-wave":
        x, positive, negative = _half_wave(drawing, view, picker.take(P.RECTIFIER_DIODE) or picker.take(P.DIODE))
    else:
        x, positive, negative = _centre_tapped(drawing, view, _rectifier_diodes(picker))
    ladder = Ladder(drawing, view, positive, negative)
    ladder.x = x
    smoothing(ladder, picker)
    ladder.outputs(*_output_names(view))
    return finish_stage(drawing, view, picker)


def smoothing(ladder: Ladder, picker: Picker) -> None:
    """The choke in the live rail, then each capacitor across the rails, then a bleeder."""
    choke = picker.take(P.CHOKE)
    if choke is not None:
        ladder.series(choke)
    for capacitor in picker.take_all(P.CAPACITOR):
        ladder.shunt(capacitor)
    bleeders = picker.take_all(BLEEDER)
    for part in bleeders:
        ladder.shunt(part)
    if not bleeders:
        ladder.bleeders()


def _output_names(view: StageView) -> tuple[str | None, str | None]:
    """A rectifier's outputs are DC whatever came in: '+'/'−' unless the stage names its rails."""
    if view.rails:
        return None, None
    return ("−", "+") if negative_output(view) else ("+", "−")


def negative_output(view: StageView) -> bool:
    """The stage makes a negative rail: its rail says so, or a part's role does (e.g. a bias supply)."""
    return Ladder(None, view).negative


def secondary(drawing, view: StageView, top: float, bottom: float, humps: int, x: float = 0.0):
    """The transformer secondary feeding the stage, drawn on the left."""
    coil = sheet.add(drawing, Winding(humps=humps).at((x, top)).to((x, bottom)))
    source = view.supply.replace(" (", "\n(") or "transformer\nsecondary"
    sheet.text(drawing, (x - 0.4, top), source, halign="right", valign="top")
    return coil


def _half_wave(drawing, view: StageView, diode: PartView):
    """One diode from the top of the secondary to the live rail; for a negative rail it points back."""
    secondary(drawing, view, TOP, BOTTOM, humps=6)
    length = max(sheet.UNIT, sheet.text_width(diode.label) + 0.4)
    symbol = diode_symbol(diode)
    if negative_output(view):
        sheet.add(drawing, symbol.at((0.8 + length, TOP)).left(length))
    else:
        sheet.add(drawing, symbol.at((0.8, TOP)).right(length))
    sheet.wire(drawing, (0, TOP), (0.8, TOP))
    sheet.text(drawing, (0.8 + length / 2, TOP + 0.45), diode.label, halign="center", valign="bottom")
    sheet.wire(drawing, (0, BOTTOM), (0.8 + length, BOTTOM))
    return 0.8 + length, TOP, BOTTOM


def _centre_tapped(drawing, view: StageView, diodes: list[PartView]):
    """Each half of the secondary through its diode to a common cathode; the centre tap is the return."""
    coil = secondary(drawing, view, TOP, BOTTOM, humps=8)
    upper, lower = diodes[0], diodes[-1]
    length = max(sheet.UNIT, sheet.text_width(upper.label) + 0.4)
    cathode_x = 0.8 + length + 0.7
    for part, y, label in ((upper, TOP, upper.label), (lower, BOTTOM, lower.label if lower is not upper else lower.ref)):
        sheet.wire(drawing, (0, y), (0.8, y))
        sheet.add(drawing, diode_symbol(part).at((0.8, y)).right(length))
        sheet.text(drawing, (0.8 + length / 2, y + 0.45), label, halign="center", valign="bottom")
    sheet.wire(drawing, (0.8 + length, TOP), (cathode_x, TOP))
    sheet.wire(drawing, (0.8 + length, BOTTOM), (cathode_x, BOTTOM), (cathode_x, TOP))
    sheet.dot(drawing, (cathode_x, TOP))
    sheet.wire(drawing, coil.tap, (-0.9, coil.tap[1]), (-0.9, RAIL), (cathode_x, RAIL))
    sheet.text(drawing, (-0.75, coil.tap[1] + 0.05), "CT", halign="left", valign="bottom")
    return cathode_x, TOP, RAIL


def _bridge_label(picker: Picker) -> str:
    """A bridge part's label, else the four diodes that make the bridge: 'D5, D6, D7, D8' over their value."""
    bridge = picker.take(P.BRIDGE)
    if bridge is not None:
        return bridge.label
    diodes = [d for d in (picker.take(P.RECTIFIER_DIODE) or picker.take(P.DIODE) for _ in range(4)) if d is not None]
    values = sorted({d.value for d in diodes if d.value})
    return "\n".join([", ".join(d.ref for d in diodes)] + values)


def _bridge(drawing, view: StageView, label: str):
    """The secondary into the bridge's AC pins; DC leaves on the right."""
    secondary(drawing, view, TOP - 0.8, BOTTOM + 0.8, humps=6)
    body = sheet.add(drawing, BridgeRectifier().at((2.0, (TOP + BOTTOM) / 2)))
    sheet.wire(drawing, (0, TOP - 0.8), (1.4, TOP - 0.8), (1.4, body.ac1[1]), body.ac1)
    sheet.wire(drawing, (0, BOTTOM + 0.8), (1.4, BOTTOM + 0.8), (1.4, body.ac2[1]), body.ac2)
    sheet.text(drawing, (2.8, (TOP + BOTTOM) / 2 + 1.05), label, halign="center", valign="bottom")
    right = body.plus[0] + 0.6
    sheet.wire(drawing, body.plus, (right, body.plus[1]), (right, TOP))
    sheet.wire(drawing, body.minus, (right, body.minus[1]), (right, BOTTOM))
    return right, TOP, BOTTOM


def handles(view: StageView) -> bool:
    return view.kind == "rectifier" and topology(view) != ""


def missing(view: StageView) -> list[str]:
    picker = Picker(view.parts)
    if topology(view) == "bridge":
        four_diodes = len(picker.take_all(P.DIODE)) >= 4
        return [] if Picker(view.parts).peek(P.BRIDGE) or four_diodes else ["a bridge rectifier part or four diodes"]
    return [] if picker.peek(P.DIODE) else ["a rectifier diode"]


def diode_symbol(part: PartView):
    return elm.Schottky() if "schottky" in f"{part.kind} {part.value}".lower() else elm.Diode()


DRAWER = StageDrawer("rectifier", handles, missing, draw)
