"""What a battery chemistry is: per-cell charging windows at 25 degC, each with its sources, and the charge-curve figures."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.findings import Source
from dossier.units import Q_

REFERENCE_TEMPERATURE = Q_(25, "degC")


@dataclass(frozen=True)
class Window:
    """A range a value should lie in (low <= value <= high), with where the range comes from."""

    low: object  # pint Quantity
    high: object  # pint Quantity, same dimension as low
    sources: tuple[Source, ...]

    def contains(self, value) -> bool:
        return self.low <= value <= self.high

    def scaled(self, factor: float) -> "Window":
        return Window(_tidy(self.low * factor), _tidy(self.high * factor), self.sources)

    def shifted(self, offset) -> "Window":
        return Window(_tidy(self.low + offset), _tidy(self.high + offset), self.sources)


def _tidy(quantity):
    """Drop floating-point noise (2.35 x 6 = 14.100000000000001) so window edges compare and print as written."""
    return Q_(round(quantity.magnitude, 9), quantity.units)


@dataclass(frozen=True)
class CurveModel:
    """The figures the CC-then-CV charge estimate needs (see docs/calcs/charge.md).

    cv_onset          state of charge (0..1) at which the terminal voltage reaches the setpoint
    termination       taper current at which the battery counts as full, per unit capacity (1/h)
    efficiency        charge efficiency: charge stored per charge delivered (0..1)
    start_voltage     terminal voltage per cell as charge starts on an empty battery
    """

    cv_onset: float
    termination: object
    efficiency: float
    start_voltage: object
    sources: tuple[Source, ...]


@dataclass(frozen=True)
class Chemistry:
    """One chemistry's charging windows; voltages are per cell at 25 degC.

    absorption        constant-voltage (absorption) setpoint window
    float_charge      float setpoint window, or None when the chemistry takes no float stage
    compensation      acceptable temperature coefficient of the setpoints per cell (V/K, both negative)
    typical_compensation  the coefficient used to move the windows with battery temperature
    charge_rate       constant-current limit as a fraction of capacity per hour (1/h, i.e. C-rate)
    charge_temperature  battery temperatures (degC) it may be charged at, or None when not known; the windows
                      move with temperature only inside it
    valve_regulated   sealed (AGM, gel): charged hot it can run away thermally
    """

    key: str
    title: str
    label: str  # short name for titles, e.g. 'AGM'
    absorption: Window
    float_charge: Window | None
    compensation: Window | None
    typical_compensation: object
    charge_rate: Window
    curve: CurveModel
    charge_temperature: Window | None = None
    valve_regulated: bool = False

    def absorption_at(self, temperature) -> Window:
        return self.absorption.shifted(self.drift(temperature))

    def float_at(self, temperature) -> Window | None:
        return self.float_charge.shifted(self.drift(temperature)) if self.float_charge else None

    def drift(self, temperature):
        """How far the per-cell windows move from their 25 degC values, the temperature held inside the charging range."""
        return self.typical_compensation * kelvin_from_reference(self.clamped(temperature))

    def clamped(self, temperature):
        """The temperature held inside the charging range: beyond it the windows (and a charger's compensation) stop."""
        if self.charge_temperature is None:
            return temperature
        low, high = self.charge_temperature.low.to("degC"), self.charge_temperature.high.to("degC")
        return min(max(temperature.to("degC"), low), high)


def kelvin_from_reference(temperature):
    return Q_(temperature.to("degC").magnitude - REFERENCE_TEMPERATURE.magnitude, "K")
