"""Mains input current, from output power, efficiency and power factor at low line."""

from __future__ import annotations

import math
import re
from dataclasses import dataclass

from dossier.calcs.protection import words

CAPACITOR_INPUT = "capacitor-input"
TRANSFORMER_CAPACITOR_INPUT = "transformer-capacitor-input"
NO_BULK_CAPACITOR = "no-bulk-capacitor"

MOST = "most"
LEAST = "least"
# Plausible power factor by input when none is declared, (lowest, highest); sources in common.PLAUSIBLE_POWER_FACTORS.
# A check takes the end that makes its own verdict harsher: the lowest for "is the fuse big enough", the highest
# for "is the fuse too big".
PLAUSIBLE_POWER_FACTOR = {CAPACITOR_INPUT: (0.4, 0.6), TRANSFORMER_CAPACITOR_INPUT: (0.55, 0.8), NO_BULK_CAPACITOR: (0.7, 1.0)}
PLAUSIBLE_EFFICIENCY = (0.6, 0.9)
_BULK_ROLE = re.compile(r"bulk|split|reservoir|smoothing", re.IGNORECASE)


@dataclass(frozen=True)
class InputCurrent:
    rms: object
    peak: object
    input_power: object
    low_line: object
    power_factor: float
    efficiency: float
    topology: str
    assumed: tuple[str, ...]


def input_topology(record) -> str:
    if record.protection.bulk_capacitance is not None or _mains_bulk_capacitor(record):
        return CAPACITOR_INPUT
    if _has_mains_transformer(record) and _has_rectifier(record):
        return TRANSFORMER_CAPACITOR_INPUT
    return NO_BULK_CAPACITOR


def _mains_bulk_capacitor(record) -> bool:
    return any(
        part.kind == "capacitor" and _BULK_ROLE.search(part.role)
        for stage in record.stages if stage.side == "mains" for part in stage.parts
    )


def _has_mains_transformer(record) -> bool:
    return any(magnetic.role == "mains-transformer" for magnetic in record.magnetics)


def _has_rectifier(record) -> bool:
    return any(stage.kind == "rectifier" for stage in record.stages)


def has_inrush(record) -> bool:
    """Whether switch-on draws a surge: a capacitor to charge or a transformer core to magnetise."""
    return input_topology(record) != NO_BULK_CAPACITOR or _has_mains_transformer(record)


def output_power(output):
    if output.power is not None:
        return output.power.to("W")
    return (output.voltage * output.current).to("W")


def input_current(record, reading: str = MOST) -> InputCurrent | None:
    """Running current at low line; None without mains or a declared output.

    What the record leaves out is taken at the plausible end that gives the MOST current (for sizing a fuse
    or a limiter) or the LEAST (for judging whether a fuse is too big).
    """
    if record.mains is None or record.output is None:
        return None
    topology = input_topology(record)
    pf, efficiency, assumed = _factors(record.output, topology, reading)
    input_power = output_power(record.output) / efficiency
    rms = (input_power / (record.mains.low * pf)).to("A")
    return InputCurrent(rms, rms * crest_factor(pf), input_power.to("W"), record.mains.low.to("V"), pf, efficiency, topology, assumed)


def _factors(output, topology: str, reading: str) -> tuple[float, float, tuple[str, ...]]:
    end = 0 if reading == MOST else 1
    assumed: list[str] = []
    pf = _ratio(output.power_factor, "output.power_factor", PLAUSIBLE_POWER_FACTOR[topology][end], assumed)
    efficiency = _ratio(output.efficiency, "output.efficiency", PLAUSIBLE_EFFICIENCY[end], assumed)
    return pf, efficiency, tuple(assumed)


def _ratio(quantity, key: str, typical: float, assumed: list[str]) -> float:
    """The declared ratio, or the plausible one with a note of what to add or correct."""
    if quantity is None:
        assumed.append(key)
        return typical
    value = float(quantity.to("").magnitude)
    if not 0 < value <= 1:
        assumed.append(words.ratio_out_of_range(key, value))
        return typical
    return value


def pulse_power_factor(angle: float) -> float:
    """Power factor of half-sine current pulses `angle` radians wide, centred on the voltage crest.

    Fundamental over total RMS current, from the Fourier series of the pulse train; 1 for angle = pi.
    """
    if angle >= math.pi - 1e-9:
        return 1.0
    a = math.pi / angle
    fundamental = (2 / math.pi) * math.cos(angle / 2) * 2 * a / (a * a - 1)
    return fundamental * math.sqrt(math.pi / angle)


def conduction_angle(power_factor: float) -> float:
    """The pulse width (radians) whose power factor is the given one; bisection, the relation is monotonic."""
    low, high = 1e-6, math.pi
    for _ in range(60):
        middle = (low + high) / 2
        if pulse_power_factor(middle) < power_factor:
            low = middle
        else:
            high = middle
    return (low + high) / 2


def crest_factor(power_factor: float) -> float:
    """Peak over RMS current of the half-sine pulse train: sqrt(2 pi / angle); sqrt 2 for a sine."""
    return math.sqrt(2 * math.pi / conduction_angle(power_factor))
