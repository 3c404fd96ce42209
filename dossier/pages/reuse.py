"""Each build's pages written into the tree, from the build cache when nothing they are made from changed.

A build found in the cache (collect.build_store: keyed by its files, the archive's settings and ledger, and the
code) has its pages placed into the tree as they were written, in this process; any other build is reviewed,
drawn and written afresh, in workers on every core when there are many of them (collect.parallel), and kept
for next time unless reading it found a problem. The result is byte-identical either way.
"""

from __future__ import annotations

import functools
from pathlib import Path
from typing import Iterator

from dossier.collect.archive import Archive, collect_with_problems
from dossier.collect.build_store import BuildStore
from dossier.collect.caches import Caches
from dossier.collect.code_version import code_fingerprint
from dossier.collect.parallel import collected
from dossier.pages import layout
from dossier.pages.tree import BuildPages, write_build_pages
from dossier.problems import Problem
from dossier.reading.archive import build_dirs


class BuildKeys(dict):
    """Each build folder's key in the build cache (None: not cacheable), in archive order."""

    def whole(self) -> bool:
        return all(key is not None for key in self.values())


def build_keys(archive: Archive, problems: list[Problem], cache: Caches | None) -> BuildKeys:
    """The keys of every build folder; all None without a cache, or for an archive that could not be opened."""
    store = cache.builds if cache is not None else None
    folders = build_dirs(archive.root)
    if store is None or problems:
        return BuildKeys.fromkeys(folders)
    store.prepare(archive.root, code_fingerprint(archive.calcs), _options(cache))
    return BuildKeys((folder, store.key(folder)) for folder in folders)


def each_build_pages(archive: Archive, problems: list[Problem], root: Path, cache: Caches | None = None, jobs: int | None = None, keys: BuildKeys | None = None) -> Iterator[BuildPages]:
    """Every build's pages written under root, in archive order; problems are added to the list."""
    keys = keys if keys is not None else build_keys(archive, problems, cache)
    placed = {folder: _placed(cache, key, root / layout.build_root(folder.name)) for folder, key in keys.items()}
    missed = [folder for folder, summary in placed.items() if summary is None]
    written = _written(archive, missed, cache, root, keys, jobs)
    for folder, summary in placed.items():
        if summary is None:
            summary, found = next(written)
            problems.extend(found)
        if summary is not None:
            yield summary


def _options(cache: Caches) -> str:
    return "pdfs" if cache.pdfs is not None else "no pdfs"


def _placed(cache: Caches | None, key: str | None, target: Path) -> BuildPages | None:
    """The build's pages from the cache, placed at target; None on a miss."""
    store: BuildStore | None = cache.builds if cache is not None else None
    entry = store.load(key) if store is not None and key is not None else None
    if entry is None or not store.place(entry, target):
        return None
    prefix = f"{layout.build_root(target.name)}/"
    entry.summary.files = {prefix + name: facts for name, facts in entry.files.items()}
    return entry.summary


def _written(archive: Archive, folders: list[Path], cache: Caches | None, root: Path, keys: BuildKeys, jobs: int | None) -> Iterator[tuple]:
    """(pages or None, problems) for each folder, in order: in workers when there are enough of them."""
    return collected(archive, folders, cache, functools.partial(_build_pages, root=root, keys=keys), jobs)


def _build_pages(archive: Archive, folder: Path, cache: Caches | None, root: Path, keys: BuildKeys) -> tuple[BuildPages | None, list[Problem]]:
    build, problems = collect_with_problems(archive, folder, cache)
    if build is None:
        return None, problems
    built = write_build_pages(root, archive, build)
    key = keys.get(folder)
    if key is not None and not problems:
        prefix = f"{layout.build_root(build.id)}/"
        files = {path[len(prefix):]: facts for path, facts in built.files.items()}
        cache.builds.save(key, root / prefix, files, _without_files(built))
    return built, problems


def _without_files(built: BuildPages) -> BuildPages:
    """The summary as the cache keeps it: its list of files is the entry's own."""
    return BuildPages(built.row, built.pages, built.dates, built.warnings)
