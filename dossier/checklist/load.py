"""Loading a commissioning file: YAML with positions, validation, then a check against the revision's checklist.

Every problem is found in one pass and reported with its file, line, column and key, like the record's.
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from dossier.reading.archive import COMMISSIONING_FILE
from dossier.checklist.items import Item
from dossier.checklist.commissioning import CommissioningFile
from dossier.checklist.sheet import Checklist
from dossier.problems import InputError, Location, Problem
from dossier.reading.model_file import load_model_file
from dossier.reading.yaml_source import SourceMap
from dossier.units import DIMENSION_NAMES, Q_, UnitProblem, dimensionality_of, fmt, parse_quantity
from dossier.wording import did_you_mean

OFFSET_UNITS = ("degC", "degF")
COMMISSIONING_EXAMPLE = "build: ..., revision: ..."
RISE = "a temperature rise in K (the reading less the room temperature)"


@dataclass(frozen=True)
class Commissioning:
    """A validated commissioning file; values parsed to quantities in the units of their items."""

    entry: CommissioningFile
    values: dict[str, object]
    sources: SourceMap
    path: Path

    def locate(self, key_path) -> Location:
        return self.sources.locate(tuple(key_path))


def commissioning_path(build_dir: Path, revision: str) -> Path | None:
    """The commissioning file of one revision in a build folder, if there is one."""
    for path in sorted(build_dir.iterdir()):
        match = COMMISSIONING_FILE.match(path.name)
        if match and match["letter"] == revision and path.is_file():
            return path
    return None


def load_commissioning(path: Path, checklist: Checklist, shown_as: str | None = None) -> Commissioning:
    loaded = load_model_file(path, CommissioningFile, COMMISSIONING_EXAMPLE, shown_as)
    entry, sources = loaded.model, loaded.sources
    problems = list(_placement_problems(entry, checklist, path, sources))
    values = {}
    for key, result in entry.results.items():
        value = _checked_result(key, result, checklist, sources, problems)
        if value is not None:
            values[key] = value
    if problems:
        raise InputError(problems)
    return Commissioning(entry, values, sources, path)


def _placement_problems(entry: CommissioningFile, checklist: Checklist, path: Path, sources: SourceMap):
    if entry.build != checklist.build:
        yield Problem("build_mismatch", sources.locate(("build",)), key="build", expected=f"'{checklist.build}', the build this file sits with", found=repr(entry.build))
    match = COMMISSIONING_FILE.match(path.name)
    expected = match["letter"] if match else checklist.revision
    if entry.revision != expected or entry.revision != checklist.revision:
        yield Problem("revision_mismatch", sources.locate(("revision",)), key="revision", expected=f"'{checklist.revision}', the revision this file records", found=repr(entry.revision))


def _checked_result(key: str, result, checklist: Checklist, sources: SourceMap, problems: list):
    """The result's value as a quantity in its item's unit; problems are added to the list."""
    item = checklist.item(key)
    if item is None:
        problems.append(_unknown_item(key, checklist, sources))
        return None
    if result.value is None:
        return None
    where = sources.locate(("results", key, "value"))
    if not item.measured:
        problems.append(Problem("value_not_expected", where, key=f"results.{key}.value", expected="no value: this item is only ticked (done: true)", found=repr(result.value)))
        return None
    try:
        return _quantity(result.value, item)
    except UnitProblem as problem:
        problems.append(Problem(problem.kind, where, key=f"results.{key}.value", expected=problem.expected, found=problem.found, hint=_unit_hint(problem, item)))
        return None


def _unknown_item(key: str, checklist: Checklist, sources: SourceMap) -> Problem:
    return Problem(
        "unknown_item",
        sources.locate(("results", key), at_key=True),
        key=f"results.{key}",
        expected=f"an item id printed on the checklist of {checklist.build} rev {checklist.revision}",
        found=repr(key),
        hint=did_you_mean(key, [item.key for item in checklist.items]),
    )


def _quantity(raw, item: Item):
    try:
        quantity = parse_quantity(raw, dimension_of(item.unit))
    except UnitProblem as problem:
        raise UnitProblem(problem.kind, RISE if item.unit == "K" else problem.expected, problem.found) from None
    if item.unit == "K" and _is_offset(quantity):
        raise UnitProblem("temperature_not_rise", RISE, f"{fmt(quantity)}, a reading")
    return quantity.to(item.unit)


def _is_offset(quantity) -> bool:
    return any(quantity.units == Q_(1, unit).units for unit in OFFSET_UNITS)


def _unit_hint(problem: UnitProblem, item: Item) -> str:
    return f"write it with a unit, e.g. '{Q_(1, item.unit):~P}'" if problem.kind == "missing_unit" else ""


def dimension_of(unit: str) -> str:
    """The record's name for the kind of quantity a unit measures, e.g. 'ohm' -> '[resistance]'."""
    wanted = Q_(1, unit).dimensionality
    return next(name for name in DIMENSION_NAMES if dimensionality_of(name) == wanted)
