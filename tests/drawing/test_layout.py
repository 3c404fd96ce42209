"""What a person looking at the drawings would object to, checked on the SVG itself: labels on
top of each other, wires running through labels, text cut off at the edge of the picture.

Text extents are estimated with schemdraw's own Arial metrics (the SVG names Arial-compatible
fonts first), the same estimate schemdraw sizes its canvas with.
"""

from __future__ import annotations

import re
from itertools import combinations
from xml.etree import ElementTree

import pytest
from tests.fixtures.demo import DEMO, RECORDS, load_demo, load_record_text, load_test_record
from tests.fixtures.stage_samples import HT, kinds_and_topologies, sample_view
from schemdraw.backends.svgtext import text_approx_size

from dossier.drawing import schematics, sheet
from dossier.drawing.sheet import HIGH_VOLTAGE_FILL, HIGH_VOLTAGE_HATCH, MAINS_FILL
from dossier.drawing.svg_text import finish

SVG = "{http://www.w3.org/2000/svg}"
DEMO_REVISIONS = sorted((path.parent.name, path.stem.split("-")[1]) for path in DEMO.glob("*/rev-*.yaml"))
SHADING = (MAINS_FILL, HIGH_VOLTAGE_FILL, HIGH_VOLTAGE_HATCH)
SLACK = 1.5  # points; touching is not overlapping
TOP_OF_BOX = {"central": 0.5, "hanging": 1.0, "ideographic": 0.0}  # of one line's height, below the y attribute


def text_boxes(root) -> list[tuple[str, tuple[float, float, float, float]]]:
    """(words, (x0, y0, x1, y1)) for every text element, in SVG coordinates."""
    boxes = []
    for text in root.iter(f"{SVG}text"):
        lines = [span.text or "" for span in text.iter(f"{SVG}tspan")] or [text.text or ""]
        size = float(text.get("font-size"))
        width = max(text_approx_size(line, font="Arial", size=size)[0] for line in lines)
        x = float(text.get("x"))
        x0 = {"start": x, "middle": x - width / 2, "end": x - width}[text.get("text-anchor")]
        y0 = float(text.get("y")) + TOP_OF_BOX[text.get("dominant-baseline")] * size
        boxes.append(("\n".join(lines), (x0, y0, x0 + width, y0 + size * len(lines))))
    return boxes


def stroke_segments(root) -> list[tuple[tuple[float, float], tuple[float, float]]]:
    """Straight stroked segments of paths and polygons, leaving out the shading (stroked in its own fill colour)
    and the light hatching of the high-voltage areas, which lies behind the words like the tint."""
    segments = []
    for element in root.iter():
        style = element.get("style", "").replace(" ", "")
        if any(f"stroke:{colour}" in style for colour in SHADING) or "stroke:none" in style:
            continue
        points = _points(element)
        segments += [(a, b) for a, b in zip(points, points[1:]) if a is not None and b is not None]
        if element.tag == f"{SVG}polygon" and len(points) > 2:
            segments.append((points[-1], points[0]))
    return segments


def _points(element) -> list:
    if element.tag == f"{SVG}path":
        return _path_points(element.get("d", ""))
    if element.tag in (f"{SVG}polygon", f"{SVG}polyline"):
        numbers = [float(n) for n in re.findall(r"-?[\d.]+(?:e-?\d+)?", element.get("points", ""))]
        return list(zip(numbers[::2], numbers[1::2]))
    return []


def _path_points(d: str) -> list:
    """M and L commands only; anything else (arcs) breaks the run."""
    points: list = []
    for command, x, y in re.findall(r"([MLa])\s*(-?[\d.e-]+)[ ,](-?[\d.e-]+)", d):
        if command == "M" and points:
            points.append(None)
        points.append((float(x), float(y)) if command in "ML" else None)
    return points


def shrink(box, by=SLACK):
    x0, y0, x1, y1 = box
    return (x0 + by, y0 + by, x1 - by, y1 - by)


def boxes_overlap(a, b) -> bool:
    a, b = shrink(a), shrink(b)
    return a[0] < b[2] and b[0] < a[2] and a[1] < b[3] and b[1] < a[3]


def segment_crosses(box, start, end) -> bool:
    """Liang-Barsky: does the segment pass through the (shrunk) box?"""
    x0, y0, x1, y1 = shrink(box)
    (ax, ay), (bx, by) = start, end
    low, high = 0.0, 1.0
    for p, q in ((-(bx - ax), ax - x0), (bx - ax, x1 - ax), (-(by - ay), ay - y0), (by - ay, y1 - ay)):
        if p == 0:
            if q < 0:
                return False
            continue
        t = q / p
        low, high = (max(low, t), high) if p < 0 else (low, min(high, t))
        if low > high:
            return False
    return True


@pytest.fixture(scope="module")
def figures():
    """Every demo revision's figures, every corpus record's, and a drawing of every stage kind and topology
    (each also with a hazardous rail, which adds the hatching, its heading and a bleeder)."""
    found = [(f"{b}-{r}/{f.key}", f.svg) for b, r in DEMO_REVISIONS for f in schematics.figures(load_demo(b, r))]
    corpus = sorted(path.parent.name for path in RECORDS.glob("*/rev-A.yaml"))
    found += [(f"{b}/{f.key}", f.svg) for b in corpus for f in schematics.figures(load_test_record(b))]
    for name, record in _branching_variants():
        found += [(f"{name}/{f.key}", f.svg) for f in schematics.figures(record) if f.key == "block-diagram"]
    for kind, topology in kinds_and_topologies():
        for rails in ((), (HT,)):
            view = sample_view(kind, topology, rails)
            svg = finish(sheet.svg_of(schematics.plan(view)[0].draw(view)), prefix="k", title=view.title)
            found.append((f"{kind}:{topology}{'+HT' if rails else ''}", svg))
    return found


BIAS_FILTER = """  - id: bias-filter
    kind: filter
    name: Bias filter and divider
    side: isolated
    topology: capacitor-input
    fed_from: [bias-rectifier]
    parts:
      - {ref: R9, kind: resistor, value: 10 kohm, role: bias filter}
      - {ref: C9, kind: capacitor, value: 47 uF 100 V, role: bias filter}
"""


def _branching_variants():
    """The valve-amp supply with its bias branch two stages long and the heater rail named under the transformer,
    whose box the barrier passes through: once with a short name, once wider than the box (the line down to the
    branches then leaves from the side)."""
    text = (DEMO / "valve-amp-supply" / "rev-B.yaml").read_text(encoding="utf-8")
    text = text.replace("\nrails:\n", f"\n{BIAS_FILTER}\nrails:\n", 1).replace("stage: bias-rectifier,", "stage: bias-filter,")
    for name, rail in (("short", "heater"), ("wide", "heater and pilot lamp winding")):
        varied = text.replace("{name: heater, stage: heater,", f"{{name: {rail}, stage: transformer,")
        yield f"two-stage-branch-{name}", load_record_text(varied, f"valve-amp-supply/{name}.yaml")


def test_no_label_overlaps_another(figures):
    clashes = []
    for name, svg in figures:
        for (one, a), (two, b) in combinations(text_boxes(ElementTree.fromstring(svg)), 2):
            if boxes_overlap(a, b):
                clashes.append(f"{name}: {one!r} / {two!r}")
    assert clashes == []


def test_no_wire_runs_through_a_label(figures):
    clashes = []
    for name, svg in figures:
        root = ElementTree.fromstring(svg)
        segments = stroke_segments(root)
        for words, box in text_boxes(root):
            if any(segment_crosses(box, a, b) for a, b in segments):
                clashes.append(f"{name}: {words!r}")
    assert clashes == []


def test_no_label_is_cut_off_at_the_edge(figures):
    clipped = []
    for name, svg in figures:
        root = ElementTree.fromstring(svg)
        left, top, width, height = (float(v) for v in root.get("viewBox").split())
        for words, (x0, y0, x1, y1) in text_boxes(root):
            if x0 < left or y0 < top or x1 > left + width or y1 > top + height:
                clipped.append(f"{name}: {words!r}")
    assert clipped == []


@pytest.mark.parametrize("valign", ["center", "top", "bottom"])
def test_the_checks_themselves_can_fail(valign):
    """Labels drawn by schemdraw over each other, across a wire and past the edge are all caught."""
    drawing = sheet.new_drawing()
    sheet.wire(drawing, (0.8, -1), (0.8, 1))
    sheet.text(drawing, (0.5, 0), "R1\n470 k", valign=valign)
    sheet.text(drawing, (1.0, 0), "C1 100 nF", valign=valign)
    root = ElementTree.fromstring(finish(sheet.svg_of(drawing), "k", "t"))
    (_, first), (_, second) = text_boxes(root)
    assert boxes_overlap(first, second)
    assert any(segment_crosses(first, a, b) for a, b in stroke_segments(root))
    assert not boxes_overlap(first, (first[2] + 5, first[1], first[2] + 50, first[3]))
    assert not segment_crosses(first, (first[0], first[1] - 5), (first[2], first[1] - 5))
