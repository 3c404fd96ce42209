"""Reading the record (and the isolation findings) into the plain views the drawers work from."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.drawing.barrier_marks import barrier_view, crosses_chain
from dossier.drawing.stage_graph import ancestors, descendants, hazards, rails_by_stage, sources, stage_ids
from dossier.drawing.views import (
    BlockView, DiagramView, MagneticView, OutputView, PartView, RailView, StageView, WindingView, quantity_text, turns_text,
)


@dataclass(frozen=True)
class Graph:
    """The stage graph read once for all the views of a record."""

    ids: list[str]
    sources: dict[str, tuple[str, ...]]
    rails: dict[str, tuple[RailView, ...]]
    hazards: dict[str, tuple[str, ...]]

    @classmethod
    def of(cls, record, hazard_names=None) -> "Graph":
        rails = rails_by_stage(record, hazard_names)
        return cls(stage_ids(record), sources(record), rails, hazards(record, rails))

    def before(self, key: str) -> list[int]:
        """Positions of the stages feeding key, directly or not, nearest (last in the record) first."""
        return sorted((self.ids.index(k) for k in ancestors(self.sources, key)), reverse=True)

    def after(self, key: str) -> list[int]:
        """Positions of the stages key feeds, directly or not, first in the record first."""
        return sorted(self.ids.index(k) for k in descendants(self.sources, key))

    def number(self, key: str) -> str:
        return f"stage {self.ids.index(key) + 1}" if key in self.ids else key


def stage_views(record, findings, hazard_names=None) -> list[StageView]:
    barriers = [barrier_view(b, findings) for b in record.barriers]
    graph = Graph.of(record, hazard_names)
    return [_stage_view(record, i, barriers, graph) for i in range(len(record.stages))]


def diagram_view(record, findings, hazard_names=None) -> DiagramView:
    crossing = tuple(barrier_view(b, findings) for b in record.barriers if crosses_chain(b))
    others = tuple(barrier_view(b, findings) for b in record.barriers if not crosses_chain(b))
    bridging_refs = {ref for b in record.barriers for ref in b.parts}
    graph = Graph.of(record, hazard_names)
    blocks = tuple(_block_view(i, stage, bridging_refs, graph) for i, stage in enumerate(record.stages, start=1))
    return DiagramView(title=f"{record.title}, revision {record.revision}", blocks=blocks, crossing=crossing, others=others)


def _block_view(index: int, stage, bridging_refs: set[str], graph: Graph) -> BlockView:
    refs = tuple(part.ref for part in stage.parts)
    key = graph.ids[index - 1]
    return BlockView(index, stage.name, stage.kind, stage.side, refs, bool(bridging_refs & set(refs)),
                     id=key, fed_from=graph.sources[key], rails=graph.rails.get(key, ()), hazard=graph.hazards[key])


def _stage_view(record, position: int, barriers, graph: Graph) -> StageView:
    stage = record.stages[position]
    key = graph.ids[position]
    parts = tuple(PartView(p.ref, p.kind, p.value, p.role) for p in stage.parts)
    refs = {part.ref for part in parts}
    return StageView(
        index=position + 1,
        kind=stage.kind,
        name=stage.name,
        side=stage.side,
        topology=stage.topology_name,
        parts=parts,
        magnetics=tuple(magnetic_view(m) for m in record.magnetics if m.ref in refs),
        barriers=tuple(b for b in barriers if refs & set(b.parts)),
        earthed=_earthed(record),
        output=_output_view(record),
        came_from=", ".join(graph.number(source) for source in graph.sources[key]),
        goes_to=", ".join(graph.number(child) for child in graph.ids if key in graph.sources[child]),
        load=_transformer_winding(record, graph.after(key), "primary"),
        supply=_transformer_winding(record, graph.before(key), "secondary"),
        direct_current=_rectified_before(record, graph.before(key)),
        rails=graph.rails.get(key, ()),
        hazard=graph.hazards[key],
        heater=_heater_winding(record, graph.before(key)) if "valve" in stage.topology else "",
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


HEATER_WORDS = ("heater", "filament")


def _heater_winding(record, positions) -> str:
    """The nearest earlier transformer's heater winding, as 'T1 heater 5 V: 12 t', for a valve rectifier."""
    for index in positions:
        for part in record.stages[index].parts:
            magnetic = next((m for m in record.magnetics if m.ref == part.ref), None)
            winding = next((w for w in magnetic.windings if any(word in w.name.lower() for word in HEATER_WORDS)), None) if magnetic else None
            if winding is not None:
                return f"{part.ref} {_winding_view(winding).label}"
    return ""


def _rectified_before(record, positions) -> bool:
    earlier = [record.stages[index] for index in positions]
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
