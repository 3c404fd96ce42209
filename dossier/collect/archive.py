"""Reading a whole archive for the site: every revision validated, reviewed and drawn.

Every problem in every file is gathered in one pass and raised together, so a build that is
refused names all that is wrong at once; nothing is written before that.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path
from typing import Callable, Iterator

from dossier.reading.archive import RevisionFile, build_dirs, load_revision, revision_files
from dossier.findings import Finding
from dossier.ledger import Ledger, Publication, frozen_problems, load_ledger
from dossier.plugins import Calc
from dossier.problems import InputError, Location, Problem
from dossier.reading.record import LoadedRecord
from dossier.review import Review, load_plugins, run_review
from dossier.checklist.sheet import Checklist, build_checklist
from dossier.signoff.revision import revision_signoffs
from dossier.signoff.state import SignoffState
from dossier.collect.caches import Caches
from dossier.collect.extras import Extras, revision_extras
from dossier.collect.parallel import collected
from dossier.reading.settings import ArchiveSettings, load_settings
from dossier.calcs import isolation, rails, thermal

CHECKLIST_SHEETS = {"a4": "checklist-a4.html", "letter": "checklist-letter.html"}


@dataclass
class Revision:
    file: RevisionFile
    loaded: LoadedRecord
    review: Review
    checklist: Checklist
    extras: Extras
    publication: Publication | None
    signoff: SignoffState

    @property
    def findings(self) -> list[Finding]:
        return list(self.review.findings)

    @property
    def record(self):
        return self.loaded.record

    @property
    def letter(self) -> str:
        return self.file.letter


@dataclass
class Build:
    id: str
    folder: Path
    revisions: list[Revision]

    @property
    def current(self) -> Revision:
        return self.revisions[-1]


@dataclass
class Archive:
    root: Path
    settings: ArchiveSettings
    calcs: list[Calc]
    ledger: Ledger
    builds: list[Build] = field(default_factory=list)



def collect(root: Path, calcs: list[Calc] | None = None, cache=None, progress: Callable[[Build], None] | None = None) -> Archive:
    """The whole archive in memory; InputError with every problem found if anything is wrong."""
    archive, problems = open_archive(root, calcs)
    for build in each_build(archive, problems, cache):
        archive.builds.append(build)
        if progress is not None:
            progress(build)
    if problems:
        raise InputError(problems)
    return archive


def open_archive(root: Path, calcs: list[Calc] | None = None) -> tuple[Archive, list[Problem]]:
    """The archive's settings and publication ledger (no builds yet), and the problems found so far."""
    if not root.is_dir():
        raise InputError([Problem("path_missing", Location(str(root)), expected="an archive folder", found="no folder at this path")])
    calcs = calcs if calcs is not None else load_plugins()
    problems: list[Problem] = []
    settings = _gathered(problems, lambda: load_settings(root), ArchiveSettings())
    ledger = _gathered(problems, lambda: load_ledger(root), Ledger())
    problems.extend(frozen_problems(root, ledger))
    return Archive(root, settings, configured_calcs(calcs, settings), ledger), problems


CONFIGURABLE = ((isolation.CALC, isolation.configured), (thermal.CALC, thermal.configured), (rails.CALC, rails.configured))


def configured_calcs(calcs: list[Calc], settings: ArchiveSettings) -> list[Calc]:
    """The isolation calc reads the archive's table_interpolation setting and default standard; the thermal and
    rails calcs read the default standard (touch limits, energy-source classes); the others take none."""
    return [next((configure(settings) for built_in, configure in CONFIGURABLE if calc is built_in), calc) for calc in calcs]


def each_build(archive: Archive, problems: list[Problem], cache=None, jobs: int | None = None) -> Iterator[Build]:
    """Builds in archive order, a few at a time so a large archive is never all in memory; problems are added
    to the list. Large archives are collected on every core (see dossier.collect.parallel)."""
    for build, found in collected(archive, build_dirs(archive.root), cache, collect_with_problems, jobs):
        problems.extend(found)
        if build is not None:
            yield build


def _gathered(problems: list[Problem], step, fallback):
    try:
        return step()
    except InputError as error:
        problems.extend(error.problems)
        return fallback


def collect_with_problems(archive: Archive, folder: Path, cache) -> tuple[Build | None, list[Problem]]:
    problems: list[Problem] = []
    return _collect_build(archive, folder, cache, problems), problems


def _collect_build(archive: Archive, folder: Path, cache, problems: list[Problem]) -> Build | None:
    revisions = []
    for rev in revision_files(folder):
        revision = _gathered(problems, lambda: _collect_revision(archive, rev, cache), None)
        if revision is not None:
            revisions.append(revision)
    return Build(folder.name, folder, revisions) if revisions else None


def _collect_revision(archive: Archive, rev: RevisionFile, cache) -> Revision:
    loaded = load_revision(rev, shown_as=f"{rev.build_id}/{rev.path.name}")
    review = run_review(loaded.record, archive.calcs)
    signoff = revision_signoffs(loaded, review.findings)
    checklist = build_checklist(loaded.record, review, signoff, archive.ledger.head if archive.ledger.chain else "")
    caches = cache or Caches()
    extras = revision_extras(loaded, review, checklist, caches.drawings, CHECKLIST_SHEETS, caches.pdfs)
    return Revision(rev, loaded, review, checklist, extras, archive.ledger.entry(rev.build_id, rev.letter), signoff)
