"""IEC 62368-1 (edition 3.0, 2018) tables as data, with small lookups for the isolation calc.

Where each figure was confirmed:
- Table 14 (minimum clearances, frequencies up to 30 kHz), required withstand voltage 2 500 V peak, pollution
  degree 2: 1.5 mm basic, 3.0 mm reinforced -- confirmed in a public CB test report to IEC 62368-1 (report
  CQASZ20210400194S, "Minimum clearances distances using required withstand voltage", reproduced on
  manualshelf.com). Every other row and column is from memory: the basic columns follow IEC 60664-1 Table F.2 at
  the preferred impulse steps and the reinforced columns the basic figure of the next preferred step.
- Table 17 (creepage, basic insulation): the pollution-degree-2 figures at 250 V (1.25 / 1.8 / 2.5 mm for
  material groups I / II / III) are confirmed (shared reference figures); the other rows are IEC 60664-1 Table
  F.5's general columns, which Table 17 carries (from memory). Table 17 has no printed-board column (from memory).
- Electric strength, clause 5.4.9.1 (from memory): the highest of Table 25 (transients) and Table 27 (temporary
  overvoltages). Reinforced insulation on a 240 V mains at 4 000 V d.c. is confirmed in the same public test report;
  the other figures, the 60 s duration and Table 26 (peak working voltage, not held) are from memory.
- Touch temperatures of accessible metal parts, Table 38 (TS1; from memory): 60 degC touched briefly (up to about
  10 s), 48 degC held or touched for longer (up to 8 h: 43 degC is not used, a heatsink is no handle). Public
  discussion of the table (emc-pstc, 2020) confirms that its limits are absolute, at 25 degC ambient, and one TS1
  figure (77 degC, plastic), not the metal ones.
- Electrical energy source classes, clause 5.2.2.2 and Table 4 (steady-state voltage; from memory): ES1 up to 60 V
  d.c. or 30 V r.m.s., ES2 up to 120 V d.c. or 50 V r.m.s., ES3 above. Between and at the limits the higher class
  is not taken: a rail exactly at 60 V d.c. is ES1, 60.1 V is ES2.
- Protective-earth continuity, clause 5.6.6.2 (from memory): at most 0.1 ohm at 200 % of the protective current
  rating for 120 s -- the same rule as IEC 60950-1 clause 2.6.3.4, confirmed in a public transcription of that clause.

Between rows every lookup takes the next row up (the harsher reading); outside the rows it raises OutsideTable.
"""

from __future__ import annotations

from dossier.standards import iec60664
from dossier.standards.iec60664 import OutsideTable, up_to_and_including
from dossier.standards.product import EarthRule, ProductStandard, Requirement, TestVoltage, TouchLimit, TouchLimits

KEY = "iec-62368-1"
EDITION = 3
TITLE = "IEC 62368-1"
EDITION_TEXT = "edition 3.0, 2018"
DOUBLED_GRADES = ("reinforced", "double")

# Table 14: required withstand voltage (V peak) up to and including the row -> clearance (mm),
# basic or supplementary at pollution degree 1, 2, 3, then reinforced at 1, 2, 3.
CLEARANCE_T14 = (
    (330, (0.01, 0.2, 0.8), (0.04, 0.2, 0.8)),
    (500, (0.04, 0.2, 0.8), (0.1, 0.2, 0.8)),
    (800, (0.1, 0.2, 0.8), (0.5, 0.5, 0.8)),
    (1500, (0.5, 0.5, 0.8), (1.5, 1.5, 1.5)),
    (2500, (1.5, 1.5, 1.5), (3.0, 3.0, 3.0)),
    (4000, (3.0, 3.0, 3.0), (5.5, 5.5, 5.5)),
    (6000, (5.5, 5.5, 5.5), (8.0, 8.0, 8.0)),
    (8000, (8.0, 8.0, 8.0), (14.0, 14.0, 14.0)),
    (12000, (14.0, 14.0, 14.0), (19.0, 19.0, 19.0)),
)
CONFIRMED_T14 = {(2500, 2)}  # (row, pollution degree) seen in public material

# Table 17: IEC 60664-1 Table F.5's general columns (no printed-board column), basic insulation.
CREEPAGE_COLUMNS = iec60664.CREEPAGE_COLUMNS[2:]
CREEPAGE_T17 = tuple((volts, by_column[2:]) for volts, by_column in iec60664.CREEPAGE_F5)
CONFIRMED_T17 = {(250, "PD2-I"), (250, "PD2-II"), (250, "PD2-III")}
REINFORCED_CREEPAGE_FACTOR = 2

# Table 25: required withstand voltage (V peak) up to and including the row -> test voltage (V peak or d.c.)
# for basic or supplementary, and for reinforced insulation.
TEST_T25 = (
    (330, 330, 500), (500, 500, 800), (800, 800, 1500), (1500, 1500, 2500), (2500, 2500, 4000),
    (4000, 4000, 6000), (6000, 6000, 8000), (8000, 8000, 12000), (12000, 12000, 18000),
)
# Table 27: mains nominal (V r.m.s.) up to and including the row -> test voltage (V peak or d.c.) for
# temporary overvoltages, basic or supplementary and reinforced.
TEST_T27 = ((250, 2000, 4000), (600, 2500, 5000))
CONFIRMED_TEST = {(2500, "reinforced", 4000)}
TEST_SECONDS = 60
TEST_WAVEFORM = "peak (a.c.) or d.c."

EARTH = EarthRule(
    limit_ohm=0.1,
    test="a test current of 200 % of the protective current rating for 120 s, resistance from the voltage drop",
    clause="clause 5.6.6.2 (clause number from memory; the same rule as IEC 60950-1 clause 2.6.3.4, confirmed)",
    confirmed=False,
)


def clearance(impulse_v: float, pollution_degree: int, grade: str, **_conditions) -> Requirement:
    """Table 14, entered with the rated impulse voltage (the mains transient voltage) as the required withstand voltage."""
    if pollution_degree not in (1, 2, 3):
        raise OutsideTable("IEC 62368-1 Table 14 gives clearances for pollution degrees 1 to 3 only")
    row = _row(CLEARANCE_T14, impulse_v, "IEC 62368-1 Table 14 (V peak)")
    doubled = grade in DOUBLED_GRADES
    value = (row[2] if doubled else row[1])[pollution_degree - 1]
    column = "reinforced" if doubled else "basic or supplementary"
    table = f"Table 14, {row[0]:g} V peak row, {column} column, pollution degree {pollution_degree}"
    notes = (_between_rows(impulse_v, row[0]),) if impulse_v != row[0] else ()
    return Requirement(value, table, (row[0], pollution_degree) in CONFIRMED_T14, notes)


def creepage(working_v: float, pollution_degree: int, group: str, printed_board: bool, grade: str) -> Requirement:
    """Table 17 for basic insulation, twice for reinforced; no printed-board column."""
    column = iec60664.creepage_column(pollution_degree, group, False)
    points = tuple((volts, by_column[CREEPAGE_COLUMNS.index(column)]) for volts, by_column in CREEPAGE_T17)
    row, basic = up_to_and_including(points, working_v, "IEC 62368-1 Table 17 (V r.m.s.)")
    factor = REINFORCED_CREEPAGE_FACTOR if grade in DOUBLED_GRADES else 1
    notes = [_between_rows(working_v, row)] if working_v != row else []
    if printed_board:
        notes.append("Table 17 has no printed-board column (from memory), so the general column is used")
    if factor != 1:
        notes.append(f"{grade} insulation takes twice the basic figure ({basic:g} mm)")
    table = f"Table 17, {row:g} V row, {_column_words(column)}"
    return Requirement(basic * factor, table, (row, column) in CONFIRMED_T17, tuple(notes))


def test_voltage(grade: str, mains_v: float | None, working_v: float, impulse_v: float, **_conditions) -> TestVoltage:
    """Clause 5.4.9.1: the highest of Table 25 (transients) and, on a mains barrier, Table 27 (temporary overvoltages)."""
    doubled = grade in DOUBLED_GRADES
    t25_row = _row(TEST_T25, impulse_v, "IEC 62368-1 Table 25 (V peak)")
    candidates = [(t25_row[2] if doubled else t25_row[1], f"Table 25, {t25_row[0]:g} V peak row")]
    if mains_v is not None:
        t27_row = _row(TEST_T27, mains_v, "IEC 62368-1 Table 27 (V r.m.s. mains)")
        candidates.append((t27_row[2] if doubled else t27_row[1], f"Table 27, mains up to {t27_row[0]:g} V"))
    volts, table = max(candidates)
    column = "reinforced" if doubled else "basic or supplementary"
    notes = ("Table 26 (peak working voltage) is not held: where the barrier's peak working voltage exceeds the mains "
             "peak, check it against Table 26 as well",)
    return TestVoltage(volts, TEST_WAVEFORM, TEST_SECONDS, f"{table}, {column}", (impulse_v, _grade_kind(grade), volts) in CONFIRMED_TEST, notes)


def _grade_kind(grade: str) -> str:
    return "reinforced" if grade in DOUBLED_GRADES else "basic"


def _row(rows, value: float, table: str):
    for row in rows:
        if value <= row[0]:
            return row
    raise OutsideTable(f"{table} ends at {rows[-1][0]:g}; {value:g} is above it")


def _between_rows(value: float, row: float) -> str:
    return f"{value:g} V lies between rows: the next row up, {row:g} V, is used (the harsher reading)"


def _column_words(column: str) -> str:
    pd, _, family = column.partition("-")
    return f"pollution degree {pd[-1]}" + (f", material group {family}" if family else "")


# Table 4 (from memory): class -> highest steady-state voltage, d.c. and a.c. r.m.s.
ENERGY_CLASSES = (("ES1", {"dc": 60, "ac": 30}), ("ES2", {"dc": 120, "ac": 50}))
ENERGY_CLASS_ABOVE = "ES3"


def energy_class(volts: float, kind: str) -> str:
    """ES1, ES2 or ES3 for a steady-state voltage (kind 'dc' or 'ac' r.m.s.), by Table 4 (from memory)."""
    return next((name for name, limits in ENERGY_CLASSES if volts <= limits[kind]), ENERGY_CLASS_ABOVE)


TOUCH = TouchLimits(
    brief=TouchLimit(60, False, "Table 38, TS1, metal touched briefly (from memory)", False),
    held=TouchLimit(48, False, "Table 38, TS1, metal held or touched for longer (from memory)", False),
)

STANDARD = ProductStandard(KEY, EDITION, TITLE, EDITION_TEXT, clearance, creepage, test_voltage, EARTH, TOUCH)
