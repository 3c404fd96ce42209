"""The RMS current in each winding: declared, or derived from the output rating where the waveform allows."""

from __future__ import annotations

import math
from dataclasses import dataclass

POWER_ROLES = ("transformer", "mains-transformer")


@dataclass(frozen=True)
class WindingCurrent:
    value: object
    basis: str


def winding_current(record, magnetic, winding, drive) -> WindingCurrent | None:
    """Declared current first; else a primary or sole secondary of a square-wave power transformer."""
    if winding.current is not None:
        return WindingCurrent(winding.current, "declared")
    if record.output is None or magnetic.role not in POWER_ROLES or drive is None:
        return None
    if winding.role == "secondary" and drive.waveform == "square" and _sole_secondary(magnetic):
        return _secondary(record.output, winding)
    if winding.role == "primary" and winding.name == drive.winding:
        return _primary(record.output, drive)
    return None


def _sole_secondary(magnetic) -> bool:
    return sum(1 for w in magnetic.windings if w.role == "secondary") == 1


def _secondary(output, winding) -> WindingCurrent:
    """A choke-input rectifier draws a square current of the output current's height."""
    if winding.centre_tap:
        return WindingCurrent(output.current / math.sqrt(2), "output current / sqrt 2: each half conducts half the time")
    return WindingCurrent(output.current, "output current: a square current through a bridge")


def _primary(output, drive) -> WindingCurrent:
    """Input power over the primary's RMS voltage at low line, where it is highest."""
    power = output.power if output.power is not None else output.voltage * output.current
    efficiency = 1.0 if output.efficiency is None else float(output.efficiency.to("").magnitude)
    assumed = "" if output.efficiency is not None else " (no efficiency declared: 100 % taken, which understates it)"
    current = (power / efficiency / drive.rms["low"]).to("A")
    return WindingCurrent(current, f"output power / efficiency / primary RMS voltage at low line{assumed}")
