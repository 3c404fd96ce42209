"""The build record of one revision, assembled from its sections."""

from __future__ import annotations

from pydantic import Field

from dossier.record.devices import Devices
from dossier.record.identity import Attachment, Identity
from dossier.record.insulation import Barrier
from dossier.record.magnetics import Magnetic
from dossier.record.output import Output
from dossier.record.protection import Protection
from dossier.record.stages import Stage
from dossier.record.supply import Environment, Mains


class Record(Identity):
    """One revision of one build, as validated from its YAML file."""

    mains: Mains | None = Field(None, description="The mains supply; leave out only for units with no mains connection.")
    environment: Environment = Field(default_factory=Environment, description="Where the unit lives: pollution degree, altitude, ambient.")
    stages: list[Stage] = Field(default_factory=list, description="The build's stages in signal order, mains first, each with its parts.")
    magnetics: list[Magnetic] = Field(default_factory=list, description="Wound components: transformers, base-drive transformers, chokes.")
    barriers: list[Barrier] = Field(default_factory=list, description="Isolation barriers with their declared creepage and clearance.")
    protection: Protection = Field(default_factory=Protection, description="Fuses, inrush limiting, earthing and output protection.")
    devices: Devices = Field(default_factory=Devices, description="Power semiconductors, capacitors under stress, heatsinks, soak readings.")
    output: Output | None = Field(None, description="What the unit delivers; for a charger, the battery.")
    attachments: list[Attachment] = Field(default_factory=list, description="Photos and datasheets kept in the build folder.")
    notes: str = Field("", description="Free notes in Markdown.")

    @property
    def has_mains(self) -> bool:
        return self.mains is not None
