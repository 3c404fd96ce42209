"""Power semiconductors, capacitors under stress and heatsinks."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import Current, Power, Section, Temperature, ThermalResistance, Voltage


class Semiconductor(Section):
    ref: str
    kind: Literal["bjt", "mosfet", "igbt", "diode", "schottky", "bridge", "regulator"]
    voltage_rating: Voltage | None = None
    current_rating: Current | None = None
    max_junction: Temperature | None = None
    rth_jc: ThermalResistance | None = None
    forward_voltage: Voltage | None = None
    current: Current | None = None
    loss: Power | None = None
    heatsink: str = ""
    pad: ThermalResistance | None = Field(None, description="Case-to-sink resistance with the insulating pad or grease.")
    tab_live: bool = False
    insulated: bool = False


class Capacitor(Section):
    ref: str
    voltage_rating: Voltage
    position: Literal["bulk", "split", "across-line", "line-to-earth", "across-barrier", "output", "other"] = "other"
    safety_class: str = Field("", description="X1, X2, Y1, Y2 ... for safety capacitors.")


class Heatsink(Section):
    ref: str
    rth_sa: ThermalResistance
    touchable: bool = True
    earthed: bool = False


class Devices(Section):
    semiconductors: list[Semiconductor] = Field(default_factory=list)
    capacitors: list[Capacitor] = Field(default_factory=list)
    heatsinks: list[Heatsink] = Field(default_factory=list)
