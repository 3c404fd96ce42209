"""IPC-2221B, Generic Standard on Printed Board Design, Table 6-1 (electrical conductor spacing), as data.

Functional spacing between conductors of one circuit, against arcing and breakdown over the board: it is no
safety figure and never replaces the clearance and creepage of a safety standard.

Columns held: B1 (internal conductors), B2 (external conductors, uncoated, sea level to 3 050 m) and B4
(external conductors with permanent polymer coating). Every row of the three columns, and the per-volt
increments above 500 V, were confirmed against two public transcriptions of the table in open-source code
(a sign-off criteria module and its tests, found with the code search; the B2 increment with the worked case
1 000 V -> 5.0 mm). Columns B3 (uncoated above 3 050 m) and A5-A7 (assemblies) are not held.
"""

from __future__ import annotations

from dossier.standards.iec60664 import OutsideTable

CONDITIONS = {"internal": "B1", "external-uncoated": "B2", "external-coated": "B4"}
CONDITION_WORDS = {
    "B1": "B1, internal conductors",
    "B2": "B2, external conductors, uncoated, sea level to 3 050 m",
    "B4": "B4, external conductors with permanent polymer coating",
}
# Voltage between conductors (V, d.c. or a.c. peak) up to and including the row -> spacing (mm) for B1, B2, B4.
SPACING_T6_1 = (
    (15, (0.05, 0.1, 0.05)),
    (30, (0.05, 0.1, 0.05)),
    (50, (0.1, 0.6, 0.13)),
    (100, (0.1, 0.6, 0.13)),
    (150, (0.2, 0.6, 0.4)),
    (170, (0.2, 1.25, 0.4)),
    (250, (0.2, 1.25, 0.4)),
    (300, (0.2, 1.25, 0.4)),
    (500, (0.25, 2.5, 0.8)),
)
COLUMNS = ("B1", "B2", "B4")
ABOVE_500_PER_VOLT = {"B1": 0.0025, "B2": 0.005, "B4": 0.00305}
UNCOATED_ALTITUDE_LIMIT_M = 3050


def spacing_mm(volts: float, column: str) -> tuple[float, str]:
    """(minimum spacing in mm, the row used) for a voltage between conductors and a board condition's column."""
    index = COLUMNS.index(column)
    for row, by_column in SPACING_T6_1:
        if volts <= row:
            return by_column[index], f"up to {row:g} V"
    top_row, by_column = SPACING_T6_1[-1]
    per_volt = ABOVE_500_PER_VOLT[column]
    return round(by_column[index] + (volts - top_row) * per_volt, 6), f"above {top_row:g} V: {by_column[index]:g} mm + {per_volt:g} mm/V"


def column_for(condition: str, altitude_m: float) -> str:
    """The Table 6-1 column for a board condition; uncoated outer layers above 3 050 m are column B3, not held."""
    column = CONDITIONS[condition]
    if column == "B2" and altitude_m > UNCOATED_ALTITUDE_LIMIT_M:
        raise OutsideTable("IPC-2221B Table 6-1 column B3 (uncoated, above 3 050 m) is not held")
    return column
