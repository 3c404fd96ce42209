"""What other parts of dossier add to a revision's pages: schematics, charts, the checklist and its PDFs.

A drawing or PDF that fails on one record does not stop the site: the failure is shown on the page and
reported on standard error, in the way a failing calc becomes a finding. An invalid commissioning record
stops the build like an invalid build record.
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field
from xml.etree import ElementTree

from dossier.checklist.overview import CommissioningState, commissioning_state, load_for_revision
from dossier.calcs.charge import CURVE, NAME as CHARGE
from dossier.calcs.rails import HAZARDS, NAME as RAILS
from dossier.checklist.page import checklist_html, checklist_markdown
from dossier.checklist.sheet import Checklist
from dossier.drawing.charts.charge import figures as charge_figures
from dossier.drawing.figure import Figure
from dossier.drawing.schematics import draw
from dossier.findings import Finding
from dossier.review import Review

# An SVG shown on the site must not carry script: it can be opened on its own, outside an <img>.
ACTIVE_ELEMENTS = frozenset({"script", "foreignobject", "iframe", "embed", "object", "handler", "listener"})
LINK_ATTRIBUTES = frozenset({"href", "src", "from", "to", "values"})
_FIGURE_KEY = re.compile(r"[^a-z0-9-]+")
PAPER_LABELS = {"a4": "A4", "letter": "US Letter"}


@dataclass
class Extras:
    figures: list[Figure] = field(default_factory=list)
    notes: list[Finding | str] = field(default_factory=list)
    checklist: str | None = None
    sheets: dict[str, str] = field(default_factory=dict)  # printable checklist (HTML) by paper size
    pdfs: dict[str, bytes] = field(default_factory=dict)  # the same sheets as PDF, by paper size
    commissioning: CommissioningState | None = None
    failures: list[str] = field(default_factory=list)


def revision_extras(loaded, review: Review, checklist: Checklist, cache=None, print_links=None, pdf_cache=None) -> Extras:
    """Drawings from the review's findings, the chart from its products, and the pages of the one checklist."""
    extras = Extras()
    curve = review.product(CHARGE, CURVE)
    hazards = review.product(RAILS, HAZARDS)
    hazard_names = None if hazards is None else {hazard.name for hazard in hazards}
    _attempt(extras, "schematics", lambda: _schematics(extras, loaded.record, list(review.findings), cache, hazard_names))
    _attempt(extras, "charge chart", lambda: extras.figures.extend(charge_figures(loaded.record, curve)))
    _checklist(extras, loaded, checklist, print_links or {}, pdf_cache)
    extras.figures = _safe_figures(extras)
    return extras


def _attempt(extras: Extras, what: str, step) -> None:
    try:
        step()
    except Exception as error:  # a drawing or PDF bug must not hide the rest of the site
        extras.failures.append(f"the {what} could not be made: {type(error).__name__}: {error}")


def _schematics(extras: Extras, record, findings, cache, hazard_names) -> None:
    result = draw(record, findings, cache=cache, hazard_names=hazard_names)
    extras.figures.extend(result.figures)
    extras.notes.extend(result.notes)


def _checklist(extras: Extras, loaded, checklist: Checklist, print_links: dict[str, str], pdf_cache) -> None:
    """The checklist page, its printable sheets and PDFs, and the commissioning record (an invalid one stops the build)."""
    commissioning = load_for_revision(loaded, checklist)
    extras.commissioning = commissioning_state(loaded, checklist, commissioning)
    extras.sheets = {paper: checklist_html(loaded, checklist, paper, commissioning) for paper in print_links}
    if pdf_cache is not None:
        _attempt(extras, "checklist PDF", lambda: extras.pdfs.update({p: pdf_cache.pdf_of(html) for p, html in extras.sheets.items()}))
    extras.checklist = checklist_markdown(loaded, checklist, commissioning, print_links=_print_labels(print_links, extras.pdfs) or None)


def _print_labels(print_links: dict[str, str], pdfs: dict[str, bytes]) -> dict[str, str]:
    """Link text -> href for each printable page, and for its PDF where one was written."""
    labels = {}
    for paper, href in print_links.items():
        name = PAPER_LABELS.get(paper, paper)
        labels[f"{name} (page)"] = href
        if paper in pdfs:
            labels[f"{name} (PDF)"] = pdf_href(href)
    return labels


def pdf_href(sheet_href: str) -> str:
    return sheet_href.removesuffix(".html") + ".pdf"


def _safe_figures(extras: Extras) -> list[Figure]:
    kept, seen = [], set()
    for figure in extras.figures:
        key = figure_key(figure.key, seen)
        if is_active_svg(figure.svg):
            extras.failures.append(f"figure '{figure.title}' was left out: its SVG holds script or event handlers")
            continue
        seen.add(key)
        kept.append(Figure(key=key, title=figure.title, svg=figure.svg, section=figure.section))
    return kept


def is_active_svg(svg: str) -> bool:
    """True when an SVG could run script: script-like elements, on* handlers, script or data links.

    An SVG that does not parse, or declares entities, counts as active: it is not shown.
    """
    if "<!ENTITY" in svg:
        return True
    try:
        elements = list(ElementTree.fromstring(svg).iter())
    except ElementTree.ParseError:
        return True
    return any(_active_element(element) for element in elements)


def _active_element(element) -> bool:
    if _local(element.tag) in ACTIVE_ELEMENTS:
        return True
    for name, value in element.attrib.items():
        attribute = _local(name)
        if attribute.startswith("on"):
            return True
        if attribute in LINK_ATTRIBUTES and value.strip().lower().startswith(("javascript:", "data:", "vbscript:")):
            return True
    return False


def _local(name) -> str:
    return str(name).rsplit("}", 1)[-1].lower()


def figure_key(key: str, taken: set[str]) -> str:
    """A file-name stem: lower case letters, digits and dashes, unique among the revision's figures."""
    stem = _FIGURE_KEY.sub("-", str(key).lower()).strip("-") or "figure"
    candidate, number = stem, 2
    while candidate in taken:
        candidate, number = f"{stem}-{number}", number + 1
    return candidate
