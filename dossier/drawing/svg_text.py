"""Finishing schemdraw's SVG text: ids unique to each figure, a title, and a well-formedness check.

schemdraw numbers its clip paths with a counter shared by every drawing in the process and names
its hatch pattern 'hatch' in every drawing, so two drawings on one page could collide and the
same drawing could come out differently on a second run. Every id is renamed here, in order
of appearance, to '<prefix>-<n>', and every reference to it (url(#...), href="#...") follows.
"""

from __future__ import annotations

import re
from xml.etree import ElementTree
from xml.sax.saxutils import escape

_ID = re.compile(r'\bid="([^"]+)"')
_SVG_OPEN = re.compile(r"<svg\b[^>]*>")
# schemdraw writes font-family="sans", which is no CSS generic family; name fonts with Arial's
# metrics (schemdraw sizes text for Arial) and fall back to the generic family.
FONT_FAMILY = 'font-family="Arial, Liberation Sans, Helvetica, sans-serif"'


def finish(svg: str, prefix: str, title: str) -> str:
    """The SVG with its ids prefixed, an accessible title, and checked to be well formed."""
    text = with_unique_ids(with_default_namespace(svg), prefix).replace('font-family="sans"', FONT_FAMILY)
    text = with_title(text, title)
    check_well_formed(text)
    return text


SVG_NAMESPACE = "http://www.w3.org/2000/svg"
_PREFIXED_ROOT = re.compile(r'^<(?P<p>[A-Za-z_][\w.-]*):svg\b(?P<attrs>[^>]*?)\sxmlns:(?P=p)="' + re.escape(SVG_NAMESPACE) + '"')


def with_default_namespace(svg: str) -> str:
    """schemdraw qualifies only the root element and relies on ElementTree's registry to make the
    SVG namespace the default one; when other code in the process has changed that registry the root
    comes out as <ns0:svg ...> and its children fall out of the namespace. Put the default back."""
    match = _PREFIXED_ROOT.match(svg)
    if match is None:
        return svg
    prefix = match.group("p")
    opening = f'<svg{match.group("attrs")} xmlns="{SVG_NAMESPACE}"'
    return opening + svg[match.end():].removesuffix(f"</{prefix}:svg>") + "</svg>"


def with_unique_ids(svg: str, prefix: str) -> str:
    renames = _renames(svg, prefix)
    if not renames:
        return svg
    pattern = re.compile(r'(\bid="|url\(#|href="#)(' + "|".join(map(re.escape, renames)) + r')(?=["\)])')
    return pattern.sub(lambda m: m.group(1) + renames[m.group(2)], svg)


def _renames(svg: str, prefix: str) -> dict[str, str]:
    renames: dict[str, str] = {}
    for match in _ID.finditer(svg):
        renames.setdefault(match.group(1), f"{prefix}-{len(renames) + 1}")
    return renames


def with_title(svg: str, title: str) -> str:
    """Add role, aria-label and a <title> as the first child of the root element."""
    opening = _SVG_OPEN.search(svg)
    if opening is None:
        raise ValueError("not an SVG document")
    tag = opening.group(0)
    label = escape(title, {'"': "&quot;"})
    new_tag = tag[:-1] + f' role="img" aria-label="{label}">' + f"<title>{escape(title)}</title>"
    return svg[: opening.start()] + new_tag + svg[opening.end():]


def check_well_formed(svg: str) -> None:
    root = ElementTree.fromstring(svg)
    if not root.tag.endswith("svg"):
        raise ValueError(f"root element is {root.tag}, not svg")
