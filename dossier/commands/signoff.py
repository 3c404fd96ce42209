"""`dossier sign-off RECORD --reviewer NAME`: start a sign-off file for a revision, listing what needs a decision."""

from __future__ import annotations

import datetime
from pathlib import Path

from dossier.collect.archive import configured_calcs
from dossier.reading.archive import expand, load_revision
from dossier.reading.settings import load_settings
from dossier.review import load_plugins, review
from dossier.signoff.start import next_signoff_path, signoff_text


class SignoffRefused(Exception):
    """The sign-off cannot be started (the record is not one revision file)."""


def start_signoff(record: Path, reviewer: str, today: datetime.date) -> Path:
    """Raises InputError for an invalid record; never overwrites a file."""
    revisions = expand([record])
    if len(revisions) != 1 or not record.is_file():
        raise SignoffRefused(f"{record}: name one revision file (BUILD/rev-X.yaml), not a folder")
    loaded = load_revision(revisions[0])
    archive = loaded.path.resolve().parent.parent
    findings = review(loaded.record, configured_calcs(load_plugins(), load_settings(archive)))  # as `check` and the build run them
    path = next_signoff_path(loaded.path.parent, loaded.record.revision)
    with path.open("x", encoding="utf-8") as handle:
        handle.write(signoff_text(loaded, findings, reviewer, today))
    return path
