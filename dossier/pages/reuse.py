"""Each build's pages written into the tree, from the build cache when nothing they are made from changed.

A build found in the cache (collect.build_store: keyed by its files, the archive's settings and ledger, and the
code) has its pages unpacked as they were written; any other build is reviewed, drawn and written afresh, and
kept for next time unless reading it found a problem. Builds are handled in workers on every core for a large
archive, as collecting is (collect.parallel); the result is byte-identical either way.
"""

from __future__ import annotations

import functools
from pathlib import Path
from typing import Iterator

from dossier.collect.archive import Archive, collect_with_problems, each_build
from dossier.collect.build_store import BuildStore, Entry
from dossier.collect.caches import Caches
from dossier.collect.code_version import code_fingerprint
from dossier.pages import layout
from dossier.pages.tree import BuildPages, write_build_pages
from dossier.problems import Problem


def each_build_pages(archive: Archive, problems: list[Problem], root: Path, cache: Caches | None = None, jobs: int | None = None) -> Iterator[BuildPages]:
    """Every build's pages written under root, in archive order; problems are added to the list."""
    store = cache.builds if cache is not None else None
    if store is not None and not problems:  # an archive that could not be opened is never cached
        store.prepare(archive.root, code_fingerprint(archive.calcs), _options(cache))
    yield from each_build(archive, problems, cache, jobs, functools.partial(_build_pages, root=root))


def _options(cache: Caches) -> str:
    return "pdfs" if cache.pdfs is not None else "no pdfs"


def _build_pages(archive: Archive, folder: Path, cache: Caches | None, root: Path) -> tuple[BuildPages | None, list[Problem]]:
    store: BuildStore | None = cache.builds if cache is not None else None
    key = store.key(folder) if store is not None else None
    entry = store.load(key) if key is not None else None
    if entry is not None:
        _unpack(entry, root / layout.build_root(folder.name))
        return entry.summary, []
    build, problems = collect_with_problems(archive, folder, cache)
    if build is None:
        return None, problems
    built = write_build_pages(root, archive, build)
    if key is not None and not problems:
        store.save(key, Entry(_packed(root / layout.build_root(build.id)), built))
    return built, problems


def _packed(folder: Path) -> dict[str, bytes]:
    return {path.relative_to(folder).as_posix(): path.read_bytes() for path in sorted(folder.rglob("*")) if path.is_file()}


def _unpack(entry: Entry, folder: Path) -> None:
    for name, content in entry.files.items():
        target = folder / name
        target.parent.mkdir(parents=True, exist_ok=True)
        target.write_bytes(content)
