"""Rendering only what changed: a new site made of the previous one and the pages whose Markdown changed.

A page's HTML depends on its own Markdown and on what every page shares: the configuration (with the
sidebar), the epoch and the renderers (output.fingerprint.shared_context). When the shared context is the
one the site in place was rendered with, and that site is still exactly as the last build left it (every
file's hash as recorded), the new site is the old one with:

- the pages whose Markdown is new or changed rendered again, by one MkDocs run that leaves out every other
  page (render.parts: they stay known, so links and the sidebar come out the same);
- the HTML of removed pages, and removed files, taken out; new and changed files copied from the tree;
- the search index merged: the old entries of pages kept as they were, the new entries of pages rendered.

Anything else renders the whole site (in parts on every core for a large one). The result is byte-identical
to a whole render of the same tree; the tests build random edit sequences both ways to hold it to that.
The record of what each site was rendered from lives in the user's cache, beside the build cache, keyed
by the site's digest; without it (first build, --no-cache, cache cleared) the whole site is rendered.
"""

from __future__ import annotations

import hashlib
import json
import math
import os
import re
import shutil
from dataclasses import dataclass, field
from pathlib import Path

from dossier.files import FolderMaker, write_whole
from dossier.output.atomic import MARKER
from dossier.output.fingerprint import digest_of, file_hashes, file_stats, read_stamp
from dossier.render import parts
from dossier.render.mkdocs_run import run_mkdocs

PARTS_FROM_PAGES = 300  # a smaller site renders in one run: starting MkDocs twice costs more than it saves
PAGES_PER_PART = 600  # bounds each MkDocs run's memory (541 MB was seen with parts of 1000 pages)
RECORDS_KEPT = 8
_PLAIN_PATH = re.compile(r"[A-Za-z0-9._/-]+")  # a path usable as an exclude_docs pattern as it is


@dataclass
class Rendered:
    """What a render did, for the user: how many pages, and which were rendered again after an edit."""

    how: str  # "whole", "parts" or "changed"
    rendered: list[str] = field(default_factory=list)  # pages rendered (for "changed")
    removed: list[str] = field(default_factory=list)
    parts: int = 1
    hashes: dict[str, str] | None = None  # every file of the new site, when known without reading it again


@dataclass(frozen=True)
class Previous:
    """The site in place and what it was rendered from (the record of its last build)."""

    site: Path
    shared: str
    sources: dict[str, str]  # tree file -> sha256
    hashes: dict[str, str]  # site file -> sha256, checked against the files
    archive: str = ""  # fingerprint.archive_inputs of the archive it was built from, when known
    outcome: dict = field(default_factory=dict)  # builds, pages and warnings, to say again when it is kept


class RenderRecords:
    """What each site was rendered from, by the digest of the site: a small JSON file per site, the newest few kept.

    A record also keeps the size and modification time of every file of the site as it was written, so the site
    in place is known unchanged by looking at its files rather than reading them; a file that looks otherwise is
    read and hashed."""

    def __init__(self, folder: Path | None):
        self.folder = folder

    def site_in_place(self, site: Path) -> tuple[dict[str, str] | None, Previous | None]:
        """The hashes of every file of the site dossier wrote at `site` (None: no such site) and its record."""
        if not (site / MARKER).is_file():
            return None, None
        record = self._read(read_stamp(site / MARKER).get("site", ""))
        hashes = _looked_at(site, record) or file_hashes(site, frozenset({MARKER}))
        record = record if record is not None and record.get("site") == hashes else self._read(digest_of(hashes))
        if record is None or record.get("site") != hashes:  # the site holds other files than the ones recorded
            return hashes, None
        return hashes, Previous(site, record["shared"], record["sources"], hashes, record.get("archive", ""), record.get("outcome", {}))

    def _read(self, digest: str) -> dict | None:
        if self.folder is None or not digest:
            return None
        try:
            return json.loads((self.folder / f"{digest}.json").read_text(encoding="utf-8"))
        except (OSError, ValueError):
            return None

    def save(self, site: Path, previous: Previous) -> None:
        """Keep the record of the site now in place at `site` (previous.hashes are its files')."""
        if self.folder is None:
            return
        record = {"shared": previous.shared, "sources": previous.sources, "site": previous.hashes, "stats": file_stats(site, frozenset({MARKER})), "archive": previous.archive, "outcome": previous.outcome}
        try:
            self.folder.mkdir(parents=True, exist_ok=True)
            write_whole(self.folder / f"{digest_of(previous.hashes)}.json", json.dumps(record))
            for old in sorted(self.folder.glob("*.json"), key=lambda p: p.stat().st_mtime_ns)[:-RECORDS_KEPT]:
                old.unlink(missing_ok=True)
        except OSError:  # a cache that cannot be written only costs time
            pass


def _looked_at(site: Path, record: dict | None) -> dict[str, str] | None:
    """The site's hashes from the record, each file whose size or time differs from it read and hashed again;
    None when the site holds other files than the record lists (or the record cannot be used)."""
    stats = file_stats(site, frozenset({MARKER}))
    try:
        if record is None or set(record["stats"]) != set(stats):
            return None
        return {path: record["site"][path] if tuple(record["stats"][path]) == stats[path] else _sha256(site / path) for path in stats}
    except (KeyError, TypeError, ValueError):  # a record from another version, or damaged: read every file
        return None


def render(config: Path, docs: Path, site: Path, epoch: int, sources: dict[str, str], shared: str, previous: Previous | None, jobs: int) -> Rendered:
    """Render the tree at docs into site (which must not exist yet): only what changed when previous allows."""
    if previous is not None and previous.shared == shared:
        try:
            return _changed_only(config, docs, site, epoch, sources, previous)
        except (parts.PartsDisagree, _NotIncremental):
            parts.remove_tree(site)
    return render_whole(config, docs, site, epoch, jobs)


def render_whole(config: Path, docs: Path, site: Path, epoch: int, jobs: int) -> Rendered:
    """Every page: in one MkDocs run, or in parts on every core for a large site."""
    front, builds = parts.units_of(docs)
    pages = sum(unit.pages for unit in front + builds)
    count = max(jobs, math.ceil(pages / PAGES_PER_PART)) if pages >= PARTS_FROM_PAGES and jobs > 1 or pages > PAGES_PER_PART else 1
    if count > 1 and len(builds) > 1:
        groups = parts.split(front, builds, count)
        try:
            parts.render_parts(config.read_text(encoding="utf-8"), config.parent, site, epoch, [[unit.pattern for unit in group] for group in groups], _base(front), jobs)
            return Rendered("parts", parts=len(groups))
        except parts.PartsDisagree:
            parts.remove_tree(site)
    run_mkdocs(config, epoch)
    return Rendered("whole")


def _base(front: list[parts.Unit]) -> list[parts.Unit]:
    """What every partial run leaves out before taking back its own: the front units and every build."""
    return front + [parts.Unit(f"/{parts.BUILDS}/**", 0)]


class _NotIncremental(Exception):
    """This change cannot be rendered on its own: render the whole site."""


def _changed_only(config: Path, docs: Path, site: Path, epoch: int, sources: dict[str, str], previous: Previous) -> Rendered:
    old, new = previous.sources, sources
    changed = [path for path in new if parts.is_page(path) and old.get(path) != new[path]]
    removed = [path for path in old if path not in new]
    copied = [path for path in new if not parts.is_page(path) and old.get(path) != new[path]]
    old_index = parts.read_search_index(previous.site)
    if old_index is None or not all(_PLAIN_PATH.fullmatch(path) for path in changed):
        raise _NotIncremental()
    replaced = {parts.page_html(path) if parts.is_page(path) else path for path in (*changed, *removed, *copied)}
    linked = _link_previous(previous, site, replaced | parts.MERGED)
    for path in copied:
        (site / path).parent.mkdir(parents=True, exist_ok=True)
        shutil.copyfile(docs / path, site / path)
    indexes = [old_index.without({parts.page_html(path) for path in (*changed, *removed)})]
    if changed:
        indexes.append(_render_pages(config, docs, site, epoch, changed, previous))
    parts.write_search_index(site, indexes, parts.reading_order(docs))
    hashes = {path: linked[path] if path in linked else _sha256(site / path) for path in file_stats(site)}
    return Rendered("changed", sorted(changed), sorted(path for path in removed if parts.is_page(path)), hashes=hashes)


def _link_previous(previous: Previous, site: Path, left_out: set[str]) -> dict[str, str]:
    """The previous site's files, as hard links where the file system allows (they are never written to);
    their hashes by path."""
    linked, folders = {}, FolderMaker()
    for relative, sha in previous.hashes.items():
        if relative in left_out:
            continue
        target = folders.parent_of(site / relative)
        try:
            os.link(previous.site / relative, target)
        except OSError:
            shutil.copyfile(previous.site / relative, target)
        linked[relative] = sha
    return linked


def _render_pages(config: Path, docs: Path, site: Path, epoch: int, pages: list[str], previous: Previous):
    """Render the pages alone into a folder beside the config; move their HTML into site; their search entries."""
    front, _ = parts.units_of(docs)
    alone = config.parent / "site-changed"
    text = parts.part_config(config.read_text(encoding="utf-8"), alone.name) + parts.exclusions(_base(front), [f"/{page}" for page in pages])
    part = config.parent / "mkdocs-changed.yml"
    part.write_text(text, encoding="utf-8", newline="\n")
    run_mkdocs(part, epoch)
    written = {parts.page_html(page) for page in pages}
    for path in sorted(p for p in alone.rglob("*") if p.is_file()):
        relative = path.relative_to(alone).as_posix()
        if relative in written:
            (site / relative).parent.mkdir(parents=True, exist_ok=True)
            os.replace(path, site / relative)
        elif relative not in parts.MERGED and previous.hashes.get(relative) != _sha256(path):
            raise parts.PartsDisagree(relative)  # the theme's files, the 404 page and the sitemap must not change
    index = parts.read_search_index(alone)
    if index is None:
        raise _NotIncremental()
    return index


def _sha256(path: Path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()
