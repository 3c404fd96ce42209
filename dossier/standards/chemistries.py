"""Battery chemistries and their charging windows: the built-in ones plus any a plugin adds.

A third party adds a chemistry through the entry-point group ``dossier.chemistries``; the entry
point's name is the key a record writes under ``output.battery.chemistry`` and its object is a
:class:`Chemistry`. For example, in the plugin's pyproject.toml::

    [project.entry-points."dossier.chemistries"]
    nicd = "my_package.cells:NICD"

Every voltage in a chemistry is per cell at the reference temperature (25 degC); every window
carries the published sources it comes from.
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache
from importlib.metadata import entry_points
from types import MappingProxyType
from typing import Mapping

from dossier.findings import Source
from dossier.units import Q_

GROUP = "dossier.chemistries"
REFERENCE_TEMPERATURE = Q_(25, "degC")


@dataclass(frozen=True)
class Window:
    """A range a value should lie in (low <= value <= high), with where the range comes from."""

    low: object  # pint Quantity
    high: object  # pint Quantity, same dimension as low
    sources: tuple[Source, ...]

    def contains(self, value) -> bool:
        return self.low <= value <= self.high

    def scaled(self, factor: float) -> "Window":
        return Window(_tidy(self.low * factor), _tidy(self.high * factor), self.sources)

    def shifted(self, offset) -> "Window":
        return Window(_tidy(self.low + offset), _tidy(self.high + offset), self.sources)


def _tidy(quantity):
    """Drop floating-point noise (2.35 x 6 = 14.100000000000001) so window edges compare and print as written."""
    return Q_(round(quantity.magnitude, 9), quantity.units)


@dataclass(frozen=True)
class CurveModel:
    """The figures the CC-then-CV charge estimate needs (see docs/calcs/charge.md).

    cv_onset          state of charge (0..1) at which the terminal voltage reaches the setpoint
    termination       taper current at which the battery counts as full, per unit capacity (1/h)
    efficiency        charge efficiency: charge stored per charge delivered (0..1)
    start_voltage     terminal voltage per cell as charge starts on an empty battery
    """

    cv_onset: float
    termination: object
    efficiency: float
    start_voltage: object
    sources: tuple[Source, ...]


@dataclass(frozen=True)
class Chemistry:
    """One chemistry's charging windows; voltages are per cell at 25 degC.

    absorption        constant-voltage (absorption) setpoint window
    float_charge      float setpoint window, or None when the chemistry takes no float stage
    compensation      acceptable temperature coefficient of the setpoints per cell (V/K, both negative)
    typical_compensation  the coefficient used to move the windows with battery temperature
    charge_rate       constant-current limit as a fraction of capacity per hour (1/h, i.e. C-rate)
    """

    key: str
    title: str
    label: str  # short name for titles, e.g. 'AGM'
    absorption: Window
    float_charge: Window | None
    compensation: Window | None
    typical_compensation: object
    charge_rate: Window
    curve: CurveModel

    def absorption_at(self, temperature) -> Window:
        return self.absorption.shifted(self.drift(temperature))

    def float_at(self, temperature) -> Window | None:
        return self.float_charge.shifted(self.drift(temperature)) if self.float_charge else None

    def drift(self, temperature):
        """How far the per-cell windows move from their 25 degC values at this battery temperature."""
        return self.typical_compensation * kelvin_from_reference(temperature)


def kelvin_from_reference(temperature):
    return Q_(temperature.to("degC").magnitude - REFERENCE_TEMPERATURE.magnitude, "K")


class ChemistryError(Exception):
    """A chemistry plugin that cannot be used, named with why."""

    def __init__(self, name: str, reason: str):
        super().__init__(f"chemistry plugin '{name}': {reason}")
        self.name = name
        self.reason = reason


def _builtins() -> dict[str, Chemistry]:
    from dossier.standards.lead_acid import CHEMISTRIES  # imported late: it builds on this module

    return {chemistry.key: chemistry for chemistry in CHEMISTRIES}


def validate(name: str, obj, taken) -> Chemistry:
    """Check a plugin's chemistry when it is registered, not when a record first uses it."""
    if not isinstance(obj, Chemistry):
        raise ChemistryError(name, f"entry point must name a dossier.standards.chemistries.Chemistry, found {type(obj).__name__}")
    if obj.key != name:
        raise ChemistryError(name, f"its Chemistry has key '{obj.key}'; the entry point and the key must match")
    if name in taken:
        raise ChemistryError(name, "that key is already taken by another chemistry")
    return obj


def load_chemistries(points=None) -> dict[str, Chemistry]:
    """Built-in chemistries plus every plugin's; a broken plugin raises ChemistryError naming it."""
    points = entry_points(group=GROUP) if points is None else points
    found = _builtins()
    for point in sorted(points, key=lambda p: p.name):
        found[point.name] = validate(point.name, _load(point), found)
    return found


def _load(point):
    try:
        return point.load()
    except Exception as error:  # a third party's import can fail in any way
        raise ChemistryError(point.name, f"could not be loaded: {type(error).__name__}: {error}") from None


@lru_cache(maxsize=1)
def registry() -> Mapping[str, Chemistry]:
    """The chemistries of this installation, loaded once (read-only)."""
    return MappingProxyType(load_chemistries())


def known_keys() -> tuple[str, ...]:
    return tuple(registry())


def chemistry(key: str) -> Chemistry:
    return registry()[key]
