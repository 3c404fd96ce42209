"""IEC 61010-1 (edition 3.0, 2010, with amendment 1, 2016; measurement, control and laboratory equipment: bench
supplies and test gear): what dossier can state, and what it cannot.

Searched for and not found in public material: the clearance and creepage tables for mains circuits (Table 4 for
overvoltage category II up to 300 V, the Annex K tables for the rest). dossier holds no figure it cannot source, so
under this standard clearance and creepage raise TableNotHeld: the findings are not assessed, name the missing
table and show what IEC 60664-1 alone would ask, and a safety barrier blocks power-up until the figures are
checked against the standard itself. A refused choice would hide the figures a builder can use; a made-up one
would be worse.

What public material did show: the identical Russian adoption (GOST IEC 61010-1-2014) reproduced on ajdocs.ru
(Table K.11, clearances and test voltages of secondary circuits derived from overvoltage category III mains) and on
docs.cntd.ru (Table C.1, the groove widths 0.25 / 1.0 / 1.5 mm by pollution degree, the same as IEC 60664-1 clause
6.8). Neither is a mains-circuit table, so neither is used for a verdict.
From memory, and said so in each finding:
- Electric strength (Table 5, solid insulation in mains circuits of overvoltage category II up to 300 V): a.c.
  r.m.s. for 5 s, 1 350 V basic / 2 700 V reinforced up to 150 V, 1 500 V / 3 000 V above 150 V up to 300 V. The
  same figures stand in IEC 61010-2-030 Table K.105 (GOST IEC 61010-2-030-2013 on ajdocs.ru), which is not this
  standard, so they stay "from memory". Above 300 V or another category: no figure (Annex K, not held).
- Protective bonding (clause 6.5.2.4): at most 0.1 ohm, tested with 25 A for 1 min.
- Accessible surface temperatures (clause 10.1, Table 19) for metal: 65 degC for an outer surface touched
  unintentionally, 55 degC for knobs and handles held in normal use.
"""

from __future__ import annotations

from dossier.standards.iec60664 import OutsideTable, up_to_and_including
from dossier.standards.product import EarthRule, ProductStandard, Requirement, TableNotHeld, TestVoltage, TouchLimit, TouchLimits

KEY = "iec-61010-1"
EDITION = 3
TITLE = "IEC 61010-1"
EDITION_TEXT = "edition 3.0, 2010, with amendment 1 (2016)"
DOUBLED_GRADES = ("reinforced", "double")
MISSING_CLEARANCE = ("IEC 61010-1 edition 3 Table 4 (clearances of mains circuits, overvoltage category II up to 300 V) "
                     "and its Annex K tables could not be confirmed in public material, so dossier holds no clearance "
                     "figure for this standard")
MISSING_CREEPAGE = ("IEC 61010-1 edition 3 Table 4 (creepage of mains circuits) and its Annex K tables could not be "
                    "confirmed in public material, so dossier holds no creepage figure for this standard")

# Table 5 (from memory): mains nominal (V r.m.s.) up to and including -> (basic, reinforced) test voltage, a.c. r.m.s., 5 s.
TEST_T5 = ((150, (1350, 2700)), (300, (1500, 3000)))
TEST_CATEGORY = "II"
TEST_SECONDS = 5
TEST_WAVEFORM = "a.c. r.m.s."

EARTH = EarthRule(
    limit_ohm=0.1,
    test="25 A a.c. r.m.s. or d.c. for 1 min between the protective conductor terminal and each bonded accessible part",
    clause="clause 6.5.2.4, protective bonding impedance (from memory)",
    confirmed=False,
)

TOUCH = TouchLimits(
    brief=TouchLimit(65, False, "clause 10.1, Table 19: outer surface of an enclosure touched unintentionally, metal (from memory)", False),
    held=TouchLimit(55, False, "clause 10.1, Table 19: knobs and handles held in normal use, metal (from memory)", False),
)


def clearance(impulse_v: float, pollution_degree: int, grade: str, **_conditions) -> Requirement:
    raise TableNotHeld(MISSING_CLEARANCE)


def creepage(working_v: float, pollution_degree: int, group: str, printed_board: bool, grade: str) -> Requirement:
    raise TableNotHeld(MISSING_CREEPAGE)


def test_voltage(grade: str, mains_v: float | None, working_v: float, impulse_v: float, *, category: str = TEST_CATEGORY,
                 **_conditions) -> TestVoltage:
    """Table 5 (from memory) for mains circuits of overvoltage category II up to 300 V; the mains nominal, or the
    working voltage of a barrier off the mains."""
    if category != TEST_CATEGORY:
        raise OutsideTable(f"IEC 61010-1 Table 5 is for overvoltage category II; category {category} needs Annex K, not held")
    rated = mains_v if mains_v is not None else working_v
    row, by_kind = up_to_and_including(TEST_T5, rated, "IEC 61010-1 Table 5 (V mains nominal)")
    kind = "reinforced" if grade in DOUBLED_GRADES else "basic or supplementary"
    volts = by_kind[1] if grade in DOUBLED_GRADES else by_kind[0]
    notes = ("the same figures stand in IEC 61010-2-030 Table K.105, which is not this standard; the 5 s duration is "
             "from memory too",)
    return TestVoltage(volts, TEST_WAVEFORM, TEST_SECONDS, f"Table 5, mains up to {row:g} V, {kind} insulation", False, notes)


STANDARD = ProductStandard(KEY, EDITION, TITLE, EDITION_TEXT, clearance, creepage, test_voltage, EARTH, TOUCH)
