"""From a YAML file to a validated pydantic model, or to located problems: the one path every file kind takes.

Records, archive.yaml, published.yaml and commissioning files all come through here, so the same mistake
(an unknown key, a missing key, a value of the wrong type) is located and worded the same way in each.
"""

from __future__ import annotations

import dataclasses
import typing
from dataclasses import dataclass
from pathlib import Path
from types import UnionType
from typing import Generic, TypeVar

from pydantic import BaseModel, ValidationError

from dossier.problems import InputError, Location, Problem
from dossier.reading.yaml_source import SourceMap, dotted, read_document
from dossier.wording import EMPTY_FILE_TEXT, either, unknown_key_hint, validation_expected, validation_found

M = TypeVar("M", bound=BaseModel)


@dataclass(frozen=True)
class ModelFile(Generic[M]):
    """A validated file: the model, where each of its keys stands, and the file it came from."""

    model: M
    sources: SourceMap
    path: Path
    data: dict


def load_model_file(path: Path, model: type[M], example: str, shown_as: str | None = None, when_empty: M | None = None) -> ModelFile[M]:
    """Read and validate one file; every problem in it is raised at once as a located InputError.

    example shows the file's first keys, e.g. 'id: ..., title: ...', for a file that is not a mapping;
    when_empty is the model of a file holding nothing (only comments), if such a file is allowed."""
    document = read_document(path, shown_as)
    if document.data is None and when_empty is not None:
        return ModelFile(when_empty, document.sources, path, {})
    if not isinstance(document.data, dict):
        found = EMPTY_FILE_TEXT if document.data is None else type(document.data).__name__
        where = Location(document.sources.file, 1, 1)
        raise InputError([Problem("not_a_mapping", where, expected=f"a mapping of keys ({example})", found=found)])
    return ModelFile(validated(document.data, model, document.sources), document.sources, path, document.data)


def validated(data: dict, model: type[M], sources: SourceMap) -> M:
    try:
        return model.model_validate(data)
    except ValidationError as error:
        raise InputError(validation_problems(error, model, sources, data)) from None


def validation_problems(error: ValidationError, model: type[BaseModel], sources: SourceMap, data: object = None) -> list[Problem]:
    """One problem per key: a value that fits none of a union's types is one problem listing them all."""
    by_key: dict[tuple, list[Problem]] = {}
    for item in error.errors():
        problem = _problem(item, model, sources, data)
        by_key.setdefault((problem.key, problem.location, problem.found), []).append(problem)
    return [_joined(problems) for problems in by_key.values()]


def _joined(problems: list[Problem]) -> Problem:
    if len(problems) == 1:
        return problems[0]
    expected = list(dict.fromkeys(problem.expected for problem in problems))
    return dataclasses.replace(problems[0], expected=either(expected))


def _problem(item: dict, model: type[BaseModel], sources: SourceMap, data: object) -> Problem:
    kind = item["type"]
    path = tuple(item["loc"]) if kind in ("missing", "extra_forbidden") else _key_path(item["loc"], sources)
    return Problem(
        code=kind,
        location=_location(kind, path, sources),
        key=dotted(path),
        expected=validation_expected(kind, item.get("ctx") or {}, item["msg"]),
        found=validation_found(kind, item.get("ctx") or {}, item.get("input"), path),
        hint=_hint(kind, path, model, data),
    )


def _key_path(loc: tuple, sources: SourceMap) -> tuple:
    """The key path in the file: pydantic adds the member it tried for a union ('str', 'int', ...); drop it."""
    path = tuple(loc)
    while path and not isinstance(path[-1], int) and path not in sources and path[:-1] in sources and _names_a_type(path[-1]):
        path = path[:-1]
    return path


def _names_a_type(part: str) -> bool:
    return part in {"str", "int", "float", "bool", "list", "dict", "date", "none"} or "[" in part


def _location(kind: str, path: tuple, sources: SourceMap) -> Location:
    if kind == "missing":
        return sources.locate(path[:-1])  # a missing key has no place of its own: point at its mapping
    return sources.locate(path, at_key=kind == "extra_forbidden")


def _hint(kind: str, path: tuple, model: type[BaseModel], data: object) -> str:
    if kind != "extra_forbidden" or not path:
        return ""
    return unknown_key_hint(str(path[-1]), known_keys(model, path[:-1]), _previous_entry(data, path))


def _previous_entry(data: object, path: tuple) -> tuple[str, object] | None:
    """The key and value written just before an unknown key in its mapping, if any."""
    for part in path[:-1]:
        try:
            data = data[part]
        except (KeyError, IndexError, TypeError):
            return None
    if not isinstance(data, dict):
        return None
    keys = list(data)
    index = keys.index(path[-1]) if path[-1] in keys else 0
    return (keys[index - 1], data[keys[index - 1]]) if index > 0 else None


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
    """The annotation one key (or list index, or mapping key) further down."""
    stripped = _strip(annotation)
    model = _model_in(stripped)
    if model is not None:
        field = model.model_fields.get(part) if isinstance(part, str) else None
        return field.annotation if field else None
    args = [a for a in typing.get_args(stripped) if a is not type(None)]
    return args[-1] if args else None  # list[X] -> X, dict[str, X] -> X


def _strip(annotation):
    while typing.get_origin(annotation) is typing.Annotated:
        annotation = typing.get_args(annotation)[0]
    args = [a for a in typing.get_args(annotation) if a is not type(None)]
    if typing.get_origin(annotation) in (typing.Union, UnionType) and len(args) == 1:
        return _strip(args[0])
    return annotation


def _model_in(annotation):
    annotation = _strip(annotation)
    if isinstance(annotation, type) and issubclass(annotation, BaseModel):
        return annotation
    return None
