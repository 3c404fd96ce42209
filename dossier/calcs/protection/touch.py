"""Touch current through the Y capacitors: what the capacitance from the mains to accessible parts lets flow.

I = 2 pi f C V at high line, with every Y capacitor (line to earth, across a barrier) taken in parallel across the
whole line voltage: the harsher reading (a broken protective earth, or the open neutral, puts each of them there).
The limit follows the unit's protective class (IEC 60335-1 clause 16.2): 0.25 mA for a class II unit, 0.75 mA for a
class I portable unit; IEC 62368-1 allows 0.5 mA (ES1) for equipment under it, so between 0.5 and 0.75 mA a class I
unit is marginal. A class not declared is read as class II.
"""

from __future__ import annotations

import dataclasses
import math

from dossier.calcs.protection import words
from dossier.calcs.protection.common import finding, measure
from dossier.calcs.shared import variac
from dossier.calcs.shared.finding_kit import banded, not_assessed
from dossier.citations import IEC_60335_1, IEC_62368_1
from dossier.findings import common_practice
from dossier.units import Q_

TOUCH = "PROT-TOUCH-CURRENT"
Y_POSITIONS = ("line-to-earth", "across-barrier")
LIMITS = {"I": Q_(0.75, "mA"), "II": Q_(0.25, "mA")}
ES1_LIMIT = Q_(0.5, "mA")
Y_TOLERANCE = 0.2  # Y capacitors are usually +-20 % (common practice, from memory)

LEAKAGE_LIMITS = dataclasses.replace(IEC_60335_1, clause=(
    "16.2 and 13.2, leakage current: class II 0.25 mA, class 0, 0I and III 0.5 mA, class I portable 0.75 mA, class I "
    "stationary motor-operated 3.5 mA (figures confirmed in a public quotation of the clause)"))
ES1_SOURCE = dataclasses.replace(IEC_62368_1, edition="edition 3.0, 2018", clause=(
    "5.2.2.2, Table 4: ES1 touch current 0.5 mA r.m.s. (from memory)"))
CAPACITIVE_CURRENT = common_practice("current through a capacitor on a sine supply I = 2 pi f C V (circuit theory); Y capacitors +-20 % (from memory)")
SOURCES = (LEAKAGE_LIMITS, ES1_SOURCE, CAPACITIVE_CURRENT)
CLASS_KEY = ("protection", "earth", "protective_class")


def limit_for(protective_class: str | None):
    """(hard limit, the figure a pass must meet): class II or undeclared 0.25 mA; class I 0.75 mA, a pass under 0.5 mA."""
    if protective_class == "I":
        return LIMITS["I"], ES1_LIMIT
    return LIMITS["II"], LIMITS["II"] * (1 - Y_TOLERANCE)


def touch_findings(record) -> list:
    if record.mains is None:
        return []
    found = [(i, c) for i, c in enumerate(record.devices.capacitors) if c.position in Y_POSITIONS]
    if not found:
        return []
    keys = tuple(("devices", "capacitors", i, "capacitance") for i, _ in found) + (CLASS_KEY,)
    missing = [c.ref for _, c in found if c.capacitance is None]
    title = "Touch current through the Y capacitors"
    if missing:
        return [not_assessed("protection", TOUCH, "touch current", title, words.touch_missing(missing), keys, SOURCES, guards_hazard=True)]
    total = sum((c.capacitance / c.in_series for _, c in found), Q_(0, "nF")).to("nF")
    lines = {c.ref: variac.part_high_line(record, c.ref) for _, c in found}
    raised = [ref for ref, (_, behind) in lines.items() if behind]
    volts, hertz = max(v for v, _ in lines.values()), record.mains.frequency.to("Hz")
    current = (2 * math.pi * hertz * sum((c.capacitance / c.in_series * lines[c.ref][0] for _, c in found), Q_(0, "nF V"))).to("mA")
    klass = record.protection.earth.protective_class if record.protection.earth else None
    limit, wanted = limit_for(klass)
    verdict = banded(current, wanted, limit, "<=")
    explanation = words.touch_text(klass, [c.ref for _, c in found], verdict, wanted)
    if raised:
        explanation += " " + words.touch_behind_variac(raised, record.protection.variac.ref, volts)
    return [finding(
        code=TOUCH, subject="touch current", title=title, verdict=verdict,
        values=(measure("touch current at high line", current),), limit=measure(f"limit for class {klass or 'II'}", limit), relation="<=",
        method="I = 2 pi f sum(C_Y V_high), every Y capacitor in parallel across the whole line voltage it sits on (a variac's top of scale behind it)",
        explanation=explanation,
        keys=keys + (("mains", "nominal"), ("mains", "tolerance"), ("mains", "frequency")) + ((variac.VARIAC_KEY,) if raised else ()),
        sources=SOURCES + ((variac.VARIAC_PRACTICE,) if raised else ()), guards_hazard=True,
        extra=(measure("total Y capacitance", total), measure("high-line voltage", volts), measure("mains frequency", hertz),
               measure("figure a pass must meet", wanted)),
    )]
