"""Protective earth: touchable metal and an earth terminal must have a declared bond, and a described bond is a claim to verify."""

from __future__ import annotations

import dataclasses
import re

from dossier.calcs.protection import words
from dossier.calcs.protection.common import finding, measure
from dossier.citations import IEC_61140
from dossier.findings import Verdict, common_practice

CLASS_I = dataclasses.replace(IEC_61140, edition="edition 4.0, 2016 (from memory)",
                              clause="7.3, class I equipment: accessible conductive parts connected to the protective conductor (clause number from memory)")
CLASS_II_METAL = common_practice("a class II unit in a metal case says how the case is kept from live parts (double or reinforced insulation)")
CLAIM_TO_VERIFY = common_practice("a bond described in words is verified by a continuity test at the standard's test current, not by reading the description")
KEYS = (("protection", "earth", "bonding"),)
# Words that say there is no bond: 'none', 'no', 'n/a', 'not bonded', 'unbonded', 'floating', '-'.
NO_BOND = re.compile(r"^\s*(none|no|nil|n/?a|-+|not bonded|unbonded|floating|no bond|not earthed|unearthed)\s*\.?\s*$", re.IGNORECASE)


def earth_findings(record) -> list:
    if record.mains is None:
        return []
    earth = record.protection.earth
    if earth is None:
        return [_terminal_unbonded() if has_earth_terminal(record) else _undeclared()]
    bonded = declares_bond(earth.bonding)
    if bonded:
        return [_claimed(earth)]
    if earth.protective_class == "I":
        return [_class_i_unbonded(earth)]
    if earth.enclosure == "metal":
        return [_class_ii_metal(earth)]
    return []


def declares_bond(bonding: str) -> bool:
    """Text that describes a bond; blank text or a word for 'none' does not."""
    return bool(bonding.strip()) and not NO_BOND.match(bonding)


def has_earth_terminal(record) -> bool:
    """An inlet or terminal on the mains side whose role or value mentions earth."""
    return any(
        part.kind in ("inlet", "terminal") and "earth" in f"{part.role} {part.value}".lower()
        for stage in record.stages if stage.side == "mains" for part in stage.parts
    )


def _terminal_unbonded():
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Earth terminal with no declared bond", verdict=Verdict.FAIL,
                   explanation=words.EARTH_TERMINAL_UNBONDED + words.add_text(["protection.earth (protective_class, enclosure, bonding)"]),
                   keys=(("protection",),), sources=(CLASS_I,))


def _undeclared():
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Earthing not declared", verdict=Verdict.INFO,
                   explanation=words.EARTH_NOT_DECLARED + words.add_text(["protection.earth (protective_class, enclosure, bonding)"]),
                   keys=(("protection",),), sources=(CLASS_I,))


def _claimed(earth):
    """A bond in words is information to verify on the checklist, never a pass."""
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Earth bond described: verify it", verdict=Verdict.INFO,
                   values=(measure("bonding", earth.bonding.strip()), measure("protective class", earth.protective_class),
                           measure("enclosure", earth.enclosure)),
                   explanation=words.bond_claimed_text(earth.bonding.strip()), keys=KEYS, sources=(CLASS_I, CLAIM_TO_VERIFY))


def _class_i_unbonded(earth):
    where = words.unbonded_where(earth.enclosure == "metal")
    return finding(code="PROT-EARTH-BOND", subject="earth", title="No earth bond", verdict=Verdict.FAIL,
                   values=(measure("enclosure", earth.enclosure), measure("bonding", earth.bonding.strip())),
                   explanation=words.class_i_unbonded_text(where, bool(earth.bonding.strip())) + words.add_text(["protection.earth.bonding"]),
                   keys=KEYS, sources=(CLASS_I,))


def _class_ii_metal(earth):
    return finding(code="PROT-EARTH-BOND", subject="earth", title="Metal case of a class II unit", verdict=Verdict.MARGINAL,
                   values=(measure("enclosure", earth.enclosure),), explanation=words.CLASS_II_METAL + words.add_text(["protection.earth.bonding"]),
                   keys=KEYS, sources=(CLASS_II_METAL,))
