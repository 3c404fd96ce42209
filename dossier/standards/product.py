"""What a product standard hands the isolation calc: requirements as data with where they were read.

Each product standard has its own module (iec62368.py, iec60335.py) holding its tables and a ProductStandard
built from them; this module holds the shapes they share, and register.py the standards held, by name and
edition. IEC 60664-1 (iec60664.py) is the basic standard and the default; it is no product standard here.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Callable

from dossier.standards.iec60664 import OutsideTable

BASIC_STANDARD = "iec-60664-1"
BASIC_EDITION = 3
BASIC_TITLE = "IEC 60664-1 edition 3 (2020)"


class TableNotHeld(OutsideTable):
    """The standard's table for this check could not be confirmed in public material, so dossier holds none."""


@dataclass(frozen=True)
class Requirement:
    """A figure read from a standard: the value, the table and row it came from, and whether the row was seen."""

    value: float
    table: str
    confirmed: bool
    notes: tuple[str, ...] = ()

    @property
    def provenance(self) -> str:
        return "confirmed in public material" if self.confirmed else "from memory"


@dataclass(frozen=True)
class TestVoltage:
    """An electric-strength test: the voltage, its waveform, how long, and where it was read."""

    volts: float
    waveform: str
    seconds: float
    table: str
    confirmed: bool
    notes: tuple[str, ...] = ()


@dataclass(frozen=True)
class EarthRule:
    """The protective-earth continuity limit and how the standard asks it to be tested."""

    limit_ohm: float
    test: str
    clause: str
    confirmed: bool


@dataclass(frozen=True)
class TouchLimit:
    """The hottest a touchable metal part may get: an absolute temperature, or a rise over the room."""

    degrees: float
    rise: bool  # True: kelvin above the room's air; False: degC
    table: str
    confirmed: bool


@dataclass(frozen=True)
class TouchLimits:
    """By contact: 'brief' (touched now and then, let go at once) and 'held' (held or touched for longer)."""

    brief: TouchLimit
    held: TouchLimit

    def for_contact(self, contact: str) -> TouchLimit:
        return self.held if contact == "held" else self.brief


@dataclass(frozen=True)
class ProductStandard:
    """A product standard's rules, as the isolation calc uses them.

    clearance(rated impulse V, pollution degree, grade, *, working_v, category) -> Requirement in mm
    creepage(working V r.m.s. or d.c., pollution degree, material group, printed board, grade) -> Requirement in mm
    test_voltage(grade, mains nominal V or None, working V, rated impulse V, *, category) -> TestVoltage
    Each raises OutsideTable beyond its rows, TableNotHeld where the table could not be confirmed at all.
    touch: the accessible-part temperature limits for a metal part, by contact, or None where none is held.
    """

    key: str
    edition: int
    title: str
    edition_text: str
    clearance: Callable[..., Requirement]
    creepage: Callable[..., Requirement]
    test_voltage: Callable[..., TestVoltage]
    earth: EarthRule
    touch: "TouchLimits | None" = None

    @property
    def name(self) -> str:
        return f"{self.title} edition {self.edition}"
