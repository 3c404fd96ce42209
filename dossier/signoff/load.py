"""Finding and loading a revision's sign-off files, every problem located by file, line, column and key."""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from dossier.problems import InputError, Location, Problem
from dossier.reading.archive import signoff_paths
from dossier.reading.model_file import load_model_file
from dossier.reading.yaml_source import SourceMap
from dossier.signoff.model import SignoffFile

SIGNOFF_EXAMPLE = "build: ..., revision: ..., reviewer: ..."


@dataclass(frozen=True)
class LoadedSignoff:
    entry: SignoffFile
    sources: SourceMap
    path: Path

    def locate(self, key_path) -> Location:
        return self.sources.locate(tuple(key_path))


def load_signoffs(build_dir: Path, build_id: str, revision: str) -> list[LoadedSignoff]:
    """Every sign-off of one revision; all problems in all of them are raised together."""
    loaded, problems = [], []
    for path in signoff_paths(build_dir, revision):
        try:
            loaded.append(load_signoff(path, build_id, revision))
        except InputError as error:
            problems.extend(error.problems)
    if problems:
        raise InputError(problems)
    return loaded


def load_signoff(path: Path, build_id: str, revision: str) -> LoadedSignoff:
    if not path.is_file() or path.is_symlink():
        raise InputError([Problem("not_a_file", Location(str(path)), expected="a plain sign-off file", found="a link, folder or device")])
    loaded = load_model_file(path, SignoffFile, SIGNOFF_EXAMPLE, str(path))
    problems = list(_placement_problems(loaded.model, build_id, revision, loaded.sources))
    if problems:
        raise InputError(problems)
    return LoadedSignoff(loaded.model, loaded.sources, path)


def _placement_problems(entry: SignoffFile, build_id: str, revision: str, sources: SourceMap):
    if entry.build != build_id:
        yield Problem("build_mismatch", sources.locate(("build",)), key="build", expected=f"'{build_id}', the build this file sits with", found=repr(entry.build))
    if entry.revision != revision:
        yield Problem("revision_mismatch", sources.locate(("revision",)), key="revision", expected=f"'{revision}', the revision its file name names", found=repr(entry.revision))
