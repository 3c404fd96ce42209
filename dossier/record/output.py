"""What the unit delivers; for a charger, the battery it charges."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import Charge, Current, Power, Ratio, Section, Temperature, Voltage


class Battery(Section):
    chemistry: Literal["flooded", "agm", "gel"]
    cells: int = Field(6, ge=1)
    capacity: Charge
    absorption_voltage: Voltage
    float_voltage: Voltage | None = None
    temperature: Temperature | None = None
    compensation: str = Field("", description="How the setpoint follows battery temperature, if it does.")


class Output(Section):
    voltage: Voltage
    current: Current
    power: Power | None = None
    efficiency: Ratio | None = None
    power_factor: Ratio | None = None
    tolerance: Ratio | None = None
    minimum_load: Current | None = Field(None, description="Load the converter needs to start and regulate, if any.")
    battery: Battery | None = None
