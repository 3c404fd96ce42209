"""An archive is a folder of builds; a build is a folder of revision files rev-A.yaml, rev-B.yaml, ..."""

from __future__ import annotations

import re
import stat
from dataclasses import dataclass
from pathlib import Path

from dossier.problems import InputError, Location, Problem
from dossier.reading.record import LoadedRecord, load_record

REVISION_FILE = re.compile(r"^rev-(?P<letter>[A-Z]{1,2})\.ya?ml$")
COMMISSIONING_FILE = re.compile(r"^commissioning-(?P<letter>[A-Z]{1,2})\.ya?ml$")
SIGNOFF_FILE = re.compile(r"^signoff-(?P<letter>[A-Z]{1,2})(?:-(?P<tag>[a-z0-9][a-z0-9-]{0,40}))?\.ya?ml$")


def signoff_paths(build_dir: Path, revision: str) -> list[Path]:
    """The sign-off files of one revision in its build folder, in name order."""
    return [path for path in sorted(build_dir.iterdir()) if (match := SIGNOFF_FILE.match(path.name)) and match["letter"] == revision]


def revision_order(letter: str) -> tuple[int, str]:
    """A, B, ..., Z, AA, AB: shorter letters first."""
    return (len(letter), letter)


@dataclass(frozen=True)
class RevisionFile:
    build_id: str
    letter: str
    path: Path
    twins: tuple[Path, ...] = ()  # other files spelling the same revision (rev-C.yml beside rev-C.yaml)


def folder_name(folder: Path) -> str:
    """The folder's own name, also for a relative path such as '.' or the parent of 'rev-A.yaml' (links kept)."""
    return folder.absolute().name


def revision_files(build_dir: Path) -> list[RevisionFile]:
    """Every name that spells a revision, whatever kind of file it is: what cannot be read is reported when
    it is loaded, never skipped. Two spellings of one revision make one entry that refuses to load."""
    by_letter: dict[str, list[Path]] = {}
    for path in sorted(build_dir.iterdir()):
        match = REVISION_FILE.match(path.name)
        if match:
            by_letter.setdefault(match["letter"], []).append(path)
    found = [RevisionFile(folder_name(build_dir), letter, paths[0], tuple(paths[1:])) for letter, paths in by_letter.items()]
    return sorted(found, key=lambda r: revision_order(r.letter))


def build_dirs(root: Path) -> list[Path]:
    return sorted(p for p in root.iterdir() if p.is_dir() and not p.name.startswith(".") and revision_files(p))


def is_build_dir(path: Path) -> bool:
    return path.is_dir() and bool(revision_files(path))


def expand(paths: list[Path]) -> list[RevisionFile]:
    """Record files named by the user: a file, a build folder or an archive folder."""
    files: list[RevisionFile] = []
    for path in paths:
        files.extend(_expand_one(path))
    return files


def _expand_one(path: Path) -> list[RevisionFile]:
    if path.is_file():
        match = REVISION_FILE.match(path.name)
        return [RevisionFile(folder_name(path.parent), match["letter"] if match else "", path)]
    if is_build_dir(path):
        return revision_files(path)
    if path.is_dir():
        return [rev for build in build_dirs(path) for rev in revision_files(build)]
    raise InputError([Problem("path_missing", Location(str(path)), expected="a record file, build folder or archive folder", found="nothing at this path")])


def load_revision(rev: RevisionFile, shown_as: str | None = None) -> LoadedRecord:
    """Load a record and check that it agrees with where it is kept."""
    problems = file_problems(rev, shown_as)
    if problems:
        raise InputError(problems)
    loaded = load_record(rev.path, shown_as)
    problems = list(_placement_problems(rev, loaded))
    if problems:
        raise InputError(problems)
    return loaded


def file_problems(rev: RevisionFile, shown_as: str | None = None) -> list[Problem]:
    """What makes a revision file unfit to read: a second spelling, a link out of the archive or to nothing,
    or something other than a regular file (a folder, a FIFO, a device)."""
    where = Location(shown_as or str(rev.path))
    if rev.twins:
        names = ", ".join(path.name for path in (rev.path, *rev.twins))
        return [Problem("revision_spelt_twice", where, expected=f"one file for revision {rev.letter}", found=names, hint="keep one and delete the others")]
    try:
        target = rev.path.resolve(strict=True)
    except (OSError, RuntimeError):  # a dangling link, or a loop of links
        return [Problem("file_unreadable", where, expected="a record file", found="a link to nothing")]
    if not target.is_relative_to(_archive_root(rev.path)):
        return [Problem("unsafe_path", where, expected="a record file inside the archive", found="a link to a file outside it")]
    kind = file_kind(target)
    if kind != "file":
        return [Problem("file_unreadable", where, expected="a record file", found=kind)]
    return []


def _archive_root(path: Path) -> Path:
    """The archive a revision file belongs to: the folder holding its build folder (links in it resolved)."""
    return path.parent.parent.resolve()


def file_kind(path: Path) -> str:
    """'file' for a regular file, else what it is, in words."""
    mode = path.stat().st_mode
    for test, kind in ((stat.S_ISREG, "file"), (stat.S_ISDIR, "a folder"), (stat.S_ISFIFO, "a FIFO (named pipe)"), (stat.S_ISSOCK, "a socket")):
        if test(mode):
            return kind
    return "a device"


def _placement_problems(rev: RevisionFile, loaded: LoadedRecord):
    record = loaded.record
    if rev.letter and record.revision != rev.letter:
        yield Problem("revision_mismatch", loaded.locate(("revision",)), key="revision", expected=f"'{rev.letter}', as in the file name {rev.path.name}", found=repr(record.revision))
    if rev.letter and record.id != rev.build_id:
        yield Problem("id_mismatch", loaded.locate(("id",)), key="id", expected=f"'{rev.build_id}', the build folder's name", found=repr(record.id))
    for index, attachment in enumerate(record.attachments):
        yield from _attachment_problems(rev.path.parent, index, attachment.path, loaded)


def _attachment_problems(build_dir: Path, index: int, relative: str, loaded: LoadedRecord):
    key = ("attachments", index, "path")
    target = build_dir / relative
    archive_root = build_dir.resolve().parent
    if not target.is_file():
        yield Problem("attachment_missing", loaded.locate(key), key=f"attachments[{index}].path", expected="a file inside the build folder", found=f"no file at {relative!r}")
    elif not target.resolve().is_relative_to(archive_root):
        yield Problem("unsafe_path", loaded.locate(key), key=f"attachments[{index}].path", expected="a file inside the archive", found=f"{relative!r} links outside it")
