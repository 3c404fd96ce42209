"""Wound components: cores, materials, windings."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, model_validator

from dossier.record.fields import (
    Area, Current, FluxDensity, Frequency, InductanceFactor, Length, Ratio, Section, Temperature, Voltage, WireSize,
)


class Steinmetz(Section):
    """Core loss per volume P_v = k f^alpha B^beta, with f in Hz, B in T and P_v in W/m^3."""

    k: float = Field(gt=0)
    alpha: float = Field(gt=0)
    beta: float = Field(gt=0)


class CoreMaterial(Section):
    name: str = ""
    saturation_flux: FluxDensity = Field(description="Saturation flux density at the hot temperature below.")
    saturation_temperature: Temperature | None = Field(None, description="Temperature the saturation figure is given at.")
    initial_permeability: float | None = Field(None, gt=0)
    steinmetz: Steinmetz | None = None
    max_temperature: Temperature | None = None


class Core(Section):
    shape: Literal["toroid", "declared"] = Field(description="toroid (give dimensions) or declared (give effective parameters).")
    outer_diameter: Length | None = None
    inner_diameter: Length | None = None
    height: Length | None = None
    effective_area: Area | None = None
    path_length: Length | None = None
    window_area: Area | None = None
    mean_turn_length: Length | None = None
    al: InductanceFactor | None = Field(None, description="Inductance factor A_L, e.g. 2500 nH (per turn squared).")
    material: CoreMaterial

    @model_validator(mode="after")
    def _shape_complete(self):
        needed = ("outer_diameter", "inner_diameter", "height") if self.shape == "toroid" else ("effective_area", "path_length")
        missing = [name for name in needed if getattr(self, name) is None]
        if missing:
            raise ValueError(f"a {self.shape} core needs {', '.join(missing)}")
        return self


class Excitation(Section):
    waveform: Literal["square", "sine"]
    voltage: Voltage = Field(description="Amplitude for a square wave, RMS for a sine, across the winding named.")
    frequency: Frequency
    winding: str = Field("", description="Winding the voltage is across; default the first.")
    duty: Ratio | None = None


class Winding(Section):
    name: str = Field(min_length=1)
    role: Literal["primary", "secondary", "feedback", "drive", "choke", "auxiliary"] = "secondary"
    turns: float = Field(gt=0, description="Turns; a fraction is allowed.")
    wire: WireSize
    strands: int = Field(1, ge=1)
    enamel_grade: Literal[1, 2, 3] | None = Field(None, description="IEC 60317 enamel grade 1, 2 or 3.")
    triple_insulated: bool = False
    tape_layers: int = Field(0, ge=0, description="Layers of insulating tape over this winding.")
    centre_tap: bool = False
    current: Current | None = Field(None, description="RMS current; default derived from the output rating.")


class Magnetic(Section):
    ref: str
    role: Literal["transformer", "base-drive", "choke", "mains-transformer", "current-sense"]
    title: str = ""
    core: Core
    excitation: Excitation | None = None
    windings: list[Winding] = Field(min_length=1)
