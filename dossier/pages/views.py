"""What the page templates show, prepared from the collected archive (no Markdown is written here).

Every path held here is a path in the page tree (see layout); templates turn it into a relative
link with link(path) for the page they are on.
"""

from __future__ import annotations

import posixpath
from dataclasses import dataclass, field

from markdown.extensions.toc import slugify, unique

from dossier.calcs.rails import HAZARDS as RAIL_HAZARDS
from dossier.calcs.rails.hazards import NAME as RAILS
from dossier.caution import beyond_mains_caution, rail_label
from dossier.findings import Finding, Verdict, counts
from dossier.record.identity import STATUS_TITLES
from dossier.pages import layout
from dossier.calcs.isolation import HIPOT, STANDARD
from dossier.units import fmt
from dossier.changes import finding_changes, record_changes
from dossier.collect.archive import Archive, Build, Revision
from dossier.pages.env import Md
from dossier.collect.extras import is_active_svg
from dossier.pages.hazards import hazards
from dossier.reading.yaml_source import dotted
from dossier.wording import (
    CLEARANCE_WORDS, accepted_text, decision_text, fix_text, signoff_line,
    comparison_text, finding_label, finding_state_text, margin_text, measure_text, source_text, verdict_counts_text,
)

IMAGE_TYPES = (".jpg", ".jpeg", ".png", ".gif", ".webp", ".svg")
ACTIVE_TYPES = (".html", ".htm", ".xhtml", ".js", ".mjs")
SHOWN_KINDS = ("photo", "drawing")
OTHER_CALC = "other"


@dataclass
class FindingView:
    finding: Finding
    label: str
    verdict: str
    comparison: str
    values: list[str]
    places: list[str]
    sources: list[str]
    anchor: str = ""
    accepted: str = ""  # the sign-off's acceptance of this finding, in words, or ''
    to_fix: str = ""  # the sign-off's demand that this finding be fixed, in words, or ''


@dataclass(frozen=True)
class SignoffRow:
    reviewer: str
    qualification: str
    date: str
    clearance: str
    file: str
    stale: bool
    decisions: list[str]
    notes: str
    outdated: bool = False  # the record is as it reviewed, but the checks changed the findings since


@dataclass(frozen=True)
class SignoffView:
    state: str
    line: str
    rows: list[SignoffRow]


def signoff_view(state) -> SignoffView:
    rows = [SignoffRow(j.entry.reviewer, j.entry.qualification, j.entry.date.isoformat(), CLEARANCE_WORDS[j.entry.clearance.value],
                       j.signoff.path.name, j.stale, [decision_text(d) for d in j.entry.decisions if d.decision], j.entry.notes,
                       j.outdated is not None)
            for j in sorted(state.signoffs, key=lambda j: (j.entry.date, j.signoff.path.name), reverse=True)]
    return SignoffView(state.state.value, signoff_line(state), rows)


@dataclass
class FigureView:
    title: str
    path: str
    svg: str


@dataclass
class CalcSection:
    name: str
    title: str
    summary: str
    anchor: str
    findings: list[FindingView]
    figures: list[FigureView]
    tally: str


@dataclass
class AttachmentView:
    caption: str
    kind: str
    path: str  # in the page tree
    source: str  # in the build folder
    shown: bool  # an image to show on the page
    refused: bool = False  # active content (HTML, script) is never published


@dataclass(frozen=True)
class HipotRow:
    """One barrier's electric-strength test on the overview: the voltage, how long, from which table."""

    view: FindingView
    voltage: str
    duration: str
    table: str


def hipot_row(view: FindingView) -> HipotRow:
    finding = view.finding
    extra = {m.label: m.quantity for m in finding.extra}
    if finding.value is None:
        return HipotRow(view, "no figure found", "", "")
    return HipotRow(view, f"{fmt(finding.value.quantity)} {extra.get('waveform', '')}".strip(),
                    fmt(extra["duration"]) if "duration" in extra else "", str(extra.get("table and row", "")))


@dataclass
class RevisionLink:
    letter: str
    path: str
    date: str
    is_current: bool


@dataclass
class RevisionView:
    build_id: str
    letter: str
    record: object
    revision: Revision
    is_current: bool
    current_letter: str
    root: str
    pages: dict[str, str]
    permanent: str
    changes: str
    revisions: list[RevisionLink]
    hazards: list[str]
    beyond_mains: str  # the caution's words for the hazardous rails, '' for none
    signoff: SignoffView
    tally: dict
    summary: str
    failing: list[FindingView]
    calcs: list[CalcSection]
    schematics: list[FigureView]
    drawing_notes: list[str]
    photos: list[AttachmentView]
    documents: list[AttachmentView]
    failures: list[str] = field(default_factory=list)
    standard: FindingView | None = None  # which standard the barriers are judged against
    hipot: list[HipotRow] = field(default_factory=list)  # the electric-strength test of each safety barrier

    @property
    def status_title(self) -> str:
        return shown_status_title(self.revision)

    @property
    def commissioning_text(self) -> str:
        """Who powered this revision up and when, with the outcome; '' without a commissioning record."""
        state = self.revision.extras.commissioning
        return Md(state.overview_markdown()) if state is not None else Md("")  # user text in it is escaped already

    @property
    def checklist(self) -> str | None:
        return self.revision.extras.checklist

    @property
    def publication(self):
        return self.revision.publication


@dataclass
class IndexRow:
    build_id: str
    title: str
    path: str
    letter: str
    status: str
    status_title: str
    date: str
    tally: dict
    has_mains: bool
    signoff: str  # the sign-off state of the current revision (dossier.signoff.state.ReviewState value)


def revision_view(archive: Archive, build: Build, revision: Revision) -> RevisionView:
    is_current = revision is build.current
    root = layout.revision_root(build.id, revision.letter, is_current)
    sections = _calc_sections(archive, revision, root)
    failing = [view for section in sections for view in section.findings if view.finding.verdict in (Verdict.FAIL, Verdict.NOT_ASSESSED, Verdict.MARGINAL)]
    photos, documents = _attachments(build, revision)
    return RevisionView(
        build_id=build.id,
        letter=revision.letter,
        record=revision.record,
        revision=revision,
        is_current=is_current,
        current_letter=build.current.letter,
        root=root,
        pages=_pages(root, revision),
        permanent=layout.page(layout.permanent_root(build.id, revision.letter), "index"),
        changes=layout.changes_page(build.id),
        revisions=revision_links(build),
        hazards=hazards(revision.record, _rail_hazards(revision)),
        beyond_mains=beyond_mains_caution([rail_label(hazard) for hazard in _rail_hazards(revision)]),
        signoff=signoff_view(revision.signoff),
        tally=counts(revision.findings),
        summary=verdict_counts_text(counts(revision.findings)),
        failing=sorted(failing, key=lambda view: view.finding.verdict.rank),
        calcs=sections,
        schematics=[_figure(root, f) for f in revision.extras.figures if f.section == "schematics"],
        drawing_notes=[_note_text(note) for note in revision.extras.notes],
        photos=photos,
        documents=documents,
        failures=list(revision.extras.failures),
        standard=next((view for section in sections for view in section.findings if view.finding.code == STANDARD), None),
        hipot=[hipot_row(view) for section in sections for view in section.findings if view.finding.code == HIPOT],
    )


def _rail_hazards(revision) -> tuple:
    return revision.review.product(RAILS, RAIL_HAZARDS) or ()


def revision_links(build: Build) -> list[RevisionLink]:
    links = []
    for revision in build.revisions:
        is_current = revision is build.current
        path = layout.page(layout.revision_root(build.id, revision.letter, is_current), "index")
        links.append(RevisionLink(revision.letter, path, revision.record.date.isoformat(), is_current))
    return links


def newest_first(rows: list[IndexRow]) -> list[IndexRow]:
    """Builds by the date of their current revision, newest first; the same date by id."""
    return sorted(rows, key=lambda row: (_descending(row.date), row.build_id))


def _descending(date: str) -> str:
    return "".join(chr(0x10FFFF - ord(ch)) for ch in date)


def index_row(build: Build) -> IndexRow:
    record = build.current.record
    return IndexRow(
        build_id=build.id,
        title=record.title,
        path=layout.page(layout.build_root(build.id), "index"),
        letter=build.current.letter,
        status=record.status,
        status_title=shown_status_title(build.current),
        date=record.date.isoformat(),
        tally=counts(build.current.findings),
        has_mains=record.has_mains,
        signoff=build.current.signoff.state.value,
    )


def shown_status_title(revision: Revision) -> str:
    """The record's status, advanced to 'commissioned' when its commissioning record passed."""
    state = revision.extras.commissioning
    if state is not None:
        return state.status.title
    return STATUS_TITLES.get(revision.record.status, revision.record.status)


def _pages(root: str, revision: Revision) -> dict[str, str]:
    pages = {"index": layout.page(root, "index"), "calcs": layout.page(root, "calcs")}
    if any(f.section == "schematics" for f in revision.extras.figures) or revision.extras.notes:
        pages["schematics"] = layout.page(root, "schematics")
    if revision.extras.checklist is not None:
        pages["checklist"] = layout.page(root, "checklist")
    return pages


def _calc_sections(archive: Archive, revision: Revision, root: str) -> list[CalcSection]:
    anchors: set[str] = set()
    unique(slugify(f"Calculations: {revision.record.title}", "-"), anchors)
    titles = {calc.name: (calc.title, calc.summary) for calc in archive.calcs}
    names = [calc.name for calc in archive.calcs] + sorted({f.calc for f in revision.findings} - set(titles))
    sections = []
    for name in names:
        title, summary = titles.get(name, (name, ""))
        anchor = unique(slugify(title, "-"), anchors)
        findings = sorted((f for f in revision.findings if f.calc == name), key=lambda f: f.verdict.rank)
        views = [_finding_view(f, revision, layout.page(root, "calcs"), anchors) for f in findings]
        figures = [_figure(root, f) for f in revision.extras.figures if f.section == name]
        sections.append(CalcSection(name, title, summary, anchor, views, figures, verdict_counts_text(counts(findings))))
    return sections


def _finding_view(finding: Finding, revision: Revision, calcs_page: str, anchors: set[str]) -> FindingView:
    label = finding_label(finding)
    comparison = comparison_text(finding)
    margin = margin_text(finding)
    return FindingView(
        finding=finding,
        label=label,
        verdict=finding.verdict.value,
        comparison=f"{comparison}; {margin}" if comparison and margin else comparison,
        values=[measure_text(m, finding.limit) for m in (*finding.values, *finding.extra)],
        places=[_place(revision, key) for key in finding.keys],
        sources=[source_text(source) for source in finding.sources],
        anchor=f"{calcs_page}#{unique(slugify(label, '-'), anchors)}",
        accepted=accepted_text(revision.signoff.accepted(finding), revision.signoff),
        to_fix=fix_text(revision.signoff.decided(finding)),
    )


def _place(revision: Revision, key) -> str:
    location = revision.loaded.locate(key)
    line = f", line {location.line}" if location.line else ""
    return f"{dotted(key)} ({location.file}{line})"


def _figure(root: str, figure) -> FigureView:
    return FigureView(figure.title, layout.figure_path(root, figure.key), figure.svg)


def _note_text(note) -> str:
    if isinstance(note, Finding):
        return f"{note.title}. {note.explanation}".strip()
    return str(note)


def _attachments(build: Build, revision: Revision) -> tuple[list[AttachmentView], list[AttachmentView]]:
    photos, documents = [], []
    for attachment in revision.record.attachments:
        view = _attachment(build, attachment)
        (photos if view.shown else documents).append(view)
    return photos, documents


def _active_svg_file(path) -> bool:
    return is_active_svg(path.read_text(encoding="utf-8", errors="replace"))


def _attachment(build: Build, attachment) -> AttachmentView:
    suffix = posixpath.splitext(attachment.path.lower())[1]
    caption = attachment.caption or posixpath.basename(attachment.path)
    return AttachmentView(
        caption=caption,
        kind=attachment.kind,
        path=layout.attachment_path(build.id, attachment.path),
        source=attachment.path,
        shown=attachment.kind in SHOWN_KINDS and suffix in IMAGE_TYPES,
        refused=suffix in ACTIVE_TYPES or (suffix == ".svg" and _active_svg_file(build.folder / attachment.path)),
    )


@dataclass
class ChangeRow:
    label: str
    before: str
    after: str


@dataclass
class ChangeStep:
    letter: str
    previous: str
    date: str
    note: str
    path: str
    values: list[ChangeRow]
    texts: list[tuple[str, str]]  # (key, unified diff) for long text
    findings: list[ChangeRow]
    amendments: list


def change_steps(build: Build) -> list[ChangeStep]:
    """Revision by revision, newest first: what the record and the findings did between each pair."""
    steps = []
    for index, revision in enumerate(build.revisions):
        previous = build.revisions[index - 1] if index else None
        steps.append(_change_step(build, previous, revision))
    return list(reversed(steps))


def _change_step(build: Build, previous: Revision | None, revision: Revision) -> ChangeStep:
    values = record_changes(previous.record, revision.record) if previous else []
    findings = finding_changes(previous.findings, revision.findings) if previous else []
    links = {link.letter: link.path for link in revision_links(build)}
    return ChangeStep(
        letter=revision.letter,
        previous=previous.letter if previous else "",
        date=revision.record.date.isoformat(),
        note=revision.record.changes,
        path=links[revision.letter],
        values=[ChangeRow(c.key, _before(c), _after(c)) for c in values if c.kind != "text"],
        texts=[(c.key, "\n".join(c.lines)) for c in values if c.kind == "text"],
        findings=[ChangeRow(c.label, finding_state_text(c.before), _with_cause(finding_state_text(c.after), c.cause)) for c in findings],
        amendments=list(revision.publication.amendments) if revision.publication else [],
    )


def _with_cause(text: str, cause: str) -> str:
    return f"{text} ({cause})" if cause else text


def _before(change) -> str:
    return change.before if change.kind != "added" else "(none)"


def _after(change) -> str:
    return change.after if change.kind != "removed" else "(removed)"
