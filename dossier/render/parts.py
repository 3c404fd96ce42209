"""Rendering a page tree in parts, each part by its own MkDocs run, and putting the parts together.

Every run reads the whole tree and the same configuration, but MkDocs' standard `exclude_docs` leaves out
the pages of the other parts: they are still known (links to them resolve, the sidebar lists them) but not
rendered. Each page's HTML therefore comes out byte-identical to a single run's; so do the theme's files,
the 404 page and the sitemap, which every run writes (they must agree, or the parts are refused and the
caller renders in one run). Only the search index is made of every part's pages: it is merged here, in the
order MkDocs reads the pages, and written as MkDocs and the theme write it.

A part is a list of units of the tree: a build's folder (builds/<id>/) or a front-page file or folder.
"""

from __future__ import annotations

import json
import os
import posixpath
import shutil
from concurrent.futures import ThreadPoolExecutor
from dataclasses import dataclass
from pathlib import Path

from dossier.pages import layout
from dossier.render import search_index
from dossier.render.mkdocs_run import run_mkdocs

MARKDOWN_SUFFIXES = (".md", ".markdown", ".mdown", ".mkdn", ".mkd")  # what MkDocs reads as a page
MERGED = search_index.FILES
BUILDS = layout.build_root("").rstrip("/")  # "builds"


class PartsDisagree(Exception):
    """Two parts wrote different bytes for one shared file: render in one run instead."""


@dataclass(frozen=True)
class Unit:
    pattern: str  # an exclude_docs pattern (gitignore style) naming the unit's files
    pages: int


def is_page(path: str) -> bool:
    return path.lower().endswith(MARKDOWN_SUFFIXES)


def page_html(path: str) -> str:
    """Where MkDocs writes a page (use_directory_urls: false): foo.md -> foo.html, README.md -> index.html."""
    parent, name = posixpath.split(path)
    stem = posixpath.splitext(name)[0]
    return posixpath.join(parent, ("index" if stem == "README" else stem) + ".html")


def reading_order(docs: Path) -> list[str]:
    """Every file of the tree in the order MkDocs reads it: folders walked in name order, each folder's files
    before its subfolders, an index or README first among them."""
    found = []
    for folder, subfolders, names in os.walk(docs, followlinks=True):
        subfolders.sort()
        relative = Path(folder).relative_to(docs).as_posix()
        for name in sorted(names, key=lambda n: (os.path.splitext(n)[0] not in ("index", "README"), n)):
            found.append(name if relative == "." else f"{relative}/{name}")
    return found


def units_of(docs: Path) -> tuple[list[Unit], list[Unit]]:
    """The front units (every top-level entry but the builds; our assets folder rather than the theme's) and one
    unit per build folder, in name order, with the number of pages each holds."""
    front, builds = [], []
    assets_top = layout.ASSETS.split("/")[0]
    for entry in sorted(docs.iterdir()):
        if entry.name == BUILDS and entry.is_dir():
            builds = [Unit(f"/{BUILDS}/{folder.name}/**", _pages_under(folder)) for folder in sorted(entry.iterdir()) if folder.is_dir()]
        elif entry.is_dir():
            name = layout.ASSETS if entry.name == assets_top else entry.name
            front.append(Unit(f"/{name}/**", _pages_under(docs / name)))
        else:
            front.append(Unit(f"/{entry.name}", int(is_page(entry.name))))
    return front, builds


def _pages_under(folder: Path) -> int:
    return sum(1 for path in folder.rglob("*") if is_page(path.name)) if folder.is_dir() else 0


def split(front: list[Unit], builds: list[Unit], parts: int) -> list[list[Unit]]:
    """The units in `parts` runs of builds with about as many pages each; the front pages join the first."""
    parts = max(1, min(parts, len(builds)))
    total = sum(unit.pages for unit in builds)
    groups: list[list[Unit]] = [[] for _ in range(parts)]
    done, index = 0, 0
    for unit in builds:
        if groups[index] and done >= total * (index + 1) / parts and index < parts - 1:
            index += 1
        groups[index].append(unit)
        done += unit.pages
    groups = [group for group in groups if group]
    groups[0] = front + groups[0]
    return groups


def exclusions(every: list[Unit], kept: list[str]) -> str:
    """The exclude_docs block that leaves out every unit but the kept patterns."""
    lines = [unit.pattern for unit in every] + [f"!{pattern}" for pattern in kept]
    return "exclude_docs: |\n" + "".join(f"  {line}\n" for line in lines)


def render_parts(config_text: str, work: Path, site: Path, epoch: int, parts: list[list[str]], every: list[Unit], jobs: int) -> None:
    """Render each part (a list of kept patterns) by its own MkDocs run, `jobs` at a time, and merge into site.

    Each part's configuration is the site's (config_text) with its own site_dir and exclusions, written in
    work beside it. Raises PartsDisagree when two
    parts wrote different bytes for a shared file."""
    configs = []
    for number, kept in enumerate(parts):
        config = work / f"mkdocs-part-{number}.yml"
        config.write_text(part_config(config_text, f"site-part-{number}") + exclusions(every, kept), encoding="utf-8", newline="\n")
        configs.append(config)
    with ThreadPoolExecutor(max(1, jobs)) as pool:
        list(pool.map(lambda config: run_mkdocs(config, epoch), configs))
    merge([work / f"site-part-{number}" for number in range(len(parts))], site, reading_order(work / docs_dir_of(config_text)))


def part_config(config_text: str, site_dir: str) -> str:
    """The site's configuration, writing to another folder: only the site_dir line differs."""
    lines = config_text.splitlines(keepends=True)
    replaced = [f"site_dir: {json.dumps(site_dir)}\n" if line.startswith("site_dir:") else line for line in lines]
    if replaced == lines:
        raise ValueError("the configuration names no site_dir")
    return "".join(replaced)


def docs_dir_of(config_text: str) -> str:
    line = next(line for line in config_text.splitlines() if line.startswith("docs_dir:"))
    return json.loads(line.split(":", 1)[1].strip())


def merge(parts: list[Path], site: Path, order: list[str]) -> None:
    """Move every part's files into site: a file written by several parts must be the same in each; the
    search index is merged in reading order."""
    site.mkdir(parents=True, exist_ok=True)
    indexes = []
    for part in parts:
        for path in sorted(p for p in part.rglob("*") if p.is_file()):
            relative = path.relative_to(part).as_posix()
            if relative in MERGED:
                continue
            target = site / relative
            if target.exists():
                if target.read_bytes() != path.read_bytes():
                    raise PartsDisagree(relative)
                continue
            target.parent.mkdir(parents=True, exist_ok=True)
            os.replace(path, target)
        if (part / search_index.SEARCH_INDEX).is_file():
            indexes.append(read_search_index(part))
    if indexes:
        write_search_index(site, indexes, order)


def write_search_index(site: Path, indexes: list, order: list[str]) -> None:
    """One index from several (search_index.SearchPages), its pages in the reading order of the tree's files."""
    if any(index is None for index in indexes):
        raise PartsDisagree(search_index.SEARCH_INDEX)
    try:
        search_index.merged(indexes).write(site, [page_html(path) for path in order if is_page(path)])
    except search_index.IndexDisagrees as error:
        raise PartsDisagree(str(error)) from None


def read_search_index(site: Path):
    return search_index.SearchPages.read(site)


def remove_tree(path: Path) -> None:
    shutil.rmtree(path, ignore_errors=True)
