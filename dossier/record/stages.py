"""The build's stages, each with its parts and their designators."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import Designator, Name, Section

StageKind = Literal["mains-input", "converter", "magnetics", "rectifier", "regulator", "output", "other"]


class Part(Section):
    ref: Designator
    kind: str = Field(description="What it is: fuse, capacitor, resistor, transistor, diode, ntc, switch, transformer, choke, diac, ...")
    value: str = Field("", description="Value as printed on a drawing, e.g. '330 uF 400 V'.")
    role: str = Field("", description="Its job in the stage, e.g. 'upper switch', 'start-up trigger', 'bulk capacitor'.")
    note: str = Field("", description="Anything a reviewer should know about this part.")


class Stage(Section):
    kind: StageKind = Field(description="mains-input, converter, magnetics, rectifier, regulator, output or other.")
    name: Name = Field(description="Heading for the stage, e.g. 'Mains input and rectifier'.")
    side: Literal["mains", "isolated"] = Field(description="Whether the stage is connected to the mains (hazardous) or on the isolated side.")
    topology: str = Field("", description="e.g. self-oscillating-half-bridge, centre-tapped, bridge, linear, buck.")
    parts: list[Part] = Field(default_factory=list, description="The stage's parts with their designators.")
    notes: str = Field("", description="Notes on the stage, in Markdown.")
