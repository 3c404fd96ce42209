"""`dossier check`: validate records (and the commissioning files beside them) and run every calc."""

from __future__ import annotations

from functools import lru_cache, partial
from pathlib import Path

from dossier.collect.archive import configured_calcs
from dossier.ledger import load_ledger, published_revision_problems
from dossier.reading.settings import load_settings

from dossier.problems import InputError
from dossier.reading.archive import RevisionFile, expand, load_revision
from dossier.report.result import CheckResult, RecordCheck
from dossier.review import load_plugins, run_review


def run_check(paths: list[Path]) -> CheckResult:
    """Every record named, checked; a broken plugin raises before any record is read."""
    calcs = load_plugins()
    try:
        revisions = expand(paths)
    except InputError as error:
        return CheckResult([RecordCheck(str(paths[0]), problems=error.problems)])
    calcs_in = lru_cache(maxsize=None)(partial(_archive_calcs, calcs))
    return CheckResult([_check_one(rev, calcs_in) for rev in revisions])


def _archive_calcs(calcs, archive: Path):
    """The calcs as the site build runs them for this archive, its archive.yaml settings applied, and its ledger."""
    return configured_calcs(calcs, load_settings(archive)), load_ledger(archive)


def _check_one(rev: RevisionFile, calcs_in) -> RecordCheck:
    try:
        loaded = load_revision(rev)
        archive = rev.path.resolve().parent.parent
        calcs, ledger = calcs_in(archive)
    except InputError as error:
        return RecordCheck(str(rev.path), problems=error.problems)
    reviewed = run_review(loaded.record, calcs)
    title = f"{rev.path}  ({loaded.record.id} rev {loaded.record.revision}: {loaded.record.title})"
    checked = RecordCheck(str(rev.path), title, list(reviewed.findings), loaded.locate)
    checked.problems.extend(published_revision_problems(archive, ledger, rev.build_id, rev.letter))
    _check_signoffs(loaded, checked)
    _check_commissioning(loaded, reviewed, checked)
    return checked


def _check_signoffs(loaded, checked: RecordCheck) -> None:
    """Sign-off files beside the record are validated like the record, and judged against its findings."""
    from dossier.signoff.revision import revision_signoffs

    try:
        checked.signoff = revision_signoffs(loaded, checked.findings)
    except InputError as error:
        checked.problems.extend(error.problems)


def _check_commissioning(loaded, reviewed, checked: RecordCheck) -> None:
    """A commissioning file beside the record is validated like the record itself, against the checklist the
    build makes from the same review (built once here, as there)."""
    from dossier.checklist.overview import commissioning_state, load_for_revision
    from dossier.checklist.sheet import build_checklist

    checklist = build_checklist(loaded.record, reviewed, checked.signoff)
    try:
        commissioning = load_for_revision(loaded, checklist)
    except InputError as error:
        checked.problems.extend(error.problems)
        return
    if commissioning is not None:
        checked.commissioning = commissioning_state(loaded, checklist, commissioning)
