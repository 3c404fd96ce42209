"""`dossier diff A B`: what changed between two revisions, the same content as the site's changes page."""

from __future__ import annotations

from pathlib import Path

from dossier.reading.archive import expand, load_revision
from dossier.reading.settings import load_settings
from dossier.caution import MAINS_CAUTION
from dossier.collect.archive import configured_calcs
from dossier.plugins import load_calcs
from dossier.problems import InputError, Location, Problem
from dossier.review import review
from dossier.changes import finding_changes, record_changes

INDENT = "  "


def diff_text(old_path: Path, new_path: Path, calcs=None) -> str:
    """The changes from the record at old_path to the one at new_path, as lines for a terminal."""
    old, new = _load(old_path), _load(new_path)
    calcs = calcs if calcs is not None else load_calcs()
    lines = [_heading(old.record, new.record), "", "Record values that changed:"]
    lines += _value_lines(record_changes(old.record, new.record)) or [INDENT + "none"]
    lines += ["", "Findings whose verdict or value changed:"]
    changes = finding_changes(review(old.record, _as_archive_runs(calcs, old_path)), review(new.record, _as_archive_runs(calcs, new_path)))
    lines += [INDENT + change.text for change in changes] or [INDENT + "none"]
    if old.record.has_mains or new.record.has_mains:
        lines += ["", f"Caution: {MAINS_CAUTION}"]
    return "\n".join(lines)


def _as_archive_runs(calcs, path: Path):
    """The calcs with the settings of the archive the record sits in (archive.yaml two folders up), as the site runs them."""
    return configured_calcs(calcs, load_settings(path.resolve().parent.parent))


def _load(path: Path):
    revisions = expand([path])
    if len(revisions) != 1 or not path.is_file():
        raise InputError([Problem("path_missing", Location(str(path)), expected="one record file, e.g. my-build/rev-B.yaml", found="a folder" if path.is_dir() else "nothing at this path")])
    return load_revision(revisions[0])


def _heading(old, new) -> str:
    return f"{old.id} rev {old.revision} ({old.date.isoformat()}) -> {new.id} rev {new.revision} ({new.date.isoformat()})"


def _value_lines(changes) -> list[str]:
    lines = []
    for change in changes:
        if change.kind == "text":
            lines.append(f"{INDENT}{change.key}: text changed")
            lines.extend(f"{INDENT * 2}{line}" for line in change.lines)
        elif change.kind == "added":
            lines.append(f"{INDENT}{change.key}: added ({change.after})")
        elif change.kind == "removed":
            lines.append(f"{INDENT}{change.key}: removed (was {change.before})")
        else:
            lines.append(f"{INDENT}{change.key}: {change.before} -> {change.after}")
    return lines
