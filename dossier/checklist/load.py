"""Loading a commissioning file: YAML with positions, validation, then a check against the revision's checklist.

Every problem is found in one pass and reported with its file, line, column and key, like the record's.
"""

from __future__ import annotations

import dataclasses
import difflib
from dataclasses import dataclass
from pathlib import Path

from pydantic import ValidationError

from dossier.reading.archive import COMMISSIONING_FILE
from dossier.checklist.items import Item
from dossier.checklist.commissioning import CommissioningFile
from dossier.checklist.sheet import Checklist
from dossier.problems import InputError, Location, Problem
from dossier.reading.record import _problem as record_problem
from dossier.reading.record import known_keys
from dossier.reading.yaml_source import SourceMap, read_document
from dossier.units import DIMENSION_NAMES, Q_, UnitProblem, dimensionality_of, fmt, parse_quantity

OFFSET_UNITS = ("degC", "degF")
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
    document = read_document(path, shown_as)
    if not isinstance(document.data, dict):
        found = "an empty file" if document.data is None else type(document.data).__name__
        raise InputError([Problem("not_a_mapping", Location(document.sources.file, 1, 1), expected="a mapping of keys (build: ..., revision: ...)", found=found)])
    entry = _validated(document.data, document.sources)
    problems = list(_placement_problems(entry, checklist, path, document.sources))
    values = {}
    for key, result in entry.results.items():
        value = _checked_result(key, result, checklist, document.sources, problems)
        if value is not None:
            values[key] = value
    if problems:
        raise InputError(problems)
    return Commissioning(entry, values, document.sources, path)


def _validated(data: dict, sources: SourceMap) -> CommissioningFile:
    try:
        return CommissioningFile.model_validate(data)
    except ValidationError as error:
        raise InputError([_problem(item, sources) for item in error.errors()]) from None


def _problem(item: dict, sources: SourceMap) -> Problem:
    """The record's mapping of a pydantic error, with key suggestions from this file's model."""
    problem = record_problem(item, sources)
    path = tuple(item["loc"])
    if item["type"] != "extra_forbidden":
        return problem
    close = difflib.get_close_matches(str(path[-1]), known_keys(CommissioningFile, path[:-1]), n=1, cutoff=0.6)
    return dataclasses.replace(problem, hint=f"did you mean '{close[0]}'?" if close else "")


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
    close = difflib.get_close_matches(key, [item.key for item in checklist.items], n=1, cutoff=0.6)
    return Problem(
        "unknown_item",
        sources.locate(("results", key), at_key=True),
        key=f"results.{key}",
        expected=f"an item id printed on the checklist of {checklist.build} rev {checklist.revision}",
        found=repr(key),
        hint=f"did you mean '{close[0]}'?" if close else "",
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
