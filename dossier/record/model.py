"""The build record of one revision, assembled from its sections."""

from __future__ import annotations

from pydantic import Field, ValidationError, model_validator
from pydantic_core import InitErrorDetails, PydanticCustomError

from dossier.record.devices import Devices
from dossier.record.identity import Attachment, Identity
from dossier.record.insulation import Barrier, BoardSpacing
from dossier.record.magnetics import Magnetic
from dossier.record.output import Output
from dossier.record.protection import Protection
from dossier.record.rails import Rail, rail_problems, winding_problems
from dossier.record.stages import Stage, default_stage_ids, graph_problems
from dossier.record.standard import StandardChoice
from dossier.record.supply import Environment, Mains


class Record(Identity):
    """One revision of one build, as validated from its YAML file."""

    mains: Mains | None = Field(None, description="The mains supply; leave out only for units with no mains connection.")
    environment: Environment = Field(default_factory=Environment, description="Where the unit lives: pollution degree, altitude, ambient.")
    stages: list[Stage] = Field(default_factory=list, description="The build's stages in signal order, mains first, each with its parts; a stage names the stages it is fed from, so branches (heater, bias) form a graph.")
    magnetics: list[Magnetic] = Field(default_factory=list, description="Wound components: transformers, base-drive transformers, chokes.")
    standard: StandardChoice | None = Field(None, description="The product standard the unit is judged against, e.g. {name: iec-62368-1, edition: 3}; default: the archive's standard, else IEC 60664-1 edition 3.")
    barriers: list[Barrier] = Field(default_factory=list, description="Isolation barriers with their declared creepage and clearance.")
    board_spacings: list[BoardSpacing] = Field(default_factory=list, description="Conductor spacings on the low-voltage side of printed boards, checked as functional spacing (IPC-2221B Table 6-1).")
    protection: Protection = Field(default_factory=Protection, description="Fuses, inrush limiting, earthing and output protection.")
    devices: Devices = Field(default_factory=Devices, description="Power semiconductors, capacitors under stress, heatsinks, soak readings.")
    output: Output | None = Field(None, description="What the unit delivers; for a charger, the battery.")
    rails: list[Rail] = Field(default_factory=list, description="Every supply the unit makes (B+, heater, bias, +15 V), each from the stage that delivers it.")
    attachments: list[Attachment] = Field(default_factory=list, description="Photos and datasheets kept in the build folder.")
    notes: str = Field("", description="Free notes in Markdown.")

    @property
    def has_mains(self) -> bool:
        return self.mains is not None

    @property
    def stage_ids(self) -> list[str]:
        return [stage.id for stage in self.stages]

    def stage_by_id(self, stage_id: str):
        """(index, stage) of the stage with this id, or None."""
        return next(((index, stage) for index, stage in enumerate(self.stages) if stage.id == stage_id), None)

    @model_validator(mode="before")
    @classmethod
    def _stage_defaults(cls, data):
        """Stages without an id are s1, s2, ... by position, each fed from the one before unless it says."""
        if isinstance(data, dict) and isinstance(data.get("stages"), list):
            data = {**data, "stages": default_stage_ids(data["stages"])}
        return data

    @model_validator(mode="after")
    def _designators_once(self):
        """Each part listed once: a designator given twice would let a finding name the wrong part."""
        twice = [error for places in self._designator_lists() for error in _repeated(places)]
        _raise_located(self, twice)
        return self

    @model_validator(mode="after")
    def _graph_holds(self):
        """Stage ids once, every fed_from and rail naming a stage that exists, no stage fed round a circle, every rail's
        winding one the record has."""
        found = list(graph_problems(self.stages)) + list(rail_problems(self.rails, self.stage_ids))
        found += list(winding_problems(self.rails, self.magnetics))
        _raise_located(self, [InitErrorDetails(type=problem, loc=where, input=None) for where, problem in found])
        return self

    def _designator_lists(self):
        yield [(("stages", s, "parts", p, "ref"), part.ref) for s, stage in enumerate(self.stages) for p, part in enumerate(stage.parts)]
        yield [(("magnetics", m, "ref"), magnetic.ref) for m, magnetic in enumerate(self.magnetics)]
        yield [(("devices", "capacitors", c, "ref"), capacitor.ref) for c, capacitor in enumerate(self.devices.capacitors)]
        yield [(("devices", "semiconductors", d, "ref"), device.ref) for d, device in enumerate(self.devices.semiconductors)] + [
            (("devices", "heatsinks", h, "ref"), sink.ref) for h, sink in enumerate(self.devices.heatsinks)
        ]
        yield [(("devices", "valves", v, "ref"), valve.ref) for v, valve in enumerate(self.devices.valves)]


def _raise_located(record, errors: list) -> None:
    """Raise the problems each with its own place, so every one is reported at its file:line:column."""
    if errors:
        raise ValidationError.from_exception_data(type(record).__name__, errors)


def _repeated(places: list[tuple[tuple, str]]):
    first: dict[str, tuple] = {}
    for where, ref in places:
        if ref in first:
            problem = PydanticCustomError("duplicate_designator", "expected {expected}, found {found}", {"expected": "each designator once in this list", "found": f"{ref} again (first at {_dotted(first[ref])})"})
            yield InitErrorDetails(type=problem, loc=where, input=ref)
        else:
            first[ref] = where


def _dotted(path: tuple) -> str:
    return "".join(f"[{part}]" if isinstance(part, int) else f".{part}" for part in path).lstrip(".")

