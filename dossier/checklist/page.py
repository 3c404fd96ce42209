"""The checklist as a site page (Markdown) and as a printable sheet (standalone HTML with print CSS)."""

from __future__ import annotations

import re
from functools import lru_cache

import jinja2

from dossier.checklist.sheet import Checklist
from dossier.checklist.view import SheetView, sheet_view
from dossier import markup
from dossier.templates import templates_dir
from dossier.units import fmt

PAPER = {"a4": "A4", "letter": "letter"}


@lru_cache(maxsize=2)
def _environment(autoescape: bool) -> jinja2.Environment:
    env = jinja2.Environment(
        loader=jinja2.FileSystemLoader(str(templates_dir() / "checklist")),
        autoescape=autoescape,
        trim_blocks=True,
        lstrip_blocks=True,
        undefined=jinja2.StrictUndefined,
        keep_trailing_newline=True,
    )
    env.filters["md"] = markup.text
    env.filters["prose"] = markup.prose
    env.filters["quantity"] = fmt
    return env


def view_for(loaded, checklist: Checklist, commissioning=None) -> SheetView:
    return sheet_view(checklist, loaded.record.status, commissioning)


def checklist_markdown(loaded, checklist: Checklist, commissioning=None, *, print_links: dict[str, str] | None = None) -> str:
    """The site page's Markdown body. print_links maps a label ('A4 PDF') to the printable sheet's address."""
    text = _environment(False).get_template("page.md.j2").render(v=view_for(loaded, checklist, commissioning), links=print_links or {})
    return re.sub(r"\n{3,}", "\n\n", text).strip() + "\n"


def checklist_html(loaded, checklist: Checklist, paper: str = "a4", commissioning=None) -> str:
    """A standalone printable page: its own print CSS, no site navigation."""
    if paper not in PAPER:
        raise ValueError(f"paper must be one of {', '.join(PAPER)}, not {paper!r}")
    css = (templates_dir() / "checklist" / "print.css").read_text(encoding="utf-8")
    template = _environment(True).get_template("sheet.html.j2")
    return template.render(v=view_for(loaded, checklist, commissioning), page_size=PAPER[paper], css=jinja2.utils.markupsafe.Markup(css))
