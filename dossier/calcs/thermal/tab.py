"""A live tab on a heatsink: which grade of insulation the pad must give, from where the heatsink sits.

A pad and bush are at most basic insulation. A sink that cannot be touched and is not earthed is itself live
(no pad needed, count it as mains). An earthed sink needs basic insulation (else the mains is shorted to earth);
a touchable sink is safe with basic insulation only when it is protectively earthed in a class I unit.
Otherwise a touchable sink needs double or reinforced insulation, with creepage and clearance round the pad
and screw: a barrier of that grade that lists the device or the sink, so the isolation calc checks them
(IEC 61140, clauses on class I and class II equipment; IEC 62368-1 clause 5.4 for the insulation grades).
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.findings import Verdict

DOUBLED = ("reinforced", "double")


@dataclass(frozen=True)
class TabNeed:
    """What the insulation between a live tab and its heatsink must be, and why."""

    grade: str | None  # None: the sink is live itself, no insulation asked
    why: str  # a key into words.TAB_NEED
    keys: tuple


def need_of(record, heatsink_index: int, heatsink) -> TabNeed:
    sink_key = ("devices", "heatsinks", heatsink_index)
    class_key = ("protection", "earth", "protective_class")
    if not heatsink.touchable:
        return TabNeed("basic", "earthed-out-of-reach", (sink_key,)) if heatsink.earthed else TabNeed(None, "floating", (sink_key,))
    if not heatsink.earthed:
        return TabNeed("reinforced", "touchable-unearthed", (sink_key,))
    protective_class = _protective_class(record)
    if protective_class == "I":
        return TabNeed("basic", "protectively-earthed", (sink_key, class_key))
    why = "class-ii-earthed" if protective_class == "II" else "class-unknown"
    return TabNeed("reinforced", why, (sink_key, class_key))


def _protective_class(record) -> str | None:
    earth = record.protection.earth
    return earth.protective_class if earth is not None else None


def grade_of(device) -> str | None:
    """The grade the record gives the pad: declared, else basic for a pad and bush, else none."""
    if device.insulation is not None:
        return device.insulation
    return "basic" if device.insulated else None


def barrier_round(record, device, heatsink):
    """(index, barrier) of a double or reinforced barrier that lists the device or its heatsink, or None."""
    for index, barrier in enumerate(record.barriers):
        if barrier.grade in DOUBLED and {device.ref, heatsink.ref} & set(barrier.parts):
            return index, barrier
    return None


def verdict_of(need: TabNeed, grade: str | None, barrier) -> tuple[Verdict, str]:
    """(verdict, outcome) where outcome is a key into words.TAB_OUTCOME."""
    if need.grade is None:
        return Verdict.INFO, "live-sink"
    if grade is None:
        return Verdict.FAIL, "no-pad"
    if need.grade == "basic":
        return Verdict.PASS, "basic-enough"
    if grade not in DOUBLED:
        return Verdict.FAIL, "basic-only"
    if barrier is None:
        return Verdict.FAIL, "no-barrier"
    return Verdict.PASS, "doubled"
