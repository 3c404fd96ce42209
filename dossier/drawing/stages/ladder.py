"""A two-rail network drawn left to right: the live rail on top, the return below, series parts in the
live rail and shunt parts across the two. Filters, switches, bleeders and series capacitor banks are all
drawn this way, so they share one way of placing parts, labels and terminals."""

from __future__ import annotations

import re

import schemdraw.elements as elm

from dossier.drawing import parts as P
from dossier.drawing import sheet
from dossier.drawing.parts import Picker
from dossier.drawing.symbols import GasTube, Winding
from dossier.drawing.views import PartView, RailView, StageView

LIVE, RETURN = 2.8, 0.0
SHUNT_GAP = 0.8  # live rail run before a shunt part
NOT_ELECTROLYTIC = re.compile(r"\b(film|mica|ceramic|polyester|polypropylene|paper|X[12]|Y[1-4])\b", re.IGNORECASE)
_MICROFARADS = re.compile(r"(\d+(?:\.\d+)?)\s*(?:u|\u00b5|\u03bc)F", re.IGNORECASE)


def polarised(part: PartView) -> bool:
    """An electrolytic: a reservoir or smoothing role, or a value of a microfarad or more."""
    if not P.CAPACITOR(part) or NOT_ELECTROLYTIC.search(f"{part.value} {part.role}"):
        return False
    found = _MICROFARADS.search(part.value)
    return P.BULK(part) or part.has_role("filter", "series bank", "electrolytic") or (found is not None and float(found.group(1)) >= 1)


def symbol_for(part: PartView):
    """The IEC-style two-terminal symbol for a part, by its kind."""
    words = f"{part.kind} {part.value}".lower()
    if P.FUSE(part):
        return elm.FuseIEC()
    if P.SWITCH(part) or part.is_kind("relay", "contact"):
        return elm.Switch()
    if part.is_kind("zener") or "zener" in words:
        return elm.Zener()
    if P.DIODE(part):
        return elm.Schottky() if "schottky" in words else elm.Diode()
    if P.CAPACITOR(part):
        return elm.Capacitor(polar=polarised(part))
    if P.CHOKE(part):
        return Winding(humps=5, core=True)
    if part.is_kind("ntc", "thermistor", "ptc"):
        return elm.Thermistor()
    if part.is_kind("varistor", "mov"):
        return elm.ResistorVarIEC()
    if part.is_kind("lamp", "bulb"):
        return elm.Lamp()
    if part.is_kind("neon", "indicator", "gas regulator") or (part.is_kind("valve", "tube") and "gas" in words):
        return GasTube()
    return elm.ResistorIEC()


def placed(symbol, start, end):
    """The symbol from start to end; upright ones by direction and length, since a lamp's own `to` turns it round."""
    (x0, y0), (x1, y1) = start, end
    if x0 == x1:
        return symbol.at(start).down(y0 - y1) if y0 > y1 else symbol.at(start).up(y1 - y0)
    return symbol.at(start).to(end)


def has_symbol(part: PartView) -> bool:
    """Whether symbol_for knows the part, rather than falling back to a plain resistor."""
    known = (P.FUSE, P.SWITCH, P.DIODE, P.CAPACITOR, P.CHOKE,
             P.kind("resistor", "bleeder", "ntc", "thermistor", "ptc", "varistor", "mov", "lamp", "bulb", "neon",
                    "indicator", "gas regulator", "zener", "relay", "contact"))
    return any(test(part) for test in known)


class Ladder:
    """Draws along the two rails from x = 0; x is where the next part goes."""

    def __init__(self, drawing, view: StageView, live: float = LIVE, ret: float = RETURN):
        self.drawing, self.view = drawing, view
        self.live, self.ret = live, ret
        self.x = 0.0

    def inputs(self, live: str | None = None, ret: str | None = None) -> None:
        origin = f" from {self.view.came_from}" if self.view.came_from else ""
        names = (live or self.view.pole(True), ret or self.view.pole(False))
        for y, name in zip((self.live, self.ret), names):
            sheet.terminal(self.drawing, (-0.11, y), f"{name}{origin}", side="left")

    def run(self, length: float) -> None:
        """Both rails straight on by length."""
        for y in (self.live, self.ret):
            sheet.wire(self.drawing, (self.x, y), (self.x + length, y))
        self.x += length

    def series(self, part: PartView, symbol=None) -> None:
        """A part in the live rail, labelled above it."""
        length = max(sheet.UNIT, sheet.text_width(part.label) + 0.5)
        sheet.add(self.drawing, (symbol or symbol_for(part)).at((self.x, self.live)).right(length))
        sheet.text(self.drawing, (self.x + length / 2, self.live + 0.5), part.label, halign="center", valign="bottom")
        sheet.wire(self.drawing, (self.x, self.ret), (self.x + length, self.ret))
        self.x += length

    def shunt(self, part: PartView, symbol=None, words: str | None = None) -> None:
        """A part across the rails, labelled on its right; a diode or zener with its cathode to the more
        positive rail, so it conducts only when it regulates or the rail reverses."""
        upward = (P.DIODE(part) or part.is_kind("zener")) and not self.negative
        self._across(symbol or symbol_for(part), words or part.label, upward)

    @property
    def negative(self) -> bool:
        return any(rail.negative for rail in self.view.rails) or any(p.has_role("negative") for p in self.view.parts)

    def bleeder(self, rail: RailView) -> None:
        """The bleeder resistor a rail declares, across that rail."""
        self._across(elm.ResistorIEC(), f"bleeder {rail.bleeder}\nacross {rail.name}")

    def _across(self, symbol, words: str, upward: bool = False) -> None:
        self.run(SHUNT_GAP)
        ends = ((self.x, self.ret), (self.x, self.live)) if upward else ((self.x, self.live), (self.x, self.ret))
        sheet.add(self.drawing, placed(symbol, *ends))
        sheet.text(self.drawing, (self.x + 0.45, (self.live + self.ret) / 2), words)
        for y in (self.live, self.ret):
            sheet.dot(self.drawing, (self.x, y))
        self.run(sheet.text_width(words) + 0.8)

    def stack(self, capacitors: list[PartView], resistors: list[PartView | None]) -> None:
        """Capacitors in series across the rails, each with its balancing resistor beside it (resistors[i]
        across capacitors[i]; None where it has none, which is said in words), joined at every node."""
        count = max(len(capacitors), 1)
        step = (self.live - self.ret) / count
        self.run(SHUNT_GAP)
        cap_x = self.x
        res_x = cap_x + max((sheet.text_width(c.label) for c in capacitors), default=1.0) + 1.2
        for number, (capacitor, resistor) in enumerate(zip(capacitors, resistors)):
            top = self.live - number * step
            sheet.add(self.drawing, elm.Capacitor(polar=polarised(capacitor)).at((cap_x, top)).to((cap_x, top - step)))
            sheet.text(self.drawing, (cap_x + 0.45, top - step / 2), capacitor.label)
            if resistor is None:
                sheet.text(self.drawing, (res_x, top - step / 2), f"no balancing\nresistor across {capacitor.ref}",
                           size=sheet.SMALL_FONT, colour=sheet.MAINS_INK)
                continue
            sheet.add(self.drawing, elm.ResistorIEC().at((res_x, top)).to((res_x, top - step)))
            sheet.text(self.drawing, (res_x + 0.45, top - step / 2), resistor.label)
            for y in (top, top - step):
                sheet.wire(self.drawing, (cap_x, y), (res_x, y))
                sheet.dot(self.drawing, (res_x, y))
        for number in range(count + 1):
            sheet.dot(self.drawing, (cap_x, self.live - number * step))
        words = [r.label for r in resistors if r is not None] + [f"no balancing\nresistor across {c.ref}" for c, r in zip(capacitors, resistors) if r is None]
        widest = max((sheet.text_width(w, sheet.SMALL_FONT if w.startswith("no ") else sheet.FONT_SIZE) for w in words), default=0.0)
        self.run(res_x - cap_x + widest + 0.8)

    def outputs(self, live: str | None = None, ret: str | None = None) -> None:
        """Terminals on the right: the rails the stage delivers, or the poles, and where they go."""
        self.run(0.6)
        onward = f" to {self.view.goes_to}" if self.view.goes_to else ""
        rails = ", ".join(rail.label for rail in self.view.rails)
        direct = self.view.rails and all(rail.direct for rail in self.view.rails)
        names = (live or rails or self.view.pole(True), ret or ("0 V" if direct else self.view.pole(False)))
        for y, name in zip((self.live, self.ret), names):
            sheet.terminal(self.drawing, (self.x + 0.11, y), f"{name}{onward}")

    def bleeders(self) -> None:
        """A bleeder for each rail of this stage that declares one."""
        for rail in self.view.rails:
            if rail.bleeder:
                self.bleeder(rail)


def opened_ladder(view: StageView, lead: float = 0.4):
    """A new drawing with its part picker and a ladder whose input terminals are drawn and led in."""
    drawing = sheet.new_drawing()
    ladder = Ladder(drawing, view)
    ladder.inputs()
    ladder.run(lead)
    return drawing, Picker(view.parts), ladder
