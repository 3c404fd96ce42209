"""Isolation barriers: what they separate and the distances declared across them."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, model_validator

from dossier.record.fields import Length, Name, Section, Voltage

Grade = Literal["functional", "basic", "supplementary", "reinforced", "double"]
MaterialGroup = Literal["I", "II", "IIIa", "IIIb"]


class Slot(Section):
    """A groove or slot cut across the creepage path."""

    width: Length = Field(description="Width of the groove across the creepage path.")
    credited: bool = Field(
        True,
        description="The declared creepage counts on this slot (measured around or across it as an interruption); "
        "false when the creepage was measured straight across it, as if bridged.",
    )
    note: str = Field("", description="Where the slot is, e.g. 'routed under T1'.")


class Barrier(Section):
    name: Name = Field(description="e.g. 'primary to output'.")
    between: tuple[str, str] = Field(description="The two circuits it separates, e.g. [mains, output].")
    grade: Grade = Field(description="functional, basic, supplementary, reinforced or double.")
    material_group: MaterialGroup | None = Field(None, description="Insulating material group I, II, IIIa or IIIb.")
    cti: int | None = Field(None, ge=0, le=1000, description="Comparative tracking index; gives the material group. With material_group too, the worse of the two is used.")
    printed_board: bool = Field(False, description="The creepage path runs over printed-wiring board material.")
    creepage: Length = Field(description="Shortest creepage distance measured or designed.")
    clearance: Length = Field(description="Shortest clearance through air.")
    working_voltage: Voltage | None = Field(
        None,
        description="AC working voltage across the barrier, RMS; default, for a barrier between mains and something: "
        "the mains nominal voltage.",
    )
    working_dc: Voltage | None = Field(
        None, description="DC working voltage across the barrier, e.g. a high-voltage DC rail to chassis."
    )
    working_peak: Voltage | None = Field(
        None,
        description="Recurring peak voltage across the barrier (a flyback or forward converter's reset, a valve "
        "amplifier's high voltage), where it exceeds the peak of the AC and DC working voltages.",
    )
    slots: list[Slot] = Field(default_factory=list, description="Grooves or slots cut across the creepage path.")
    parts: list[str] = Field(default_factory=list, description="Designators that bridge or form the barrier, e.g. T1, C9.")

    @model_validator(mode="after")
    def _material_given(self):
        if self.material_group is None and self.cti is None:
            raise ValueError("give material_group (I, II, IIIa or IIIb) or cti")
        return self


BoardCondition = Literal["internal", "external-uncoated", "external-coated"]


class BoardSpacing(Section):
    """Spacing between two conductors on the low-voltage side of a printed board: a functional check, no safety barrier."""

    name: Name = Field(description="e.g. '12 V rail to signal ground near U3'.")
    between: tuple[str, str] = Field(description="The two conductors or nets, e.g. [14 V rail, sense line].")
    voltage: Voltage = Field(description="Highest voltage between them, d.c. or a.c. peak.")
    spacing: Length = Field(description="Narrowest spacing between the two conductors on the board.")
    condition: BoardCondition = Field(
        "external-uncoated",
        description="internal (an inner layer), external-uncoated or external-coated (a permanent polymer coating); "
        "default external-uncoated, the widest spacing of the three.",
    )
