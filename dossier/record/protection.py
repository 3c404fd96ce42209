"""Fuses, inrush limiting, earthing and the output-side protection."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import (
    Capacitance, Designator, Current, Duration, Energy, Length, MeltingIntegral, NonNegativeResistance, NtcBConstant, Power, Ratio, Resistance,
    Section, Temperature, Voltage, WireSize,
)

LoadKind = Literal["regulated", "unregulated-linear", "resistive"]
SocketEarth = Literal["unconnected", "protective-earth", "equipotential-bond"]


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


class ThermalCutoff(Section):
    ref: Designator | None = Field(None, description="Designator of the cut-off, e.g. TF1.")
    temperature: Temperature = Field(description="Rated opening temperature, e.g. 130 degC.")
    current_rating: Current | None = Field(None, description="Rated current it carries and breaks, e.g. 10 A.")
    protects: str = Field("", description="What it sits on, e.g. 'clamped to R1' or 'inside T1, on the primary'.")


class InrushLimiter(Section):
    ref: Designator
    kind: Literal["ntc", "resistor", "relay-bypassed-resistor"] = Field("ntc", description="ntc, resistor or relay-bypassed-resistor.")
    cold_resistance: Resistance = Field(description="Resistance at 25 degC (for a resistor, its resistance), e.g. 10 ohm.")
    hot_resistance: Resistance | None = Field(None, description="NTC residual resistance at its maximum current, from the maker's data.")
    max_energy: Energy | None = Field(None, description="Largest switch-on energy the part is rated to absorb, e.g. 60 J; for a resistor, its rated pulse energy.")
    max_capacitance: Capacitance | None = Field(None, description="Largest capacitance the maker allows, if given instead of energy.")
    max_capacitance_voltage: Voltage | None = Field(None, description="The RMS voltage the maker quotes max_capacitance at, e.g. 230 V; the allowed capacitance scales as 1/V^2.")
    b_value: NtcBConstant | None = Field(None, description="The NTC's B constant (B25/85) in kelvin, e.g. 3000 K; 4000 K when not given.")
    max_current: Current | None = Field(None, description="Maximum steady current, e.g. 3 A.")
    power_rating: Power | None = Field(None, description="A resistor's continuous power rating at the air it sits in, e.g. 25 W.")
    bypass_delay: Duration | None = Field(None, description="relay-bypassed-resistor: time from switch-on until the relay closes across it, e.g. 150 ms.")
    thermal_cutoff: ThermalCutoff | None = Field(None, description="A thermal cut-off that opens the circuit if the resistor overheats (the bypass never closing).")


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


class SecondaryBank(Section):
    name: str = Field("", description="Which rail it smooths, e.g. '+35 V'.")
    capacitance: Capacitance = Field(description="Total capacitance of the bank, e.g. 20000 uF.")
    voltage: Voltage = Field(description="DC voltage the bank charges to at nominal mains, e.g. 41 V.")


class Rcd(Section):
    ref: Designator
    residual_current: Current = Field(description="Rated residual operating current, e.g. 30 mA.")
    test_button: bool | None = Field(None, description="It has a test button; not declared is read as none.")
    position: Literal["supply", "isolated-output"] = Field("supply", description="supply (on the incoming mains) or isolated-output (behind an isolating transformer).")


class SeriesLamp(Section):
    ref: Designator
    power: Power = Field(description="The lamp's rated wattage, e.g. 100 W (an incandescent lamp).")
    voltage: Voltage = Field(description="The lamp's rated voltage, e.g. 230 V.")
    bypass: bool = Field(False, description="A switch can short the lamp once the unit under test is known to be sound.")
    cold_ratio: Ratio | None = Field(None, description="Hot over cold filament resistance; 15 when not given (harsher).")


class Variac(Section):
    ref: Designator
    top_voltage: Voltage = Field(description="Output voltage at the top of the scale with nominal mains in, e.g. 260 V.")
    current_rating: Current | None = Field(None, description="Rated output current, e.g. 4 A.")


class Socket(Section):
    ref: Designator
    earth_contact: SocketEarth | None = Field(None, description="Where the socket's earth contact goes: unconnected, protective-earth (the case or the mains earth) or equipotential-bond (bonded to the other isolated sockets only).")
    voltage_rating: Voltage | None = Field(None, description="Rated voltage of the socket, e.g. 250 V.")


class IsolatedOutputFuse(Section):
    ref: Designator
    rating: Current = Field(description="Rated current, e.g. 2 A.")
    voltage_rating: Voltage | None = Field(None, description="Rated voltage, e.g. 250 V.")


class IsolatingOutput(Section):
    transformer: str = Field("", description="Designator of the isolating transformer under magnetics, if listed, e.g. T1.")
    rated_power: Power | None = Field(None, description="The isolating transformer's rated output, e.g. 500 VA.")
    voltage: Voltage | None = Field(None, description="Nominal output voltage, e.g. 230 V.")
    fuse: IsolatedOutputFuse | None = Field(None, description="The fuse on the isolated output.")
    sockets: list[Socket] = Field(default_factory=list, description="The output sockets.")


class Protection(Section):
    fuse: Fuse | None = Field(None, description="The mains fuse.")
    inrush_limiter: InrushLimiter | None = Field(None, description="NTC thermistor or resistor that limits the switch-on current.")
    bulk_capacitance: Capacitance | None = Field(None, description="Total capacitance charged from the mains at switch-on (behind a transformer: already referred to the primary).")
    secondary_banks: list[SecondaryBank] = Field(default_factory=list, description="Capacitor banks behind a mains transformer, each with its voltage; referred to the primary as C (V_bank / V_primary peak)^2.")
    load_kind: LoadKind | None = Field(None, description="regulated (constant power), unregulated-linear (input power as V^2, e.g. a class-AB amplifier on unregulated rails) or resistive; not given: whichever draws more (or less) current for each check.")
    thermal_fuse: ThermalCutoff | None = Field(None, description="A thermal fuse in the mains transformer that opens on an overload the mains fuse does not clear.")
    bulk_esr: NonNegativeResistance | None = Field(None, description="Equivalent series resistance of the bulk capacitance, e.g. 0.3 ohm.")
    source_resistance: NonNegativeResistance | None = Field(None, description="Resistance of the mains source and cord, e.g. 0.5 ohm.")
    switch_on_cycles: int | None = Field(None, ge=1, le=1_000_000_000, description="Switch-ons expected in the unit's life; 10000 when not given.")
    earth: Earth | None = Field(None, description="Protective class, enclosure and earth bonding.")
    wiring: Wiring | None = Field(None, description="Current ratings of what the mains fuse protects: inlet, cord, switch, internal wiring.")
    internal_ambient: Temperature | None = Field(None, description="Air temperature inside the enclosure at full load and the highest room temperature, e.g. 55 degC; room + 20 K when not given.")
    output_fuse: OutputFuse | None = Field(None, description="The fuse in the battery lead, for a charger.")
    reverse_polarity: str = Field("", description="How reversed battery leads are caught, e.g. 'series Schottky D9'.")
    rcd: Rcd | None = Field(None, description="A residual-current device in the unit.")
    series_lamp: SeriesLamp | None = Field(None, description="A series lamp that limits the current to a unit under test.")
    variac: Variac | None = Field(None, description="A variable autotransformer; its top-of-scale voltage is the high line for what it feeds.")
    isolating_output: IsolatingOutput | None = Field(None, description="An isolated output behind an isolating transformer: its fuse and sockets.")
