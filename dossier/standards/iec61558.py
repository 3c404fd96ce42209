"""IEC 61558-1 (edition 3.0, 2017; safety of transformers, reactors and power supply units) tables as data.

Where each figure was confirmed: Tables 14, 20 and 21 below are those of one public transcription of the edition 3
tables in open-source code (the OpenMagnetics MKF project, file src/data/insulation_standards/IEC_61558-1.json),
and they agree with the basic standard where it can be checked: Table 20's overvoltage category II rows are IEC
60664-1 Table F.2 at the Table F.1 impulse voltage (300 V: 2 500 V, 1.5 mm basic; reinforced 3.0 mm, F.2 at
4 000 V), and Table 21's pollution-degree-2 basic rows are Table F.5 carried to the 300 V row (group I 1.5 mm,
II 2.1 mm, IIIa 3.0 mm). One transcription is not the standard: the findings say "confirmed in one public
transcription" and the docs list it.
- Table 20 (clearances) by working voltage, overvoltage category, pollution degree 2 or 3; basic and
  supplementary alike, reinforced and double alike. It has no pollution-degree-1 column: PD1 takes the PD2
  column (larger or equal; the harsher reading).
- Table 21 (creepage) by working voltage, material group, pollution degree 1 to 3; no printed-board column.
- Table 14 (electric-strength test voltages, V r.m.s.) by working voltage and overvoltage category.
From memory: the 60 s test duration (clause 18.3) and the protective-earth rule (clause 9.x / 27, 0.1 ohm).

Between rows every lookup takes the next row up (the harsher reading); outside the rows it raises OutsideTable.
"""

from __future__ import annotations

from dossier.standards.iec60664 import OutsideTable, up_to_and_including
from dossier.standards.product import EarthRule, ProductStandard, Requirement, TestVoltage

KEY = "iec-61558-1"
EDITION = 3
TITLE = "IEC 61558-1"
EDITION_TEXT = "edition 3.0, 2017"
DOUBLED_GRADES = ("reinforced", "double")
CATEGORIES = ("I", "II", "III", "IV")
ROWS_V = (50, 100, 150, 300, 600, 1000)  # working voltage r.m.s., up to and including

# Table 20: category -> grade kind -> pollution degree -> clearance (mm) by ROWS_V.
CLEARANCE_T20 = {
    "I": {"basic": {2: (0.2, 0.2, 0.2, 0.5, 1.5, 3.0), 3: (0.8, 0.8, 0.8, 0.8, 1.5, 3.0)},
          "reinforced": {2: (0.2, 0.2, 0.5, 1.5, 3.0, 5.5), 3: (0.8, 0.8, 0.8, 1.5, 3.0, 5.5)}},
    "II": {"basic": {2: (0.2, 0.2, 0.5, 1.5, 3.0, 5.5), 3: (0.8, 0.8, 0.8, 1.5, 3.0, 5.5)},
           "reinforced": {2: (0.2, 0.5, 1.5, 3.0, 5.5, 8.0), 3: (0.8, 0.8, 1.5, 3.0, 5.5, 8.0)}},
    "III": {"basic": {2: (0.2, 0.5, 1.5, 3.0, 5.5, 8.0), 3: (0.8, 0.8, 1.5, 3.0, 5.5, 8.0)},
            "reinforced": {2: (0.5, 1.5, 3.0, 5.5, 8.0, 14.0), 3: (0.8, 1.5, 3.0, 5.5, 8.0, 14.0)}},
    "IV": {"basic": {2: (0.5, 1.5, 3.0, 5.5, 8.0, 14.0), 3: (0.8, 1.5, 3.0, 5.5, 8.0, 14.0)},
           "reinforced": {2: (1.5, 3.0, 5.5, 8.0, 14.0, 25.0), 3: (1.5, 3.0, 5.5, 8.0, 14.0, 25.0)}},
}

# Table 21: material group -> grade kind -> pollution degree -> creepage (mm) by ROWS_V.
_LOW = {1: (0.18, 0.25, 0.3, 0.7, 1.7, 3.2)}
_LOW_REINFORCED = {1: (0.25, 0.4, 0.7, 1.7, 4.0, 7.5)}
CREEPAGE_T21 = {
    "I": {"basic": {**_LOW, 2: (0.6, 0.7, 0.8, 1.5, 3.0, 5.5), 3: (1.5, 1.8, 2.0, 3.9, 7.7, 12.5)},
          "reinforced": {**_LOW_REINFORCED, 2: (0.7, 1.0, 1.6, 3.0, 6.0, 10.0), 3: (1.8, 2.5, 4.2, 7.7, 16.0, 25.0)}},
    "II": {"basic": {**_LOW, 2: (0.9, 1.0, 1.1, 2.1, 4.3, 7.1), 3: (1.7, 2.0, 2.2, 4.2, 8.6, 14.0)},
           "reinforced": {**_LOW_REINFORCED, 2: (1.0, 1.4, 2.0, 4.3, 8.6, 14.0), 3: (2.0, 2.8, 4.2, 8.6, 17.2, 28.0)}},
    "IIIa": {"basic": {**_LOW, 2: (1.2, 1.4, 1.6, 3.0, 6.0, 10.0), 3: (1.9, 2.2, 2.5, 4.7, 9.5, 16.0)},
             "reinforced": {**_LOW_REINFORCED, 2: (1.4, 2.0, 3.0, 6.0, 12.0, 20.0), 3: (2.2, 3.0, 4.7, 9.5, 19.2, 32.0)}},
    "IIIb": {"basic": {**_LOW, 2: (1.2, 1.4, 1.6, 3.0, 6.0, 10.0), 3: (1.9, 2.2, 2.5, 4.7, 9.5, 16.0)},
             "reinforced": {1: (0.36, 0.5, 0.7, 1.7, 4.0, 7.5), 2: (2.4, 2.8, 3.2, 6.0, 12.0, 20.0),
                            3: (3.8, 4.4, 5.0, 9.5, 19.2, 32.0)}},
}

# Table 14: category -> grade kind -> test voltage (V r.m.s.) by ROWS_V.
TEST_T14 = {
    "I": {"basic": (250, 350, 700, 1100, 1500, 2250), "reinforced": (500, 700, 1400, 2200, 3000, 4500)},
    "II": {"basic": (250, 500, 1250, 1500, 2100, 2500), "reinforced": (500, 1000, 2500, 3000, 4200, 5000)},
    "III": {"basic": (250, 700, 1400, 2100, 2500, 2750), "reinforced": (500, 1400, 2800, 4200, 5000, 5500)},
    "IV": {"basic": (250, 850, 1700, 2500, 2800, 3000), "reinforced": (500, 1700, 3400, 5000, 5600, 6000)},
}
TEST_SECONDS = 60
TEST_WAVEFORM = "a.c. r.m.s., 50 or 60 Hz"
PROVENANCE_NOTE = "confirmed in one public transcription of the table"

EARTH = EarthRule(
    limit_ohm=0.1,
    test="a current of 25 A from a source of no more than 12 V for 1 min, resistance from the voltage drop",
    clause="the protective-earth continuity clause (limit, test and clause number from memory)",
    confirmed=False,
)


def clearance(impulse_v: float, pollution_degree: int, grade: str, *, working_v: float, category: str, **_conditions) -> Requirement:
    """Table 20, entered with the working voltage in the column of the overvoltage category."""
    if pollution_degree not in (1, 2, 3):
        raise OutsideTable("IEC 61558-1 Table 20 gives clearances for pollution degrees 2 and 3 only")
    column = 2 if pollution_degree == 1 else pollution_degree
    row, value = _lookup(CLEARANCE_T20[_category(category)][_kind(grade)][column], working_v, "IEC 61558-1 Table 20 (V working)")
    notes = [_between_rows(working_v, row)] if working_v != row else []
    if pollution_degree == 1:
        notes.append("Table 20 has no pollution-degree-1 column: the pollution-degree-2 column is used (the harsher reading)")
    table = f"Table 20, {row:g} V row, overvoltage category {category}, {_kind_words(grade)}, pollution degree {column}"
    return Requirement(value, table, True, tuple(notes))


def creepage(working_v: float, pollution_degree: int, group: str, printed_board: bool, grade: str) -> Requirement:
    """Table 21 by working voltage, material group and pollution degree; reinforced from its own column."""
    if pollution_degree not in (1, 2, 3):
        raise OutsideTable("IEC 61558-1 Table 21 gives creepage for pollution degrees 1 to 3 only")
    row, value = _lookup(CREEPAGE_T21[group][_kind(grade)][pollution_degree], working_v, "IEC 61558-1 Table 21 (V working)")
    notes = [_between_rows(working_v, row)] if working_v != row else []
    if printed_board:
        notes.append("Table 21 has no printed-board column, so the general column is used")
    table = f"Table 21, {row:g} V row, material group {group}, {_kind_words(grade)}, pollution degree {pollution_degree}"
    return Requirement(value, table, True, tuple(notes))


def test_voltage(grade: str, mains_v: float | None, working_v: float, impulse_v: float, *, category: str, **_conditions) -> TestVoltage:
    """Table 14 by working voltage and overvoltage category; 60 s (from memory)."""
    row, volts = _lookup(TEST_T14[_category(category)][_kind(grade)], working_v, "IEC 61558-1 Table 14 (V working)")
    notes = ("the 60 s duration is from memory",) + ((_between_rows(working_v, row),) if working_v != row else ())
    table = f"Table 14, {row:g} V row, overvoltage category {category}, {_kind_words(grade)}"
    return TestVoltage(volts, TEST_WAVEFORM, TEST_SECONDS, table, True, notes)


def _lookup(values, volts: float, table: str):
    return up_to_and_including(tuple(zip(ROWS_V, values)), volts, table)


def _category(category: str) -> str:
    if category not in CATEGORIES:
        raise OutsideTable(f"IEC 61558-1 gives its tables for overvoltage categories I to IV, not {category}")
    return category


def _kind(grade: str) -> str:
    return "reinforced" if grade in DOUBLED_GRADES else "basic"


def _kind_words(grade: str) -> str:
    return "reinforced or double insulation" if grade in DOUBLED_GRADES else "basic or supplementary insulation"


def _between_rows(value: float, row: float) -> str:
    return f"{value:g} V lies between rows: the next row up, {row:g} V, is used (the harsher reading)"


STANDARD = ProductStandard(KEY, EDITION, TITLE, EDITION_TEXT, clearance, creepage, test_voltage, EARTH)
