"""Drawing primitives shared by every drawer: an explicit SVG canvas, wires, text, terminals,
the shaded hazardous areas and the dashed isolation barrier.

Two kinds of hazardous area are marked: the mains-connected side (a plain pink tint) and, on the
isolated side, whatever carries a voltage above the extra-low-voltage limits (a pale amber tint under
diagonal hatching). The hatching keeps the two apart in greyscale print and for readers who cannot
tell the tints apart; each carries its own heading in words.

Style is set on each drawing (Drawing.config), never with schemdraw's module-wide settings, so
nothing here changes how anyone else's drawings look.
"""

from __future__ import annotations

import schemdraw
import schemdraw.elements as elm
from schemdraw.backends.svg import text_size

from dossier.drawing.symbols import Hatching, HazardMark

FONT_SIZE = 11
SMALL_FONT = 9.5
POINTS_PER_UNIT = 36  # 0.5 inch per drawing unit
UNIT = 2.5  # length of a two-terminal element
LINE_HEIGHT = 1.0  # schemdraw sets lines one font size apart

INK = "black"
NOTE_INK = "#4a4a4a"
MAINS_FILL = "#fbe6e3"
MAINS_INK = "#9b1c1c"
BARRIER_INK = "#1d4f91"
HIGH_VOLTAGE_FILL = "#fff4d4"
HIGH_VOLTAGE_HATCH = "#d9a93f"
HIGH_VOLTAGE_INK = "#6b4200"
MAINS_HEADING = "MAINS-CONNECTED: hazardous voltage"


def new_drawing() -> schemdraw.Drawing:
    drawing = schemdraw.Drawing(canvas="svg", show=False)
    drawing.config(unit=UNIT, inches_per_unit=POINTS_PER_UNIT / 72, fontsize=FONT_SIZE, font="sans-serif",
                   color=INK, lw=1.6, ls="-", fill="none", margin=0.3)
    drawing.dwgparams["lblofst"] = 0.12
    return drawing


def svg_of(drawing: schemdraw.Drawing) -> str:
    return drawing.get_imagedata("svg").decode("utf-8")


def text_width(text: str, size: float = FONT_SIZE) -> float:
    """Approximate width of (multi-line) text in drawing units."""
    return text_size(text, font="Arial", size=size)[0] / POINTS_PER_UNIT


def text_height(text: str, size: float = FONT_SIZE) -> float:
    return len(text.splitlines()) * size * LINE_HEIGHT / POINTS_PER_UNIT


def add(drawing: schemdraw.Drawing, element):
    """Add an element; one not given a direction is drawn upright, whatever was drawn before it.
    (Before it is added, an element's params hold only what it was given and its own defaults.)"""
    if not isinstance(element, elm.Element2Term) and "theta" not in element.params:
        element.theta(0)
    drawing.add(element)
    return element


def text(drawing, xy, words: str, halign="left", valign="center", size=FONT_SIZE, colour=INK):
    label = elm.Label().at(xy).label(words, halign=halign, valign=valign, fontsize=size, color=colour, ofst=0)
    return add(drawing, label)


def wire(drawing, *points, colour=INK, dashed=False):
    """A wire through the points in order (straight runs only)."""
    for start, end in zip(points, points[1:]):
        line = elm.Line().at(start).to(end).color(colour)
        add(drawing, line.linestyle("--") if dashed else line)


def dot(drawing, xy):
    return add(drawing, elm.Dot(radius=0.09).at(xy))


def terminal(drawing, xy, words: str, side: str = "right", size: float = FONT_SIZE):
    """A connection point (open circle) named with where it leads."""
    add(drawing, elm.Dot(open=True, radius=0.11).at(xy))
    offset = 0.35 if side == "right" else -0.35
    align = "left" if side == "right" else "right"
    text(drawing, (xy[0] + offset, xy[1]), words, halign=align, size=size)


def shade(drawing, corner1, corner2, fill=MAINS_FILL):
    """A filled area behind everything else, with no outline."""
    area = elm.Rect(corner1=corner1, corner2=corner2, fill=fill).at((0, 0)).color(fill).zorder(0)
    return add(drawing, area)


def shade_high_voltage(drawing, corner1, corner2):
    """The isolated side's hazardous area: a pale tint under diagonal hatching, behind everything."""
    shade(drawing, corner1, corner2, fill=HIGH_VOLTAGE_FILL)
    return add(drawing, Hatching(corner1, corner2, colour=HIGH_VOLTAGE_HATCH).at((0, 0)).zorder(0))


def hazard_heading(drawing, xy, words: str = MAINS_HEADING, colour: str = MAINS_INK):
    """The dangerous-voltage mark and a heading, left-aligned at xy."""
    add(drawing, HazardMark(size=0.5, colour=colour).at((xy[0], xy[1] - 0.2)))
    text(drawing, (xy[0] + 0.7, xy[1]), words, colour=colour)


def high_voltage_heading(rails) -> str:
    """'ABOVE EXTRA-LOW VOLTAGE (not mains): B+ 350 V DC, bias -45 V DC'."""
    named = ", ".join(rails)
    return f"ABOVE EXTRA-LOW VOLTAGE (not mains): {named}" if named else "ABOVE EXTRA-LOW VOLTAGE (not mains)"


def barrier_line(drawing, x: float, top: float, bottom: float):
    wire(drawing, (x, top), (x, bottom), colour=BARRIER_INK, dashed=True)


VERDICT_INK = {"FAIL": "#b3261e", "MARGINAL": "#8a5a00", "PASS": "#1e6b34"}


def barrier_label(drawing, xy, barrier):
    """The barrier's lines top-down from xy (left-aligned), the verdict line coloured by the verdict."""
    *body, verdict = barrier.lines
    words = "\n".join(body)
    text(drawing, xy, words, valign="top", size=SMALL_FONT, colour=BARRIER_INK)
    below = (xy[0], xy[1] - text_height(words, SMALL_FONT))
    text(drawing, below, verdict, valign="top", size=SMALL_FONT, colour=VERDICT_INK.get(barrier.verdict, BARRIER_INK))


def note(drawing, xy, words: str, halign="left", valign="top"):
    text(drawing, xy, words, halign=halign, valign=valign, size=SMALL_FONT, colour=NOTE_INK)


def extent(drawing) -> tuple[float, float, float, float]:
    """(xmin, ymin, xmax, ymax) of everything drawn so far, labels included."""
    box = drawing.get_bbox()
    return box.xmin, box.ymin, box.xmax, box.ymax
