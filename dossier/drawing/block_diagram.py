"""The whole build as stage blocks laid out like the unit branches (see graph_layout): a chain on one
row, each branch (a heater or bias supply, say) on a row of its own under the stage that feeds it. The
rails a stage delivers are named under it. The isolation barrier is a dashed line across the diagram,
the mains-connected side is shaded and headed with the dangerous-voltage mark, and stages on the
isolated side above extra-low voltage are hatched; a legend under the diagram tells the two apart."""

from __future__ import annotations

import textwrap

import schemdraw.elements as elm

from dossier.drawing import sheet
from dossier.drawing.graph_layout import Place, layout
from dossier.drawing.symbols import Box, Hatching, HazardMark
from dossier.drawing.views import BlockView, DiagramView

GAP = 1.1  # between columns, room for the arrow
ROW_GAP = 1.5  # between rows, room for the line down to a branch
NAME_WIDTH = 20  # characters per line of a block's name
REFS_WIDTH = 16
MARGIN = 0.35  # shading round a block
TRUNK_INSET = 0.45  # the line down to a branch, from the right edge of its stage's box
TAG_CLEARANCE = 0.3  # between a stage's rail names and a line passing them


def draw(view: DiagramView):
    drawing = sheet.new_drawing()
    if not view.blocks:
        sheet.note(drawing, (0, 0), "The record lists no stages, so there is nothing to draw.")
        _barrier_list(drawing, view.crossing + view.others, "Barriers recorded:")
        return drawing
    grid = Grid(view.blocks)
    for block in view.blocks:
        grid.draw_block(drawing, block)
    for block in view.blocks:
        grid.connect(drawing, block)
    barrier_x = _barrier_x(view.blocks, grid)
    _shade_mains(drawing, view.blocks, grid, barrier_x)
    _hatch_high_voltage(drawing, view.blocks, grid, barrier_x)
    if barrier_x is not None:
        _barrier(drawing, barrier_x, grid, view)
    _barrier_list(drawing, view.others, "Other barriers (not across the circuit):")
    _legend(drawing, view.blocks)
    return drawing


def block_text(block: BlockView, also_from: tuple[str, ...] = ()) -> str:
    name = textwrap.fill(f"{block.index}. {block.name}", NAME_WIDTH, break_on_hyphens=False)
    refs = textwrap.fill(" ".join(block.refs), REFS_WIDTH, break_on_hyphens=False) if block.refs else "(no parts)"
    also = f"\nalso fed from {', '.join(also_from)}" if also_from else ""
    return f"{name}\n[{block.kind}]\n{refs}{also}"


def rails_text(block: BlockView) -> str:
    return "\n".join(f"\u2192 {rail.label}" for rail in block.rails)


class Grid:
    """The blocks' places, sizes and the coordinates of every row and column."""

    def __init__(self, blocks: tuple[BlockView, ...]):
        self.blocks = {block.id: block for block in blocks}
        self.places: dict[str, Place] = layout([b.id for b in blocks], {b.id: b.fed_from for b in blocks})
        numbers = {block.id: str(block.index) for block in blocks}
        self.texts = {b.id: block_text(b, tuple(numbers[s] for s in b.fed_from if s in numbers and s != self.places[b.id].parent))
                      for b in blocks}
        self.widths = {key: max(2.6, sheet.text_width(words) + 0.6) for key, words in self.texts.items()}
        rows = max(place.row for place in self.places.values()) + 1
        columns = max(place.column for place in self.places.values()) + 1
        self.box_height = [0.0] * rows
        self.tag_height = [0.0] * rows
        column_width = [0.0] * columns
        for key, place in self.places.items():
            self.box_height[place.row] = max(self.box_height[place.row], sheet.text_height(self.texts[key]) + 0.6)
            self.tag_height[place.row] = max(self.tag_height[place.row], _tag_height(self.blocks[key]))
            column_width[place.column] = max(column_width[place.column], self.widths[key], self.tag_width(key))
        self.column_x = [sum(column_width[:c]) + GAP * c for c in range(columns)]
        self.row_y = [-sum(self.box_height[r] + self.tag_height[r] + ROW_GAP for r in range(row)) for row in range(rows)]

    def left(self, key: str) -> float:
        return self.column_x[self.places[key].column]

    def right(self, key: str) -> float:
        return self.left(key) + self.widths[key]

    def top(self, key: str) -> float:
        return self.row_y[self.places[key].row]

    def bottom(self, key: str) -> float:
        """The bottom of the block's box."""
        return self.top(key) - self.box_height[self.places[key].row]

    def lowest(self, key: str) -> float:
        """The bottom of the block with its rail names."""
        return self.bottom(key) - self.tag_height[self.places[key].row]

    def middle(self, key: str) -> float:
        return self.top(key) - self.box_height[self.places[key].row] / 2

    @property
    def floor(self) -> float:
        return self.row_y[-1] - self.box_height[-1] - self.tag_height[-1]

    def draw_block(self, drawing, block: BlockView) -> None:
        fill = "none" if block.bridging and not block.on_mains else "white"
        height = self.box_height[self.places[block.id].row]
        sheet.add(drawing, Box(self.widths[block.id], height, self.texts[block.id], fill=fill).at((self.left(block.id), self.top(block.id))).zorder(2))
        if block.rails:
            colour = sheet.HIGH_VOLTAGE_INK if block.hazardous_dc or block.on_mains else sheet.INK
            sheet.text(drawing, (self.left(block.id), self.bottom(block.id) - 0.15), rails_text(block),
                       valign="top", size=sheet.SMALL_FONT, colour=colour)

    def connect(self, drawing, block: BlockView) -> None:
        """An arrow from the stage it is drawn from: across from the left, or down and across for a branch."""
        place = self.places[block.id]
        if place.parent is None:
            return
        y = self.middle(block.id)
        if not place.branch:
            sheet.add(drawing, elm.Arrow().at((self.right(place.parent), y)).to((self.left(block.id), y)))
            return
        trunk, top = self.trunk(place.parent), self.bottom(place.parent)
        if trunk > self.right(place.parent) - TRUNK_INSET:  # its rail names reach under the usual trunk: leave from the side
            top = self.middle(place.parent)
            sheet.wire(drawing, (self.right(place.parent), top), (trunk, top))
            if any(p.parent == place.parent and not p.branch for p in self.places.values()):
                sheet.dot(drawing, (trunk, top))  # where it leaves the arrow to the next stage on the row
        sheet.wire(drawing, (trunk, top), (trunk, y))
        sheet.add(drawing, elm.Arrow().at((trunk, y)).to((self.left(block.id), y)))

    def trunk(self, key: str) -> float:
        """Where the line down to a stage's branches runs: inside its box near the right, or right of its rail
        names where they are wider than that (the column's width leaves room for them before the next column)."""
        return max(self.right(key) - TRUNK_INSET, self.left(key) + self.tag_width(key) + TAG_CLEARANCE)

    def tag_width(self, key: str) -> float:
        block = self.blocks[key]
        return sheet.text_width(rails_text(block), sheet.SMALL_FONT) if block.rails else 0.0

    def tag_spans(self, key: str, x: float) -> bool:
        """Whether the stage's rail names, under its box, reach across x."""
        return self.tag_width(key) > 0 and self.left(key) - TAG_CLEARANCE < x < self.left(key) + self.tag_width(key) + TAG_CLEARANCE


def _tag_height(block: BlockView) -> float:
    return sheet.text_height(rails_text(block), sheet.SMALL_FONT) + 0.25 if block.rails else 0.0


def _barrier_x(blocks, grid: Grid) -> float | None:
    """Through the block that forms the barrier at the mains-to-isolated step, else in the gap there."""
    for block in blocks:
        parent = grid.places[block.id].parent
        if parent is None or block.on_mains or not grid.blocks[parent].on_mains:
            continue
        if block.bridging:
            return (grid.left(block.id) + grid.right(block.id)) / 2
        if grid.blocks[parent].bridging:
            return (grid.left(parent) + grid.right(parent)) / 2
        return grid.left(block.id) - GAP / 2
    return None


def _barrier(drawing, x: float, grid: Grid, view: DiagramView) -> None:
    """The dashed line from above the diagram down past it (not over a block's words), each crossing barrier labelled below."""
    first_row = [key for key, place in grid.places.items() if place.row == 0]
    named_across = any(grid.tag_spans(key, x) for key in first_row)  # rail names under a stage the line passes
    top_bottom = grid.lowest(first_row[0]) if named_across else grid.bottom(first_row[0])
    y = grid.floor - 0.5
    for barrier in view.crossing:
        sheet.barrier_label(drawing, (x + 0.25, y), barrier)
        y -= sheet.text_height(barrier.label, sheet.SMALL_FONT) + 0.3
    sheet.barrier_line(drawing, x, 1.6, 0)
    sheet.barrier_line(drawing, x, top_bottom, min(y + 0.2, grid.floor - 0.3))
    sheet.text(drawing, (x + 0.25, 0.95), "isolated side", colour=sheet.BARRIER_INK)
    if not view.crossing:
        sheet.note(drawing, (x + 0.25, grid.floor - 0.5), "no barrier recorded across the circuit")


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


def _runs(blocks, grid: Grid, marked) -> list[list[str]]:
    """Runs of marked blocks side by side on one row, each block after the one it is drawn from."""
    runs: list[list[str]] = []
    for block in blocks:
        if not marked(block):
            continue
        place = grid.places[block.id]
        joined = runs and not place.branch and place.parent == runs[-1][-1]
        if joined:
            runs[-1].append(block.id)
        else:
            runs.append([block.id])
    return runs


def _shade_mains(drawing, blocks, grid: Grid, barrier_x) -> None:
    """Shade each run of mains blocks up to the barrier (or the run's end) and head the first."""
    for number, run in enumerate(_runs(blocks, grid, lambda b: b.on_mains)):
        left, right = grid.left(run[0]) - MARGIN, grid.right(run[-1]) + MARGIN
        top, bottom = grid.top(run[0]) + (1.7 if number == 0 else MARGIN), min(grid.lowest(k) for k in run) - 0.3
        if barrier_x is not None and right < barrier_x <= right + GAP + grid.widths.get(_next(grid, run[-1]), 0):
            right = barrier_x
        sheet.shade(drawing, (left, top), (right, bottom))
        if number == 0:
            sheet.add(drawing, HazardMark(size=0.45).at((left + 0.2, top - 0.93)))
            sheet.text(drawing, (left + 0.8, top - 0.75), _hazard_heading(right - left - 0.8), colour=sheet.MAINS_INK)


def _next(grid: Grid, key: str) -> str:
    """The block drawn right after key on its row, or ''."""
    return next((k for k, p in grid.places.items() if p.parent == key and not p.branch), "")


def _hatch_high_voltage(drawing, blocks, grid: Grid, barrier_x) -> None:
    """Hatch each run of isolated blocks above extra-low voltage; a run starting at the block that forms
    the barrier starts at the barrier, so the hatching never covers the mains side."""
    for run in _runs(blocks, grid, lambda b: b.hazardous_dc):
        left, right = grid.left(run[0]) - MARGIN, grid.right(run[-1]) + MARGIN
        if barrier_x is not None and left < barrier_x < grid.right(run[0]):
            left = barrier_x
        top, bottom = grid.top(run[0]) + MARGIN, min(grid.lowest(k) for k in run) - 0.2
        sheet.shade_high_voltage(drawing, (left, top), (right, bottom))


def _hazard_heading(room: float) -> str:
    """The heading on one line when it fits the shaded run, else on two."""
    words = sheet.MAINS_HEADING
    return words if sheet.text_width(words) <= room else words.replace(": ", ":\n")


LEGEND_MAINS = "mains-connected: hazardous voltage"
LEGEND_HIGH_VOLTAGE = "isolated from the mains but above extra-low voltage: hazardous"


def _legend(drawing, blocks) -> None:
    """A swatch and words for each kind of shading the diagram uses."""
    if not any(block.hazardous_dc for block in blocks):
        return  # the mains heading alone says what the one shading means
    entries = [(False, LEGEND_MAINS)] if any(block.on_mains for block in blocks) else []
    entries.append((True, LEGEND_HIGH_VOLTAGE))
    _, ymin, _, _ = sheet.extent(drawing)
    y = ymin - 0.5
    for hatched, words in entries:
        corner1, corner2 = (0, y), (0.9, y - 0.5)
        if hatched:
            sheet.shade(drawing, corner1, corner2, fill=sheet.HIGH_VOLTAGE_FILL)
            sheet.add(drawing, Hatching(corner1, corner2, spacing=0.2, colour=sheet.HIGH_VOLTAGE_HATCH).at((0, 0)))
        else:
            sheet.shade(drawing, corner1, corner2)
        sheet.text(drawing, (1.15, y - 0.25), words, size=sheet.SMALL_FONT,
                   colour=sheet.HIGH_VOLTAGE_INK if hatched else sheet.MAINS_INK)
        y -= 0.75
