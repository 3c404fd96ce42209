"""IEC 61558-1 and IEC 61010-1 as held, row by row, with worked cases across their boundaries.

Each check names the standard, edition and table. IEC 61558-1 edition 3.0 (2017) Tables 14, 20 and 21 are those of one
public transcription (OpenMagnetics MKF, src/data/insulation_standards/IEC_61558-1.json), cross-checked here against
IEC 60664-1 edition 3 (2020) Tables F.1, F.2 and F.5. IEC 61010-1 edition 3.0 (2010 + A1 2016): the mains clearance and
creepage tables could not be found in public material and are not held; the test voltages are from memory.
"""

from __future__ import annotations

import pytest

from dossier.standards import iec60664, iec61010, iec61558
from dossier.standards.iec60664 import OutsideTable
from dossier.standards.product import TableNotHeld

ROWS = (50, 100, 150, 300, 600, 1000)

# --- IEC 61558-1:2017 Table 20: clearances (mm), by working voltage, overvoltage category, PD2 / PD3 -----------------

T20 = {  # category -> (basic PD2, basic PD3, reinforced PD2, reinforced PD3), each by ROWS
    "I": ((0.2, 0.2, 0.2, 0.5, 1.5, 3.0), (0.8, 0.8, 0.8, 0.8, 1.5, 3.0), (0.2, 0.2, 0.5, 1.5, 3.0, 5.5), (0.8, 0.8, 0.8, 1.5, 3.0, 5.5)),
    "II": ((0.2, 0.2, 0.5, 1.5, 3.0, 5.5), (0.8, 0.8, 0.8, 1.5, 3.0, 5.5), (0.2, 0.5, 1.5, 3.0, 5.5, 8.0), (0.8, 0.8, 1.5, 3.0, 5.5, 8.0)),
    "III": ((0.2, 0.5, 1.5, 3.0, 5.5, 8.0), (0.8, 0.8, 1.5, 3.0, 5.5, 8.0), (0.5, 1.5, 3.0, 5.5, 8.0, 14.0), (0.8, 1.5, 3.0, 5.5, 8.0, 14.0)),
    "IV": ((0.5, 1.5, 3.0, 5.5, 8.0, 14.0), (0.8, 1.5, 3.0, 5.5, 8.0, 14.0), (1.5, 3.0, 5.5, 8.0, 14.0, 25.0), (1.5, 3.0, 5.5, 8.0, 14.0, 25.0)),
}


@pytest.mark.parametrize("category", T20)
def test_iec61558_table20_row_by_row(category):
    # IEC 61558-1:2017 Table 20 (one public transcription): every row, both grades, PD2 and PD3
    basic2, basic3, reinforced2, reinforced3 = T20[category]
    for i, volts in enumerate(ROWS):
        def at(pd, grade):
            return iec61558.clearance(0, pd, grade, working_v=volts, category=category)
        assert (at(2, "basic").value, at(3, "basic").value) == (basic2[i], basic3[i])
        assert (at(2, "supplementary").value, at(3, "supplementary").value) == (basic2[i], basic3[i])
        assert (at(2, "reinforced").value, at(3, "double").value) == (reinforced2[i], reinforced3[i])
        assert at(2, "basic").confirmed


def test_iec61558_table20_agrees_with_iec60664_at_category_ii():
    # Cross-check: IEC 60664-1:2020 Table F.1 (300 V, category II: 2500 V) and Table F.2 case A PD2 (2500 V: 1.5 mm;
    # 4000 V: 3.0 mm) give IEC 61558-1:2017 Table 20's 300 V row, basic 1.5 mm and reinforced 3.0 mm
    impulse = iec60664.rated_impulse_voltage(300, "II")
    assert iec61558.clearance(0, 2, "basic", working_v=300, category="II").value == iec60664.clearance_mm(impulse, 2)
    assert iec61558.clearance(0, 2, "reinforced", working_v=300, category="II").value == iec60664.clearance_mm(4000, 2)


def test_iec61558_table20_300_v_and_301_v():
    # IEC 61558-1:2017 Table 20, category II, PD2: 300 V is on the 300 V row (1.5 mm); 301 V takes the 600 V row (3.0 mm)
    on_row = iec61558.clearance(0, 2, "basic", working_v=300, category="II")
    above = iec61558.clearance(0, 2, "basic", working_v=301, category="II")
    assert (on_row.value, above.value) == (1.5, 3.0)
    assert not on_row.notes and "next row up, 600 V" in above.notes[0]
    assert "Table 20, 600 V row, overvoltage category II" in above.table


def test_iec61558_table20_edges():
    # PD1 has no column in Table 20: the PD2 column is taken (0.2 <= PD2); PD4 and above 1000 V are outside the table
    pd1 = iec61558.clearance(0, 1, "basic", working_v=50, category="II")
    assert pd1.value == 0.2 and "pollution-degree-2 column" in pd1.notes[0]
    with pytest.raises(OutsideTable):
        iec61558.clearance(0, 4, "basic", working_v=230, category="II")
    with pytest.raises(OutsideTable):
        iec61558.clearance(0, 2, "basic", working_v=1001, category="II")
    with pytest.raises(OutsideTable):
        iec61558.clearance(0, 2, "basic", working_v=230, category="V")


# --- IEC 61558-1:2017 Table 21: creepage (mm), by working voltage, material group, pollution degree ----------------

T21 = {  # (group, grade kind, pollution degree) -> mm by ROWS
    ("I", "basic", 1): (0.18, 0.25, 0.3, 0.7, 1.7, 3.2), ("I", "basic", 2): (0.6, 0.7, 0.8, 1.5, 3.0, 5.5),
    ("I", "basic", 3): (1.5, 1.8, 2.0, 3.9, 7.7, 12.5), ("I", "reinforced", 1): (0.25, 0.4, 0.7, 1.7, 4.0, 7.5),
    ("I", "reinforced", 2): (0.7, 1.0, 1.6, 3.0, 6.0, 10.0), ("I", "reinforced", 3): (1.8, 2.5, 4.2, 7.7, 16.0, 25.0),
    ("II", "basic", 1): (0.18, 0.25, 0.3, 0.7, 1.7, 3.2), ("II", "basic", 2): (0.9, 1.0, 1.1, 2.1, 4.3, 7.1),
    ("II", "basic", 3): (1.7, 2.0, 2.2, 4.2, 8.6, 14.0), ("II", "reinforced", 1): (0.25, 0.4, 0.7, 1.7, 4.0, 7.5),
    ("II", "reinforced", 2): (1.0, 1.4, 2.0, 4.3, 8.6, 14.0), ("II", "reinforced", 3): (2.0, 2.8, 4.2, 8.6, 17.2, 28.0),
    ("IIIa", "basic", 1): (0.18, 0.25, 0.3, 0.7, 1.7, 3.2), ("IIIa", "basic", 2): (1.2, 1.4, 1.6, 3.0, 6.0, 10.0),
    ("IIIa", "basic", 3): (1.9, 2.2, 2.5, 4.7, 9.5, 16.0), ("IIIa", "reinforced", 1): (0.25, 0.4, 0.7, 1.7, 4.0, 7.5),
    ("IIIa", "reinforced", 2): (1.4, 2.0, 3.0, 6.0, 12.0, 20.0), ("IIIa", "reinforced", 3): (2.2, 3.0, 4.7, 9.5, 19.2, 32.0),
    ("IIIb", "basic", 1): (0.18, 0.25, 0.3, 0.7, 1.7, 3.2), ("IIIb", "basic", 2): (1.2, 1.4, 1.6, 3.0, 6.0, 10.0),
    ("IIIb", "basic", 3): (1.9, 2.2, 2.5, 4.7, 9.5, 16.0), ("IIIb", "reinforced", 1): (0.36, 0.5, 0.7, 1.7, 4.0, 7.5),
    ("IIIb", "reinforced", 2): (2.4, 2.8, 3.2, 6.0, 12.0, 20.0), ("IIIb", "reinforced", 3): (3.8, 4.4, 5.0, 9.5, 19.2, 32.0),
}


@pytest.mark.parametrize("group, kind, pd", list(T21))
def test_iec61558_table21_row_by_row(group, kind, pd):
    # IEC 61558-1:2017 Table 21 (one public transcription): every row of every column
    for volts, expected in zip(ROWS, T21[(group, kind, pd)]):
        assert iec61558.creepage(volts, pd, group, False, kind).value == expected


def test_iec61558_table21_agrees_with_iec60664_at_250_and_320_v():
    # Cross-check: IEC 60664-1:2020 Table F.5 PD2 at 250 V (1.25 / 1.8 / 2.5 mm) and 320 V (1.6 / 2.2 / 3.2 mm) bracket
    # IEC 61558-1:2017 Table 21's 300 V row (1.5 / 2.1 / 3.0 mm) for groups I, II and IIIa
    rows = dict(iec60664.CREEPAGE_F5)
    for group in ("I", "II", "IIIa"):
        column = iec60664.CREEPAGE_COLUMNS.index(iec60664.creepage_column(2, group, False))
        at_300 = iec61558.creepage(300, 2, group, False, "basic").value
        assert rows[250][column] <= at_300 <= rows[320][column]


def test_iec61558_table21_boundaries_and_board_note():
    # IEC 61558-1:2017 Table 21, group IIIa PD2 basic: 300 V 3.0 mm, 301 V the 600 V row 6.0 mm; no printed-board column
    assert iec61558.creepage(300, 2, "IIIa", False, "basic").value == 3.0
    assert iec61558.creepage(301, 2, "IIIa", False, "basic").value == 6.0
    board = iec61558.creepage(250, 2, "IIIa", True, "basic")
    assert board.value == 3.0 and any("no printed-board column" in note for note in board.notes)
    with pytest.raises(OutsideTable):
        iec61558.creepage(230, 4, "IIIa", False, "basic")


# --- IEC 61558-1:2017 Table 14: electric-strength test voltages (V r.m.s.) -----------------------------------------

T14 = {
    "I": ((250, 350, 700, 1100, 1500, 2250), (500, 700, 1400, 2200, 3000, 4500)),
    "II": ((250, 500, 1250, 1500, 2100, 2500), (500, 1000, 2500, 3000, 4200, 5000)),
    "III": ((250, 700, 1400, 2100, 2500, 2750), (500, 1400, 2800, 4200, 5000, 5500)),
    "IV": ((250, 850, 1700, 2500, 2800, 3000), (500, 1700, 3400, 5000, 5600, 6000)),
}


@pytest.mark.parametrize("category", T14)
def test_iec61558_table14_row_by_row(category):
    # IEC 61558-1:2017 Table 14 (one public transcription); the 60 s duration is from memory
    basic, reinforced = T14[category]
    for i, volts in enumerate(ROWS):
        test = iec61558.test_voltage("basic", None, volts, 0, category=category)
        assert test.volts == basic[i] and test.seconds == 60 and test.confirmed
        assert iec61558.test_voltage("supplementary", None, volts, 0, category=category).volts == basic[i]
        assert iec61558.test_voltage("reinforced", None, volts, 0, category=category).volts == reinforced[i]


def test_iec61558_table14_230_v_mains_and_the_300_v_step():
    # 230 V mains rationalised to 250 V (IEC 60664-1 Table F.3) -> Table 14's 300 V row: 1500 V basic, 3000 V reinforced
    assert iec61558.test_voltage("basic", 230, 250, 2500, category="II").volts == 1500
    assert iec61558.test_voltage("reinforced", 230, 250, 2500, category="II").volts == 3000
    assert iec61558.test_voltage("reinforced", 230, 301, 2500, category="II").volts == 4200


# --- IEC 61010-1 edition 3: what is held and what is not ---------------------------------------------------------


def test_iec61010_clearance_and_creepage_tables_are_not_held():
    # IEC 61010-1:2010 Table 4 / Annex K could not be confirmed in public material: no figure is given
    with pytest.raises(TableNotHeld, match="Table 4"):
        iec61010.clearance(2500, 2, "basic", working_v=250, category="II")
    with pytest.raises(TableNotHeld, match="Table 4"):
        iec61010.creepage(250, 2, "IIIa", False, "basic")


@pytest.mark.parametrize("mains, grade, volts", [
    (120, "basic", 1350), (150, "basic", 1350), (150, "reinforced", 2700),  # IEC 61010-1:2010 Table 5, up to 150 V (from memory)
    (151, "basic", 1500), (230, "supplementary", 1500), (300, "double", 3000),  # above 150 V up to 300 V (from memory)
])
def test_iec61010_table5_test_voltages_from_memory(mains, grade, volts):
    test = iec61010.test_voltage(grade, mains, 250, 2500, category="II")
    assert test.volts == volts and test.seconds == 5 and not test.confirmed and "Table 5" in test.table


def test_iec61010_table5_ends_at_300_v_and_category_ii():
    # IEC 61010-1:2010 Table 5 covers category II mains up to 300 V; the rest is Annex K (not held)
    with pytest.raises(OutsideTable):
        iec61010.test_voltage("basic", 301, 301, 4000, category="II")
    with pytest.raises(OutsideTable, match="Annex K"):
        iec61010.test_voltage("basic", 230, 250, 4000, category="III")


def test_iec61010_earth_and_touch_limits_are_marked_from_memory():
    # IEC 61010-1:2010 clause 6.5.2.4 (0.1 ohm) and Table 19 (metal: 65 degC touched unintentionally, 55 degC held)
    assert iec61010.EARTH.limit_ohm == 0.1 and not iec61010.EARTH.confirmed and "from memory" in iec61010.EARTH.clause
    assert (iec61010.TOUCH.for_contact("brief").degrees, iec61010.TOUCH.for_contact("held").degrees) == (65, 55)
    assert "from memory" in iec61010.TOUCH.held.table
