"""Reading YAML while keeping where every key and value stands in the file."""

from __future__ import annotations

import os
import re
import stat
from dataclasses import dataclass
from pathlib import Path

import yaml

from dossier.problems import InputError, Location, Problem

MAX_BYTES = 1_000_000
MAX_NODES = 50_000
MAX_DEPTH = 40

KeyPath = tuple
PLAIN_TAGS = {f"tag:yaml.org,2002:{name}" for name in ("str", "int", "float", "bool", "null", "map", "seq", "timestamp", "merge")}


@dataclass(frozen=True)
class Spot:
    key: Location
    value: Location


class SourceMap:
    """Maps a key path such as ('barriers', 0, 'creepage') to its place in the file."""

    def __init__(self, file: str):
        self.file = file
        self._spots: dict[KeyPath, Spot] = {}

    def record(self, path: KeyPath, key: Location, value: Location) -> None:
        self._spots[path] = Spot(key, value)

    def locate(self, path: KeyPath, *, at_key: bool = False) -> Location:
        """The nearest known place for a path: the value itself, or its closest parent."""
        for end in range(len(path), -1, -1):
            spot = self._spots.get(tuple(path[:end]))
            if spot is not None:
                return spot.key if at_key and end == len(path) else spot.value
        return Location(self.file, 1, 1)

    def __contains__(self, path: KeyPath) -> bool:
        return tuple(path) in self._spots


@dataclass(frozen=True)
class Document:
    data: object
    sources: SourceMap
    text: str


def read_document(path: Path, shown_as: str | None = None) -> Document:
    """Load one YAML file safely; any problem is raised as a located InputError."""
    name = shown_as or str(path)
    text = _read_text(path, name)
    node = _compose(text, name)
    sources = SourceMap(name)
    if node is not None:
        sources.record((), _location(sources, node), _location(sources, node))
    data = _Converter(sources).convert(node, ()) if node is not None else None
    return Document(data, sources, text)


def _read_text(path: Path, name: str) -> str:
    try:
        raw = _read_bounded(path, name)
    except OSError as error:
        raise _single("file_unreadable", Location(name), found=error.strerror or str(error)) from None
    try:
        return raw.decode("utf-8-sig")
    except UnicodeDecodeError as error:
        return _bad_encoding(raw, error, name)


def _read_bounded(path: Path, name: str) -> bytes:
    """The file's bytes, never more than the limit: its size is checked before reading, and the reading stops
    one byte past the limit (a file may grow, or a special file report no size). A FIFO or a device is not
    read at all: opened without waiting, then refused by its kind."""
    descriptor = os.open(path, os.O_RDONLY | os.O_NONBLOCK | getattr(os, "O_CLOEXEC", 0))
    with os.fdopen(descriptor, "rb") as stream:
        status = os.fstat(stream.fileno())
        if not stat.S_ISREG(status.st_mode):
            raise _single("file_unreadable", Location(name), expected="a regular file", found="a folder" if stat.S_ISDIR(status.st_mode) else "a special file (FIFO, socket or device)")
        if status.st_size > MAX_BYTES:
            raise _too_large(name, status.st_size)
        raw = stream.read(MAX_BYTES + 1)
    if len(raw) > MAX_BYTES:
        raise _too_large(name, len(raw))
    return raw


def _too_large(name: str, size: int) -> InputError:
    return _single("file_too_large", Location(name), expected=f"at most {MAX_BYTES:,} bytes", found=f"{size:,} bytes")


def _bad_encoding(raw: bytes, error: UnicodeDecodeError, name: str):
    before = raw[: error.start]
    line = before.count(b"\n") + 1
    column = error.start - (before.rfind(b"\n") + 1) + 1
    found = f"byte 0x{raw[error.start]:02x}"
    raise _single("not_utf8", Location(name, line, column), expected="UTF-8 text", found=found)


class _BoundedLoader(yaml.SafeLoader):
    """Composes nodes while counting them and their depth, so a file that is too large or too deep is
    refused as soon as the limit is passed (not after composing it all, nor by running out of stack)."""

    def __init__(self, text: str, name: str):
        super().__init__(text)
        self.name = name
        self.nodes = 0
        self.depth = 0

    def compose_node(self, parent, index):
        self.nodes += 1
        self.depth += 1
        try:
            self._guard()
            return super().compose_node(parent, index)
        finally:
            self.depth -= 1

    def _guard(self) -> None:
        if self.nodes <= MAX_NODES and self.depth <= MAX_DEPTH + 1:  # the top node is at depth 1 here, 0 below
            return
        mark = self.peek_event().start_mark
        where = Location(self.name, mark.line + 1, mark.column + 1)
        if self.nodes > MAX_NODES:
            raise _too_many(where)
        raise _single("too_deep", where, expected=f"nesting at most {MAX_DEPTH} levels")


def _compose(text: str, name: str):
    loader = None
    try:
        loader = _BoundedLoader(text, name)  # the reader checks every character here
        return loader.get_single_node()
    except yaml.MarkedYAMLError as error:
        mark = error.problem_mark or error.context_mark
        location = Location(name, mark.line + 1, mark.column + 1) if mark else Location(name)
        raise _single("yaml_syntax", location, **_syntax_details(error.problem or str(error)), hint=_syntax_context(error)) from None
    except yaml.reader.ReaderError as error:
        location = _offset_location(text, error.position, name)
        raise _single("control_character", location, expected="printable text", found=f"character U+{ord(error.character) if isinstance(error.character, str) else error.character:04X}") from None
    except yaml.YAMLError as error:
        raise _single("yaml_syntax", Location(name, 1, 1), found=str(error)) from None
    finally:
        if loader is not None:
            loader.dispose()


# The YAML reader words its problems as "found X", "expected X, but found Y" and the like; split them so
# they read as dossier's own "expected ..., found ..." without saying "found" twice.
_SYNTAX_WORDING = (
    re.compile(r"expected (?P<expected>.+?),? but (?:found|got) (?P<found>.+)"),
    re.compile(r"could not find expected (?P<expected>.+)"),
    re.compile(r"(?:but )?found (?P<found>.+)"),
)


def _syntax_details(problem: str) -> dict:
    for pattern in _SYNTAX_WORDING:
        match = pattern.fullmatch(problem)
        if match:
            return {key: value for key, value in match.groupdict().items() if value}
    return {"found": problem}


def _too_many(where: Location) -> InputError:
    return _single("too_many_nodes", where, expected=f"at most {MAX_NODES:,} values (aliases count each time they are used)")


def _offset_location(text: str, offset: int, name: str) -> Location:
    before = text[:offset]
    return Location(name, before.count("\n") + 1, offset - (before.rfind("\n") + 1) + 1)


def _syntax_context(error: yaml.MarkedYAMLError) -> str:
    """Where the construct that the error broke off began, e.g. the '[' of an unclosed list."""
    mark, context = error.context_mark, error.context
    if not (mark and context) or mark is error.problem_mark:
        return ""
    return f"{context} that began at line {mark.line + 1}, column {mark.column + 1}"


def _single(code: str, location: Location, **details) -> InputError:
    return InputError([Problem(code, location, **details)])


def _location(sources: SourceMap, node) -> Location:
    return Location(sources.file, node.start_mark.line + 1, node.start_mark.column + 1)


class _Converter:
    """Turns composed nodes into plain data, bounding size and depth (aliases count each time used)."""

    def __init__(self, sources: SourceMap):
        self.sources = sources
        self.count = 0
        self.constructor = yaml.constructor.SafeConstructor()

    def convert(self, node, path: KeyPath, depth: int = 0):
        self._guard(node, depth)
        if isinstance(node, yaml.MappingNode):
            return self._mapping(node, path, depth)
        if isinstance(node, yaml.SequenceNode):
            return [self._item(child, path + (i,), depth) for i, child in enumerate(node.value)]
        return self._scalar(node, path)

    def _guard(self, node, depth: int) -> None:
        self.count += 1
        where = _location(self.sources, node)
        if self.count > MAX_NODES:
            raise _too_many(where)
        if depth > MAX_DEPTH:
            raise _single("too_deep", where, expected=f"nesting at most {MAX_DEPTH} levels")
        if node.tag not in PLAIN_TAGS:
            raise _single("yaml_tag", where, expected="plain YAML values", found=f"tag {node.tag}")

    def _item(self, child, path: KeyPath, depth: int):
        where = _location(self.sources, child)
        self.sources.record(path, where, where)
        return self.convert(child, path, depth + 1)

    def _mapping(self, node, path: KeyPath, depth: int) -> dict:
        result: dict = {}
        for key_node, value_node in node.value:
            if key_node.tag == "tag:yaml.org,2002:merge":
                raise _single("merge_key", _location(self.sources, key_node), found="'<<' merge key", hint="write the keys out in full")
            key = self._key(key_node)
            if key in result:
                raise _single("duplicate_key", _location(self.sources, key_node), key=_dotted(path + (key,)), found=f"{key!r} given twice")
            self.sources.record(path + (key,), _location(self.sources, key_node), _location(self.sources, value_node))
            result[key] = self.convert(value_node, path + (key,), depth + 1)
        return result

    def _key(self, node):
        if not isinstance(node, yaml.ScalarNode):
            raise _single("bad_key", _location(self.sources, node), expected="a plain key", found="a list or mapping used as a key")
        return str(self._scalar(node, ()))

    def _scalar(self, node, path: KeyPath):
        try:
            return self.constructor.construct_object(node, deep=True)
        except (yaml.constructor.ConstructorError, ValueError) as error:
            found = getattr(error, "problem", None) or str(error)
            raise _single("yaml_value", _location(self.sources, node), key=dotted(path), found=found) from None


def _dotted(path: KeyPath) -> str:
    return dotted(path)


def dotted(path) -> str:
    """('barriers', 0, 'creepage') -> 'barriers[0].creepage'."""
    text = ""
    for part in path:
        text += f"[{part}]" if isinstance(part, int) else (f".{part}" if text else str(part))
    return text
