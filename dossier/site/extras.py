"""What other parts of dossier add to a revision's pages: schematics, charts and the checklist.

Each part is optional: while its module is not installed the pages simply leave it out. A part that
is installed but fails on one record does not stop the site: the failure is shown on the page and
reported on standard error, in the way a failing calc becomes a finding.
"""

from __future__ import annotations

import importlib
import re
from dataclasses import dataclass, field
from pathlib import Path
from xml.etree import ElementTree

from dossier.drawing.figure import Figure
from dossier.findings import Finding

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
    failures: list[str] = field(default_factory=list)


def optional(module: str, name: str):
    """module.name, or None while that module does not exist (any other import error is raised)."""
    try:
        loaded = importlib.import_module(module)
    except ModuleNotFoundError as error:
        if error.name and module.startswith(error.name):
            return None
        raise
    return getattr(loaded, name, None)


def revision_extras(loaded, findings: list[Finding], build_dir: Path, cache=None, print_links=None) -> Extras:
    extras = Extras()
    _attempt(extras, "schematics", lambda: _schematics(extras, loaded.record, findings, cache))
    _attempt(extras, "charge chart", lambda: _charge_chart(extras, loaded.record))
    _attempt(extras, "checklist", lambda: _checklist(extras, loaded, findings, build_dir, print_links))
    extras.figures = _safe_figures(extras)
    return extras


def _attempt(extras: Extras, what: str, step) -> None:
    from dossier.problems import InputError

    try:
        step()
    except InputError:
        raise
    except Exception as error:  # another module's bug must not hide the rest of the site
        extras.failures.append(f"the {what} could not be made: {type(error).__name__}: {error}")


def _schematics(extras: Extras, record, findings, cache) -> None:
    draw = optional("dossier.drawing.schematics", "draw")
    if draw is not None:
        result = draw(record, findings, cache=cache)
        extras.figures.extend(result.figures)
        extras.notes.extend(result.notes)
        return
    figures = optional("dossier.drawing.schematics", "figures")
    if figures is not None:
        _sort_items(extras, figures(record, findings))


def _charge_chart(extras: Extras, record) -> None:
    figures = optional("dossier.drawing.charge_chart", "figures")
    if figures is not None:
        _sort_items(extras, figures(record))


def _sort_items(extras: Extras, items) -> None:
    for item in items:
        (extras.figures if isinstance(item, Figure) else extras.notes).append(item)


def _checklist(extras: Extras, loaded, findings, build_dir: Path, print_links) -> None:
    markdown = optional("dossier.checklist.page", "checklist_markdown")
    if markdown is None:
        return
    commissioning = _commissioning(loaded, findings, build_dir)
    sheet = optional("dossier.checklist.page", "checklist_html")
    if sheet is not None and print_links:
        extras.sheets = {paper: sheet(loaded, findings, paper, commissioning) for paper in print_links}
        labels = {PAPER_LABELS.get(paper, paper): href for paper, href in print_links.items()}
        extras.checklist = markdown(loaded, findings, commissioning, print_links=labels)
    else:
        extras.checklist = markdown(loaded, findings, commissioning)


def _commissioning(loaded, findings, build_dir: Path):
    """The revision's commissioning record, when it has one; an invalid one stops the build like a bad record."""
    find = optional("dossier.checklist.load", "commissioning_path")
    load = optional("dossier.checklist.load", "load_commissioning")
    checklist_of = optional("dossier.checklist.sheet", "build_checklist")
    if not (find and load and checklist_of):
        return None
    path = find(build_dir, loaded.record.revision)
    if path is None:
        return None
    shown = f"{build_dir.name}/{path.name}"
    return load(path, checklist_of(loaded.record, findings), shown_as=shown)


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
