"""Symbols schemdraw does not have, drawn in IEC 60617 style.

IEC 60617 (Graphical symbols for diagrams) is the open standard the trade draws to; the
protective-earth and dangerous-voltage marks are IEC 60417-5019 and -5036.
"""

from __future__ import annotations

import math

from schemdraw.elements import Element, Element2Term
from schemdraw.segments import Segment, SegmentArc, SegmentCircle, SegmentPoly, SegmentText

HUMP = 0.34  # diameter of one winding hump, drawing units


class Winding(Element2Term):
    """An inductor or transformer winding: a row of humps (IEC 60617-04-03-01), optional core lines.

    Drawn along +x; the humps bulge to +y. Anchors: 'tap' at the middle of the humps,
    'core' at the middle of the core line when there is one.
    """

    def __init__(self, humps: int = 5, core: bool = False, **kwargs):
        super().__init__(**kwargs)
        length = humps * HUMP
        # The first segment spans the body with a gap; schemdraw adds the leads to it.
        self.segments.append(Segment([(0, 0), (math.nan, math.nan), (length, 0)]))
        for i in range(humps):
            self.segments.append(SegmentArc(((i + 0.5) * HUMP, 0), width=HUMP, height=HUMP, theta1=0, theta2=180))
        self.anchors["tap"] = (length / 2, 0)
        if core:
            self.segments.append(Segment([(0, HUMP * 0.85), (length, HUMP * 0.85)]))
            self.anchors["core"] = (length / 2, HUMP * 0.85)
        self.elmparams["lblloc"] = "bot"


class BridgeRectifier(Element):
    """A bridge rectifier as one block: a square holding a diode glyph (IEC 60617-06-04-03 style).

    Anchors ac1, ac2 on the left, plus and minus on the right.
    """

    def __init__(self, size: float = 1.6, **kwargs):
        super().__init__(**kwargs)
        half = size / 2
        self.segments.append(SegmentPoly([(0, -half), (size, -half), (size, half), (0, half)]))
        _diode_glyph(self.segments, centre=(half, 0), size=size * 0.45)
        pins = {"ac1": (0, half * 0.55), "ac2": (0, -half * 0.55), "plus": (size, half * 0.55), "minus": (size, -half * 0.55)}
        marks = {"ac1": "~", "ac2": "~", "plus": "+", "minus": "\u2212"}
        for name, (x, y) in pins.items():
            inside = 0.18 if x == 0 else size - 0.18
            self.segments.append(SegmentText((inside, y), marks[name], align=("center", "center"), fontsize=10))
            self.anchors[name] = (x, y)


def _diode_glyph(segments, centre, size):
    x, y = centre
    h = size / 2
    segments.append(SegmentPoly([(x - h * 0.6, y + h * 0.7), (x - h * 0.6, y - h * 0.7), (x + h * 0.6, y)]))
    segments.append(Segment([(x + h * 0.6, y + h * 0.7), (x + h * 0.6, y - h * 0.7)]))
    segments.append(Segment([(x - h * 1.4, y), (x + h * 1.4, y)]))


class ProtectiveEarth(Element):
    """Protective earth: an earth symbol in a circle (IEC 60417-5019). Anchor 'start' at the top."""

    def __init__(self, **kwargs):
        super().__init__(**kwargs)
        radius = 0.42
        centre = (0, -0.2 - radius)
        self.segments.append(Segment([(0, 0), (0, -0.45)]))
        for width, y in ((0.5, -0.45), (0.32, -0.62), (0.14, -0.79)):
            self.segments.append(Segment([(-width / 2, y), (width / 2, y)]))
        self.segments.append(SegmentCircle(centre, radius))
        self.anchors["start"] = (0, 0)
        self.anchors["note"] = (radius + 0.15, centre[1])


class HazardMark(Element):
    """The dangerous-voltage mark: a triangle holding a lightning arrow (IEC 60417-5036)."""

    def __init__(self, size: float = 0.6, colour: str = "#9b1c1c", **kwargs):
        super().__init__(**kwargs)
        h = size * math.sqrt(3) / 2
        self.segments.append(SegmentPoly([(0, 0), (size, 0), (size / 2, h)], color=colour, fill="#fff4d6", lw=1.4))
        bolt = [(size * 0.56, h * 0.78), (size * 0.42, h * 0.40), (size * 0.58, h * 0.42), (size * 0.44, h * 0.10)]
        self.segments.append(Segment(bolt, color=colour, lw=1.3, arrow="->", arrowwidth=0.09, arrowlength=0.1))
        self.anchors["east"] = (size, h / 2)


class Box(Element):
    """A rectangle with centred text: stage blocks, regulator blocks, placeholders.

    Anchors N, S, E, W and the corners NW, NE, SW, SE; the box spans (0, 0) to (width, -height).
    """

    def __init__(self, width: float, height: float, text: str = "", fill: str = "white",
                 dashed: bool = False, fontsize: float = 11, **kwargs):
        super().__init__(**kwargs)
        corners = [(0, 0), (width, 0), (width, -height), (0, -height)]
        self.segments.append(SegmentPoly(corners, fill=fill, ls="--" if dashed else "-", lw=1.4))
        if text:
            self.segments.append(SegmentText((width / 2, -height / 2), text, align=("center", "center"), fontsize=fontsize))
        self.anchors.update(N=(width / 2, 0), S=(width / 2, -height), W=(0, -height / 2), E=(width, -height / 2),
                            NW=(0, 0), NE=(width, 0), SW=(0, -height), SE=(width, -height))


class Hatching(Element):
    """Diagonal lines (rising to the right) filling the rectangle between two corners, as one path."""

    def __init__(self, corner1, corner2, spacing: float = 0.32, colour: str = "#d9a93f", **kwargs):
        super().__init__(**kwargs)
        left, right = sorted((corner1[0], corner2[0]))
        bottom, top = sorted((corner1[1], corner2[1]))
        points: list = []
        step = spacing * math.sqrt(2)
        offset = bottom - right + step / 2
        while offset < top - left:
            start = max(left, bottom - offset)
            end = min(right, top - offset)
            if end > start:
                points += [(start, start + offset), (end, end + offset), (math.nan, math.nan)]
            offset += step
        if points:
            self.segments.append(Segment(points[:-1], color=colour, lw=0.7))
        self.params["drop"] = (0, 0)


class GasTube(Element2Term):
    """A gas-filled two-electrode tube (neon indicator, gas regulator valve): an envelope holding two
    facing electrodes, the dot marking the gas fill (IEC 60617-05 style). Drawn along +x."""

    def __init__(self, **kwargs):
        super().__init__(**kwargs)
        radius = 0.45
        self.segments.append(Segment([(0, 0), (radius - 0.12, 0), (math.nan, math.nan), (radius + 0.12, 0), (2 * radius, 0)]))
        self.segments.append(SegmentCircle((radius, 0), radius))
        for x in (radius - 0.12, radius + 0.12):
            self.segments.append(Segment([(x, -0.25), (x, 0.25)]))
        self.segments.append(SegmentCircle((radius + 0.22, 0.28), 0.05, fill=True))
