"""The build's stages, each with its parts and their designators."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import Section

StageKind = Literal["mains-input", "converter", "magnetics", "rectifier", "regulator", "output", "other"]
DESIGNATOR_PATTERN = r"^[A-Z]{1,4}[0-9]{1,4}[A-Za-z]?$"


class Part(Section):
    ref: str = Field(pattern=DESIGNATOR_PATTERN, description="Designator, e.g. F1, Q2, T1.")
    kind: str = Field(description="What it is: fuse, capacitor, resistor, transistor, diode, ntc, switch, transformer, choke, diac, ...")
    value: str = Field("", description="Value as printed on a drawing, e.g. '470 uF 400 V'.")
    role: str = Field("", description="Its job in the stage, e.g. 'upper switch', 'start-up trigger', 'bulk capacitor'.")
    note: str = ""


class Stage(Section):
    kind: StageKind = Field(description="mains-input, converter, magnetics, rectifier, regulator, output or other.")
    name: str = Field(min_length=1)
    side: Literal["mains", "isolated"] = Field(description="Whether the stage is connected to the mains (hazardous) or on the isolated side.")
    topology: str = Field("", description="e.g. self-oscillating-half-bridge, centre-tapped, bridge, linear, buck.")
    parts: list[Part] = Field(default_factory=list)
    notes: str = ""
