"""Wire sizes and copper: ASTM B258 AWG diameters, IEC 60317-0-1 enamel grades, IEC 60028 copper."""

from __future__ import annotations

import math

import pytest

from dossier.standards import copper, wire
from dossier.units import Q_, awg_diameter


def test_awg_18_and_26_in_millimetres():
    # ASTM B258, table of nominal diameters: AWG 18 = 0.0403 in = 1.024 mm, AWG 26 = 0.0159 in = 0.404 mm (confirmed).
    assert awg_diameter(18).to("mm").magnitude == pytest.approx(1.024, abs=0.0005)
    assert awg_diameter(26).to("mm").magnitude == pytest.approx(0.404, abs=0.001)


# ASTM B258-18, Table 1, nominal diameters in inches to four decimals: AWG 18 and 26 confirmed, the others from memory.
ASTM_B258_TABLE_1 = [
    (10, 0.1019, "from memory"), (12, 0.0808, "from memory"), (14, 0.0641, "from memory"), (16, 0.0508, "from memory"),
    (18, 0.0403, "confirmed"), (20, 0.0320, "from memory"), (22, 0.0253, "from memory"), (24, 0.0201, "from memory"),
    (26, 0.0159, "confirmed"), (28, 0.0126, "from memory"), (30, 0.0100, "from memory"),
]


@pytest.mark.parametrize("gauge, inches, status", ASTM_B258_TABLE_1)
def test_awg_formula_matches_the_table_to_its_last_digit(gauge, inches, status):
    # ASTM B258-18, Table 1 (status of each value beside it): the formula rounds to the table's four decimals.
    assert awg_diameter(gauge).to("inch").magnitude == pytest.approx(inches, abs=0.00005)


def test_awg_steps_by_the_39th_root_of_92():
    # ASTM B258 defines the series: 39 steps from AWG 36 (0.005 in) to AWG 0000 (0.46 in), a ratio of 92.
    assert awg_diameter(-3).to("inch").magnitude == pytest.approx(0.46, rel=1e-9)
    assert (awg_diameter(20) / awg_diameter(21)).to("").magnitude == pytest.approx(92 ** (1 / 39))


def test_enamel_grades_thicken_in_order_for_every_size():
    # IEC 60317-0-1: grade 1 < grade 2 < grade 3 overall diameter at each nominal size (table values from memory).
    for size, (g1, g2, g3) in wire.ENAMEL_TABLE.items():
        assert size < g1 < g2 < g3, size


def test_enamel_build_up_grows_with_size():
    # IEC 60317-0-1: the permitted increase in diameter grows with the conductor size (from memory).
    for grade in (1, 2, 3):
        builds = [row[grade - 1] - size for size, row in sorted(wire.ENAMEL_TABLE.items())]
        assert builds == sorted(builds), grade


def test_overall_diameter_at_a_table_size_is_the_table_value():
    # IEC 60317-0-1, enamelled round copper wire, 0.500 mm grade 2: at most 0.566 mm overall (from memory).
    found = wire.overall_diameter(Q_(0.5, "mm"), 2)
    assert found.diameter.magnitude == pytest.approx(0.566)
    assert "table value" in found.basis


def test_overall_diameter_between_sizes_is_interpolated():
    # IEC 60317-0-1 grade 2 (from memory): 0.500 mm -> 0.566 (build 0.066), 0.630 mm -> 0.704 (build 0.074);
    # 0.565 mm lies halfway, so its build is 0.070 mm and its overall diameter 0.635 mm (dossier's interpolation).
    found = wire.overall_diameter(Q_(0.565, "mm"), 2)
    assert found.diameter.magnitude == pytest.approx(0.635)
    assert "interpolated" in found.basis


def test_overall_diameter_without_a_grade_assumes_grade_2():
    # IEC 60317-0-1, 0.800 mm grade 2: at most 0.884 mm overall (from memory).
    found = wire.overall_diameter(Q_(0.8, "mm"))
    assert found.diameter.magnitude == pytest.approx(0.884)
    assert "grade assumed" in found.basis


def test_overall_diameter_outside_the_table_uses_the_nearest_build_up():
    # IEC 60317-0-1, 2.000 mm grade 1: 2.074 mm (from memory); 3 mm keeps that 0.074 mm build: 3.074 mm.
    found = wire.overall_diameter(Q_(3.0, "mm"), 1)
    assert found.diameter.magnitude == pytest.approx(3.074)
    assert "outside the table" in found.basis


def test_triple_insulated_wire_is_thicker_than_any_enamel_grade():
    # Triple-insulated wire: about 0.2 mm over the copper (makers' listings, from memory): 0.5 mm -> 0.7 mm.
    tiw = wire.overall_diameter(Q_(0.5, "mm"), triple_insulated=True).diameter
    assert tiw.to("mm").magnitude == pytest.approx(0.7)
    assert tiw > wire.overall_diameter(Q_(0.5, "mm"), 3).diameter


def test_copper_area_of_strands():
    # three strands of 0.8 mm: 3 x pi x 0.8^2 / 4 = 1.508 mm^2 (geometry)
    assert wire.copper_area(Q_(0.8, "mm"), 3).magnitude == pytest.approx(1.508, abs=0.0005)
    assert wire.copper_area(Q_(0.8, "mm"), 3).magnitude == pytest.approx(3 * math.pi * 0.64 / 4)


def test_copper_resistivity_at_20_degC():
    # IEC 60028: annealed copper 1/58 ohm mm^2/m = 0.017241 at 20 degC (confirmed).
    assert copper.resistivity().to("ohm*mm**2/m").magnitude == pytest.approx(0.017241, rel=1e-4)


def test_copper_temperature_coefficient():
    # IEC 60028: 0.00393 per kelvin at 20 degC (confirmed); at 100 degC rho is (1 + 80 x 0.00393) times rho_20.
    ratio = (copper.resistivity(Q_(100, "degC")) / copper.resistivity()).to("").magnitude
    assert ratio == pytest.approx(1 + 80 * 0.00393)


@pytest.mark.parametrize("gauge, ohm_per_kft", [(18, 7.77), (14, 3.07)])
def test_solid_awg_resistance_at_75_degC(gauge, ohm_per_kft):
    # NFPA 70 (National Electrical Code), Chapter 9, Table 8: solid uncoated copper at 75 degC,
    # 18 AWG 7.77 ohm/kFT, 14 AWG 3.07 ohm/kFT (from memory).
    area = wire.copper_area(awg_diameter(gauge))
    found = copper.resistance(Q_(1000, "ft"), area, Q_(75, "degC"))
    assert found.to("ohm").magnitude == pytest.approx(ohm_per_kft, abs=0.01)


def test_skin_depth_of_copper_at_20_kHz():
    # delta = sqrt(rho / (pi f mu_0)) with IEC 60028 copper: 0.467 mm at 20 kHz and 20 degC (confirmed). McLyman,
    # Transformer and Inductor Design Handbook (CRC Press), gives 6.62 / sqrt(f) cm for copper (from memory).
    assert copper.skin_depth(Q_(20, "kHz")).to("mm").magnitude == pytest.approx(0.467, abs=0.0005)
    assert copper.skin_depth(Q_(20, "kHz")).to("cm").magnitude == pytest.approx(6.62 / math.sqrt(20e3), rel=0.005)


def test_skin_depth_falls_with_the_root_of_frequency():
    # delta is proportional to 1 / sqrt f: four times the frequency halves it
    ratio = (copper.skin_depth(Q_(10, "kHz")) / copper.skin_depth(Q_(40, "kHz"))).to("").magnitude
    assert ratio == pytest.approx(2.0)


# IEC 60317-0-1 (edition 4.0, 2013), table of dimensions of enamelled round copper wire: maximum overall diameter
# (mm) of grade 1, 2 and 3 by nominal conductor diameter. Every row from memory: not seen in a copy of the standard.
IEC_60317_0_1_MAXIMUM_OVERALL = [
    (0.100, 0.117, 0.125, 0.132), (0.125, 0.144, 0.153, 0.162), (0.160, 0.182, 0.194, 0.205),
    (0.200, 0.226, 0.239, 0.252), (0.250, 0.281, 0.297, 0.312), (0.315, 0.349, 0.367, 0.384),
    (0.400, 0.439, 0.459, 0.478), (0.500, 0.544, 0.566, 0.587), (0.630, 0.679, 0.704, 0.728),
    (0.710, 0.762, 0.789, 0.814), (0.800, 0.855, 0.884, 0.911), (0.900, 0.959, 0.989, 1.018),
    (1.000, 1.062, 1.094, 1.124), (1.250, 1.316, 1.349, 1.381), (1.600, 1.670, 1.706, 1.740),
    (2.000, 2.074, 2.112, 2.148),
]


@pytest.mark.parametrize("nominal, grade_1, grade_2, grade_3", IEC_60317_0_1_MAXIMUM_OVERALL)
def test_every_enamel_table_row_is_pinned(nominal, grade_1, grade_2, grade_3):
    # IEC 60317-0-1 ed. 4.0 (2013), table of dimensions, grades 1-3 (from memory): each row as the code uses it
    for grade, expected in ((1, grade_1), (2, grade_2), (3, grade_3)):
        assert wire.overall_diameter(Q_(nominal, "mm"), grade).diameter.to("mm").magnitude == pytest.approx(expected, abs=1e-9)
    assert len(wire.ENAMEL_TABLE) == len(IEC_60317_0_1_MAXIMUM_OVERALL)
