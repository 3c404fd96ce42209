"""Fuses, inrush limiting, earthing and the output-side protection."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import (
    Capacitance, Current, Energy, Length, MeltingIntegral, Resistance, Section, Voltage, WireSize,
)


class Fuse(Section):
    ref: str
    rating: Current
    speed: Literal["time-lag", "fast-acting"]
    voltage_rating: Voltage
    breaking_capacity: Current | None = None
    body: Literal["glass", "ceramic", "other"] = "glass"
    melting_i2t: MeltingIntegral | None = Field(None, description="Nominal melting I^2 t from the fuse maker's data, e.g. 3.2 A^2 s.")


class InrushLimiter(Section):
    ref: str
    kind: Literal["ntc", "resistor", "relay-bypassed-resistor"] = "ntc"
    cold_resistance: Resistance
    hot_resistance: Resistance | None = None
    max_energy: Energy | None = None
    max_capacitance: Capacitance | None = None
    max_current: Current | None = None


class Earth(Section):
    protective_class: Literal["I", "II"]
    enclosure: Literal["metal", "plastic", "none"] = "plastic"
    bonding: str = Field("", description="How protective earth is bonded to touchable metal, e.g. 'M4 stud with star washer'.")


class OutputFuse(Section):
    ref: str
    rating: Current
    distance_to_battery: Length | None = None
    lead_wire: WireSize | None = None


class Protection(Section):
    fuse: Fuse | None = None
    inrush_limiter: InrushLimiter | None = None
    bulk_capacitance: Capacitance | None = Field(None, description="Total capacitance charged at switch-on.")
    bulk_esr: Resistance | None = None
    source_resistance: Resistance | None = None
    earth: Earth | None = None
    output_fuse: OutputFuse | None = None
    reverse_polarity: str = Field("", description="How reversed battery leads are caught, e.g. 'series Schottky D9'.")
