"""Finding a stage's parts by what they are (kind) and what they do (role).

Roles are free text in the record, so matching is by words; a Picker remembers which parts a
drawer has placed, so the rest can be listed under the drawing rather than silently dropped.
"""

from __future__ import annotations

import re
from typing import Callable

from dossier.drawing.views import PartView

Test = Callable[[PartView], bool]

CAPACITORS = ("capacitor", "cap")
SWITCHING_DEVICES = ("transistor", "bjt", "mosfet", "igbt", "fet")


def kind(*kinds: str) -> Test:
    return lambda part: part.is_kind(*kinds)


def role(*words: str) -> Test:
    return lambda part: part.has_role(*words)


def kind_and_role(kinds: tuple[str, ...], words: tuple[str, ...]) -> Test:
    return lambda part: part.is_kind(*kinds) and part.has_role(*words)


def either(*tests: Test) -> Test:
    return lambda part: any(test(part) for test in tests)


def x_capacitor(part: PartView) -> bool:
    """A capacitor across the line: role says so, or the value names a safety class X1/X2."""
    marked = re.search(r"\bX[12]\b", part.value) is not None
    return part.is_kind(*CAPACITORS) and (part.has_role("x capacitor", "x-capacitor", "across") or marked)


FUSE = kind("fuse")
SWITCH = kind("switch")
INRUSH = either(kind("ntc", "thermistor"), role("inrush"))
INLET = either(kind("inlet", "plug"), role("inlet"))
BRIDGE = kind("bridge")
SHUNT = either(x_capacitor, kind("varistor", "mov"), role("bleed"))
BULK = kind_and_role(CAPACITORS, ("bulk", "reservoir", "smoothing"))
SPLIT = kind_and_role(CAPACITORS, ("split",))
UPPER_SWITCH = kind_and_role(SWITCHING_DEVICES, ("upper", "high"))
LOWER_SWITCH = kind_and_role(SWITCHING_DEVICES, ("lower", "low"))
DRIVE_TRANSFORMER = kind_and_role(("transformer",), ("drive",))
TRANSFORMER = kind("transformer")
CHOKE = either(kind("choke", "inductor"), role("choke"))
DIODE = kind("diode", "schottky", "rectifier")
RECTIFIER_DIODE = kind_and_role(("diode", "schottky", "rectifier"), ("rectif",))
CAPACITOR = kind(*CAPACITORS)
REGULATOR = either(kind("regulator", "ic", "controller"), role("regulator"))
PASS_DEVICE = kind_and_role(SWITCHING_DEVICES, ("pass",))
TERMINAL = kind("terminal", "connector", "jack", "socket", "clamp", "binding post")
START_RESISTOR = kind_and_role(("resistor",), ("start",))
START_CAPACITOR = kind_and_role(CAPACITORS, ("start",))
TRIGGER = either(kind("diac"), role("trigger"))
RCD = either(kind("rcd", "rccb", "rcbo"), role("residual"))
SOFT_START = kind_and_role(("resistor",), ("soft",))
LAMP = kind("lamp")
BYPASS = either(kind_and_role(("relay", "switch", "contactor"), ("bypass",)))
THERMAL_CUTOFF = either(kind("thermal-cutoff", "thermal cut-off", "thermal-fuse", "thermal fuse"), role("thermal cut-off", "thermal cutoff", "thermal fuse"))


def clamped_to(ref: str) -> Test:
    """A thermal cut-off whose role or value names the part it sits on (e.g. 'thermal cut-off clamped to R1')."""
    pattern = re.compile(rf"\b{re.escape(ref)}\b")
    return lambda part: THERMAL_CUTOFF(part) and pattern.search(f"{part.role} {part.value}") is not None


class Picker:
    """Takes parts from a stage one match at a time; what is never taken is left over."""

    def __init__(self, parts: tuple[PartView, ...]):
        self.parts = parts
        self.taken: list[str] = []

    def peek(self, test: Test) -> PartView | None:
        return next((p for p in self.parts if p.ref not in self.taken and test(p)), None)

    def take(self, test: Test) -> PartView | None:
        part = self.peek(test)
        if part is not None:
            self.taken.append(part.ref)
        return part

    def take_all(self, test: Test) -> list[PartView]:
        found = []
        while (part := self.take(test)) is not None:
            found.append(part)
        return found

    def leftover(self) -> list[PartView]:
        return [p for p in self.parts if p.ref not in self.taken]


def leftover_text(parts: list[PartView]) -> str:
    """'Also in this stage (not drawn): R9 1 M (bleeder); ...' or ''."""
    if not parts:
        return ""
    items = [" ".join(filter(None, (p.ref, p.value, f"({p.role})" if p.role else ""))) for p in parts]
    return "Also in this stage, not drawn:\n" + "\n".join(items)
