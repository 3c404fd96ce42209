"""The whole build as a row of stage blocks, with the isolation barrier as a dashed line across it
and the mains-connected side shaded and headed with the dangerous-voltage mark."""

from __future__ import annotations

import textwrap

import schemdraw.elements as elm

from dossier.drawing import sheet
from dossier.drawing.symbols import Box, HazardMark
from dossier.drawing.views import BlockView, DiagramView

GAP = 1.1  # between blocks, room for the arrow
NAME_WIDTH = 20  # characters per line of a block's name
REFS_WIDTH = 16


def draw(view: DiagramView):
    drawing = sheet.new_drawing()
    if not view.blocks:
        sheet.note(drawing, (0, 0), "The record lists no stages, so there is nothing to draw.")
        _barrier_list(drawing, view.crossing + view.others, "Barriers recorded:")
        return drawing
    texts = [block_text(block) for block in view.blocks]
    height = max((sheet.text_height(t) for t in texts), default=1.0) + 0.6
    boxes = _blocks(drawing, view.blocks, texts, height)
    barrier_x = _barrier_x(view.blocks, boxes)
    if barrier_x is not None:
        _barrier(drawing, barrier_x, height, view)
    _barrier_list(drawing, view.others, "Other barriers (not across the circuit):")
    _shade_mains(drawing, view.blocks, boxes, barrier_x, height)
    return drawing


def block_text(block: BlockView) -> str:
    name = textwrap.fill(f"{block.index}. {block.name}", NAME_WIDTH, break_on_hyphens=False)
    refs = textwrap.fill(" ".join(block.refs), REFS_WIDTH, break_on_hyphens=False) if block.refs else "(no parts)"
    return f"{name}\n[{block.kind}]\n{refs}"


def _blocks(drawing, blocks, texts, height) -> list[tuple[float, float]]:
    """Draw the row; return each block's left and right x."""
    x, spans = 0.0, []
    for number, (block, words) in enumerate(zip(blocks, texts)):
        width = max(2.6, sheet.text_width(words) + 0.6)
        fill = "none" if block.bridging and not block.on_mains else "white"
        sheet.add(drawing, Box(width, height, words, fill=fill).at((x, 0)).zorder(2))
        if number:
            sheet.add(drawing, elm.Arrow().at((x - GAP, -height / 2)).to((x, -height / 2)))
        spans.append((x, x + width))
        x += width + GAP
    return spans


def _barrier_x(blocks, spans) -> float | None:
    """Through the block that forms the barrier at the mains-to-isolated step, else in the gap there."""
    for number in range(1, len(blocks)):
        before, after = blocks[number - 1], blocks[number]
        if before.on_mains and not after.on_mains:
            if after.bridging:
                return sum(spans[number]) / 2
            if before.bridging:
                return sum(spans[number - 1]) / 2
            return spans[number][0] - GAP / 2
    return None


def _barrier(drawing, x: float, height: float, view: DiagramView) -> None:
    """The dashed line from above the row down past it (not over a block's words), each crossing barrier labelled below."""
    y = -height - 0.5
    for barrier in view.crossing:
        sheet.barrier_label(drawing, (x + 0.25, y), barrier)
        y -= sheet.text_height(barrier.label, sheet.SMALL_FONT) + 0.3
    sheet.barrier_line(drawing, x, 1.6, 0)
    sheet.barrier_line(drawing, x, -height, min(y + 0.2, -height - 0.3))
    sheet.text(drawing, (x + 0.25, 0.95), "isolated side", colour=sheet.BARRIER_INK)
    if not view.crossing:
        sheet.note(drawing, (x + 0.25, -height - 0.5), "no barrier recorded across the circuit")


def _barrier_list(drawing, barriers, heading: str) -> None:
    """Barriers listed under the diagram, e.g. mains to chassis, which no line across the row shows."""
    if not barriers:
        return
    _, ymin, _, _ = sheet.extent(drawing)
    sheet.text(drawing, (0, ymin - 0.4), heading, valign="top", size=sheet.SMALL_FONT, colour=sheet.BARRIER_INK)
    y = ymin - 0.4 - sheet.text_height(heading, sheet.SMALL_FONT) - 0.1
    for barrier in barriers:
        sheet.barrier_label(drawing, (0, y), barrier)
        y -= sheet.text_height(barrier.label, sheet.SMALL_FONT) + 0.25


def _shade_mains(drawing, blocks, spans, barrier_x, height) -> None:
    """Shade each run of mains blocks up to the barrier (or the run's end) and head the first."""
    runs = _mains_runs(blocks, spans, barrier_x)
    for number, (left, right) in enumerate(runs):
        sheet.shade(drawing, (left - 0.35, 1.7), (right, -height - 0.3))
        if number == 0:
            sheet.add(drawing, HazardMark(size=0.45).at((left - 0.15, 0.77)))
            sheet.text(drawing, (left + 0.45, 0.95), _hazard_heading(right - left - 0.8), colour=sheet.MAINS_INK)


def _hazard_heading(room: float) -> str:
    """The heading on one line when it fits the shaded run, else on two."""
    words = "MAINS-CONNECTED: hazardous voltage"
    return words if sheet.text_width(words) <= room else words.replace(": ", ":\n")


def _mains_runs(blocks, spans, barrier_x) -> list[tuple[float, float]]:
    """(left, right) of each run of consecutive mains blocks; a run ends at the barrier when it is next."""
    runs: list[list] = []
    for number, block in enumerate(blocks):
        if block.on_mains and runs and runs[-1][2] == number - 1:
            runs[-1][1:] = [spans[number][1], number]
        elif block.on_mains:
            runs.append([spans[number][0], spans[number][1], number])
    return [(left, _run_end(right, last, spans, barrier_x)) for left, right, last in runs]


def _run_end(right: float, last: int, spans, barrier_x) -> float:
    following = spans[last + 1][1] if last + 1 < len(spans) else right
    if barrier_x is not None and right < barrier_x <= following:
        return barrier_x
    return right + 0.35
