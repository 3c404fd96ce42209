"""Power semiconductors, capacitors under stress, heatsinks, the builder's margins and soak-test readings."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, field_validator, model_validator
from pydantic_core import PydanticCustomError

from dossier.record.fields import (
    Designator,
    Current, Duration, Energy, Frequency, Power, Ratio, Section, Temperature, ThermalResistance, Voltage,
)
from dossier.units import Q_

SafetyClass = Literal["", "X1", "X2", "X3", "Y1", "Y2", "Y3", "Y4"]


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


class Capacitor(Section):
    ref: Designator
    voltage_rating: Voltage = Field(description="Rated voltage: DC for ordinary capacitors, AC RMS for X and Y safety capacitors.")
    position: Literal["bulk", "split", "across-line", "line-to-earth", "across-barrier", "output", "other"] = Field("other", description="Where it sits: bulk, split, across-line, line-to-earth, across-barrier, output or other.")
    safety_class: SafetyClass = Field("", description="X1, X2, X3, Y1, Y2, Y3 or Y4 (IEC 60384-14) for safety capacitors.")


class Heatsink(Section):
    ref: Designator
    rth_sa: ThermalResistance = Field(description="Sink-to-air thermal resistance.")
    touchable: bool = Field(True, description="It can be touched from outside the enclosure.")
    earthed: bool = Field(False, description="It is bonded to protective earth.")


class Margins(Section):
    """Margins a club or builder sets for its reviews; each one left out falls back to common practice."""

    switch_voltage: Ratio | None = Field(None, description="Switch voltage rating over the highest voltage it blocks, e.g. 1.25.")
    rectifier_voltage: Ratio | None = Field(None, description="Rectifier reverse-voltage rating over its peak inverse voltage, e.g. 1.5.")
    capacitor_voltage: Ratio | None = Field(None, description="Capacitor voltage rating over the highest voltage it sees, e.g. 1.1.")
    junction: Temperature | None = Field(None, description="How far below its maximum a junction should stay, e.g. 25 K.")
    touch_temperature: Temperature | None = Field(None, description="Hottest a touchable heatsink may get, e.g. 60 degC.")
    basis: str = Field("", description="Who sets these margins, e.g. 'club build notes, sheet 3'.")

    @field_validator("switch_voltage", "rectifier_voltage", "capacitor_voltage")
    @classmethod
    def _at_least_one(cls, ratio):
        if ratio is not None and ratio.to("").magnitude < 1:
            raise ValueError("a ratio of at least 1, e.g. 1.5")
        return ratio

    @field_validator("junction")
    @classmethod
    def _a_difference(cls, margin):
        if margin is not None and margin.units not in (Q_(1, "K").units, Q_(1, "delta_degC").units):
            raise ValueError("a temperature difference in K, e.g. 25 K")
        return margin


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
