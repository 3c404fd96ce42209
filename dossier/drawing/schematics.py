"""Schematics drawn from the record: a block diagram of the build and one drawing per stage.

    result = draw(record, findings, cache=DrawingCache.under(build_folder))
    result.figures   Figure for the block diagram, then one per stage, in record order
    result.notes     an INFO finding (code DRAW-PLACEHOLDER) for each stage drawn as a placeholder

figures(record, findings) gives just the figures. findings are the calc findings of the same
record; the drawings read only the isolation ones (ISO-CREEPAGE, ISO-CLEARANCE) to label the
barrier with its required distances and verdict.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.drawing import placeholder, sheet
from dossier.drawing.stages import block as stage_block
from dossier.drawing.stages import converter as stage_converter
from dossier.drawing.stages import doubler as stage_doubler
from dossier.drawing.stages import filter as stage_filter
from dossier.drawing.stages import half_bridge as stage_half_bridge
from dossier.drawing.stages import magnetics as stage_magnetics
from dossier.drawing.stages import mains as stage_mains
from dossier.drawing.stages import output as stage_output
from dossier.drawing.stages import rectifier as stage_rectifier
from dossier.drawing.stages import regulator as stage_regulator
from dossier.drawing.stages import series_bank as stage_series_bank
from dossier.drawing.stages import shunt_regulator as stage_shunt_regulator
from dossier.drawing.stages import switch as stage_switch
from dossier.drawing.stages import switching_regulator as stage_switching_regulator
from dossier.drawing.stages import valve_rectifier as stage_valve_rectifier
from dossier.drawing.block_diagram import draw as draw_block_diagram
from dossier.drawing.cache import NoCache, content_key
from dossier.drawing.drawers import StageDrawer
from dossier.drawing.figure import Figure
from dossier.drawing.reading import diagram_view, stage_views
from dossier.drawing.svg_text import finish
from dossier.drawing.views import StageView
from dossier.findings import Finding, Verdict

SECTION = "schematics"
CALC_NAME = "schematics"
PLACEHOLDER_CODE = "DRAW-PLACEHOLDER"
DRAWERS: tuple[StageDrawer, ...] = (
    stage_mains.DRAWER, stage_converter.DRAWER, stage_half_bridge.DRAWER, stage_magnetics.DRAWER,
    stage_doubler.DRAWER, stage_valve_rectifier.DRAWER, stage_rectifier.DRAWER,
    stage_series_bank.DRAWER, stage_filter.DRAWER, stage_shunt_regulator.DRAWER, stage_switching_regulator.DRAWER,
    stage_regulator.DRAWER, stage_switch.DRAWER, stage_output.DRAWER,
    stage_block.DRAWER,  # last: any stage no drawer above knows, as a block with its parts
)


@dataclass(frozen=True)
class Schematics:
    figures: tuple[Figure, ...]
    notes: tuple[Finding, ...]


def draw(record, findings=(), cache=None, hazard_names=None) -> Schematics:
    """hazard_names: the rails above the extra-low-voltage limits as the rails calc named them (its product);
    None: judged here with the calc's own functions (dossier.drawing.stage_graph)."""
    store = cache if cache is not None else NoCache()
    views = stage_views(record, list(findings), hazard_names)
    drawn = [_block_figure(record, list(findings), store, hazard_names)] + [_stage_figure(view, store) for view in views]
    return Schematics(figures=tuple(drawn), notes=tuple(_notes(views)))


def figures(record, findings=(), cache=None, hazard_names=None) -> list[Figure]:
    return list(draw(record, findings, cache, hazard_names).figures)


def notes(record) -> list[Finding]:
    """The placeholder findings alone; they depend on the record only."""
    return _notes(stage_views(record, []))


def plan(view: StageView) -> tuple[StageDrawer | None, str]:
    """The drawer for a stage, or None and the reason it gets a placeholder: the drawer that knows its
    kind and topology lacks a part it cannot be drawn without. (Every stage has a drawer: the block
    drawer takes any the others do not know.)"""
    drawer = next(d for d in DRAWERS if d.handles(view))
    lacks = drawer.missing(view)
    if lacks:
        return None, f"the {drawer.name} drawing needs {', '.join(lacks)}"
    return drawer, ""


def _block_figure(record, findings, store, hazard_names=None) -> Figure:
    view = diagram_view(record, findings, hazard_names)
    key = content_key(view.key, view)
    svg = store.get_or_draw(key, lambda: _finished(draw_block_diagram(view), view.key, key, "Block diagram"))
    return Figure(key=view.key, title="Block diagram", svg=svg, section=SECTION)


def _stage_figure(view: StageView, store) -> Figure:
    key = content_key(view.key, view)
    svg = store.get_or_draw(key, lambda: _finished(_draw_stage(view), view.key, key, view.title))
    return Figure(key=view.key, title=view.title, svg=svg, section=SECTION)


def _draw_stage(view: StageView):
    drawer, reason = plan(view)
    return drawer.draw(view) if drawer is not None else placeholder.draw(view, reason)


def _finished(drawing, figure_key: str, content: str, title: str) -> str:
    return finish(sheet.svg_of(drawing), prefix=f"{figure_key}-{content[:8]}", title=title)


def _notes(views: list[StageView]) -> list[Finding]:
    found = []
    for view in views:
        drawer, reason = plan(view)
        if drawer is None:
            found.append(_placeholder_finding(view, reason))
    return found


def _placeholder_finding(view: StageView, reason: str) -> Finding:
    return Finding(
        code=PLACEHOLDER_CODE,
        calc=CALC_NAME,
        subject=f"stage {view.index}: {view.name}",
        title=f"Stage {view.index} ({view.name}) is drawn as a placeholder block",
        verdict=Verdict.INFO,
        explanation=f"{reason[0].upper()}{reason[1:]}. The parts are listed in the block; draw this stage by hand "
        "or give it a kind, topology and parts the drawer knows (see the schematics page of the docs).",
        keys=(("stages", view.index - 1),),
    )
