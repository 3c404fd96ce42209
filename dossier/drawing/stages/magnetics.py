"""Transformers and chokes: each winding labelled with its turns and wire (centre tap where
there is one), the core between the sides, and the barrier drawn through the core when the
transformer forms it."""

from __future__ import annotations

from dataclasses import replace

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage, mark_hazardous
from dossier.drawing.parts import Picker
from dossier.drawing.symbols import HUMP, HazardMark, Winding
from dossier.drawing.views import BarrierView, MagneticView, PartView, StageView, WindingView

WINDING_OFFSET = 0.55  # from the core's centre line to a winding
LEAD = 0.3
LEAD_OUT = 0.9
GAP = 0.8  # between windings on one side


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    x, drawn, barrier_cores = 0.0, [], []
    for part in picker.take_all(P.TRANSFORMER):
        barrier = view.barrier_through(part.ref)
        x, core_x, core_bottom = _transformer(drawing, x, part, view, barrier)
        if barrier is not None:
            drawn.append(barrier.name)
            barrier_cores.append((core_x, core_bottom))
    for part in picker.take_all(P.CHOKE):
        x = _choke(drawing, x, part, view.magnetic(part.ref))
    _mark(drawing, view, barrier_cores[0] if barrier_cores else None)
    # finish_stage would shade a whole mains stage; the sides are marked above instead.
    return finish_stage(drawing, replace(view, side="isolated"), picker, drawn)


def _mark(drawing, view: StageView, barrier_core: tuple[float, float] | None) -> None:
    if barrier_core is not None:
        _mark_sides(drawing, *barrier_core)
    elif view.on_mains:
        mark_hazardous(drawing)


def _mark_sides(drawing, barrier_x: float, core_bottom: float) -> None:
    """Shade the mains side of the barrier down to the windings and name both sides above them."""
    xmin, _, _, ymax = sheet.extent(drawing)
    top = ymax + 0.9
    heading = "mains side (hazardous)"
    left = barrier_x - 0.3 - sheet.text_width(heading)
    sheet.add(drawing, HazardMark(size=0.45).at((left - 0.6, top - 0.2)))
    sheet.text(drawing, (barrier_x - 0.3, top), heading, halign="right", colour=sheet.MAINS_INK)
    sheet.text(drawing, (barrier_x + 0.3, top), "isolated side", colour=sheet.BARRIER_INK)
    sheet.barrier_line(drawing, barrier_x, top + 0.3, core_bottom - 0.2)
    sheet.shade(drawing, (min(xmin, left - 0.6) - 0.25, top + 0.45), (barrier_x, core_bottom - 0.2))


def _transformer(drawing, x: float, part: PartView, view: StageView, barrier: BarrierView | None):
    """One transformer at x; returns the next free x, the core's centre line and its bottom."""
    magnetic = view.magnetic(part.ref) or _unrecorded(part)
    primary, secondary = magnetic.side(True), magnetic.side(False)
    core_x = x + _outer_width(primary) + WINDING_OFFSET
    spans = [_side_span(w) for w in (primary, secondary)]
    top = max(spans) / 2
    bottom = _windings(drawing, core_x - WINDING_OFFSET, top - (max(spans) - spans[0]) / 2, primary, -1, view.came_from)
    bottom = min(bottom, _windings(drawing, core_x + WINDING_OFFSET, top - (max(spans) - spans[1]) / 2, secondary, 1, view.goes_to))
    _core(drawing, core_x, top, bottom)
    _part_caption(drawing, core_x, bottom, part, barrier)
    right = core_x + WINDING_OFFSET + _outer_width(secondary)
    return right + 0.6, core_x, bottom


def _outer_width(windings) -> float:
    """From a winding to the far edge of its label, beyond the terminals."""
    return LEAD_OUT + 0.45 + _widest(windings) + 0.3


def _unrecorded(part: PartView) -> MagneticView:
    """A transformer with no magnetics entry: one winding a side, unlabelled turns."""
    return MagneticView(part.ref, part.value, (
        WindingView("primary", "primary", "?", "wire not recorded", False),
        WindingView("secondary", "secondary", "?", "wire not recorded", False),
    ))


def _humps(winding: WindingView) -> int:
    if winding.centre_tap:
        return 8
    return 6 if winding.on_primary_side else 4


def _span(winding: WindingView) -> float:
    return _humps(winding) * HUMP + 2 * LEAD


def _side_span(windings) -> float:
    return sum(_span(w) for w in windings) + GAP * max(len(windings) - 1, 0)


def _widest(windings) -> float:
    return max((sheet.text_width(w.label) for w in windings), default=0.0)


def _windings(drawing, x: float, top: float, windings, outward: int, onward: str) -> float:
    """Stack one side's windings from top down; outward is -1 for the left side, +1 for the right."""
    y = top
    for number, winding in enumerate(windings):
        _winding(drawing, x, y, winding, outward, onward if number == 0 else "")
        y -= _span(winding) + GAP
    return y + GAP


def _winding(drawing, x: float, top: float, winding: WindingView, outward: int, onward: str) -> None:
    bottom = top - _span(winding)
    start, end = ((x, top), (x, bottom)) if outward < 0 else ((x, bottom), (x, top))
    coil = sheet.add(drawing, Winding(humps=_humps(winding)).at(start).to(end))
    far = x + outward * LEAD_OUT
    for y in (top, bottom):
        sheet.wire(drawing, (x, y), (far, y))
        sheet.add(drawing, elm.Dot(open=True, radius=0.11).at((far + outward * 0.11, y)))
    _winding_label(drawing, far, top, bottom, winding, outward)
    if onward:
        _onward(drawing, far, top, onward, outward)
    if winding.centre_tap:
        _centre_tap(drawing, coil.tap, far, outward)


def _winding_label(drawing, far: float, top: float, bottom: float, winding: WindingView, outward: int) -> None:
    """Beyond the terminals, halfway down the winding (halfway down its upper half when tapped)."""
    middle = (top + bottom) / 2
    if winding.centre_tap:
        middle = (top + middle) / 2
    align = "left" if outward > 0 else "right"
    sheet.text(drawing, (far + outward * 0.45, middle), winding.label, halign=align)


def _onward(drawing, far: float, y: float, onward: str, outward: int) -> None:
    words = f"{'to' if outward > 0 else 'from'} {onward}"
    align = "left" if outward > 0 else "right"  # away from the core, so a long list of stages crosses no lead
    sheet.text(drawing, (far - outward * 0.15, y + 0.3), words, halign=align, valign="bottom", size=sheet.SMALL_FONT, colour=sheet.NOTE_INK)


def _centre_tap(drawing, tap, far: float, outward: int) -> None:
    sheet.wire(drawing, tap, (far, tap[1]))
    sheet.add(drawing, elm.Dot(open=True, radius=0.11).at((far + outward * 0.11, tap[1])))
    sheet.text(drawing, (far + outward * 0.45, tap[1]), "CT", halign="left" if outward > 0 else "right")


def _core(drawing, x: float, top: float, bottom: float) -> None:
    for offset in (-0.13, 0.13):
        sheet.wire(drawing, (x + offset, top + 0.1), (x + offset, bottom - 0.1))


def _part_caption(drawing, x: float, bottom: float, part: PartView, barrier: BarrierView | None) -> None:
    sheet.text(drawing, (x, bottom - 0.5), part.label, halign="center", valign="top")
    if barrier is not None:
        left = x - sheet.text_width(barrier.label, sheet.SMALL_FONT) / 2
        sheet.barrier_label(drawing, (left, bottom - 0.7 - sheet.text_height(part.label)), barrier)


def _choke(drawing, x: float, part: PartView, magnetic: MagneticView | None) -> float:
    label = part.label + (f"\n{magnetic.windings[0].label}" if magnetic else "")
    length = max(sheet.UNIT, sheet.text_width(label) + 0.4)
    sheet.add(drawing, Winding(humps=5, core=True).at((x + 0.5, 0)).right(length))
    sheet.text(drawing, (x + 0.5 + length / 2, 0.7), label, halign="center", valign="bottom")
    return x + length + 1.5


def handles(view: StageView) -> bool:
    return view.kind == "magnetics"


def missing(view: StageView) -> list[str]:
    picker = Picker(view.parts)
    return [] if picker.peek(P.either(P.TRANSFORMER, P.CHOKE)) else ["a transformer or a choke"]


DRAWER = StageDrawer("magnetics", handles, missing, draw)
