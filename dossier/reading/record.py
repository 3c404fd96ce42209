"""Loading a record file: YAML with positions, then validation, every problem in one pass."""

from __future__ import annotations

import difflib
import typing
from dataclasses import dataclass
from pathlib import Path

from pydantic import BaseModel, ValidationError

from dossier.problems import InputError, Location, Problem
from dossier.record.model import Record
from dossier.reading.yaml_source import SourceMap, dotted, read_document


@dataclass(frozen=True)
class LoadedRecord:
    record: Record
    sources: SourceMap
    path: Path

    def locate(self, key_path) -> Location:
        return self.sources.locate(tuple(key_path))


def load_record(path: Path, shown_as: str | None = None) -> LoadedRecord:
    document = read_document(path, shown_as)
    if not isinstance(document.data, dict):
        found = "an empty file" if document.data is None else type(document.data).__name__
        raise InputError([Problem("not_a_mapping", Location(document.sources.file, 1, 1), expected="a mapping of keys (id: ..., title: ...)", found=found)])
    try:
        record = Record.model_validate(document.data)
    except ValidationError as error:
        raise InputError([_problem(item, document.sources) for item in error.errors()]) from None
    return LoadedRecord(record, document.sources, path)


def _problem(item: dict, sources: SourceMap) -> Problem:
    path = tuple(item["loc"])
    kind = item["type"]
    location = sources.locate(path, at_key=kind == "extra_forbidden")
    if kind == "missing":
        location = sources.locate(path[:-1])
    return Problem(
        code=kind,
        location=location,
        key=dotted(path),
        expected=_expected(item),
        found=_found(item),
        hint=_hint(kind, path),
    )


EXPECTED_BY_TYPE = {
    "string_too_long": "at most {max_length} characters",
    "string_too_short": "at least {min_length} character(s)",
    "too_short": "at least {min_length} item(s)",
    "too_long": "at most {max_length} item(s)",
    "greater_than": "a number above {gt}",
    "greater_than_equal": "a number of at least {ge}",
    "less_than": "a number below {lt}",
    "less_than_equal": "a number of at most {le}",
    "string_pattern_mismatch": "text matching {pattern}",
    "string_type": "text",
    "int_type": "a whole number",
    "int_parsing": "a whole number",
    "float_type": "a number",
    "float_parsing": "a number",
    "bool_type": "true or false",
    "bool_parsing": "true or false",
    "list_type": "a list",
    "dict_type": "a mapping",
    "model_type": "a mapping",
    "date_type": "a date (YYYY-MM-DD)",
    "date_from_datetime_parsing": "a date (YYYY-MM-DD)",
}


def _expected(item: dict) -> str:
    ctx = item.get("ctx") or {}
    if "expected" in ctx:
        return str(ctx["expected"])
    template = EXPECTED_BY_TYPE.get(item["type"])
    if template:
        try:
            return template.format(**ctx)
        except KeyError:
            pass
    if item["type"] == "missing":
        return "this key"
    if item["type"] == "extra_forbidden":
        return "a known key"
    return item["msg"].removeprefix("Value error, ")


def _found(item: dict) -> str:
    ctx = item.get("ctx") or {}
    if "found" in ctx:
        return str(ctx["found"])
    if item["type"] == "missing":
        return "nothing"
    if item["type"] == "extra_forbidden":
        return repr(str(item["loc"][-1]))
    value = item.get("input")
    if isinstance(value, (dict, list)):
        return "a mapping" if isinstance(value, dict) else "a list"
    text = repr(value)
    return text if len(text) <= 60 else text[:57] + "..."


def _hint(kind: str, path: tuple) -> str:
    if kind != "extra_forbidden" or not path:
        return ""
    known = known_keys(Record, path[:-1])
    close = difflib.get_close_matches(str(path[-1]), known, n=1, cutoff=0.6)
    return f"did you mean '{close[0]}'?" if close else ""


def known_keys(model: type[BaseModel], path: tuple) -> list[str]:
    """The keys a mapping at this path may hold, following the model's annotations."""
    annotation: object = model
    for part in path:
        annotation = _step(annotation, part)
        if annotation is None:
            return []
    target = _model_in(annotation)
    return list(target.model_fields) if target else []


def _step(annotation, part):
    model = _model_in(annotation)
    if isinstance(part, int):
        args = [a for a in typing.get_args(_strip(annotation)) if a is not type(None)]
        return args[0] if args else None
    if model is None or part not in model.model_fields:
        return None
    return model.model_fields[part].annotation


def _strip(annotation):
    while typing.get_origin(annotation) is typing.Annotated:
        annotation = typing.get_args(annotation)[0]
    args = [a for a in typing.get_args(annotation) if a is not type(None)]
    if typing.get_origin(annotation) in (typing.Union, getattr(__import__("types"), "UnionType")) and len(args) == 1:
        return _strip(args[0])
    return annotation


def _model_in(annotation):
    annotation = _strip(annotation)
    if isinstance(annotation, type) and issubclass(annotation, BaseModel):
        return annotation
    return None
