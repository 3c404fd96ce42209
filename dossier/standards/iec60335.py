"""IEC 60335-1 (edition 5.0, 2010, with amendments 1 and 2) tables as data, with small lookups.

None of these tables could be confirmed in public material: every figure here is from memory, and each
finding that uses one says so. What public material did confirm is the wording of clause 29.1 (clearances
not less than Table 16 for the rated impulse voltage of Table 15; a public forum transcription on
bbs.angui.org). The rated impulse voltages (Table 15) are those of IEC 60664-1 Table F.1.
- Table 16 (clearances, rated impulse voltage): 0.5 mm up to 1 500 V, then IEC 60664-1's figures; pollution
  degree 3 at least 0.8 mm. The table's relief for printed-board tracks is not applied (the harsher reading).
- Clause 29.1.3 and 29.1.4: supplementary insulation as basic; reinforced insulation takes the next higher step
  of rated impulse voltage.
- Table 17 (creepage, basic insulation): IEC 60664-1 Table F.5's general columns; reinforced insulation twice.
- Table 7 (electric strength, clause 16.3): by rated voltage, basic 1 000 / 1 250 V, supplementary 1 750 V,
  reinforced 3 000 V r.m.s.; above 250 V by working voltage U: 1.2 U + 700, 1.2 U + 1 450, 2.4 U + 2 400 V; 1 min.
- Table 3 (clause 11.8, temperature rises of handles, knobs and grips, metal): 35 K for parts held for short periods
  only, 30 K for parts held continuously; rises over the room, not temperatures.
- Clause 27.5: at most 0.1 ohm, the supply cord excluded, at 1.5 times the rated current or 25 A, whichever is
  higher, from a source of no more than 12 V.

Between rows every lookup takes the next row up (the harsher reading); outside the rows it raises OutsideTable.
"""

from __future__ import annotations

from dossier.standards import iec60664
from dossier.standards.iec60664 import OutsideTable, up_to_and_including
from dossier.standards.product import EarthRule, ProductStandard, Requirement, TestVoltage, TouchLimit, TouchLimits

KEY = "iec-60335-1"
EDITION = 5
TITLE = "IEC 60335-1"
EDITION_TEXT = "edition 5.0, 2010, with amendments 1 (2013) and 2 (2016)"
DOUBLED_GRADES = ("reinforced", "double")

# Table 16: rated impulse voltage (V) up to and including the row -> minimum clearance (mm).
CLEARANCE_T16 = (
    (330, 0.5), (500, 0.5), (800, 0.5), (1500, 0.5), (2500, 1.5), (4000, 3.0), (6000, 5.5), (8000, 8.0), (10000, 11.0),
)
PD3_MINIMUM_MM = 0.8
IMPULSE_STEPS = tuple(row for row, _ in CLEARANCE_T16)

# Table 17: IEC 60664-1 Table F.5's general columns, basic insulation.
CREEPAGE_COLUMNS = iec60664.CREEPAGE_COLUMNS[2:]
CREEPAGE_T17 = tuple((volts, by_column[2:]) for volts, by_column in iec60664.CREEPAGE_F5)
REINFORCED_CREEPAGE_FACTOR = 2

# Table 7: rated voltage (V) up to and including the row -> test voltage (V r.m.s.) for basic, supplementary,
# reinforced insulation; above the last row the working-voltage formulas apply.
TEST_T7 = ((150, (1000, 1750, 3000)), (250, (1250, 1750, 3000)))
TEST_ABOVE_250 = {"basic": (1.2, 700), "supplementary": (1.2, 1450), "reinforced": (2.4, 2400)}
TEST_SECONDS = 60
TEST_WAVEFORM = "a.c. r.m.s., 50 or 60 Hz"

EARTH = EarthRule(
    limit_ohm=0.1,
    test="1.5 times the rated current or 25 A, whichever is higher, from a source of no more than 12 V; the supply cord excluded",
    clause="clause 27.5 (from memory)",
    confirmed=False,
)


def clearance(impulse_v: float, pollution_degree: int, grade: str, **_conditions) -> Requirement:
    """Table 16; reinforced insulation at the next higher step of rated impulse voltage; PD3 at least 0.8 mm."""
    if pollution_degree not in (1, 2, 3):
        raise OutsideTable("IEC 60335-1 Table 16 is read here for pollution degrees 1 to 3 only")
    row, value = up_to_and_including(CLEARANCE_T16, impulse_v, "IEC 60335-1 Table 16 (V impulse)")
    notes = [_between_rows(impulse_v, row)] if impulse_v != row else []
    if grade in DOUBLED_GRADES:
        step = _next_step(row)
        notes.append(f"{grade} insulation takes the next higher step of rated impulse voltage, {step:g} V (clause 29.1.4, from memory)")
        row, value = up_to_and_including(CLEARANCE_T16, step, "IEC 60335-1 Table 16 (V impulse)")
    if pollution_degree == 3 and value < PD3_MINIMUM_MM:
        notes.append(f"at pollution degree 3 at least {PD3_MINIMUM_MM:g} mm")
        value = PD3_MINIMUM_MM
    notes.append("the table's smaller figure for printed-board tracks is not applied (the harsher reading)")
    return Requirement(value, f"Table 16, {row:g} V row", False, tuple(notes))


def _next_step(row: float) -> float:
    index = IMPULSE_STEPS.index(row)
    if index + 1 >= len(IMPULSE_STEPS):
        raise OutsideTable(f"IEC 60335-1 Table 16 has no step above {row:g} V for reinforced insulation")
    return IMPULSE_STEPS[index + 1]


def creepage(working_v: float, pollution_degree: int, group: str, printed_board: bool, grade: str) -> Requirement:
    """Table 17 for basic insulation, twice for reinforced."""
    column = iec60664.creepage_column(pollution_degree, group, False)
    points = tuple((volts, by_column[CREEPAGE_COLUMNS.index(column)]) for volts, by_column in CREEPAGE_T17)
    row, basic = up_to_and_including(points, working_v, "IEC 60335-1 Table 17 (V working)")
    factor = REINFORCED_CREEPAGE_FACTOR if grade in DOUBLED_GRADES else 1
    notes = [_between_rows(working_v, row)] if working_v != row else []
    if printed_board:
        notes.append("no printed-board relief is applied (the harsher reading)")
    if factor != 1:
        notes.append(f"{grade} insulation takes twice the basic figure ({basic:g} mm; clause 29.2, from memory)")
    pd, _, family = column.partition("-")
    table = f"Table 17, {row:g} V row, pollution degree {pd[-1]}" + (f", material group {family}" if family else "")
    return Requirement(basic * factor, table, False, tuple(notes))


def test_voltage(grade: str, mains_v: float | None, working_v: float, impulse_v: float, **_conditions) -> TestVoltage:
    """Table 7 by rated voltage (the mains nominal, or the working voltage without mains); above 250 V by working voltage."""
    kind = "reinforced" if grade in DOUBLED_GRADES else grade if grade == "supplementary" else "basic"
    rated = mains_v if mains_v is not None else working_v
    if rated > TEST_T7[-1][0]:
        slope, offset = TEST_ABOVE_250[kind]
        volts = slope * working_v + offset
        return TestVoltage(volts, TEST_WAVEFORM, TEST_SECONDS, f"Table 7, above 250 V: {slope:g} U + {offset:g} V, {kind} insulation", False)
    row, by_kind = up_to_and_including(TEST_T7, rated, "IEC 60335-1 Table 7 (V rated)")
    volts = by_kind[("basic", "supplementary", "reinforced").index(kind)]
    return TestVoltage(volts, TEST_WAVEFORM, TEST_SECONDS, f"Table 7, rated voltage up to {row:g} V, {kind} insulation", False)


def _between_rows(value: float, row: float) -> str:
    return f"{value:g} V lies between rows: the next row up, {row:g} V, is used (the harsher reading)"


TOUCH = TouchLimits(
    brief=TouchLimit(35, True, "Table 3 (clause 11.8), metal handles held for short periods only (from memory)", False),
    held=TouchLimit(30, True, "Table 3 (clause 11.8), metal handles held continuously (from memory)", False),
)

STANDARD = ProductStandard(KEY, EDITION, TITLE, EDITION_TEXT, clearance, creepage, test_voltage, EARTH, TOUCH)
