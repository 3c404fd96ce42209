"""The build's stages, each with its parts and their designators, and the graph they form (each stage names the
stages it takes its power from)."""

from __future__ import annotations

from typing import Annotated, Literal

from pydantic import Field, ValidationInfo, field_validator

from dossier.record.fields import Designator, Name, Section, problem

StageKind = Literal["mains-input", "converter", "magnetics", "rectifier", "filter", "regulator", "switch", "output", "other"]
STAGE_ID_PATTERN = r"^[A-Za-z][A-Za-z0-9_-]{0,39}$"
StageId = Annotated[str, Field(pattern=STAGE_ID_PATTERN, description="A stage's id, e.g. 'ht-rectifier' or s3.")]

RECTIFIER_TOPOLOGIES = ("bridge", "centre-tapped", "half-wave", "doubler", "valve-centre-tapped", "valve-half-wave")
# Each kind whose topology is checked, with the topologies dossier knows for it. The other kinds take free text.
TOPOLOGIES: dict[str, tuple[str, ...]] = {
    "rectifier": RECTIFIER_TOPOLOGIES,
    "filter": ("capacitor-input", "lc", "clc", "choke-input", "series-bank"),
    "regulator": ("series-pass", "shunt", "switching"),
    # a mains-input stage that rectifies the mains itself names its rectifier
    "mains-input": ("direct", "isolating-transformer", "variac", "bridge", "half-wave", "doubler"),
    "switch": ("standby", "high-voltage"),
}
# Spellings kept because records written before the topologies were checked use them: each reads as its target.
TOPOLOGY_ALIASES = {"linear": "series-pass", "voltage-doubler": "doubler"}


def known_topology(kind: str, topology: str) -> str:
    """The topology as dossier reads it: an alias turned into the name it stands for."""
    return TOPOLOGY_ALIASES.get(topology, topology) if kind in TOPOLOGIES else topology


class Part(Section):
    ref: Designator
    kind: str = Field(description="What it is: fuse, capacitor, resistor, transistor, diode, ntc, switch, transformer, choke, diac, valve, lamp, ...")
    value: str = Field("", description="Value as printed on a drawing, e.g. '330 uF 400 V'.")
    role: str = Field("", description="Its job in the stage, e.g. 'upper switch', 'start-up trigger', 'bulk capacitor', 'bleeder'.")
    note: str = Field("", description="Anything a reviewer should know about this part.")


class Stage(Section):
    id: StageId | None = Field(None, description="Short name other stages and rails use for this stage, unique in the record, e.g. ht-rectifier; default s1, s2, ... by position.")
    kind: StageKind = Field(description="mains-input, converter, magnetics, rectifier, filter, regulator, switch, output or other.")
    name: Name = Field(description="Heading for the stage, e.g. 'Mains input and rectifier'.")
    side: Literal["mains", "isolated"] = Field(description="Whether the stage is connected to the mains (hazardous) or on the isolated side.")
    topology: str = Field("", description=(
        "How the stage is built. rectifier: bridge, centre-tapped, half-wave, doubler, valve-centre-tapped or valve-half-wave; "
        "filter: capacitor-input, lc, clc, choke-input or series-bank; regulator: series-pass (or linear), shunt or switching; "
        "mains-input: direct, isolating-transformer, variac, or bridge, half-wave or doubler when it rectifies the mains itself; "
        "switch: standby or high-voltage; free text for the other kinds (e.g. half-bridge). Empty: judged by the harsher reading."))
    fed_from: list[StageId] | None = Field(None, description="Ids of the stages this stage takes its power from; default the stage before it (none for the first), so a list of stages is one chain.")
    parts: list[Part] = Field(default_factory=list, description="The stage's parts with their designators.")
    notes: str = Field("", description="Notes on the stage, in Markdown.")

    @field_validator("topology")
    @classmethod
    def _topology_fits_kind(cls, value: str, info: ValidationInfo) -> str:
        kind = info.data.get("kind")
        accepted = TOPOLOGIES.get(kind)
        if value and accepted is not None and known_topology(kind, value) not in accepted:
            raise problem("unknown_topology", f"a {kind} topology: {', '.join(accepted)}", repr(value))
        return value

    @property
    def topology_name(self) -> str:
        """The topology as dossier reads it ('linear' is a series-pass regulator)."""
        return known_topology(self.kind, self.topology)

    @property
    def feeds_from(self) -> tuple[str, ...]:
        return tuple(self.fed_from or ())


def default_stage_ids(raw_stages: list) -> list:
    """The stages as written, each without an id given s1, s2, ... by position and each without fed_from fed from
    the stage before it; entries that are not mappings are left for validation to refuse."""
    filled = []
    previous = None
    for position, raw in enumerate(raw_stages, start=1):
        if isinstance(raw, dict):
            raw = dict(raw)
            raw.setdefault("id", f"s{position}")
            if "fed_from" not in raw:
                raw["fed_from"] = [previous] if isinstance(previous, str) else []
            previous = raw["id"]
        else:
            previous = None
        filled.append(raw)
    return filled


def graph_problems(stages: list[Stage]):
    """(key path, problem) for each repeated id, unknown fed_from id and fed_from entry that closes a loop."""
    first: dict[str, int] = {}
    for index, stage in enumerate(stages):
        if stage.id in first:
            yield ("stages", index, "id"), problem("duplicate_stage_id", "each stage id once", f"{stage.id} again (first at stages[{first[stage.id]}].id)")
        else:
            first[stage.id] = index
    for index, stage in enumerate(stages):
        for entry, source in enumerate(stage.feeds_from):
            if source not in first:
                known = ", ".join(first) or "none"
                yield ("stages", index, "fed_from", entry), problem("unknown_stage", f"the id of a stage in this record ({known})", repr(source))
    yield from _loops(stages, first)


def _loops(stages: list[Stage], position: dict[str, int]):
    """A fed_from entry that leads back to its own stage: power would flow round a circle. Every circle holds an
    entry naming the stage itself or one listed after it, and that entry is the one reported."""
    for index, stage in enumerate(stages):
        for entry, source in enumerate(stage.feeds_from):
            if position.get(source, -1) >= index and _reaches(stages, position, source, stage.id):
                found = f"{source}, the stage itself" if source == stage.id else f"{source}, which is fed from {stage.id} in turn"
                yield ("stages", index, "fed_from", entry), problem("stage_loop", "stages fed from other stages, never round a circle", found)


def _reaches(stages: list[Stage], position: dict[str, int], start: str, target: str) -> bool:
    """Whether following fed_from from start arrives at target."""
    seen, waiting = set(), [start]
    while waiting:
        current = waiting.pop()
        if current == target:
            return True
        if current in seen or current not in position:
            continue
        seen.add(current)
        waiting.extend(stages[position[current]].feeds_from)
    return False

