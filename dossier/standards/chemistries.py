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

from functools import lru_cache
from importlib.metadata import entry_points
from types import MappingProxyType
from typing import Mapping

from dossier.standards.battery import Chemistry
from dossier.standards.lead_acid import CHEMISTRIES

GROUP = "dossier.chemistries"


class ChemistryError(Exception):
    """A chemistry plugin that cannot be used, named with why."""

    def __init__(self, name: str, reason: str):
        super().__init__(f"chemistry plugin '{name}': {reason}")
        self.name = name
        self.reason = reason


def _builtins() -> dict[str, Chemistry]:
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
