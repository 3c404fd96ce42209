"""The air inside the enclosure, which every part inside it sits in: one reading for every calc.

Declared as protection.internal_ambient, else the room's highest temperature plus a stated rise (the harsher
reading: parts inside a closed box run in air warmer than the room).
"""

from __future__ import annotations

from dossier.findings import common_practice
from dossier.units import Q_

DEFAULT_INTERNAL_RISE = Q_(20, "K")
INTERNAL_RISE = common_practice("air inside a closed enclosure about 20 K above the room at full load, when not declared (from memory)")
INTERNAL_AMBIENT_KEY = ("protection", "internal_ambient")


def internal_ambient(record):
    """(air temperature inside the enclosure, assumed?): declared, or the room's highest plus 20 K."""
    declared = record.protection.internal_ambient
    if declared is not None:
        return declared, False
    room = record.environment.max_ambient.to("degC")
    return Q_(room.magnitude + DEFAULT_INTERNAL_RISE.magnitude, "degC"), True


def internal_rise(record):
    """How far the enclosure's air sits above the room's highest temperature (never below zero)."""
    inside, _ = internal_ambient(record)
    rise = inside.to("K").magnitude - record.environment.max_ambient.to("K").magnitude
    return Q_(max(rise, 0.0), "K")
