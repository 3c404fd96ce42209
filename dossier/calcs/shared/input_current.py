"""Mains input current, from output power, efficiency and power factor, by the kind of load.

Three load models (protection.load_kind):
- regulated: constant input power, so the most current at low line;
- unregulated-linear: input power as the square of the mains (an unregulated rail into a class-AB amplifier),
  so current in proportion to the mains and the most at high line;
- resistive: current in proportion to the mains, a sine with no bulk capacitor.
When the record is silent, regulated and unregulated-linear are both worked out and each check takes the one
that makes its own verdict harsher.
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass


CAPACITOR_INPUT = "capacitor-input"
TRANSFORMER_CAPACITOR_INPUT = "transformer-capacitor-input"
NO_BULK_CAPACITOR = "no-bulk-capacitor"

REGULATED = "regulated"
UNREGULATED = "unregulated-linear"
RESISTIVE = "resistive"
LOAD_MODELS = {
    REGULATED: "constant power: I = P_in / (pf V)",
    UNREGULATED: "input power as V^2: P_in(V) = P_in (V / V_nom)^2, I = P_in V / (pf V_nom^2)",
    RESISTIVE: "resistive: I = P_in V / (pf V_nom^2), a sine",
}

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
    load_kind: str = REGULATED
    line_name: str = "low"
    load_assumed: bool = False

    @property
    def peak_model(self) -> str:
        return "sine" if self.topology == NO_BULK_CAPACITOR and self.load_kind == RESISTIVE else "half-sine pulses"


def input_topology(record) -> str:
    """A mains transformer in front of the capacitors keeps a unit a transformer input, whatever is declared."""
    transformer = _has_mains_transformer(record)
    if record.protection.load_kind == RESISTIVE:
        return NO_BULK_CAPACITOR
    if _mains_bulk_capacitor(record) or (record.protection.bulk_capacitance is not None and not transformer):
        return CAPACITOR_INPUT
    if transformer and (_has_rectifier(record) or record.protection.secondary_banks or record.protection.bulk_capacitance is not None):
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
    """Running current at the line that gives the most (or least) of it; None without mains or a declared output.

    What the record leaves out is taken at the plausible end that gives the MOST current (for sizing a fuse
    or a limiter) or the LEAST (for judging whether a fuse is too big); so is the load model when
    protection.load_kind is not declared.
    """
    if record.mains is None or record.output is None:
        return None
    topology = input_topology(record)
    pf, efficiency, assumed = _factors(record.output, topology, reading)
    nominal_power = output_power(record.output) / efficiency
    kinds = (record.protection.load_kind,) if record.protection.load_kind else (REGULATED, UNREGULATED)
    found = [_at_worst_line(record.mains, kind, nominal_power, pf, reading) for kind in kinds]
    pick = max if reading == MOST else min
    kind, line_name, line, rms, power = pick(found, key=lambda item: item[3].magnitude)
    crest = math.sqrt(2) if topology == NO_BULK_CAPACITOR and kind == RESISTIVE else crest_factor(pf)
    return InputCurrent(rms, rms * crest, power.to("W"), line.to("V"), pf, efficiency, topology, assumed, kind, line_name,
                        not record.protection.load_kind)


def _at_worst_line(mains, kind: str, nominal_power, pf: float, reading: str):
    """(kind, line name, line voltage, RMS current, input power) at whichever of low and high line the reading wants."""
    candidates = []
    for name, line in (("low", mains.low), ("high", mains.high)):
        scale = 1.0 if kind == REGULATED else float((line / mains.nominal).to("").magnitude) ** 2
        power = nominal_power * scale
        candidates.append((kind, name, line, (power / (line * pf)).to("A"), power))
    pick = max if reading == MOST else min
    return pick(candidates, key=lambda item: item[3].magnitude)


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
        assumed.append(ratio_out_of_range(key, value))
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


def ratio_out_of_range(key: str, value: float) -> str:
    """What an assumed-ratio note says when the declared ratio is not between 0 and 1."""
    return f"{key} between 0 and 100 % (found {value * 100:g} %)"
