"""Mains input: inlet with earth, the series parts on the line conductor (fuse, switch, residual-current
device, inrush limiter, soft-start resistor (with a thermal cut-off clamped to it) or series lamp with the
contact that bypasses it, in the record's order), parts across the line (X capacitor, varistor, bleeder), then an
isolating transformer or a variac where the stage has one (topologies isolating-transformer and
variac; direct has neither), the bridge rectifier and the bulk capacitors."""

from __future__ import annotations

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.drawers import StageDrawer, finish_stage
from dossier.drawing.parts import Picker
from dossier.drawing.stages.ladder import polarised
from dossier.drawing.stages.rectifier import diode_symbol
from dossier.drawing.symbols import Box, BridgeRectifier, ProtectiveEarth, Winding
from dossier.drawing.views import PartView, StageView

LINE_Y = 2.6  # line conductor (L), later the positive DC rail
NEUTRAL_Y = 0.0  # neutral (N), later the negative DC rail
EARTH_Y = -1.4
START_X = 0.6


def draw(view: StageView):
    drawing = sheet.new_drawing()
    picker = Picker(view.parts)
    _inlet(drawing, picker.take(P.INLET))
    _earth(drawing, view)
    x = _series(drawing, picker.take_all(P.either(P.FUSE, P.RCD, P.SWITCH, P.INRUSH, P.SOFT_START, P.LAMP)), picker)
    x = _shunts(drawing, x, picker.take_all(P.SHUNT))
    x, names = _transformation(drawing, x, view, picker)
    if view.topology in MAINS_RECTIFIERS and picker.peek(P.DIODE):
        x = MAINS_RECTIFIERS[view.topology](drawing, x, picker)
        x = _shunts(drawing, x, picker.take_all(P.either(P.BULK, P.SPLIT)))
        _rails_out(drawing, x, ("+DC", "\u2212DC"), view.goes_to)
        return finish_stage(drawing, view, picker)
    bridge = picker.take(P.BRIDGE)
    if bridge is None:
        _rails_out(drawing, x, names, view.goes_to)
        return finish_stage(drawing, view, picker)
    x = _bridge(drawing, x, bridge)
    x = _shunts(drawing, x, picker.take_all(P.either(P.BULK, P.SPLIT)))
    _rails_out(drawing, x, ("+DC", "\u2212DC"), view.goes_to)
    return finish_stage(drawing, view, picker)


def _inlet(drawing, inlet: PartView | None) -> None:
    for name, y in (("L", LINE_Y), ("N", NEUTRAL_Y), ("PE", EARTH_Y)):
        sheet.add(drawing, elm.Dot(open=True, radius=0.11).at((0, y)))
        sheet.text(drawing, (-0.25, y), name, halign="right")
    if inlet is not None:
        outline = Box(1.25, LINE_Y - EARTH_Y + 0.9, fill="none", dashed=True)
        sheet.add(drawing, outline.at((-0.95, LINE_Y + 0.45)))
        sheet.text(drawing, (-0.95, LINE_Y + 0.6), inlet.label, valign="bottom")
    sheet.wire(drawing, (0.11, LINE_Y), (START_X, LINE_Y))
    sheet.wire(drawing, (0.11, NEUTRAL_Y), (START_X, NEUTRAL_Y))


def _earth(drawing, view: StageView) -> None:
    if not view.earthed:
        return
    sheet.wire(drawing, (0.11, EARTH_Y), (1.2, EARTH_Y))
    earth = sheet.add(drawing, ProtectiveEarth().at((1.2, EARTH_Y)))
    sheet.text(drawing, earth.note, "protective earth\nto chassis", size=sheet.SMALL_FONT)


def _series(drawing, found: list[PartView], picker: Picker) -> float:
    """Parts in the line conductor; a 2-pole switch or an RCD breaks N as well, and a soft-start resistor or a
    series lamp has the contact that bypasses it drawn across it."""
    x = START_X
    for part in found:
        length = _part_length(part)
        sheet.add(drawing, _symbol(part).at((x, LINE_Y)).right(length).label(part.label, loc="bottom" if _bypassed(part) else "top"))
        cutoff = picker.take(P.clamped_to(part.ref)) if P.SOFT_START(part) else None
        if cutoff is not None:  # in series with the resistor, so inside what the bypass shorts
            sheet.add(drawing, elm.FuseIEC().at((x + length, LINE_Y)).right(_part_length(cutoff)).label(cutoff.label, loc="bottom"))
            length += _part_length(cutoff)
        if (P.SWITCH(part) and _two_pole(part)) or P.RCD(part):
            _neutral_pole(drawing, x, length, P.RCD(part))
        else:
            sheet.wire(drawing, (x, NEUTRAL_Y), (x + length, NEUTRAL_Y))
        bypass = picker.take(P.BYPASS) if _bypassed(part) else None
        if bypass is not None:
            _bypass(drawing, x, length, bypass)
        x += length
    return x


def _part_length(part: PartView) -> float:
    return max(sheet.UNIT, sheet.text_width(part.label) + 0.5)


def _bypassed(part: PartView) -> bool:
    return P.SOFT_START(part) or P.LAMP(part)


def _bypass(drawing, x: float, length: float, contact: PartView) -> None:
    """The relay contact or switch that shorts a soft-start resistor or a series lamp, drawn above it."""
    top = LINE_Y + 1.1
    sheet.wire(drawing, (x, LINE_Y), (x, top))
    sheet.add(drawing, elm.Switch().at((x, top)).right(length).label(contact.label, loc="top"))
    sheet.wire(drawing, (x + length, top), (x + length, LINE_Y))
    sheet.dot(drawing, (x, LINE_Y))
    sheet.dot(drawing, (x + length, LINE_Y))


def _symbol(part: PartView):
    if P.FUSE(part):
        return elm.FuseIEC()
    if P.SWITCH(part):
        return elm.Switch()
    if P.RCD(part):
        return elm.RBox()
    if P.SOFT_START(part):
        return elm.ResistorIEC()
    if P.LAMP(part):
        return elm.Lamp()
    return elm.Thermistor()


def _two_pole(part: PartView) -> bool:
    words = f"{part.value} {part.role}".lower()
    return any(w in words for w in ("2-pole", "two-pole", "double-pole", "2 pole", "dpst", "dp "))


def _neutral_pole(drawing, x: float, length: float, sensing: bool = False) -> None:
    """The second pole on N, linked to the first: a switch contact, or an RCD's sensing pole."""
    sheet.add(drawing, (elm.RBox() if sensing else elm.Switch()).at((x, NEUTRAL_Y)).right(length))
    middle = x + length / 2
    sheet.wire(drawing, (middle, NEUTRAL_Y + 0.2), (middle, LINE_Y + 0.2), dashed=True)


def _shunts(drawing, x: float, found: list[PartView]) -> float:
    """Parts across the two conductors, each labelled on its right."""
    for part in found:
        x += 0.6
        sheet.wire(drawing, (x - 0.6, LINE_Y), (x, LINE_Y))
        sheet.wire(drawing, (x - 0.6, NEUTRAL_Y), (x, NEUTRAL_Y))
        sheet.add(drawing, _shunt_symbol(part).at((x, LINE_Y)).to((x, NEUTRAL_Y)).label(part.label, loc="bottom"))
        sheet.dot(drawing, (x, LINE_Y))
        sheet.dot(drawing, (x, NEUTRAL_Y))
        wide = sheet.text_width(part.label) + 1.0
        sheet.wire(drawing, (x, LINE_Y), (x + wide, LINE_Y))
        sheet.wire(drawing, (x, NEUTRAL_Y), (x + wide, NEUTRAL_Y))
        x += wide
    return x


def _shunt_symbol(part: PartView):
    if P.CAPACITOR(part):
        return elm.Capacitor(polar=P.BULK(part) or P.SPLIT(part))
    if part.is_kind("varistor", "mov"):
        return elm.ResistorVarIEC()
    return elm.ResistorIEC()


def _bridge(drawing, x: float, bridge: PartView) -> float:
    """The bridge between the conductors: AC pins on the left, DC on the right."""
    centre_y = (LINE_Y + NEUTRAL_Y) / 2
    body = sheet.add(drawing, BridgeRectifier().at((x + 1.2, centre_y)))
    sheet.wire(drawing, (x, LINE_Y), (x + 0.5, LINE_Y), (x + 0.5, body.ac1[1]), body.ac1)
    sheet.wire(drawing, (x, NEUTRAL_Y), (x + 0.5, NEUTRAL_Y), (x + 0.5, body.ac2[1]), body.ac2)
    sheet.text(drawing, (body.ac1[0] + 0.8, centre_y + 1.05), bridge.label, halign="center", valign="bottom")
    right = body.plus[0] + 0.5
    sheet.wire(drawing, body.plus, (right, body.plus[1]), (right, LINE_Y))
    sheet.wire(drawing, body.minus, (right, body.minus[1]), (right, NEUTRAL_Y))
    return right


VARIAC = P.either(P.kind("variac", "autotransformer", "variable transformer"), P.role("variac", "autotransformer"))
ISOLATING = "isolating-transformer"


def _transformation(drawing, x: float, view: StageView, picker: Picker) -> tuple[float, tuple[str, str]]:
    """An isolating transformer or a variac between the protection and the outputs, with the names its outputs take."""
    variac = picker.take(VARIAC)
    if variac is not None:
        return _variac(drawing, x, variac), ("L adjustable", "N")
    isolating = view.topology.lower() == ISOLATING or picker.peek(P.kind_and_role(("transformer",), ("isolat",)))
    transformer = picker.take(P.TRANSFORMER) if isolating else None
    if transformer is not None:
        return _isolating(drawing, x, transformer), ("isolated L", "isolated N")
    return x, ("L", "N")


def _isolating(drawing, x: float, part: PartView) -> float:
    """A 1:1 transformer: primary across L and N, secondary facing it across the core, each winding its own circuit."""
    primary, secondary = x + 0.8, x + 2.0
    sheet.wire(drawing, (x, LINE_Y), (primary, LINE_Y))
    sheet.wire(drawing, (x, NEUTRAL_Y), (primary, NEUTRAL_Y))
    sheet.add(drawing, Winding(humps=6).at((primary, LINE_Y)).to((primary, NEUTRAL_Y)))
    sheet.add(drawing, Winding(humps=6).at((secondary, NEUTRAL_Y)).to((secondary, LINE_Y)))
    for offset in (-0.13, 0.13):
        core = (primary + secondary) / 2 + offset
        sheet.wire(drawing, (core, LINE_Y + 0.1), (core, NEUTRAL_Y - 0.1))
    sheet.text(drawing, ((primary + secondary) / 2, NEUTRAL_Y - 0.4), part.label, halign="center", valign="top")
    return secondary


def _variac(drawing, x: float, part: PartView) -> float:
    """An autotransformer across L and N; the output line is taken from its wiper (the arrow)."""
    coil, wiper = x + 0.8, x + 2.0
    sheet.wire(drawing, (x, LINE_Y), (coil, LINE_Y))
    sheet.wire(drawing, (x, NEUTRAL_Y), (wiper, NEUTRAL_Y))
    sheet.add(drawing, Winding(humps=7).at((coil, LINE_Y)).to((coil, NEUTRAL_Y)))
    sheet.dot(drawing, (coil, NEUTRAL_Y))
    tap = NEUTRAL_Y + (LINE_Y - NEUTRAL_Y) * 0.6
    sheet.add(drawing, elm.Arrow().at((wiper, tap)).to((coil + 0.45, tap)))
    sheet.wire(drawing, (wiper, tap), (wiper, LINE_Y))
    sheet.text(drawing, (coil, NEUTRAL_Y - 0.4), part.label, halign="center", valign="top")
    return wiper


def _half_wave(drawing, x: float, picker: Picker) -> float:
    """One diode in the line conductor: the neutral becomes the negative rail."""
    diode = picker.take(P.DIODE)
    length = max(sheet.UNIT, sheet.text_width(diode.label) + 0.5)
    sheet.add(drawing, diode_symbol(diode).at((x, LINE_Y)).right(length).label(diode.label, loc="top"))
    sheet.wire(drawing, (x, NEUTRAL_Y), (x + length, NEUTRAL_Y))
    return x + length


DOUBLER_TOP, DOUBLER_BOTTOM, DIODE_TOP = LINE_Y + 2.2, NEUTRAL_Y - 2.4, NEUTRAL_Y - 2.4 + sheet.UNIT


def _doubler(drawing, x: float, picker: Picker) -> float:
    """The full-wave doubler straight off the mains: the line to the diodes' midpoint, the neutral to the
    midpoint of the two reservoir capacitors (crossing the diode column's wire, not joining it)."""
    diodes = [picker.take(P.DIODE), picker.take(P.DIODE)]
    capacitors = [c for c in (picker.take(P.CAPACITOR), picker.take(P.CAPACITOR)) if c is not None]
    diode_x = x + 0.8
    sheet.wire(drawing, (x, LINE_Y), (diode_x, LINE_Y))
    upper = [d for d in diodes if d is not None]
    sheet.add(drawing, diode_symbol(upper[0]).at((diode_x, LINE_Y)).to((diode_x, DOUBLER_TOP)))
    sheet.text(drawing, (diode_x + 0.45, (LINE_Y + DOUBLER_TOP) / 2), upper[0].label)
    lower = upper[-1]
    sheet.add(drawing, diode_symbol(lower).at((diode_x, DOUBLER_BOTTOM)).to((diode_x, DIODE_TOP)))
    sheet.wire(drawing, (diode_x, DIODE_TOP), (diode_x, LINE_Y))
    sheet.text(drawing, (diode_x + 0.45, (DOUBLER_BOTTOM + DIODE_TOP) / 2), lower.label if lower is not upper[0] else lower.ref)
    sheet.dot(drawing, (diode_x, LINE_Y))
    cap_x = diode_x + max(sheet.text_width(d.label) for d in upper) + 1.0
    sheet.wire(drawing, (x, NEUTRAL_Y), (cap_x, NEUTRAL_Y))
    for part, (top, bottom) in zip(capacitors, ((DOUBLER_TOP, NEUTRAL_Y), (NEUTRAL_Y, DOUBLER_BOTTOM))):
        sheet.add(drawing, elm.Capacitor(polar=polarised(part)).at((cap_x, top)).to((cap_x, bottom)))
        sheet.text(drawing, (cap_x + 0.45, (top + bottom) / 2), part.label)
    sheet.dot(drawing, (cap_x, NEUTRAL_Y))
    right = cap_x + max((sheet.text_width(c.label) for c in capacitors), default=0.0) + 0.9
    for y in (DOUBLER_TOP, DOUBLER_BOTTOM):
        sheet.wire(drawing, (diode_x, y), (right, y))
        sheet.dot(drawing, (cap_x, y))
    sheet.wire(drawing, (right, DOUBLER_TOP), (right, LINE_Y))
    sheet.wire(drawing, (right, DOUBLER_BOTTOM), (right, NEUTRAL_Y))
    return right


MAINS_RECTIFIERS = {"half-wave": _half_wave, "doubler": _doubler}


def _rails_out(drawing, x: float, names: tuple[str, str], goes_to: str) -> None:
    end = x + 0.6
    sheet.wire(drawing, (x, LINE_Y), (end, LINE_Y))
    sheet.wire(drawing, (x, NEUTRAL_Y), (end, NEUTRAL_Y))
    onward = f" to {goes_to}" if goes_to else ""
    sheet.terminal(drawing, (end + 0.11, LINE_Y), f"{names[0]}{onward}")
    sheet.terminal(drawing, (end + 0.11, NEUTRAL_Y), f"{names[1]}{onward}")


def handles(view: StageView) -> bool:
    return view.kind == "mains-input"


def missing(view: StageView) -> list[str]:
    return []


DRAWER = StageDrawer("mains input", handles, missing, draw)
