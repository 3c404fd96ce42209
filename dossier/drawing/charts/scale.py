"""Axis scales for charts: round tick steps (1, 2, 2.5, 5 x 10^n) and their labels."""

from __future__ import annotations

import math
from dataclasses import dataclass

NICE_STEPS = (1.0, 2.0, 2.5, 5.0)


@dataclass(frozen=True)
class Scale:
    """A linear axis from low to high, divided into `intervals` equal, round steps."""

    low: float
    step: float
    intervals: int

    @property
    def high(self) -> float:
        return self.low + self.step * self.intervals

    @property
    def ticks(self) -> list[float]:
        return [round(self.low + self.step * i, 9) for i in range(self.intervals + 1)]

    def fraction(self, value: float) -> float:
        """Where a value sits along the axis, 0 at low and 1 at high."""
        return (value - self.low) / (self.high - self.low)

    def label(self, value: float) -> str:
        return f"{value:.{decimals(self.step)}f}"


def decimals(step: float) -> int:
    """Decimals a tick label needs so that every tick of this step prints exactly."""
    for places in range(7):
        if abs(step * 10**places - round(step * 10**places)) < 1e-6:
            return places
    return 6


def nice_steps(smallest: float):
    """Round steps from the first one at or above `smallest`, upwards."""
    exponent = math.floor(math.log10(smallest)) if smallest > 0 else 0
    while True:
        for mantissa in NICE_STEPS:
            step = mantissa * 10**exponent
            if step >= smallest * (1 - 1e-9):
                yield step
        exponent += 1


def fixed_intervals(low: float, high: float, intervals: int, from_zero: bool = False) -> Scale:
    """The tightest round scale with exactly `intervals` steps that covers low..high."""
    low = 0.0 if from_zero else low
    span = max(high - low, abs(high) * 1e-3, 1e-9)
    for step in nice_steps(span / intervals):
        start = 0.0 if from_zero else math.floor(low / step + 1e-9) * step
        if start + step * intervals >= high - 1e-9:
            return Scale(start, step, intervals)
    raise AssertionError("unreachable: steps grow without bound")


def at_most(high: float, most_intervals: int) -> Scale:
    """A scale from zero to at least `high` with round steps and no more than `most_intervals` of them."""
    for step in nice_steps(max(high, 1e-9) / most_intervals):
        count = math.ceil(high / step - 1e-9)
        if count <= most_intervals:
            return Scale(0.0, step, max(count, 1))
    raise AssertionError("unreachable: steps grow without bound")
