"""Wound components: cores, materials, windings."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, ValidationInfo, field_validator, model_validator
from pydantic_core import PydanticCustomError

from dossier.record.fields import (
    Designator,
    Area, Current, Name, FieldStrength, FluxDensity, Frequency, InductanceFactor, Length, Mass, Power, Resistance, Section, Share, SpecificLoss,
    Temperature, Voltage, WireSize, out_of_range,
)
from dossier.standards.electrical_steel import is_grade
from dossier.standards.laminations import size_names, tongue_of

LAMINATED = ("ei-lamination", "ui-lamination", "c-core")


def _bad(code: str, expected: str, found: str) -> PydanticCustomError:
    return PydanticCustomError(code, "expected {expected}, found {found}", {"expected": expected, "found": found})


def _text(quantity) -> str:
    return f"{quantity.magnitude:g} {quantity.units:~P}".strip()


class Steinmetz(Section):
    """Core loss per volume P_v = k f^alpha B^beta, with f in Hz, B in T and P_v in W/m^3."""

    k: float = Field(gt=0, le=1e9, description="Steinmetz coefficient k, for f in Hz, B in T and loss in W/m^3.")
    alpha: float = Field(gt=0, le=4, description="Frequency exponent alpha; power ferrites lie between about 1 and 2.")
    beta: float = Field(gt=0, le=4, description="Flux-density exponent beta; power ferrites lie between about 2 and 3.")


class RatedLoss(Section):
    """A maker's specific total loss of a silicon steel at one flux density and frequency."""

    loss: SpecificLoss = Field(description="Specific total loss, e.g. 1.3 W/kg, from the maker's data or the grade's guaranteed figure.")
    flux: FluxDensity = Field(description="Peak flux density the loss is given at, e.g. 1.5 T.")
    frequency: Frequency = Field(description="Frequency the loss is given at, e.g. 50 Hz.")
    flux_exponent: float = Field(2.0, gt=0, le=4, description="Exponent of B the loss scales with; 2 (loss as B^2) is common practice for silicon steel at mains frequency.")
    frequency_exponent: float | None = Field(
        None, ge=1, le=2, description="Exponent of f the loss scales with, between 1 (hysteresis) and 2 (eddy currents). When not given and "
                                      "the frequency differs from the figure's: 2 above it, 1 below (harsher).")


class CoreMaterial(Section):
    name: str = Field("", description="Material name or grade as the builder knows it.")
    family: Literal["ferrite", "iron-powder", "silicon-steel"] | None = Field(
        None, description="ferrite, iron-powder or silicon-steel (laminations or tape); sets the headroom kept below "
                          "saturation. When not given: silicon-steel at 400 Hz or below, ferrite above.")
    saturation_flux: FluxDensity = Field(description="Saturation flux density at the hot temperature below.")
    saturation_temperature: Temperature | None = Field(None, description="Temperature the saturation figure is given at.")
    initial_permeability: float | None = Field(None, gt=0, le=1_000_000, description="Initial relative permeability; gives A_L when A_L is not declared.")
    steinmetz: Steinmetz | None = Field(None, description="Steinmetz parameters for core loss, from the maker's loss curves.")
    max_temperature: Temperature | None = Field(None, description="Highest temperature the core (and its winding) may reach.")
    max_field: FieldStrength | None = Field(None, description="Highest DC field strength N I / l_e the material takes before its permeability falls too far, e.g. 3500 A/m.")
    remanence: FluxDensity | None = Field(None, description="Remanent flux density B_r at the hot temperature, from the maker's data; a unipolar drive's flux starts there. "
                                                           "When not given: 0.2 T for ferrite and iron powder, 1.0 T for silicon steel (harsher; from memory).")
    grade: str | None = Field(
        None, description="Silicon steel: grade by its IEC 60404-8 name, e.g. M400-50A (non-oriented, at most 4.00 W/kg at 1.5 T, 50 Hz, "
                          "0.50 mm) or M111-30P (grain-oriented, at 1.7 T); gives the loss when specific_loss is not declared.")
    orientation: Literal["non-oriented", "grain-oriented"] | None = Field(
        None, description="Silicon steel: non-oriented or grain-oriented; sets the density and the loss taken when none is given. "
                          "When not given (and no grade says it): non-oriented (harsher).")
    specific_loss: RatedLoss | None = Field(None, description="Silicon steel: the maker's loss per kilogram at a stated flux density and frequency.")

    @field_validator("grade")
    @classmethod
    def _grade_named(cls, value):
        if value is not None and not is_grade(value):
            raise _bad("unknown_grade", "an IEC 60404-8 grade name such as M400-50A or M111-30P", repr(value))
        return value


class Core(Section):
    shape: Literal["toroid", "declared", "ei-lamination", "ui-lamination", "c-core"] = Field(
        description="toroid (give dimensions), declared (give effective parameters), ei-lamination, ui-lamination or c-core "
                    "(give the limb width, stack and window; an E-I size name or limb width alone gives a scrapless lamination).")
    outer_diameter: Length | None = Field(None, description="Toroid: outer diameter of the bare core.")
    inner_diameter: Length | None = Field(None, description="Toroid: inner diameter of the bare core.")
    height: Length | None = Field(None, description="Toroid: height of the bare core.")
    lamination: str | None = Field(None, description=f"E-I lamination: a scrapless size by its overall width in mm ({', '.join(size_names())}); gives the limb width and window.")
    limb_width: Length | None = Field(None, description="Laminated and C cores: width of the wound limb (an E-I's tongue, a C core's build of tape).")
    stack: Length | None = Field(None, description="Laminated and C cores: stack height of the laminations (a C core's strip width).")
    window_width: Length | None = Field(None, description="Laminated and C cores: width of the winding window (E-I: one of its two windows).")
    window_height: Length | None = Field(None, description="Laminated and C cores: height of the winding window.")
    stacking_factor: float | None = Field(None, gt=0.5, le=1, description="Net iron over the stack's gross section. When not given: 0.95 (0.35-0.5 mm laminations, tightly stacked; from memory).")
    bobbin_wall: Length | None = Field(None, description="Laminated and C cores: thickness of the bobbin's wall and flanges. When not given: 1.0 mm (from memory).")
    wound_limbs: Literal[1, 2] | None = Field(None, description="U-I and C cores: limbs carrying windings, each taking half of every winding (2), or one (1). When not given: 2.")
    mass: Mass | None = Field(None, description="Mass of the iron; overrides the mass computed from the geometry.")
    effective_area: Area | None = Field(None, description="Effective magnetic cross-section A_e (declared cores; overrides a laminated core's).")
    path_length: Length | None = Field(None, description="Effective magnetic path length l_e (declared cores).")
    window_area: Area | None = Field(None, description="Winding window area A_w (declared cores; a toroid's is computed).")
    mean_turn_length: Length | None = Field(None, description="Mean length of one turn (declared cores; a toroid's is computed).")
    surface_area: Area | None = Field(None, description="Outside surface of the wound component, for the temperature-rise estimate (declared cores).")
    al: InductanceFactor | None = Field(None, description="Inductance factor A_L, e.g. 2500 nH (per turn squared).")
    configuration: Literal["pot", "powder", "lamination", "c-core", "single-coil", "tape-wound"] | None = Field(
        None, description="Core configuration as McLyman tabulates it, for the current-density limit J = K_j A_p^x. When not given: "
                          "a ferrite or powder toroid is 'powder', a steel toroid 'tape-wound', a declared core the lowest K_j of the table (harsher).")
    material: CoreMaterial = Field(description="The core material's magnetic limits and losses.")
    isolated: bool = Field(False, description="The core is insulated from every winding for the grade of the barrier its windings "
                                              "cross (e.g. a coated core under rated insulation). When false the core, conductive "
                                              "like MnZn ferrite or steel, counts as part of the winding nearest it (the first wound).")

    @field_validator("inner_diameter")
    @classmethod
    def _inside_outer(cls, value, info: ValidationInfo):
        outer = info.data.get("outer_diameter")
        if value is not None and outer is not None and value >= outer:
            raise out_of_range(f"less than the outer diameter ({_text(outer)})", _text(value))
        return value

    @field_validator("lamination")
    @classmethod
    def _size_known(cls, value):
        if value is not None and tongue_of(value) is None:
            raise _bad("unknown_lamination", f"one of the scrapless E-I sizes ({', '.join(size_names())})", repr(value))
        return value

    @model_validator(mode="after")
    def _shape_complete(self):
        missing = [name for name in self._needed() if getattr(self, name) is None]
        if missing:
            raise _bad("incomplete_core", f"{', '.join(missing)} for a {self.shape} core", "not given")
        if self.lamination is not None and self.shape != "ei-lamination":
            raise _bad("lamination_not_e_i", "a lamination size only with shape ei-lamination", f"shape {self.shape}")
        return self

    def _needed(self) -> tuple:
        if self.shape == "toroid":
            return ("outer_diameter", "inner_diameter", "height")
        if self.shape == "declared":
            return ("effective_area", "path_length")
        if self.shape == "ei-lamination":
            sized = self.lamination is not None or self.limb_width is not None
            return ("stack",) if sized else ("limb_width", "stack")
        return ("limb_width", "stack", "window_width", "window_height")


class Excitation(Section):
    waveform: Literal["square", "sine"] = Field(description="square (bipolar, as from a bridge, unless polarity says unipolar) or sine.")
    polarity: Literal["bipolar", "unipolar"] = Field(
        "bipolar", description="Square wave only: bipolar (plus and minus, as from a bridge) or unipolar (one direction, reset "
                               "between pulses, as in a forward converter).")
    supply: Literal["mains", "fixed"] | None = Field(
        None, description="mains: the voltage is taken from the bus rectified from the mains, declared at nominal line, and scales "
                          "with the mains tolerance; fixed: it does not follow the mains. When not given and the record has mains, "
                          "mains is taken (harsher).")
    voltage: Voltage = Field(description="Amplitude for a square wave, RMS for a sine, across the winding named.")
    frequency: Frequency = Field(description="Switching or mains frequency of the drive.")
    winding: str = Field("", description="Winding the voltage is across; default the first.")
    duty: Share | None = Field(None, description="Fraction of the period the voltage is applied (square wave); default 100 %.")


class Winding(Section):
    name: Name = Field(description="Name of the winding, e.g. primary, secondary, upper base.")
    role: Literal["primary", "secondary", "feedback", "drive", "choke", "auxiliary"] = Field("secondary", description="primary, secondary, feedback, drive, choke or auxiliary.")
    turns: float = Field(ge=0.25, le=100_000, description="Turns, end to end (a centre-tapped winding counts both halves); a fraction is allowed.")
    wire: WireSize = Field(description="Bare-copper size of one strand: AWG 26 or 0.71 mm.")
    strands: int = Field(1, ge=1, le=10_000, description="Strands in parallel.")
    enamel_grade: Literal[1, 2, 3] | None = Field(None, description="IEC 60317 enamel grade 1, 2 or 3; grade 2 is assumed when not given.")
    overall_diameter: Length | None = Field(None, description="Measured or datasheet diameter over the insulation; overrides the enamel grade.")
    triple_insulated: bool = Field(False, description="Wound with triple-insulated wire.")
    tape_layers: int = Field(0, ge=0, le=1000, description="Layers of insulating tape over this winding.")
    centre_tap: bool = Field(False, description="The winding has a centre tap; turns count the whole winding.")
    side: str = Field("", description="The circuit the winding belongs to, as named in the barrier's between (e.g. mains, output). "
                                      "When not given: a primary is on the mains side, every other winding on the far side (harsher).")
    end_margin: Length | None = Field(None, description="Width of the margin tape at each end of the winding on a bobbin, e.g. 3 mm: "
                                                        "the creepage along the bobbin to a winding across a barrier.")
    layers: int | None = Field(None, ge=1, le=1000, description="Layers the winding is wound in, for its proximity loss (Dowell); "
                                                                "a toroid's is worked out at the hole when not given.")
    current: Current | None = Field(None, description="RMS current (in each half of a centre-tapped winding); default derived from the output rating.")
    resistance: Resistance | None = Field(None, description="Measured DC resistance of the whole winding at room temperature, e.g. 1.9 ohm; used before the one computed from the wire.")

    @field_validator("overall_diameter")
    @classmethod
    def _over_copper(cls, value, info: ValidationInfo):
        wire = info.data.get("wire")
        if value is not None and wire is not None and value < wire:
            raise out_of_range(f"at least the copper diameter ({_text(wire)})", _text(value))
        return value


class Magnetic(Section):
    ref: Designator
    role: Literal["transformer", "base-drive", "gate-drive", "choke", "mains-transformer", "current-sense"] = Field(description="transformer, base-drive, gate-drive, choke, mains-transformer or current-sense.")
    title: str = Field("", description="Heading for the component, e.g. 'Main transformer'.")
    core: Core = Field(description="The core: a toroid by its dimensions, or declared effective parameters.")
    windings: list[Winding] = Field(min_length=1, description="Every winding in the order it is wound, from the core outwards (usually primary first).")
    construction: Literal["split-bobbin", "layered"] | None = Field(
        None, description="How a transformer on a bobbin keeps its windings apart: split-bobbin (windings in separate sections of a "
                          "sectioned bobbin) or layered (one over another, with tape between). Not for a toroid.")
    frequency: Frequency | None = Field(None, description="Operating frequency when the excitation is derived from the converter stage, e.g. 50 kHz.")
    rated_power: Power | None = Field(None, description="A mains transformer's rated output, e.g. 500 VA; gives its rated primary current.")
    cooling: Literal["natural", "forced-air"] = Field("natural", description="natural (convection) or forced-air (a fan blows on it).")
    excitation: Excitation | None = Field(None, description="Declared drive: waveform, voltage, frequency (and the winding it is across).")
    insulation_class: Literal["A", "E", "B", "F", "H", "N", "R"] | None = Field(
        None, description="Thermal class of the winding insulation system (IEC 60085): A 105, E 120, B 130, F 155, H 180, N 200, "
                          "R 220 degC. When not given, class A (105 degC) is taken (harsher).")

    @field_validator("construction")
    @classmethod
    def _bobbin_for_split(cls, construction, info: ValidationInfo):
        core = info.data.get("core")
        if construction == "split-bobbin" and core is not None and core.shape == "toroid":
            raise _bad("split_toroid", "layered, or a declared core on a bobbin (a toroid has no bobbin to split)", "split-bobbin on a toroid")
        return construction

    @field_validator("windings")
    @classmethod
    def _names_unique(cls, windings):
        names = [w.name for w in windings]
        twice = sorted({n for n in names if names.count(n) > 1})
        if twice:
            raise _bad("duplicate_name", "a different name for each winding", f"{', '.join(repr(n) for n in twice)} given twice")
        return windings

    @field_validator("excitation")
    @classmethod
    def _winding_known(cls, excitation, info: ValidationInfo):
        names = [w.name for w in info.data.get("windings") or []]
        if excitation is not None and excitation.winding and names and excitation.winding not in names:
            raise _bad("unknown_winding", f"the name of one of the windings ({', '.join(names)})", repr(excitation.winding))
        return excitation
