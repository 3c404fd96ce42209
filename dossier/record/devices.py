"""Power semiconductors, capacitors under stress, heatsinks, the builder's margins and soak-test readings."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, model_validator
from pydantic_core import PydanticCustomError

from dossier.record.fields import (
    Designator,
    Capacitance, Current, Duration, Energy, Frequency, MarginRatio, MeltingIntegral, Power, Ratio, Resistance, Section, Temperature, TemperatureRise,
    ThermalResistance, Voltage,
)

SafetyClass = Literal["", "X1", "X2", "X3", "Y1", "Y2", "Y3", "Y4"]
DiodeRole = Literal["mains-bridge", "bridge", "centre-tapped", "half-wave", "doubler", "reset", "clamp", "freewheel"]
RatingKind = Literal["V_CEO", "V_CES", "V_CBO", "V_DSS", "V_RRM"]
InsulationGrade = Literal["basic", "supplementary", "reinforced", "double"]
# Which voltage ratings a maker gives for each kind of part.
RATING_KINDS = {"bjt": ("V_CEO", "V_CES", "V_CBO"), "mosfet": ("V_DSS",), "igbt": ("V_CES",),
                "diode": ("V_RRM",), "schottky": ("V_RRM",), "bridge": ("V_RRM",), "regulator": ()}


class Switching(Section):
    """Data for a switching-loss estimate: give energy, or voltage, current and crossover time."""

    frequency: Frequency = Field(description="Switching frequency, e.g. 50 kHz.")
    energy: Energy | None = Field(None, description="Turn-on plus turn-off energy per cycle from the maker's data, e.g. 50 uJ.")
    voltage: Voltage | None = Field(None, description="Voltage across the device while it switches, e.g. 358 V.")
    current: Current | None = Field(None, description="Current it switches, e.g. 1.4 A.")
    crossover_time: Duration | None = Field(None, description="Rise plus fall time of the voltage-current crossover, e.g. 0.2 us.")

    @model_validator(mode="after")
    def _enough_data(self):
        if self.energy is None and None in (self.voltage, self.current, self.crossover_time):
            raise ValueError("give energy, or all of voltage, current and crossover_time")
        return self


class Semiconductor(Section):
    ref: Designator
    kind: Literal["bjt", "mosfet", "igbt", "diode", "schottky", "bridge", "regulator"] = Field(description="bjt, mosfet, igbt, diode, schottky, bridge or regulator.")
    voltage_rating: Voltage | None = Field(None, description="Collector-emitter, drain-source or repetitive reverse voltage rating.")
    current_rating: Current | None = Field(None, description="Maximum continuous current from the datasheet.")
    max_junction: Temperature | None = Field(None, description="Maximum junction temperature from the maker's data.")
    rth_jc: ThermalResistance | None = Field(None, description="Junction-to-case thermal resistance.")
    rth_ja: ThermalResistance | None = Field(None, description="Junction-to-air thermal resistance, for a device with no heatsink.")
    forward_voltage: Voltage | None = Field(None, description="Forward voltage (diode) or saturation voltage (switch) at the current below.")
    current: Current | None = Field(None, description="Average current the device carries over a whole cycle.")
    loss: Power | None = Field(None, description="Total loss when known; replaces the estimate from current and voltage.")
    switching: Switching | None = Field(None, description="Switching data, for a switching-loss estimate.")
    heatsink: str = Field("", description="Designator of the heatsink it is mounted on, e.g. HS1.")
    pad: ThermalResistance | None = Field(None, description="Case-to-sink resistance with the insulating pad or grease.")
    tab_live: bool = Field(False, description="Its mounting tab is connected to a mains-side (hazardous) circuit.")
    insulated: bool = Field(False, description="An insulating pad and bush sit between its tab and the heatsink.")
    insulation: InsulationGrade | None = Field(None, description="Grade of the insulation between tab and heatsink (pad, bush and the creepage round them): basic, supplementary, reinforced or double; one pad and bush is basic.")
    role: DiodeRole | None = Field(None, description="A diode's job, which sets the voltage it blocks: mains-bridge, bridge, centre-tapped, half-wave, doubler, reset, clamp or freewheel.")
    voltage_rating_kind: RatingKind | None = Field(None, description="Which rating voltage_rating is: V_CEO, V_CES or V_CBO (bjt), V_DSS (mosfet), V_CES (igbt), V_RRM (diodes).")
    base_held_off: bool = Field(False, description="A bjt's base is shorted or reverse-biased to its emitter through a low impedance while it is off, so V_CES applies.")
    current_rms: Current | None = Field(None, description="RMS current through a MOSFET over a whole cycle, for its conduction loss.")
    rds_on: Resistance | None = Field(None, description="A MOSFET's on-resistance at 25 degC from the maker's data (the maximum, not the typical).")
    rds_on_hot: Resistance | None = Field(None, description="A MOSFET's on-resistance at its hot junction temperature, read from the maker's curve.")
    surge_current: Current | None = Field(None, description="Non-repetitive peak forward surge current I_FSM of a rectifier (one half-sine), e.g. 200 A.")
    surge_duration: Duration | None = Field(None, description="The half-sine I_FSM is given for, e.g. 8.3 ms or 10 ms; 8.3 ms when not given (harsher).")
    surge_i2t: MeltingIntegral | None = Field(None, description="A rectifier's I^2 t rating for fusing, e.g. 166 A^2 s.")
    rds_on_rise: Ratio | None = Field(None, description="A MOSFET's on-resistance at its hot junction temperature over its value at 25 degC, from the maker's curve, e.g. 1.9.")

    @model_validator(mode="after")
    def _rating_kind_fits(self):
        if self.voltage_rating_kind is not None and self.voltage_rating_kind not in RATING_KINDS[self.kind]:
            allowed = ", ".join(RATING_KINDS[self.kind]) or "none"
            raise PydanticCustomError("literal_error", "expected {expected}, found {found}", {"expected": f"a rating a {self.kind} has ({allowed})", "found": repr(self.voltage_rating_kind)})
        return self


class Capacitor(Section):
    ref: Designator
    voltage_rating: Voltage = Field(description="Rated voltage: DC for ordinary capacitors, AC RMS for X and Y safety capacitors.")
    position: Literal["bulk", "split", "across-line", "line-to-earth", "across-barrier", "output", "other"] = Field("other", description="Where it sits: bulk, split, across-line, line-to-earth, across-barrier, output or other.")
    safety_class: SafetyClass = Field("", description="X1, X2, X3, Y1, Y2, Y3 or Y4 (IEC 60384-14) for safety capacitors.")
    in_series: int = Field(1, ge=1, le=20, description="Equal capacitors in series across the voltage its position names (a split pair counts 2 by itself); this entry stands for each of them.")
    balancing_resistor: Resistance | None = Field(None, description="Resistor across each capacitor of a series string, to share the voltage, e.g. 220 kohm.")
    leakage: Current | None = Field(None, description="Largest leakage current of one capacitor from the maker's data, at its hot temperature if given, e.g. 0.3 mA.")
    capacitance: Capacitance | None = Field(None, description="Capacitance of one capacitor, e.g. 470 uF; gives the makers' usual leakage limit when leakage is not given.")
    no_load_voltage: Voltage | None = Field(None, description="DC voltage across the whole string with no load at nominal line, measured or from the transformer maker's regulation figure.")
    ripple_current: Current | None = Field(None, description="Rated ripple current (RMS) at the ripple frequency and the hot temperature, from the maker's data, e.g. 0.8 A.")
    doubler: Literal["full-wave", "half-wave-input", "half-wave-output"] | None = Field(
        None, description="In a voltage doubler, which capacitor it is, which sets the voltage it holds: full-wave (either of the "
                          "pair, each charged to the winding's peak), half-wave-input (the series capacitor of a half-wave doubler, "
                          "at the peak) or half-wave-output (its output capacitor, at twice the peak). When not given for a capacitor "
                          "in a doubler stage: the doubler's whole output (the harsher reading).")
    discharge_resistor: Resistance | None = Field(None, description="For an X capacitor across the line: the resistance across it that discharges it once the plug is pulled, e.g. 1 Mohm (two 470 kohm in series).")


class Valve(Section):
    """A rectifier valve's maximum ratings from its maker's data sheet."""

    ref: Designator
    peak_inverse_voltage: Voltage | None = Field(None, description="The maker's peak inverse anode voltage, e.g. 1400 V.")
    peak_current: Current | None = Field(None, description="The maker's peak anode current, per anode, e.g. 440 mA.")
    max_reservoir: Capacitance | None = Field(None, description="The largest capacitor-input reservoir the maker allows, e.g. 32 uF.")


class Heatsink(Section):
    ref: Designator
    rth_sa: ThermalResistance = Field(description="Sink-to-air thermal resistance.")
    touchable: bool = Field(True, description="It can be touched from outside the enclosure.")
    earthed: bool = Field(False, description="It is bonded to protective earth.")
    contact: Literal["brief", "held"] | None = Field(None, description="How it is touched, for a product standard's touch limit: brief "
                                                                     "(touched now and then, let go at once) or held (held or touched for longer); "
                                                                     "left out, held is assumed (the lower limit).")
    outside: bool = Field(False, description="It stands outside the enclosure in the room's air (e.g. fins on the back panel); "
                                             "when false it is taken inside, in the enclosure's warmer air (protection.internal_ambient).")


class Margins(Section):
    """Margins a club or builder sets for its reviews; each one left out falls back to common practice."""

    switch_voltage: MarginRatio | None = Field(None, description="Switch voltage rating over the highest voltage it blocks, e.g. 1.25.")
    rectifier_voltage: MarginRatio | None = Field(None, description="Rectifier reverse-voltage rating over its peak inverse voltage, e.g. 1.5.")
    capacitor_voltage: MarginRatio | None = Field(None, description="Capacitor voltage rating over the highest voltage it sees, e.g. 1.1.")
    junction: TemperatureRise | None = Field(None, description="How far below its maximum a junction should stay, e.g. 25 K.")
    touch_temperature: Temperature | None = Field(None, description="Hottest a touchable heatsink may get, e.g. 60 degC.")
    basis: str = Field("", description="Who sets these margins, e.g. 'club build notes, sheet 3'.")


class SoakReading(Section):
    """A temperature measured after a run at full load."""

    ref: str = Field(description="Device (measured on its case or tab) or heatsink (measured on the sink).")
    temperature: Temperature = Field(description="Temperature measured at the end of the run.")
    ambient: Temperature = Field(description="Air temperature around the unit during the run.")
    duration: Duration = Field(description="How long it ran at that load before the reading, e.g. 2 h.")
    load: str = Field("", description="What it was driving, e.g. '3 A into a resistive load'.")
    note: str = Field("", description="Where and how it was measured.")


class Devices(Section):
    semiconductors: list[Semiconductor] = Field(default_factory=list, description="Power semiconductors with ratings and thermal data.")
    capacitors: list[Capacitor] = Field(default_factory=list, description="Capacitors whose voltage or safety class matters.")
    heatsinks: list[Heatsink] = Field(default_factory=list, description="Heatsinks by designator, with sink-to-air resistance.")
    valves: list[Valve] = Field(default_factory=list, description="Rectifier valves with their maker's ratings, checked against what their stage puts on them.")
    margins: Margins = Field(default_factory=Margins, description="Margins the builder's club sets; defaults are common practice.")
    soak: list[SoakReading] = Field(default_factory=list, description="Temperatures measured after a run at full load.")

    @model_validator(mode="after")
    def _references_known(self):
        sinks = {sink.ref for sink in self.heatsinks}
        for device in self.semiconductors:
            if device.heatsink and device.heatsink not in sinks:
                raise _unknown(f"a heatsink listed under devices.heatsinks for {device.ref}", device.heatsink)
        known = sinks | {device.ref for device in self.semiconductors}
        for reading in self.soak:
            if reading.ref not in known:
                raise _unknown("a listed semiconductor or heatsink for the soak reading", reading.ref)
        return self


def _unknown(expected: str, found: str) -> PydanticCustomError:
    return PydanticCustomError("unknown_reference", "expected {expected}, found {found}", {"expected": expected, "found": repr(found)})
