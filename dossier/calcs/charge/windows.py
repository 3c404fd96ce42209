"""Judging a value against a window (low..high), as the charge calc does for setpoints and currents."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.findings import Measure, Verdict
from dossier.standards.battery import Window

DIGITS = 9  # window edges are products like 2.35 x 6; compare past their rounding noise


@dataclass(frozen=True)
class WindowJudgement:
    verdict: Verdict
    limit: Measure
    relation: str


def inside(value, low, high) -> bool:
    units = value.units
    number = round(value.magnitude, DIGITS)
    return round(low.to(units).magnitude, DIGITS) <= number <= round(high.to(units).magnitude, DIGITS)


def nearer_edge(value, window: Window, what: str) -> tuple[Measure, str]:
    """The edge the value is outside of, or the closer one when it is inside, with the relation to meet it."""
    below_gap = (value - window.low).to(value.units).magnitude
    above_gap = (window.high - value).to(value.units).magnitude
    if below_gap < 0 or (above_gap >= 0 and below_gap <= above_gap):
        return Measure(f"low end of the {what} window", window.low.to(value.units)), ">="
    return Measure(f"high end of the {what} window", window.high.to(value.units)), "<="


def judge_window(value, window: Window, what: str, outside: Verdict = Verdict.FAIL, band=None) -> WindowJudgement:
    """FAIL (or `outside`) when the value leaves the window; MARGINAL when its tolerance band does."""
    limit, relation = nearer_edge(value, window, what)
    if not inside(value, window.low, window.high):
        return WindowJudgement(outside, limit, relation)
    if band is not None and not all(inside(edge, window.low, window.high) for edge in band):
        return WindowJudgement(Verdict.MARGINAL, limit, relation)
    return WindowJudgement(Verdict.PASS, limit, relation)


def tolerance_band(value, tolerance) -> tuple | None:
    """(lowest, highest) the value may sit at with the declared tolerance, or None without one."""
    if tolerance is None:
        return None
    fraction = tolerance.to("").magnitude
    return value * (1 - fraction), value * (1 + fraction)
