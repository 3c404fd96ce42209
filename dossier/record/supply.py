"""The mains the unit sits on and the environment it lives in."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from dossier.record.fields import Altitude, Fraction, MainsFrequency, MainsVoltage, Section, Temperature
from dossier.units import Q_


class Mains(Section):
    nominal: MainsVoltage = Field(description="Nominal line-to-neutral RMS voltage, e.g. 230 V.")
    frequency: MainsFrequency = Field(description="Mains frequency, e.g. 50 Hz.")
    tolerance: Fraction = Field(default_factory=lambda: Q_(10, "percent"), description="Tolerance either side of nominal; default 10 %.")
    overvoltage_category: Literal["I", "II", "III", "IV"] = Field("II", description="Overvoltage category (IEC 60664-1); II for equipment plugged into a socket.")

    @property
    def low(self):
        return self.nominal * (1 - self.tolerance.to("").magnitude)

    @property
    def high(self):
        return self.nominal * (1 + self.tolerance.to("").magnitude)


class Environment(Section):
    pollution_degree: Literal[1, 2, 3, 4] = Field(2, description="Pollution degree at the insulation (IEC 60664-1); 2 for most indoor equipment.")
    altitude: Altitude = Field(default_factory=lambda: Q_(0, "m"), description="Highest altitude of use, e.g. 400 m.")
    max_ambient: Temperature = Field(default_factory=lambda: Q_(40, "degC"), description="Highest air temperature around the unit.")
