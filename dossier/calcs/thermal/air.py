"""Which air a device or heatsink gives its heat to: the enclosure's, unless its heatsink stands outside.

A part inside the enclosure sits in the enclosure's air (declared, or the room's highest plus a stated rise:
dossier.calcs.shared.enclosure_air); a heatsink declared outside (devices.heatsinks[].outside) sits in the
room's. A device with no heatsink is inside.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.shared.enclosure_air import INTERNAL_AMBIENT_KEY, INTERNAL_RISE, internal_ambient, internal_rise
from dossier.units import Q_


@dataclass(frozen=True)
class Air:
    temperature: object
    inside: bool
    assumed: bool  # the enclosure's air was taken as room + the default rise
    keys: tuple

    @property
    def sources(self) -> tuple:
        return (INTERNAL_RISE,) if self.assumed else ()


def air_of(record, heatsink, heatsink_index: int | None = None) -> Air:
    """The air at the record's highest room temperature for a part on this heatsink (None: no heatsink)."""
    place = (("devices", "heatsinks", heatsink_index, "outside"),) if heatsink_index is not None else ()
    if heatsink is not None and heatsink.outside:
        return Air(record.environment.max_ambient.to("degC"), False, False, (("environment", "max_ambient"),) + place)
    temperature, assumed = internal_ambient(record)
    return Air(temperature.to("degC"), True, assumed, (("environment", "max_ambient"), INTERNAL_AMBIENT_KEY) + place)


def air_during(record, room, heatsink) -> object:
    """The air round a part while the room was at `room`: the room's, plus the enclosure's rise for a part inside."""
    if heatsink is not None and heatsink.outside:
        return room.to("degC")
    return Q_(room.to("degC").magnitude + internal_rise(record).magnitude, "degC")
