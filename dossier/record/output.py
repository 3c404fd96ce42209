"""What the unit delivers; for a charger, the battery it charges."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, ValidationInfo, field_validator, model_validator
from pydantic_core import PydanticCustomError

from dossier.record.fields import Charge, Current, Duration, Fraction, Power, Section, Share, Temperature, Voltage, VoltagePerKelvin
from dossier.standards.battery import REFERENCE_TEMPERATURE
from dossier.standards.chemistries import known_keys
from dossier.units import Q_, fmt


def _problem(kind: str, expected: str, found: str) -> PydanticCustomError:
    return PydanticCustomError(kind, "expected {expected}, found {found}", {"expected": expected, "found": found})


class Battery(Section):
    """The battery a charger is set up for; voltages are for the whole battery, not per cell."""

    chemistry: str = Field(
        description="Battery chemistry: flooded, agm or gel (lead-acid), or a key a chemistry plugin adds.",
        json_schema_extra={"examples": ["flooded", "agm", "gel"]},
    )
    cells: int = Field(6, ge=1, le=10_000, description="Cells in series; 6 for a 12 V lead-acid battery.")
    capacity: Charge = Field(description="Rated capacity, e.g. 60 Ah.")
    absorption_voltage: Voltage = Field(
        description="Constant-voltage (absorption) setpoint at 25 degC, e.g. 14.4 V; the fixed setpoint if the charger has no compensation."
    )
    float_voltage: Voltage | None = Field(None, description="Float setpoint at 25 degC, e.g. 13.6 V; leave out if the charger has no float stage.")
    charge_current: Current | None = Field(None, description="Constant-current limit set for this battery; default: the output's current rating.")
    temperature: Temperature | None = Field(None, description="Expected battery temperature while charging; default 25 degC.")
    lowest_temperature: Temperature | None = Field(None, description="Coldest battery temperature expected while charging, if it varies.")
    highest_temperature: Temperature | None = Field(None, description="Warmest battery temperature expected while charging, if it varies.")
    compensation: VoltagePerKelvin | None = Field(
        None, description="Temperature compensation of the setpoints for the whole battery, e.g. -18 mV/K; leave out if there is none."
    )
    absorption_timer: Duration | None = Field(
        None, description="Longest time the charger stays in absorption before it drops to float or stops, e.g. 8 h; leave out if it has no timer."
    )
    high_temperature_cutoff: Temperature | None = Field(
        None, description="Battery temperature above which the charger stops charging, e.g. 45 degC; leave out if it has none."
    )
    temperature_sensor: Literal["battery", "charger", "none"] | None = Field(
        None, description="Where the temperature sensor for compensation and cut-off sits: battery (on the battery), charger (inside the charger) or none."
    )
    start_state_of_charge: Fraction = Field(
        default_factory=lambda: Q_(20, "percent"), description="State of charge the time-to-full estimate starts from; default 20 %."
    )

    @field_validator("chemistry")
    @classmethod
    def _known_chemistry(cls, value: str) -> str:
        known = known_keys()  # a broken chemistry plugin raises ChemistryError: the installation's fault, not the record's
        if value not in known:
            raise _problem("unknown_chemistry", "one of " + ", ".join(known), repr(value))
        return value

    @field_validator("float_voltage")
    @classmethod
    def _float_below_absorption(cls, value, info: ValidationInfo):
        absorption = info.data.get("absorption_voltage")
        if value is not None and absorption is not None and value >= absorption:
            raise _problem("float_not_below_absorption", f"below absorption_voltage ({fmt(absorption)})", fmt(value))
        return value

    @model_validator(mode="after")
    def _temperatures_in_order(self):
        ordered = [t.to("degC") for t in (self.lowest_temperature, self.temperature, self.highest_temperature) if t is not None]
        if ordered != sorted(ordered, key=lambda t: t.magnitude):
            found = ", ".join(fmt(t) for t in ordered)
            raise _problem("temperatures_out_of_order", "lowest_temperature <= temperature <= highest_temperature", found)
        return self

    @property
    def expected_temperature(self):
        return self.temperature if self.temperature is not None else REFERENCE_TEMPERATURE

    @property
    def temperature_span(self) -> tuple:
        """(coldest, warmest) battery temperature while charging; the expected one where none is given."""
        expected = self.expected_temperature
        low = self.lowest_temperature if self.lowest_temperature is not None else expected
        high = self.highest_temperature if self.highest_temperature is not None else expected
        return low, high


class Output(Section):
    voltage: Voltage = Field(description="Rated output voltage, e.g. 13.8 V.")
    current: Current = Field(description="Rated output current; for a charger, its largest charge current.")
    power: Power | None = Field(None, description="Rated output power; default voltage x current.")
    efficiency: Share | None = Field(None, description="Efficiency at full load, e.g. 80 %.")
    power_factor: Share | None = Field(None, description="Input power factor; default a typical value for the input type.")
    tolerance: Fraction | None = Field(None, description="How far the output voltage may sit from its setting (setpoint accuracy and regulation), e.g. 2 %.")
    minimum_load: Current | None = Field(None, description="Load the converter needs to start and regulate, if any.")
    battery: Battery | None = Field(None, description="For a charger: the battery it is set up for. Leave out for other outputs.")

    @property
    def is_charger(self) -> bool:
        return self.battery is not None
