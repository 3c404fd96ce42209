"""Loading a record file: YAML with positions, then validation, every problem in one pass."""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from dossier.problems import Location
from dossier.reading.model_file import load_model_file
from dossier.reading.yaml_source import SourceMap
from dossier.record.model import Record

RECORD_EXAMPLE = "id: ..., title: ..."


@dataclass(frozen=True)
class LoadedRecord:
    record: Record
    sources: SourceMap
    path: Path

    def locate(self, key_path) -> Location:
        return self.sources.locate(tuple(key_path))


def load_record(path: Path, shown_as: str | None = None) -> LoadedRecord:
    loaded = load_model_file(path, Record, RECORD_EXAMPLE, shown_as)
    return LoadedRecord(loaded.model, loaded.sources, path)
