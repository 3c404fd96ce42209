"""Demo revisions with their findings, checklists and commissioning records, for the checklist tests."""

from __future__ import annotations

from functools import lru_cache

from conftest import DEMO

from dossier.archive import RevisionFile, load_revision
from dossier.checklist.overview import load_for_revision
from dossier.checklist.sheet import build_checklist
from dossier.plugins import load_calcs
from dossier.record.load import LoadedRecord
from dossier.review import review

DEMO_REVISIONS = [("solar-bank-charger", "A"), ("solar-bank-charger", "B"), ("solar-bank-charger", "C"), ("bench-psu-13v8", "A"), ("rotator-control", "A")]


@lru_cache(maxsize=None)
def demo(build: str, revision: str) -> tuple[LoadedRecord, tuple]:
    """A demo revision, loaded, with every calc's findings."""
    loaded = load_revision(RevisionFile(build, revision, DEMO / build / f"rev-{revision}.yaml"))
    return loaded, tuple(review(loaded.record, load_calcs()))


def checklist_of(build: str, revision: str):
    loaded, findings = demo(build, revision)
    return build_checklist(loaded.record, list(findings))


def commissioning_of(build: str, revision: str):
    loaded, findings = demo(build, revision)
    return load_for_revision(loaded, list(findings))


def with_record(loaded: LoadedRecord, **changes) -> LoadedRecord:
    """The same loaded revision with some top-level record fields replaced (the file is not touched)."""
    return LoadedRecord(loaded.record.model_copy(update=changes), loaded.sources, loaded.path)
