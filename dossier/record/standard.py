"""Which product standard a unit is judged against, by name and edition (in a record or in archive.yaml)."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, model_validator
from pydantic_core import PydanticCustomError

from dossier.record.fields import Section
from dossier.standards.register import held_names, is_held

StandardName = Literal["iec-60664-1", "iec-62368-1", "iec-60335-1", "iec-61010-1", "iec-61558-1"]


class StandardChoice(Section):
    """A product standard and its edition; IEC 60664-1 edition 3 is the basic standard and the default."""

    name: StandardName = Field(description="iec-60664-1 (the basic standard), iec-62368-1 (audio/video and ICT equipment), iec-60335-1 "
                                           "(household appliances, chargers), iec-61010-1 (test and measurement gear; clearance and "
                                           "creepage not held) or iec-61558-1 (transformers and power supply units).")
    edition: int = Field(description="The edition held: 3 for iec-60664-1, iec-62368-1, iec-61010-1 and iec-61558-1, 5 for iec-60335-1.")

    @model_validator(mode="after")
    def _edition_held(self):
        if not is_held(self.name, self.edition):
            raise PydanticCustomError("standard_not_held", "expected {expected}, found {found}",
                                      {"expected": "one of the standards held: " + ", ".join(held_names()), "found": f"{self.name} edition {self.edition}"})
        return self
