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
from dossier.output.fingerprint import file_hashes, marker_text, render_inputs, shared_context, site_hashes, still_current
from dossier.output.incremental import Rendered, RenderRecords, render
from dossier.output.lock import building, real_output
from dossier.pages.reuse import each_build_pages
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
    reuse, a site already rendered from the same page tree, and untouched since, is kept without rendering.
    """
    started = time.perf_counter()
    output = real_output(output)
    check_output(output, archive)
    opened, problems = open_archive(archive, calcs)
    with building(output) as work:
        builds = _reported(each_build_pages(opened, problems, work / DOCS, cache, jobs), progress)
        tree = finish_tree(opened, work / DOCS, builds)
        if problems:
            raise InputError(problems)
        if cache is not None and cache.builds is not None:
            cache.builds.trim()
        if pages_only:
            swap_in(work / DOCS, output)
        rendered = None if pages_only else _render_and_swap(opened, tree, work, output, announce, reuse, RenderRecords(_records_folder(cache)), jobs)
    replaced = pages_only or rendered is not None
    return Built(output, len(tree.rows), tree.pages, time.perf_counter() - started, tree.warnings, replaced, rendered)


def _records_folder(cache) -> Path | None:
    return cache.renders if cache is not None else None


def _reported(builds: Iterator[BuildPages], progress: Callable | None) -> Iterator[BuildPages]:
    for build in builds:
        if progress is not None:
            progress(build)
        yield build


def _render_and_swap(opened: Archive, tree: TreeSummary, work: Path, output: Path, announce, reuse: bool, records: RenderRecords, jobs: int | None) -> Rendered | None:
    """Render the tree and put the site in place: only the changed pages when the site in place allows it.
    None when the site in place already is that rendering and was kept."""
    config = write_config(opened.settings, tree, work, DOCS, SITE)
    epoch = source_epoch(tree.newest)
    sources = file_hashes(work / DOCS)
    shared = shared_context(config.read_text(encoding="utf-8"), epoch)
    inputs = render_inputs(sources, shared)
    existing = site_hashes(output) if reuse else None
    if existing is not None and still_current(output, inputs, existing):
        return None
    previous = records.load(output, existing) if reuse else None
    if announce is not None:
        announce(f"rendering {tree.pages} pages with MkDocs" if previous is None else "rendering the changed pages with MkDocs")
    rendered = render(config, work / DOCS, work / SITE, epoch, sources, shared, previous, jobs or os.cpu_count() or 1)
    hashes = file_hashes(work / SITE)
    swap_in(work / SITE, output, marker_text(hashes, inputs))
    records.save(shared, sources, hashes)
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
    """A progress bar over the builds on standard error, or nothing for a small archive."""

    def __init__(self, total: int, shown: bool):
        self.bar = click.progressbar(length=total, label="reviewing builds", file=sys.stderr) if shown else None

    def __enter__(self):
        if self.bar is None:
            return None
        self.bar.__enter__()
        return lambda build: self.bar.update(1)

    def __exit__(self, *exc):
        if self.bar is not None:
            self.bar.__exit__(*exc)
        return False


def _announcer(shown: bool):
    return (lambda message: click.echo(message, err=True)) if shown else None
