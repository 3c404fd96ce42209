"""Lamination sizes and proportions, and silicon steel's grades, density and loss scaling."""

from __future__ import annotations

import pytest

from dossier.standards import electrical_steel as steel
from dossier.standards import laminations
from dossier.units import Q_


def test_ei_sizes_name_three_tongues_of_width():
    # Scrapless E-I series named by overall width = 3 a (McLyman; IEC 60740-1; from memory): EI 48 has a 16 mm tongue.
    assert laminations.tongue_of("EI 48") == Q_(16, "mm")
    assert laminations.tongue_of("ei48") == Q_(16, "mm")
    assert laminations.tongue_of("EI 96") == Q_(32, "mm")
    assert laminations.tongue_of("EI 50") is None
    assert laminations.tongue_of("E 48") is None


def test_scrapless_proportions_give_the_ei_48_window():
    # Scrapless E-I (McLyman's handbook, from memory): window a/2 by 3a/2, outer limbs and yokes a/2;
    # EI 48: window 8 x 24 mm, overall 48 x 40 mm.
    parts = laminations.scrapless(Q_(16, "mm"))
    assert parts["window_width"] == Q_(8, "mm") and parts["window_height"] == Q_(24, "mm")
    assert parts["outer_limb"] == Q_(8, "mm") and parts["yoke"] == Q_(8, "mm")


def test_two_is_fit_in_the_windows_of_two_es():
    # What 'scrapless' means: an I (3a by a/2) is cut from the windows of two E's facing each other (2 x a/2 by 3a/2 each).
    a = 1.0
    i_piece = 3 * a * (a / 2)
    two_windows = 2 * (laminations.SCRAPLESS["window_width"] * a) * (laminations.SCRAPLESS["window_height"] * a)
    assert two_windows == pytest.approx(i_piece)


@pytest.mark.parametrize("grade, loss, flux, thickness, family", [
    # IEC 60404-8-4 names: M<loss x 100>-<thickness x 100>A at 1.5 T, 50 Hz (designation scheme from memory).
    ("M400-50A", 4.00, 1.5, 0.50, steel.NON_ORIENTED),
    ("M270-35A", 2.70, 1.5, 0.35, steel.NON_ORIENTED),
    ("M1000-65A", 10.00, 1.5, 0.65, steel.NON_ORIENTED),
    # IEC 60404-8-7 names: grain-oriented at 1.7 T, 50 Hz; S conventional, P high permeability (from memory).
    ("M111-30P", 1.11, 1.7, 0.30, steel.GRAIN_ORIENTED),
    ("M150-35S", 1.50, 1.7, 0.35, steel.GRAIN_ORIENTED),
])
def test_a_grade_name_carries_its_loss(grade, loss, flux, thickness, family):
    rated = steel.grade_loss(grade)
    assert rated.loss == Q_(loss, "W/kg") and rated.flux == Q_(flux, "T") and rated.frequency == Q_(50, "Hz")
    assert steel.grade_thickness(grade) == Q_(thickness, "mm")
    assert steel.grade_family(grade) == family


def test_unknown_grade_names_are_not_grades():
    assert not steel.is_grade("M400-50") and not steel.is_grade("400-50A") and not steel.is_grade("silicon steel")


def test_loss_scales_as_b_squared_by_hand():
    # Common practice at mains frequency: loss as B^2. By hand: 1.3 W/kg at 1.5 T, 50 Hz -> at 1.2 T:
    # 1.3 x (1.2 / 1.5)^2 = 1.3 x 0.64 = 0.832 W/kg.
    rated = steel.RatedLoss(Q_(1.3, "W/kg"), Q_(1.5, "T"), Q_(50, "Hz"), "declared")
    assert steel.specific_loss(rated, Q_(1.2, "T"), Q_(50, "Hz")).magnitude == pytest.approx(0.832)


def test_frequency_exponent_takes_the_harsher_end():
    # Between hysteresis (f^1) and eddy-current (f^2) loss (common practice): 60 Hz on a 50 Hz figure takes f^2,
    # 50 Hz on a 60 Hz figure f^1, each the higher loss. By hand: 1.3 x (60 / 50)^2 = 1.872 W/kg.
    assert steel.frequency_exponent(Q_(60, "Hz"), Q_(50, "Hz"), None)[0] == 2.0
    assert steel.frequency_exponent(Q_(50, "Hz"), Q_(60, "Hz"), None)[0] == 1.0
    assert steel.frequency_exponent(Q_(60, "Hz"), Q_(50, "Hz"), 1.5)[0] == 1.5
    rated = steel.RatedLoss(Q_(1.3, "W/kg"), Q_(1.5, "T"), Q_(50, "Hz"), "declared")
    assert steel.specific_loss(rated, Q_(1.5, "T"), Q_(60, "Hz"), 2.0, 2.0).magnitude == pytest.approx(1.872)


def test_defaults_are_the_high_loss_ends():
    # Harsher readings (grades from memory): non-oriented as M1000-65A, 10 W/kg at 1.5 T; unknown steel's density the
    # densest conventional figure, 7.80 kg/dm^3; grain-oriented 7.65 kg/dm^3 (IEC 60404-8-7; from memory).
    assert steel.DEFAULT_LOSS[steel.NON_ORIENTED].loss == steel.grade_loss("M1000-65A").loss
    assert steel.DENSITY[steel.NON_ORIENTED] > steel.DENSITY[steel.GRAIN_ORIENTED] == Q_(7650, "kg/m**3")
