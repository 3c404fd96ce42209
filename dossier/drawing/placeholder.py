"""The block drawn for a stage no drawer can draw: its name, why, and its parts as text."""

from __future__ import annotations

from dossier.drawing import sheet
from dossier.drawing.drawers import mark_stage
from dossier.drawing.symbols import Box
from dossier.drawing.views import StageView


def draw(view: StageView, reason: str):
    drawing = sheet.new_drawing()
    words = _box_text(view, reason)
    width = sheet.text_width(words) + 1.0
    height = sheet.text_height(words) + 0.8
    sheet.add(drawing, Box(width, height, words, dashed=True).at((0, 0)))
    mark_stage(drawing, view)
    return drawing


def _box_text(view: StageView, reason: str) -> str:
    kind = f"{view.kind}, {view.topology}" if view.topology else view.kind
    lines = [f"{view.name} ({kind})", f"not drawn: {reason}", ""]
    lines += [" ".join(filter(None, (p.ref, p.value))) for p in view.parts] or ["(no parts listed)"]
    return "\n".join(lines)
