"""A checklist item: what to do, what to measure, and the range the measurement must fall in."""

from __future__ import annotations

import enum
import re
from dataclasses import dataclass

from dossier.findings import Source
from dossier.units import Q_, fmt


class Phase(str, enum.Enum):
    """When an item is done, in the order the sheet lists them."""

    UNPOWERED = "unpowered"
    POWER_UP = "power-up"
    SETTINGS = "settings"
    SOAK = "soak"

    @property
    def title(self) -> str:
        return PHASE_TITLES[self]


PHASE_TITLES = {
    Phase.UNPOWERED: "Before the mains is connected",
    Phase.POWER_UP: "First power-up",
    Phase.SETTINGS: "Output settings",
    Phase.SOAK: "Temperature soak",
}


class Origin(str, enum.Enum):
    GENERAL = "general"
    BUILD = "this build"


@dataclass(frozen=True)
class Expected:
    """A closed range; either end may be open (None)."""

    low: object = None
    high: object = None

    def contains(self, value) -> bool:
        if self.low is not None and value < self.low:
            return False
        return self.high is None or value <= self.high

    def text(self, unit: str) -> str:
        """'at most 0.1 Ω', 'at least 1 MΩ' or '14.1 V to 14.7 V', in the item's unit."""
        if self.low is not None and self.high is not None:
            return f"{_shown(self.low, unit)} to {_shown(self.high, unit)}"
        if self.high is not None:
            return f"at most {_shown(self.high, unit)}"
        return f"at least {_shown(self.low, unit)}"


def _shown(quantity, unit: str) -> str:
    return fmt(quantity.to(unit)) if unit else fmt(quantity)


def at_most(quantity) -> Expected:
    return Expected(high=quantity)


def at_least(quantity) -> Expected:
    return Expected(low=quantity)


def within(nominal, fraction: float) -> Expected:
    """nominal plus or minus a fraction of itself, e.g. 14.4 V +- 2 %."""
    return Expected(low=nominal * (1 - fraction), high=nominal * (1 + fraction))


@dataclass(frozen=True)
class Item:
    """One line of the sheet.

    key       stable id; the commissioning file uses it to give the item's result
    steps     what to do, in plain sentences
    unit      unit of the value to measure, '' for an item that is only ticked
    expected  the range the value must fall in, when there is one
    note      where the range comes from when no published source gives it
    """

    key: str
    phase: Phase
    origin: Origin
    title: str
    steps: str
    unit: str = ""
    expected: Expected | None = None
    sources: tuple[Source, ...] = ()
    note: str = ""

    @property
    def measured(self) -> bool:
        return bool(self.unit)

    @property
    def expected_text(self) -> str:
        return self.expected.text(self.unit) if self.expected else ""

    @property
    def unit_symbol(self) -> str:
        """The unit as printed beside the blank, e.g. 'Ω' or 'MΩ'."""
        return f"{Q_(1, self.unit).units:~P}" if self.unit else ""


def slug(text: str) -> str:
    """'primary to output' -> 'primary-to-output'; used to build item keys from names."""
    return re.sub(r"[^a-z0-9]+", "-", text.lower()).strip("-")
