"""IEC 62368-1, IEC 60335-1 and IPC-2221B tables row by row, and worked cases across their boundaries.

Each check names the standard, edition and table; figures not seen in public material say "from memory".
"""

from __future__ import annotations

import pytest

from dossier.standards import iec60335, iec62368, ipc2221
from dossier.standards.iec60664 import OutsideTable
from dossier.standards.register import HELD, held_names, is_held, product_standard

# --- IEC 62368-1 edition 3.0 (2018), Table 14: clearance by required withstand voltage ----------------

# (V peak, pollution degree) -> (basic mm, reinforced mm); the 2500 V / PD2 row is confirmed in a public CB test
# report (1.5 mm basic, 3.0 mm reinforced); every other row is from memory.
T14_ROWS = [
    (330, (0.01, 0.2, 0.8), (0.04, 0.2, 0.8)),
    (500, (0.04, 0.2, 0.8), (0.1, 0.2, 0.8)),
    (800, (0.1, 0.2, 0.8), (0.5, 0.5, 0.8)),
    (1500, (0.5, 0.5, 0.8), (1.5, 1.5, 1.5)),
    (2500, (1.5, 1.5, 1.5), (3.0, 3.0, 3.0)),
    (4000, (3.0, 3.0, 3.0), (5.5, 5.5, 5.5)),
    (6000, (5.5, 5.5, 5.5), (8.0, 8.0, 8.0)),
    (8000, (8.0, 8.0, 8.0), (14.0, 14.0, 14.0)),
    (12000, (14.0, 14.0, 14.0), (19.0, 19.0, 19.0)),
]


@pytest.mark.parametrize("volts, basic, reinforced", T14_ROWS)
def test_iec62368_table14_row_by_row(volts, basic, reinforced):
    # IEC 62368-1:2018 Table 14 (from memory, but for 2500 V at PD2: confirmed)
    for pd in (1, 2, 3):
        assert iec62368.clearance(volts, pd, "basic").value == basic[pd - 1]
        assert iec62368.clearance(volts, pd, "supplementary").value == basic[pd - 1]
        assert iec62368.clearance(volts, pd, "reinforced").value == reinforced[pd - 1]


def test_iec62368_table14_confirmed_row_is_marked_confirmed():
    # IEC 62368-1:2018 Table 14, 2500 V peak, PD2: 1.5 mm basic, 3.0 mm reinforced (public CB test report)
    assert iec62368.clearance(2500, 2, "basic").confirmed and iec62368.clearance(2500, 2, "reinforced").value == 3.0
    assert not iec62368.clearance(4000, 2, "basic").confirmed
    assert "2500 V peak row" in iec62368.clearance(2500, 2, "reinforced").table


def test_iec62368_table14_between_rows_takes_the_next_row_up():
    # 2501 V is above the 2500 V row: the 4000 V row (IEC 62368-1:2018 Table 14; the harsher reading)
    assert iec62368.clearance(2500, 2, "basic").value == 1.5
    assert iec62368.clearance(2501, 2, "basic").value == 3.0
    assert "next row up" in iec62368.clearance(2501, 2, "basic").notes[0]
    with pytest.raises(OutsideTable):
        iec62368.clearance(12001, 2, "basic")
    with pytest.raises(OutsideTable):
        iec62368.clearance(2500, 4, "basic")


# --- IEC 62368-1:2018 Table 17: creepage -------------------------------------------------------------


@pytest.mark.parametrize("group, expected", [("I", 1.25), ("II", 1.8), ("IIIa", 2.5), ("IIIb", 2.5)])
def test_iec62368_table17_pd2_at_250_v(group, expected):
    # IEC 62368-1:2018 Table 17, 250 V, PD2: 1.25 / 1.8 / 2.5 mm (confirmed)
    found = iec62368.creepage(250, 2, group, False, "basic")
    assert found.value == expected and found.confirmed


def test_iec62368_table17_has_no_printed_board_column_and_doubles_for_reinforced():
    # IEC 62368-1:2018 Table 17 (no printed-board column, from memory): a board at PD2 gets the general column
    on_board = iec62368.creepage(250, 2, "II", True, "basic")
    assert on_board.value == 1.8 and any("printed-board" in note for note in on_board.notes)
    assert iec62368.creepage(250, 2, "II", False, "reinforced").value == pytest.approx(3.6)


def test_iec62368_table17_across_the_250_v_row():
    # IEC 62368-1:2018 Table 17 PD2 group IIIa: 250 V 2.5 mm, 251 V -> the 320 V row, 3.2 mm (from memory)
    assert iec62368.creepage(250, 2, "IIIa", False, "basic").value == 2.5
    assert iec62368.creepage(251, 2, "IIIa", False, "basic").value == 3.2


# --- IEC 62368-1:2018 electric strength, Tables 25 and 27 --------------------------------------------


@pytest.mark.parametrize("impulse, basic, reinforced", [row for row in iec62368.TEST_T25])
def test_iec62368_table25_row_by_row_without_mains(impulse, basic, reinforced):
    # IEC 62368-1:2018 Table 25 (from memory; reinforced 4000 V at 2500 V confirmed in a public test report)
    assert iec62368.test_voltage("basic", None, 100, impulse).volts == basic
    assert iec62368.test_voltage("reinforced", None, 100, impulse).volts == reinforced


def test_iec62368_table27_governs_where_it_is_higher():
    # IEC 62368-1:2018 Table 27 (from memory): mains up to 250 V -> 2000 V basic, 4000 V reinforced;
    # on a 120 V mains (1500 V transients) basic 2000 V from Table 27 beats 1500 V from Table 25
    assert iec62368.test_voltage("basic", 120, 120, 1500).volts == 2000
    assert iec62368.test_voltage("reinforced", 230, 230, 2500).volts == 4000
    assert iec62368.test_voltage("reinforced", 230, 230, 2500).confirmed
    # above 250 V the 600 V row: 2500 V basic, 5000 V reinforced
    assert iec62368.test_voltage("reinforced", 251, 251, 1500).volts == 5000


# --- IEC 60335-1 edition 5.0 (2010) with amendments: Table 16, Table 17, Table 7 (all from memory) -----


@pytest.mark.parametrize("impulse, expected", iec60335.CLEARANCE_T16)
def test_iec60335_table16_row_by_row(impulse, expected):
    # IEC 60335-1:2010 Table 16, from memory; PD2
    assert iec60335.clearance(impulse, 2, "basic").value == expected
    assert not iec60335.clearance(impulse, 2, "basic").confirmed


def test_iec60335_reinforced_takes_the_next_impulse_step():
    # IEC 60335-1:2010 clause 29.1.4 (from memory): 230 V category II, 2500 V -> next step 4000 V -> 3.0 mm
    assert iec60335.clearance(2500, 2, "reinforced").value == 3.0
    assert iec60335.clearance(1500, 2, "reinforced").value == 1.5
    with pytest.raises(OutsideTable):
        iec60335.clearance(10000, 2, "reinforced")


def test_iec60335_pollution_degree_3_at_least_0_8_mm():
    # IEC 60335-1:2010 Table 16 note (from memory): PD3 at least 0.8 mm
    assert iec60335.clearance(800, 3, "basic").value == 0.8
    assert iec60335.clearance(2500, 3, "basic").value == 1.5


def test_iec60335_asks_more_than_iec60664_at_low_impulse_voltages():
    # IEC 60335-1:2010 Table 16 0.5 mm at 800 V (from memory) vs IEC 60664-1:2020 Table F.2 PD2 0.2 mm (confirmed)
    from dossier.standards import iec60664

    assert iec60335.clearance(800, 2, "basic").value > iec60664.clearance_mm(800, 2)


@pytest.mark.parametrize("rated, basic, supplementary, reinforced", [(120, 1000, 1750, 3000), (150, 1000, 1750, 3000),
                                                                    (151, 1250, 1750, 3000), (230, 1250, 1750, 3000), (250, 1250, 1750, 3000)])
def test_iec60335_table7_by_rated_voltage(rated, basic, supplementary, reinforced):
    # IEC 60335-1:2010 Table 7 (clause 16.3), from memory; the 150 V / 151 V step
    assert iec60335.test_voltage("basic", rated, rated, 2500).volts == basic
    assert iec60335.test_voltage("supplementary", rated, rated, 2500).volts == supplementary
    assert iec60335.test_voltage("reinforced", rated, rated, 2500).volts == reinforced
    assert iec60335.test_voltage("basic", rated, rated, 2500).seconds == 60


def test_iec60335_table7_above_250_v_by_working_voltage():
    # IEC 60335-1:2010 Table 7 (from memory): above 250 V, 1.2 U + 700 / 1.2 U + 1450 / 2.4 U + 2400
    assert iec60335.test_voltage("basic", 400, 400, 4000).volts == pytest.approx(1180)
    assert iec60335.test_voltage("reinforced", 400, 400, 4000).volts == pytest.approx(3360)


# --- IPC-2221B Table 6-1 (confirmed against two public transcriptions) ----------------------------------


@pytest.mark.parametrize("volts, b1, b2, b4", [(row, *by_column) for row, by_column in ipc2221.SPACING_T6_1])
def test_ipc2221_table6_1_row_by_row(volts, b1, b2, b4):
    # IPC-2221B Table 6-1, columns B1, B2, B4
    assert ipc2221.spacing_mm(volts, "B1")[0] == b1
    assert ipc2221.spacing_mm(volts, "B2")[0] == b2
    assert ipc2221.spacing_mm(volts, "B4")[0] == b4


def test_ipc2221_across_rows_and_above_500_v():
    # IPC-2221B Table 6-1, B2: 30 V 0.1 mm, 31 V 0.6 mm; 300 V 1.25 mm, 301 V 2.5 mm; 1000 V 2.5 + 500 x 0.005 = 5.0 mm
    assert ipc2221.spacing_mm(30, "B2")[0] == 0.1 and ipc2221.spacing_mm(31, "B2")[0] == 0.6
    assert ipc2221.spacing_mm(300, "B2")[0] == 1.25 and ipc2221.spacing_mm(301, "B2")[0] == 2.5
    assert ipc2221.spacing_mm(1000, "B2")[0] == pytest.approx(5.0)


def test_ipc2221_uncoated_above_3050_m_is_not_held():
    # IPC-2221B Table 6-1: B2 covers sea level to 3050 m; B3 (above) is not held
    assert ipc2221.column_for("external-uncoated", 3050) == "B2"
    with pytest.raises(OutsideTable):
        ipc2221.column_for("external-uncoated", 3051)
    assert ipc2221.column_for("external-coated", 4000) == "B4"


# --- the register -------------------------------------------------------------------------------------


def test_the_register_holds_four_product_standards_and_the_basic_one():
    assert set(HELD) == {("iec-62368-1", 3), ("iec-60335-1", 5), ("iec-61010-1", 3), ("iec-61558-1", 3)}
    assert product_standard("iec-60664-1", 3) is None and is_held("iec-60664-1", 3)
    assert not is_held("iec-62368-1", 2)
    assert held_names()[0] == "iec-60664-1 edition 3"
