"""The RMS current in each winding: declared, or derived from the output rating where the waveform allows."""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.calcs.shared.input_current import input_current

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
        return _primary(record, magnetic, drive)
    return None


def _sole_secondary(magnetic) -> bool:
    return sum(1 for w in magnetic.windings if w.role == "secondary") == 1


def _secondary(output, winding) -> WindingCurrent:
    """A choke-input rectifier draws a square current of the output current's height."""
    if winding.centre_tap:
        return WindingCurrent(output.current / math.sqrt(2), "output current / sqrt 2: each half conducts half the time")
    return WindingCurrent(output.current, "output current: a square current through a bridge")


def _primary(record, magnetic, drive) -> WindingCurrent | None:
    """The protection calc's input current: a mains transformer's primary carries it; a converter's takes its power.

    A mains transformer's primary is in series with the mains, so it carries the mains input current at low line,
    power factor included. A converter transformer's primary takes the same input power (output power / efficiency)
    at its own RMS voltage at low line.
    """
    running = input_current(record)
    if running is None:
        return None
    assumed = _assumed_words(running.assumed)
    if magnetic.role == "mains-transformer" and drive.waveform == "sine" and drive.follows_mains:
        return WindingCurrent(running.rms.to("A"), "the mains input current at low line (as the protection calc works it out: "
                                                   f"power factor {running.power_factor:g}, efficiency {running.efficiency:g}){assumed}")
    current = (running.input_power / drive.rms["low"]).to("A")
    return WindingCurrent(current, f"input power ({running.input_power.magnitude:.4g} W at efficiency {running.efficiency:g}, as the "
                                   f"protection calc takes it) / primary RMS voltage at low line{assumed}")


def _assumed_words(assumed) -> str:
    return "" if not assumed else f"; typical value taken for {', '.join(assumed)} (declare it to make this exact)"
