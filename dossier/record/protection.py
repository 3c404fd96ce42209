"""Fuses, inrush limiting, earthing and the output-side protection."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import (
    Capacitance, Designator, Current, Duration, Energy, Length, MeltingIntegral, NonNegativeResistance, NtcBConstant, Resistance, Section, Temperature,
    Voltage, WireSize,
)


class MeltingPoint(Section):
    time: Duration = Field(description="Pre-arcing (melting) time, e.g. 1 ms.")
    i2t: MeltingIntegral = Field(description="Melting I^2 t that melts the fuse in that time, from the maker's I^2 t-t curve, e.g. 0.8 A^2 s.")


class Fuse(Section):
    ref: Designator
    rating: Current = Field(description="Rated current as marked, e.g. 2 A or 500 mA.")
    speed: Literal["time-lag", "fast-acting"] = Field(description="time-lag (T) or fast-acting (F).")
    voltage_rating: Voltage = Field(description="Rated voltage as marked, e.g. 250 V.")
    breaking_capacity: Current | None = Field(None, description="Rated breaking capacity, e.g. 1500 A (high) or 35 A (low).")
    body: Literal["glass", "ceramic", "other"] = Field("glass", description="Body of the fuse-link: glass, ceramic or other.")
    melting_i2t: MeltingIntegral | None = Field(None, description="Nominal melting I^2 t from the fuse maker's data, e.g. 3.2 A^2 s (makers usually measure it at ten times the rated current).")
    melting_curve: list[MeltingPoint] = Field(default_factory=list, description="Melting I^2 t against pre-arcing time from the maker's curve, e.g. [{time: 1 ms, i2t: 0.8 A^2 s}, {time: 10 ms, i2t: 1.6 A^2 s}]; used before melting_i2t for short pulses.")
    ambient: Temperature | None = Field(None, description="Air temperature at the fuse, if higher than the environment's max_ambient.")


class InrushLimiter(Section):
    ref: Designator
    kind: Literal["ntc", "resistor", "relay-bypassed-resistor"] = Field("ntc", description="ntc, resistor or relay-bypassed-resistor.")
    cold_resistance: Resistance = Field(description="Resistance at 25 degC (for a resistor, its resistance), e.g. 10 ohm.")
    hot_resistance: Resistance | None = Field(None, description="NTC residual resistance at its maximum current, from the maker's data.")
    max_energy: Energy | None = Field(None, description="Largest switch-on energy the part is rated to absorb, e.g. 60 J.")
    max_capacitance: Capacitance | None = Field(None, description="Largest capacitance the maker allows, if given instead of energy.")
    max_capacitance_voltage: Voltage | None = Field(None, description="The RMS voltage the maker quotes max_capacitance at, e.g. 230 V; the allowed capacitance scales as 1/V^2.")
    b_value: NtcBConstant | None = Field(None, description="The NTC's B constant (B25/85) in kelvin, e.g. 3000 K; 4000 K when not given.")
    max_current: Current | None = Field(None, description="Maximum steady current, e.g. 3 A.")


class Earth(Section):
    protective_class: Literal["I", "II"] = Field(description="Class I (protective earth) or class II (double or reinforced insulation).")
    enclosure: Literal["metal", "plastic", "none"] = Field("plastic", description="Enclosure material: metal, plastic or none.")
    bonding: str = Field("", description="How protective earth is bonded to touchable metal, e.g. 'M4 stud with star washer'; 'none' if it is not.")


class Wiring(Section):
    inlet: Current | None = Field(None, description="Rated current of the mains inlet or plug, e.g. 10 A for an IEC 60320 C14 inlet.")
    cord: Current | None = Field(None, description="Rated current of the mains cord, e.g. 6 A for 0.75 mm^2.")
    switch: Current | None = Field(None, description="Rated current of the mains switch, e.g. 4 A.")
    internal: Current | None = Field(None, description="Rated current of the thinnest wiring or track behind the fuse, e.g. 2 A.")


class OutputFuse(Section):
    ref: Designator
    rating: Current = Field(description="Rated current, e.g. 10 A.")
    distance_to_battery: Length | None = Field(None, description="Length of lead between the fuse and the battery terminal, e.g. 150 mm.")
    lead_wire: WireSize | None = Field(None, description="Size of the battery lead, e.g. AWG 14 or 1.6 mm.")
    lead_ampacity: Current | None = Field(None, description="The lead's rated current from its maker, if known; otherwise the IEC 60335-1 supply-cord table is used.")
    dc_voltage_rating: Voltage | None = Field(None, description="The fuse's rated DC voltage from its maker's data, e.g. 32 V DC.")
    breaking_capacity: Current | None = Field(None, description="The fuse's rated breaking capacity at that DC voltage, e.g. 1000 A.")
    body: Literal["glass", "ceramic", "blade", "other"] = Field("other", description="Fuse body: glass, ceramic, blade (automotive) or other.")
    prospective_current: Current | None = Field(None, description="The battery's short-circuit current from its maker's data, e.g. 800 A; 30 A per Ah of capacity when not given.")


class Protection(Section):
    fuse: Fuse | None = Field(None, description="The mains fuse.")
    inrush_limiter: InrushLimiter | None = Field(None, description="NTC thermistor or resistor that limits the switch-on current.")
    bulk_capacitance: Capacitance | None = Field(None, description="Total capacitance charged from the mains at switch-on.")
    bulk_esr: NonNegativeResistance | None = Field(None, description="Equivalent series resistance of the bulk capacitance, e.g. 0.3 ohm.")
    source_resistance: NonNegativeResistance | None = Field(None, description="Resistance of the mains source and cord, e.g. 0.5 ohm.")
    switch_on_cycles: int | None = Field(None, ge=1, le=1_000_000_000, description="Switch-ons expected in the unit's life; 10000 when not given.")
    earth: Earth | None = Field(None, description="Protective class, enclosure and earth bonding.")
    wiring: Wiring | None = Field(None, description="Current ratings of what the mains fuse protects: inlet, cord, switch, internal wiring.")
    internal_ambient: Temperature | None = Field(None, description="Air temperature inside the enclosure at full load and the highest room temperature, e.g. 55 degC; room + 20 K when not given.")
    output_fuse: OutputFuse | None = Field(None, description="The fuse in the battery lead, for a charger.")
    reverse_polarity: str = Field("", description="How reversed battery leads are caught, e.g. 'series Schottky D9'.")
