"""Protective earth: touchable metal and an earth terminal must have a declared bond."""

from __future__ import annotations

import dataclasses

from dossier.calcs.protection.common import add_text, finding, measure
from dossier.citations import IEC_61140
from dossier.findings import Verdict, common_practice

CLASS_I = dataclasses.replace(IEC_61140, clause="class I equipment: accessible conductive parts connected to the protective conductor")
CLASS_II_METAL = common_practice("a class II unit in a metal case says how the case is kept from live parts (double or reinforced insulation)")
KEYS = (("protection", "earth", "bonding"),)


def earth_findings(record) -> list:
    if record.mains is None:
        return []
    earth = record.protection.earth
    if earth is None:
        return [_terminal_unbonded() if has_earth_terminal(record) else _undeclared()]
    if earth.bonding.strip():
        return [_declared(earth)]
    if earth.protective_class == "I":
        return [_class_i_missing(earth)]
    if earth.enclosure == "metal":
        return [_class_ii_metal(earth)]
    return []


def has_earth_terminal(record) -> bool:
    """An inlet or terminal on the mains side whose role or value mentions earth."""
    return any(
        part.kind in ("inlet", "terminal") and "earth" in f"{part.role} {part.value}".lower()
        for stage in record.stages if stage.side == "mains" for part in stage.parts
    )


def _terminal_unbonded():
    text = ("The mains inlet has a protective-earth terminal, but the record does not say what it is bonded to. "
            "An earth pin that goes nowhere protects nothing.")
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Earth terminal with no declared bond", verdict=Verdict.FAIL,
                   explanation=text + add_text(["protection.earth (protective_class, enclosure, bonding)"]),
                   keys=(("protection",),), sources=(CLASS_I,))


def _undeclared():
    text = "The record does not say whether the unit is class I or class II, nor how touchable metal is earthed."
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Earthing not declared", verdict=Verdict.INFO,
                   explanation=text + add_text(["protection.earth (protective_class, enclosure, bonding)"]),
                   keys=(("protection",),), sources=(CLASS_I,))


def _declared(earth):
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Earth bonding declared", verdict=Verdict.PASS,
                   values=(measure("bonding", earth.bonding.strip()),),
                   explanation="Check the bond's continuity before power-up.", keys=KEYS, sources=(CLASS_I,))


def _class_i_missing(earth):
    where = "the metal enclosure" if earth.enclosure == "metal" else "touchable metal parts"
    text = (f"The unit is class I but the record does not say how protective earth is bonded to {where}. "
            "If that bond is missing or loose, a fault from the mains to the case leaves the case live and nothing trips: "
            "whoever touches it takes the fault current. Say how the earth lead is fixed (stud, star washer, locknut, crimped "
            "ring terminal) and have it checked by a qualified person.")
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Earth bond not declared", verdict=Verdict.FAIL,
                   values=(measure("enclosure", earth.enclosure),), explanation=text + add_text(["protection.earth.bonding"]),
                   keys=KEYS, sources=(CLASS_I,))


def _class_ii_metal(earth):
    text = ("The unit is class II in a metal enclosure, and the record does not say how the case is kept from live parts. "
            "State the double or reinforced insulation that does it, or bond the case to earth and declare class I.")
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Metal case of a class II unit", verdict=Verdict.MARGINAL,
                   values=(measure("enclosure", earth.enclosure),), explanation=text + add_text(["protection.earth.bonding"]),
                   keys=KEYS, sources=(CLASS_II_METAL,))
