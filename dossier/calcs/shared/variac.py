"""A variac's top of scale as the mains of everything it feeds: its output at the top of the scale can exceed its
input (e.g. 260 V from 230 V), so what it feeds is judged at that voltage, and at high line at that voltage times
(1 + the mains tolerance) (common practice: a variac's top of scale sets the voltage of everything it feeds)."""

from __future__ import annotations

from dossier.calcs.shared.stage_graph import stage_of, upstream
from dossier.findings import common_practice

VARIAC_PRACTICE = common_practice("a variac's top of scale sets the voltage of everything it feeds; their ratings are compared with it")
VARIAC_KEY = ("protection", "variac", "top_voltage")


def fed_voltage(record):
    """(nominal, high line) of what a variac feeds: its top of scale; else the mains."""
    variac = record.protection.variac
    nominal = variac.top_voltage if variac is not None else record.mains.nominal
    return nominal.to("V"), (nominal * (1 + record.mains.tolerance.to("").magnitude)).to("V")


def raises_mains(record) -> bool:
    """The record declares a variac whose top of scale is above the mains nominal."""
    variac = record.protection.variac
    return variac is not None and record.mains is not None and variac.top_voltage > record.mains.nominal


def scale(record) -> float:
    """Top of scale over the mains nominal (at least 1): how much higher than the mains what it feeds can be."""
    if not raises_mains(record):
        return 1.0
    return float((record.protection.variac.top_voltage / record.mains.nominal).to("").magnitude)


def feeds(record, stage_id: str) -> bool:
    """The variac's stage is this stage or one above it in the stage graph; a variac in no stage is read as feeding
    everything (the harsher reading)."""
    if not raises_mains(record):
        return False
    ref = record.protection.variac.ref
    if not any(part.ref == ref for stage in record.stages for part in stage.parts):
        return True
    return any(part.ref == ref for _, stage in upstream(record, stage_id) for part in stage.parts)


def part_high_line(record, ref: str):
    """(high-line voltage, raised) across a part on the mains: the variac's top of scale at high line when the variac
    feeds the part's stage, or the part is in no stage while a variac raises the mains (the harsher reading); else
    the mains at high line."""
    found = stage_of(record, ref)
    if raises_mains(record) and (found is None or feeds(record, found[1].id)):
        return fed_voltage(record)[1], True
    return record.mains.high.to("V"), False
