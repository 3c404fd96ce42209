"""IEC 60664-1 (edition 3.0, 2020) tables as data, with small pure lookups.

Numbers are plain floats in volts, millimetres and metres, so the tables read as the standard prints
them; the isolation calc converts to and from quantities. Table numbers are edition 3's (edition 2,
2007, numbered the creepage table F.4 and the steady-state clearance table F.7). Every lookup that falls
outside the rows held here raises OutsideTable rather than guess.

Between two rows, every lookup takes the next row up unless asked to interpolate: the next row up is the
harsher of the two readings, and interpolation is for a user who names the clause that allows it.
"""

from __future__ import annotations

CATEGORIES = ("I", "II", "III", "IV")
POLLUTION_DEGREES = (1, 2, 3, 4)
MATERIAL_GROUPS = ("I", "II", "IIIa", "IIIb")


class OutsideTable(ValueError):
    """An input the tables held here do not cover; the message names the table and its range."""


# Table F.1: rated impulse voltage (V) for a line-to-neutral voltage up to and including the row (V),
# by overvoltage category I, II, III, IV.
RATED_IMPULSE_F1 = (
    (50, (330, 500, 800, 1500)),
    (100, (500, 800, 1500, 2500)),
    (150, (800, 1500, 2500, 4000)),
    (300, (1500, 2500, 4000, 6000)),
    (600, (2500, 4000, 6000, 8000)),
    (1000, (4000, 6000, 8000, 12000)),
)

# Table F.2, case A (inhomogeneous field), up to 2000 m: rated impulse voltage (V) -> clearance (mm)
# at pollution degree 1, 2, 3.
CLEARANCE_F2 = (
    (330, (0.01, 0.2, 0.8)),
    (500, (0.04, 0.2, 0.8)),
    (800, (0.1, 0.2, 0.8)),
    (1000, (0.15, 0.2, 0.8)),
    (1200, (0.25, 0.25, 0.8)),
    (1500, (0.5, 0.5, 0.8)),
    (2000, (1.0, 1.0, 1.0)),
    (2500, (1.5, 1.5, 1.5)),
    (3000, (2.0, 2.0, 2.0)),
    (4000, (3.0, 3.0, 3.0)),
    (5000, (4.0, 4.0, 4.0)),
    (6000, (5.5, 5.5, 5.5)),
    (8000, (8.0, 8.0, 8.0)),
    (10000, (11.0, 11.0, 11.0)),
    (12000, (14.0, 14.0, 14.0)),
)
PD4_MINIMUM_CLEARANCE_MM = 1.6

# Reinforced insulation: edition 3 dimensions its clearance for 160 % of the basic impulse voltage.
# Edition 2 took the next step of the preferred series instead (from memory); kept to compare.
REINFORCED_IMPULSE_PERCENT = 160
PREFERRED_IMPULSE_SERIES = (330, 500, 800, 1500, 2500, 4000, 6000, 8000, 12000)
REINFORCED_CREEPAGE_FACTOR = 2

# Table A.2: altitude (m) -> multiplication factor for clearances; 1.00 up to 2000 m.
ALTITUDE_A2 = (
    (2000, 1.00),
    (3000, 1.14),
    (4000, 1.29),
    (5000, 1.48),
    (6000, 1.70),
    (7000, 1.95),
    (8000, 2.25),
)

# Table F.3, single-phase systems: nominal voltage (V) -> rationalised voltage for the creepage table.
# Every row is confirmed against a public transcription of the table; 230 and 240 V systems are the 220-240 V
# row (a 230 V supply uses the 250 V row, confirmed). Rows below 50 V fall below the Table F.5 rows held here.
RATIONALISED_F3 = {
    12.5: 12.5, 25: 25, 30: 32,
    42: 50, 48: 50, 50: 50, 60: 63,
    100: 100, 110: 125, 120: 125,
    150: 160, 200: 200,
    220: 250, 230: 250, 240: 250,
    300: 320, 600: 630, 1000: 1000,
}

# Table F.5 (F.4 in edition 2): creepage (mm) for basic insulation, by working voltage RMS up to and
# including the row (V). Only the rows from 50 V to 1000 V are held.
CREEPAGE_COLUMNS = ("board-PD1", "board-PD2", "PD1", "PD2-I", "PD2-II", "PD2-III", "PD3-I", "PD3-II", "PD3-III")
CREEPAGE_F5 = (
    (50, (0.025, 0.04, 0.18, 0.60, 0.85, 1.20, 1.50, 1.70, 1.90)),
    (100, (0.10, 0.16, 0.25, 0.71, 1.00, 1.40, 1.80, 2.00, 2.20)),
    (125, (0.16, 0.25, 0.28, 0.75, 1.05, 1.50, 1.90, 2.10, 2.40)),
    (160, (0.25, 0.40, 0.32, 0.80, 1.10, 1.60, 2.00, 2.20, 2.50)),
    (200, (0.40, 0.63, 0.42, 1.00, 1.40, 2.00, 2.50, 2.80, 3.20)),
    (250, (0.56, 1.00, 0.56, 1.25, 1.80, 2.50, 3.20, 3.60, 4.00)),
    (320, (0.75, 1.60, 0.75, 1.60, 2.20, 3.20, 4.00, 4.50, 5.00)),
    (400, (1.0, 2.0, 1.0, 2.0, 2.8, 4.0, 5.0, 5.6, 6.3)),
    (500, (1.3, 2.5, 1.3, 2.5, 3.6, 5.0, 6.3, 7.1, 8.0)),
    (630, (1.8, 3.2, 1.8, 3.2, 4.5, 6.3, 8.0, 9.0, 10.0)),
    (800, (2.4, 4.0, 2.4, 4.0, 5.6, 8.0, 10.0, 11.0, 12.5)),
    (1000, (3.2, 5.0, 3.2, 5.0, 7.1, 10.0, 12.5, 14.0, 16.0)),
)
CREEPAGE_ROWS = tuple(row for row, _ in CREEPAGE_F5)

# Table F.8 (F.7 in edition 2): clearance (mm) to withstand steady-state voltages, temporary overvoltages and
# recurring peak voltages, case A (inhomogeneous field), by peak voltage (V) up to and including the row.
# Figures confirmed against a public transcription of the table. Reinforced insulation: 160 % of the voltage
# for basic insulation (edition 3, clause 5.1.6; from memory).
STEADY_CLEARANCE_F8 = (
    (40, 0.001), (60, 0.002), (100, 0.003), (120, 0.004), (150, 0.005), (200, 0.006), (250, 0.008),
    (330, 0.01), (400, 0.02), (500, 0.04), (600, 0.06), (800, 0.13), (1000, 0.26), (1200, 0.42),
    (1500, 0.76), (2000, 1.27), (2500, 1.8), (3000, 2.4), (4000, 3.8), (5000, 5.7), (6000, 7.9),
    (8000, 11.0), (10000, 15.2), (12000, 19.0), (15000, 25.0), (20000, 34.0), (25000, 44.0),
    (30000, 55.0), (40000, 77.0), (50000, 100.0),
)
REINFORCED_STEADY_PERCENT = 160

# Material groups by comparative tracking index: the lowest CTI of each group.
CTI_GROUPS = ((600, "I"), (400, "II"), (175, "IIIa"), (100, "IIIb"))
GROUP_COLUMN = {"I": "I", "II": "II", "IIIa": "III", "IIIb": "III"}
BOARD_COLUMNS = {1: "board-PD1", 2: "board-PD2"}
BOARD_COLUMN_EXCLUDES = {1: (), 2: ("IIIb",)}

# Clause 6.8: narrowest groove that interrupts a creepage path, by pollution degree; where the
# associated clearance is below 3 mm, the width may be reduced to one third of that clearance.
GROOVE_MINIMUM_MM = {1: 0.25, 2: 1.0, 3: 1.5}
GROOVE_REDUCTION_BELOW_MM = 3.0
GROOVE_CLEARANCE_FRACTION = 1 / 3


def up_to_and_including(rows, value: float, table: str):
    """The first (limit, entry) row whose limit is at or above value."""
    for limit, entry in rows:
        if value <= limit:
            return limit, entry
    raise OutsideTable(f"{table} ends at {rows[-1][0]:g}; {value:g} is above it")


def row_up(points, x: float, table: str) -> float:
    """The y of the first (x, y) row at or above x; at or below the first x, the first y."""
    for limit, y in points:
        if x <= limit:
            return y
    raise OutsideTable(f"{table} ends at {points[-1][0]:g}; {x:g} is above it")


def lookup(points, x: float, table: str, interpolated: bool = False) -> float:
    """The next row up (the harsher reading), or linear interpolation between rows where asked for."""
    return interpolate(points, x, table) if interpolated else row_up(points, x, table)


def on_a_row(points, x: float) -> bool:
    """x is one of the table's rows, or below the first (where no reading between rows is needed)."""
    return x <= points[0][0] or any(x == limit for limit, _ in points)


def interpolate(points, x: float, table: str) -> float:
    """Linear interpolation over (x, y) points sorted by x; at or below the first x, the first y."""
    if x <= points[0][0]:
        return points[0][1]
    for (x0, y0), (x1, y1) in zip(points, points[1:]):
        if x == x1:
            return y1
        if x < x1:
            return y0 + (y1 - y0) * (x - x0) / (x1 - x0)
    raise OutsideTable(f"{table} ends at {points[-1][0]:g}; {x:g} is above it")


def rated_impulse_voltage(line_to_neutral_v: float, category: str) -> float:
    """Table F.1: rated impulse voltage (V) for the supply's line-to-neutral voltage and category."""
    _, by_category = up_to_and_including(RATED_IMPULSE_F1, line_to_neutral_v, "Table F.1 (V line to neutral)")
    return by_category[CATEGORIES.index(category)]


def reinforced_impulse_voltage(basic_v: float) -> float:
    """Edition 3: reinforced clearance is dimensioned for 160 % of the basic impulse voltage."""
    return basic_v * REINFORCED_IMPULSE_PERCENT / 100


def next_impulse_step(basic_v: float) -> float:
    """Edition 2's rule for reinforced clearance: the next step of the preferred impulse series."""
    _, step = up_to_and_including(tuple(zip(PREFERRED_IMPULSE_SERIES[:-1], PREFERRED_IMPULSE_SERIES[1:])), basic_v, "preferred impulse series (V)")
    return step


def clearance_mm(impulse_v: float, pollution_degree: int, interpolated: bool = False) -> float:
    """Table F.2 case A; between rows, the next row up (or interpolated); pollution degree 4 takes PD3 and at least 1.6 mm."""
    column = min(pollution_degree, 3) - 1
    points = tuple((volts, by_pd[column]) for volts, by_pd in CLEARANCE_F2)
    clearance = lookup(points, impulse_v, "Table F.2 (V impulse)", interpolated)
    return max(clearance, PD4_MINIMUM_CLEARANCE_MM) if pollution_degree == 4 else clearance


def steady_clearance_mm(peak_v: float, interpolated: bool = False) -> float:
    """Table F.8 case A: clearance for a steady-state or recurring peak voltage."""
    return lookup(STEADY_CLEARANCE_F8, peak_v, "Table F.8 (V peak)", interpolated)


def reinforced_steady_voltage(peak_v: float) -> float:
    """Reinforced clearance for steady-state and recurring peaks: 160 % of the basic voltage (from memory)."""
    return peak_v * REINFORCED_STEADY_PERCENT / 100


def altitude_factor(altitude_m: float, interpolated: bool = False) -> float:
    """Table A.2: 1.00 up to 2000 m; between rows above, the next row up (or interpolated)."""
    return lookup(ALTITUDE_A2, altitude_m, "Table A.2 (m altitude)", interpolated)


def rationalised_voltage(nominal_v: float) -> tuple[float, bool]:
    """Table F.3 row for a single-phase nominal voltage; (voltage, listed). Unlisted: next creepage row up."""
    listed = RATIONALISED_F3.get(nominal_v)
    if listed is not None:
        return listed, True
    row, _ = up_to_and_including(tuple((r, None) for r in CREEPAGE_ROWS), nominal_v, "Table F.5 (V working)")
    return row, False


def material_group(cti: int) -> str:
    """Material group from the comparative tracking index; below 100 there is none."""
    for lowest, group in CTI_GROUPS:
        if cti >= lowest:
            return group
    raise OutsideTable(f"CTI {cti} is below 100: no material group, and Table F.5 gives no creepage for it")


def worse_group(first: str, second: str) -> str:
    """Of two material groups, the one Table F.5 asks the longer creepage for (IIIb the worst)."""
    return max(first, second, key=MATERIAL_GROUPS.index)


def creepage_column(pollution_degree: int, group: str, printed_board: bool) -> str:
    """Which Table F.5 column applies; the printed-board PD2 column excludes group IIIb."""
    if pollution_degree == 4:
        raise OutsideTable("Table F.5 gives creepage for pollution degrees 1 to 3 only")
    if printed_board and board_column_applies(pollution_degree, group):
        return BOARD_COLUMNS[pollution_degree]
    if pollution_degree == 1:
        return "PD1"
    return f"PD{pollution_degree}-{GROUP_COLUMN[group]}"


def board_column_applies(pollution_degree: int, group: str) -> bool:
    """Table F.5 has printed-board columns for PD1 (all groups) and PD2 (all but IIIb)."""
    return pollution_degree in BOARD_COLUMNS and group not in BOARD_COLUMN_EXCLUDES[pollution_degree]


def basic_creepage_mm(working_v: float, pollution_degree: int, group: str, printed_board: bool, interpolated: bool = False) -> float:
    """Table F.5 creepage for basic insulation; between rows, the next row up (or interpolated)."""
    column = CREEPAGE_COLUMNS.index(creepage_column(pollution_degree, group, printed_board))
    points = tuple((volts, by_column[column]) for volts, by_column in CREEPAGE_F5)
    return lookup(points, working_v, "Table F.5 (V working)", interpolated)


def minimum_groove_mm(pollution_degree: int, clearance_mm_: float) -> float:
    """Clause 6.8: the narrowest groove that still interrupts a creepage path."""
    if pollution_degree not in GROOVE_MINIMUM_MM:
        raise OutsideTable("clause 6.8 gives groove widths for pollution degrees 1 to 3 only")
    width = GROOVE_MINIMUM_MM[pollution_degree]
    if clearance_mm_ < GROOVE_REDUCTION_BELOW_MM:
        return min(width, clearance_mm_ * GROOVE_CLEARANCE_FRACTION)
    return width
