"""`dossier build ARCHIVE`: the archive as a static site (or, with --pages-only, as its Markdown tree).

Steps: collect (validate, review, draw every revision) -> generate the Markdown tree -> render it
with MkDocs -> swap the finished folder in. Nothing is written before every record has been read
without a problem, and the previous site stays untouched until the new one is complete.
"""

from __future__ import annotations

import os
import sys
import time
from dataclasses import dataclass
from pathlib import Path
from typing import Callable, Iterator

import click

from dossier.commands.exits import HANDLED, Exit, message_of, status_of
from dossier.reading.archive import build_dirs
from dossier.problems import InputError
from dossier.output.atomic import check_output, swap_in
from dossier.collect.caches import user_caches
from dossier.collect.archive import Archive, open_archive
from dossier.output.atomic import MARKER
from dossier.output.fingerprint import archive_inputs, file_hashes, marker_text, read_stamp, render_inputs, shared_context, still_current
from dossier.output.incremental import Previous, Rendered, RenderRecords, render
from dossier.output.lock import building, real_output
from dossier.pages.reuse import BuildKeys, build_keys, each_build_pages
from dossier.pages.tree import BuildPages, TreeSummary, finish_tree
from dossier.render.mkdocs_run import RenderError, source_epoch, write_config

PROGRESS_FROM = 20  # builds; smaller archives build in a few seconds and need no progress bar
DOCS, SITE = "pages", "site"


@dataclass(frozen=True)
class Built:
    output: Path
    builds: int
    pages: int
    seconds: float
    warnings: list[str]
    replaced: bool = True  # False: the site in place already was this rendering and was kept
    rendered: Rendered | None = None  # what was rendered, when it was


def default_output(archive: Path) -> Path:
    """'site' beside the archive folder: demo/archive -> demo/site."""
    return archive.resolve().parent / "site"


def build_site(archive: Path, output: Path, *, pages_only: bool = False, calcs=None, cache=None, progress: Callable | None = None, announce: Callable[[str], None] | None = None, jobs: int | None = None, reuse: bool = True) -> Built:
    """Build the site (or only its page tree) into output; raises InputError, OutputRefused or RenderError.

    Builds are reviewed and written one at a time into a work folder beside the output; every problem in
    every file is gathered, and if there is any, the work folder is dropped and nothing is replaced. With
    reuse, a site already rendered from the same page tree, and untouched since, is kept without rendering;
    with the build cache as well, a site built from the very same files, code and settings is kept without
    writing the tree.
    """
    started = time.perf_counter()
    output = real_output(output)
    check_output(output, archive)
    opened, problems = open_archive(archive, calcs)
    if cache is not None and cache.builds is not None:
        cache.builds.link = not pages_only  # the tree of a site is thrown away once rendered
    with building(output) as work:
        keys = build_keys(opened, problems, cache)
        records = RenderRecords(_records_folder(cache))
        hashes, previous = records.site_in_place(output) if reuse and not pages_only else (None, None)
        made_from = _made_from(cache, keys)
        if _made_from_the_same(output, hashes, previous, made_from):
            return _kept(output, previous.outcome, started)
        builds = _reported(each_build_pages(opened, problems, work / DOCS, cache, jobs, keys), progress)
        tree = finish_tree(opened, work / DOCS, builds)
        if problems:
            raise InputError(problems)
        if cache is not None and cache.builds is not None and cache.builds.misses:
            cache.builds.trim()
        if pages_only:
            swap_in(work / DOCS, output)
        site = _SiteInPlace(output, hashes, previous, records, made_from)
        rendered = None if pages_only else _render_and_swap(opened, tree, work, site, announce, jobs)
    replaced = pages_only or rendered is not None
    return Built(output, len(tree.rows), tree.pages, time.perf_counter() - started, tree.warnings, replaced, rendered)


def _made_from(cache, keys: BuildKeys) -> str:
    """The fingerprint of everything the site is made from (fingerprint.archive_inputs); "" when a build has no key."""
    if not keys or not keys.whole():
        return ""
    return archive_inputs(cache.builds.archive_key, [(folder.name, key) for folder, key in keys.items()])


def _made_from_the_same(output: Path, hashes: dict[str, str] | None, previous: Previous | None, made_from: str) -> bool:
    """The site in place was built from exactly these inputs and is as that build left it."""
    if previous is None or not made_from or previous.archive != made_from:
        return False
    return still_current(output, read_stamp(output / MARKER).get("pages", ""), hashes)


def _kept(output: Path, outcome: dict, started: float) -> Built:
    return Built(output, outcome.get("builds", 0), outcome.get("pages", 0), time.perf_counter() - started, list(outcome.get("warnings", [])), replaced=False)


def _records_folder(cache) -> Path | None:
    return cache.renders if cache is not None else None


def _reported(builds: Iterator[BuildPages], progress: Callable | None) -> Iterator[BuildPages]:
    for build in builds:
        if progress is not None:
            progress(build)
        yield build


@dataclass
class _SiteInPlace:
    """The site at output now: its files' hashes (None: no site dossier wrote), the record of its last build, where
    records are kept, and the fingerprint of the archive this build is made from ("" when it has none)."""

    output: Path
    hashes: dict[str, str] | None
    previous: Previous | None
    records: RenderRecords
    made_from: str


def _render_and_swap(opened: Archive, tree: TreeSummary, work: Path, site: _SiteInPlace, announce, jobs: int | None) -> Rendered | None:
    """Render the tree and put the site in place: only the changed pages when the site in place allows it.
    None when the site in place already is that rendering and was kept."""
    config = write_config(opened.settings, tree, work, DOCS, SITE)
    epoch = source_epoch(tree.newest)
    sources = {path: facts.sha256 for path, facts in tree.files.items()}
    shared = shared_context(config.read_text(encoding="utf-8"), epoch)
    inputs = render_inputs(sources, shared)
    outcome = {"builds": len(tree.rows), "pages": tree.pages, "warnings": tree.warnings}
    if site.hashes is not None and still_current(site.output, inputs, site.hashes):
        site.records.save(site.output, Previous(site.output, shared, sources, site.hashes, site.made_from, outcome))
        return None
    if announce is not None:
        announce(f"rendering {tree.pages} pages with MkDocs" if site.previous is None else "rendering the changed pages with MkDocs")
    rendered = render(config, work / DOCS, work / SITE, epoch, sources, shared, site.previous, jobs or os.cpu_count() or 1)
    hashes = rendered.hashes if rendered.hashes is not None else file_hashes(work / SITE)
    swap_in(work / SITE, site.output, marker_text(hashes, inputs))
    site.records.save(site.output, Previous(site.output, shared, sources, hashes, site.made_from, outcome))
    return rendered


def run_build(archive: Path, output: Path | None, pages_only: bool, quiet: bool, use_cache: bool, pdfs: bool = True, jobs: int | None = None) -> int:
    """The command: messages on standard error, the outcome on standard output, an exit status."""
    target = output if output is not None else default_output(archive)
    total = len(build_dirs(archive)) if archive.is_dir() else 0
    show_progress = not quiet and total >= PROGRESS_FROM
    try:
        with _progress(total, show_progress) as advance:
            built = build_site(archive, target, pages_only=pages_only, cache=user_caches(use_cache, pdfs), progress=advance, announce=_announcer(show_progress), jobs=jobs, reuse=use_cache)
    except HANDLED as error:
        return _failed(error, target)
    for warning in built.warnings:
        click.echo(f"warning: {warning}", err=True)
    click.echo(_outcome(built, pages_only))
    return Exit.DONE


def _outcome(built: Built, pages_only: bool) -> str:
    from dossier.wording import counted

    what = "page tree" if pages_only else "site"
    size = f"{counted(built.builds, 'build')} ({counted(built.pages, 'page')})"
    if not built.replaced:
        return f"the site at {built.output} already shows these {size}; kept it as it is, nothing rendered ({built.seconds:.1f} s)"
    done = f"wrote the {what} of {size} to {built.output} in {built.seconds:.1f} s"
    return done if built.rendered is None or built.rendered.how != "changed" else f"{done}; {rendered_text(built)}"


def rendered_text(built: Built, shown: int = 4) -> str:
    """What MkDocs rendered: 'every page', or the pages rendered again after an edit, a few of them by name."""
    from dossier.wording import counted

    rendered = built.rendered
    if rendered is None:
        return "nothing rendered"
    if rendered.how != "changed":
        runs = f" in {rendered.parts} MkDocs runs on every core" if rendered.how == "parts" else ""
        return f"rendered every page{runs}"
    pages = rendered.rendered
    names = ", ".join(pages[:shown]) + (f" and {len(pages) - shown} more" if len(pages) > shown else "")
    said = f"re-rendered {counted(len(pages), 'changed page')}" + (f" ({names})" if pages else "")
    if rendered.removed:
        said += f", removed {counted(len(rendered.removed), 'page')}"
    return f"{said}; kept the other {built.pages - len(pages)}"


def _failed(error: Exception, target: Path) -> int:
    """Say why nothing was written; the exit status is the one every command gives for this error."""
    from dossier.wording import counted

    if isinstance(error, OSError):
        click.echo(f"dossier build: {_os_problem(error, target)}; nothing was replaced.", err=True)
        return status_of(error)
    click.echo(message_of(error, "dossier build"), err=True)
    if isinstance(error, InputError):
        click.echo(f"dossier build: nothing written; {counted(len(error.problems), 'problem')} to put right first.", err=True)
    elif isinstance(error, RenderError):
        click.echo(f"dossier build: the previous site at {target} is untouched.", err=True)
    return status_of(error)


def _os_problem(error: OSError, target: Path) -> str:
    """'cannot write /srv/site: Permission denied': the path the system named, and its reason."""
    return f"cannot write {error.filename or target}: {error.strerror or error}"


class _progress:
    """A progress bar over the builds on standard error, or nothing for a small archive; shown from the first build
    reviewed, so an archive kept as it is (nothing to review) shows none."""

    def __init__(self, total: int, shown: bool):
        self.bar = click.progressbar(length=total, label="reviewing builds", file=sys.stderr) if shown else None
        self.started = False

    def __enter__(self):
        return None if self.bar is None else self.advance

    def advance(self, build) -> None:
        if not self.started:
            self.bar.__enter__()
            self.started = True
        self.bar.update(1)

    def __exit__(self, *exc):
        if self.started:
            self.bar.__exit__(*exc)
        return False


def _announcer(shown: bool):
    return (lambda message: click.echo(message, err=True)) if shown else None
