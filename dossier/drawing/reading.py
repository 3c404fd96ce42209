"""Reading the record (and the isolation findings) into the plain views the drawers work from."""

from __future__ import annotations

from dossier.drawing.barrier_marks import barrier_view, crosses_chain
from dossier.drawing.views import (
    BlockView, DiagramView, MagneticView, OutputView, PartView, StageView, WindingView, quantity_text, turns_text,
)


def stage_views(record, findings) -> list[StageView]:
    barriers = [barrier_view(b, findings) for b in record.barriers]
    return [_stage_view(record, i, barriers) for i in range(len(record.stages))]


def diagram_view(record, findings) -> DiagramView:
    crossing = tuple(barrier_view(b, findings) for b in record.barriers if crosses_chain(b))
    others = tuple(barrier_view(b, findings) for b in record.barriers if not crosses_chain(b))
    bridging_refs = {ref for b in record.barriers for ref in b.parts}
    blocks = tuple(_block_view(i, stage, bridging_refs) for i, stage in enumerate(record.stages, start=1))
    return DiagramView(title=f"{record.title}, revision {record.revision}", blocks=blocks, crossing=crossing, others=others)


def _block_view(index: int, stage, bridging_refs: set[str]) -> BlockView:
    refs = tuple(part.ref for part in stage.parts)
    return BlockView(index, stage.name, stage.kind, stage.side, refs, bool(bridging_refs & set(refs)))


def _stage_view(record, position: int, barriers) -> StageView:
    stage = record.stages[position]
    parts = tuple(PartView(p.ref, p.kind, p.value, p.role) for p in stage.parts)
    refs = {part.ref for part in parts}
    return StageView(
        index=position + 1,
        kind=stage.kind,
        name=stage.name,
        side=stage.side,
        topology=stage.topology,
        parts=parts,
        magnetics=tuple(magnetic_view(m) for m in record.magnetics if m.ref in refs),
        barriers=tuple(b for b in barriers if refs & set(b.parts)),
        earthed=_earthed(record),
        output=_output_view(record),
        came_from=_neighbour(record, position - 1),
        goes_to=_neighbour(record, position + 1),
        load=_transformer_winding(record, range(position + 1, len(record.stages)), "primary"),
        supply=_transformer_winding(record, range(position - 1, -1, -1), "secondary"),
        direct_current=_rectified_before(record, position),
    )


def _neighbour(record, position: int) -> str:
    if 0 <= position < len(record.stages):
        return f"stage {position + 1}"
    return ""


def _transformer_winding(record, positions, winding: str) -> str:
    """The nearest main transformer in the stages given, as 'T1 primary (stage 3)'."""
    for index in positions:
        for part in record.stages[index].parts:
            if part.kind.lower() == "transformer" and "drive" not in part.role.lower():
                return f"{part.ref} {winding} ({_neighbour(record, index)})"
    return ""


def _rectified_before(record, position: int) -> bool:
    earlier = record.stages[:position]
    return any(s.kind == "rectifier" or any(p.kind.lower() == "bridge" for p in s.parts) for s in earlier)


def _earthed(record) -> bool:
    earth = record.protection.earth
    return earth is not None and earth.protective_class == "I"


def magnetic_view(magnetic) -> MagneticView:
    windings = tuple(_winding_view(w) for w in magnetic.windings)
    return MagneticView(magnetic.ref, magnetic.title, windings)


def _winding_view(winding) -> WindingView:
    wire = quantity_text(winding.wire)
    if winding.strands > 1:
        wire = f"{winding.strands} \u00d7 {wire}"
    return WindingView(winding.name, winding.role, turns_text(winding.turns), wire, winding.centre_tap)


def _output_view(record) -> OutputView | None:
    output = record.output
    if output is None:
        return None
    setpoint = f"{quantity_text(output.voltage)} / {quantity_text(output.current)}"
    return OutputView(setpoint=setpoint, battery=_battery_text(output.battery))


def _battery_text(battery) -> str:
    if battery is None:
        return ""
    return f"{battery.chemistry.upper()} battery\n{quantity_text(battery.capacity)}, {battery.cells} cells"
