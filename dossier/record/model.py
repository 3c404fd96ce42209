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
    environment: Environment = Field(default_factory=Environment)
    stages: list[Stage] = Field(default_factory=list)
    magnetics: list[Magnetic] = Field(default_factory=list)
    barriers: list[Barrier] = Field(default_factory=list)
    protection: Protection = Field(default_factory=Protection)
    devices: Devices = Field(default_factory=Devices)
    output: Output | None = None
    attachments: list[Attachment] = Field(default_factory=list)
    notes: str = Field("", description="Free notes in Markdown.")

    @property
    def has_mains(self) -> bool:
        return self.mains is not None
