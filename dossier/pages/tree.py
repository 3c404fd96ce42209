"""Generation: the collected archive becomes a plain tree of Markdown pages and assets.

The tree is complete on its own (MkDocs renders it, but any Markdown reader can follow it):
every link is relative, every record text is escaped (see markup), and the same archive always
gives the same bytes, file by file, in the same order.
"""

from __future__ import annotations

import datetime
from dataclasses import dataclass, field
from functools import partial
from pathlib import Path
from typing import Iterable

from dossier import wording
from dossier.caution import MAINS_CAUTION
from dossier.files import FileFacts
from dossier.findings import Verdict
from dossier.record.identity import STATUS_TITLES
from dossier.pages import layout
from dossier.collect.archive import CHECKLIST_SHEETS, Archive, Build
from dossier.collect.extras import pdf_href
from dossier.pages.env import Md, render
from dossier.pages.views import IndexRow, RevisionView, change_steps, index_row, newest_first, revision_view
from dossier.signoff.state import ReviewState
from dossier.templates import templates_dir

PAGE_LABELS = {"index": "Overview", "calcs": "Calculations", "schematics": "Schematics", "checklist": "Checklist"}
TEMPLATES = {"index": "overview.md.j2", "calcs": "calcs.md.j2", "schematics": "schematics.md.j2", "checklist": "checklist.md.j2"}
OLDER_REVISION_BOOST = 0.5
VENDORED = ("vendor/iframe-worker/shim.js", "vendor/iframe-worker/LICENSE", "dossier.css")


@dataclass(frozen=True)
class StatusLink:
    """A front page listing the builds in one status, or in one sign-off state (group 'signoff')."""

    status: str
    title: str
    count: int
    path: str
    group: str = "status"

    def holds(self, row: IndexRow) -> bool:
        return (row.status if self.group == "status" else row.signoff) == self.status


class TreeWriter:
    """Writes pages and files under one folder, counting the pages."""

    def __init__(self, root: Path, archive: Archive):
        self.root = root
        self.pages = 0
        self.files: dict[str, FileFacts] = {}  # every file written, by its path under root
        self.common = {
            "archive_title": archive.settings.title,
            "settings": archive.settings,
            "MAINS_CAUTION": MAINS_CAUTION,
            "Verdict": Verdict,
            "Md": Md,
            "labels": PAGE_LABELS,
            "words": wording,
            "ledger_head": archive.ledger.head if archive.ledger.chain else "",
        }

    def page(self, path: str, template: str, **context) -> None:
        text = render(template, link=partial(_link, path), **self.common, **context)
        self.text(path, text)
        self.pages += 1

    def text(self, path: str, content: str) -> None:
        self.binary(path, content.encode("utf-8"))

    def binary(self, path: str, content: bytes) -> None:
        self._target(path).write_bytes(content)
        self.files[path] = FileFacts.of(content)

    def copy(self, source: Path, path: str) -> None:
        self.binary(path, source.read_bytes())

    def _target(self, path: str) -> Path:
        target = self.root / path
        target.parent.mkdir(parents=True, exist_ok=True)
        return target


def _link(here: str, target: str) -> Md:
    return Md(layout.href(here, target))


@dataclass
class TreeSummary:
    """What the front pages and the renderer need once every build's pages are written."""

    pages: int
    rows: list[IndexRow]
    statuses: list[StatusLink]
    newest: datetime.date | None
    warnings: list[str]  # parts of pages that could not be made (a drawing or checklist failed)
    files: dict[str, FileFacts] = field(default_factory=dict)  # every file of the tree, by its path


@dataclass
class BuildPages:
    """What the front pages need of one build whose pages are written: kept with them in the build cache."""

    row: IndexRow
    pages: int
    dates: list[datetime.date]
    warnings: list[str]
    files: dict[str, FileFacts] = field(default_factory=dict)  # the build's files, by their path in the tree


def write_tree(archive: Archive, root: Path, builds: Iterable[Build] | None = None) -> TreeSummary:
    """Write the page tree under root: each build's pages as it comes, then the archive's front pages.

    builds defaults to archive.builds; pass collect.each_build(...) to hold one build in memory at a time.
    """
    return finish_tree(archive, root, (write_build_pages(root, archive, build) for build in (archive.builds if builds is None else builds)))


def write_build_pages(root: Path, archive: Archive, build: Build) -> BuildPages:
    """One build's pages under root/builds/<id>/ (nothing elsewhere), and what the front pages need of it."""
    writer = TreeWriter(root, archive)
    write_build(writer, archive, build)
    dates = [revision.record.date for revision in build.revisions]
    return BuildPages(index_row(build), writer.pages, dates, _failures(build), writer.files)


def finish_tree(archive: Archive, root: Path, built: Iterable[BuildPages]) -> TreeSummary:
    """The archive's front pages and assets, once every build's pages are written (as each one comes)."""
    writer = TreeWriter(root, archive)
    rows, dates, warnings, pages, files = [], [], [], 0, {}
    for build in built:
        rows.append(build.row)
        dates.extend(build.dates)
        warnings.extend(build.warnings)
        pages += build.pages
        files.update(build.files)
    statuses = status_links(rows) + signoff_links(rows)
    _write_front(writer, archive, newest_first(rows), statuses)
    _write_assets(writer)
    return TreeSummary(pages + writer.pages, rows, statuses, max(dates, default=None), warnings, files | writer.files)


def _failures(build: Build) -> list[str]:
    return [f"{build.id} rev {revision.letter}: {text}" for revision in build.revisions for text in revision.extras.failures]


def _write_front(writer: TreeWriter, archive: Archive, rows: list[IndexRow], statuses: list[StatusLink]) -> None:
    shared = {"statuses": statuses, "total": len(rows), "any_mains": any(row.has_mains for row in rows)}
    writer.page(layout.INDEX, "archive.md.j2", page_title=archive.settings.title, rows=rows, current_status="", **shared)
    for link in statuses:
        chosen = [row for row in rows if link.holds(row)]
        writer.page(link.path, "status.md.j2", page_title=link.title, status_title=link.title, rows=chosen, current_status=link.path, **shared)
    writer.page(layout.ABOUT, "about.md.j2", page_title="About this site")


def status_links(rows: list[IndexRow]) -> list[StatusLink]:
    """The statuses that at least one build is in, in the order a build moves through them."""
    tally = {status: 0 for status in STATUS_TITLES}
    for row in rows:
        tally[row.status] = tally.get(row.status, 0) + 1
    return [StatusLink(s, STATUS_TITLES.get(s, s), n, layout.status_page(s)) for s, n in tally.items() if n]


def signoff_links(rows: list[IndexRow]) -> list[StatusLink]:
    """The sign-off states that at least one build's current revision is in, from not reviewed to cleared."""
    tally = {state.value: 0 for state in ReviewState}
    for row in rows:
        tally[row.signoff] += 1
    return [StatusLink(s, f"Sign-off: {wording.REVIEW_STATE_SHORT[s]}", n, layout.signoff_page(s), "signoff") for s, n in tally.items() if n]


def write_build(writer: TreeWriter, archive: Archive, build: Build) -> None:
    views = [revision_view(archive, build, revision) for revision in build.revisions]
    for view in views:
        _write_revision(writer, view)
    current = views[-1]
    writer.page(current.permanent, "pointer.md.j2", v=current, page_title=f"{current.record.title}, revision {current.letter}", search_exclude=True)
    writer.page(
        current.changes, "changes.md.j2", v=current, steps=change_steps(build), page_name="changes", crumb="changes",
        page_title=f"Changes: {current.record.title}", show_caution=current.record.has_mains,
    )
    _write_attachments(writer, build, views)


def _write_revision(writer: TreeWriter, view: RevisionView) -> None:
    for name, path in view.pages.items():
        title = _page_title(view, name)
        caution = view.record.has_mains and not (name == "checklist" and view.checklist)
        writer.page(path, TEMPLATES[name], v=view, page_name=name, crumb=f"revision {view.letter}", page_title=title, show_caution=caution, **_search_meta(view, name))
    for figure in (*view.schematics, *(f for section in view.calcs for f in section.figures)):
        writer.text(figure.path, figure.svg)
    for paper, sheet in view.revision.extras.sheets.items():
        writer.text(f"{view.root}/{CHECKLIST_SHEETS[paper]}", sheet)
    for paper, pdf in view.revision.extras.pdfs.items():
        writer.binary(f"{view.root}/{pdf_href(CHECKLIST_SHEETS[paper])}", pdf)


def _search_meta(view: RevisionView, name: str) -> dict:
    """An earlier revision ranks below the current one; its checklist, whose items the current revision's
    repeats, is left out of the search index (its commissioning is on its overview). A calculations page is
    tagged with the codes of its findings that did not pass, so a search for a code finds those pages first."""
    tags = {"search_tags": _codes_not_passed(view)} if name == "calcs" else {}
    if view.is_current:
        return tags
    if name == "checklist":
        return {"search_exclude": True}
    return {"search_boost": OLDER_REVISION_BOOST, **tags}


def _codes_not_passed(view: RevisionView) -> list[str]:
    return sorted({f.finding.code for section in view.calcs for f in section.findings if f.verdict not in ("pass", "info")})


def _page_title(view: RevisionView, name: str) -> str:
    suffix = "" if view.is_current else f" (revision {view.letter})"
    if name == "index":
        return f"{view.record.title}{suffix}"
    return f"{PAGE_LABELS[name]}: {view.record.title}{suffix}"


def _write_attachments(writer: TreeWriter, build: Build, views: list[RevisionView]) -> None:
    written = set()
    for view in views:
        for attachment in (*view.photos, *view.documents):
            if attachment.refused or attachment.path in written:
                continue
            writer.copy(build.folder / attachment.source, attachment.path)
            written.add(attachment.path)


def _write_assets(writer: TreeWriter) -> None:
    source = templates_dir() / "site" / "assets"
    for name in VENDORED:
        writer.copy(source / name, f"{layout.ASSETS}/{name}")
