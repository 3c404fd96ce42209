"""The lead-acid charging windows against the published charging guides they come from."""

from __future__ import annotations

import pytest

from dossier.calcs.charge.windows import inside, judge_window, nearer_edge, tolerance_band
from dossier.citations import BU_403
from dossier.findings import Verdict
from dossier.standards.battery import REFERENCE_TEMPERATURE
from dossier.standards.chemistries import chemistry
from dossier.standards.lead_acid import AGM, CHEMISTRIES, FLOODED, GEL
from dossier.units import Q_

SIX_CELLS = 6


def volts(quantity) -> float:
    return quantity.to("V").magnitude


def test_agm_absorption_window_is_the_vrla_cyclic_range():
    # BU-403 'Charging Lead Acid' (Battery University, Cadex Electronics): valve-regulated cyclic use
    # 14.40-14.70 V for a 12 V battery at 25 degC; Yuasa NP VRLA manual agrees (from memory).
    window = AGM.absorption.scaled(SIX_CELLS)
    assert (volts(window.low), volts(window.high)) == pytest.approx((14.40, 14.70))


def test_agm_float_window_is_the_published_float_range():
    # BU-403 (Battery University): float 13.50-13.80 V for a 12 V battery at 25 degC.
    window = AGM.float_charge.scaled(SIX_CELLS)
    assert (volts(window.low), volts(window.high)) == pytest.approx((13.50, 13.80))


@pytest.mark.parametrize("chem", CHEMISTRIES, ids=lambda c: c.key)
def test_the_general_absorption_figure_of_2_40_v_per_cell_is_in_every_window(chem):
    # BU-403 (Battery University): absorption (constant-voltage) limit about 2.40 V/cell.
    assert inside(Q_(2.40, "V"), chem.absorption.low, chem.absorption.high)


@pytest.mark.parametrize("chem", CHEMISTRIES, ids=lambda c: c.key)
def test_float_sits_below_absorption(chem):
    assert chem.float_charge.high < chem.absorption.low + Q_(0.001, "V")


def test_flooded_floats_lower_and_gel_absorbs_lower_than_agm():
    # Trojan Battery User's Guide: flooded float about 2.20 V/cell (from memory);
    # GNB/Exide Handbook for Gel-VRLA-Batteries Part 2: gel charged to at most about 2.40 V/cell (from memory).
    assert FLOODED.float_charge.low < AGM.float_charge.low
    assert GEL.absorption.high <= AGM.absorption.low + Q_(0.001, "V")


def test_temperature_coefficient_is_minus_3_mv_per_cell_per_kelvin():
    # BU-403 (Battery University): about -3 mV per cell per degC, -18 mV/degC for a 12 V battery.
    for chem in CHEMISTRIES:
        assert chem.typical_compensation.to("mV/K").magnitude == pytest.approx(-3)
        assert (chem.typical_compensation * SIX_CELLS).to("mV/K").magnitude == pytest.approx(-18)


@pytest.mark.parametrize("chem", CHEMISTRIES, ids=lambda c: c.key)
def test_compensation_window_spans_the_published_coefficients(chem):
    # BU-403: about -3 mV/cell/degC; makers quote up to -5 mV/cell/degC (e.g. Trojan Battery User's Guide, from memory).
    for coefficient in (-3, -5):
        assert inside(Q_(coefficient, "mV/K"), chem.compensation.low, chem.compensation.high)
    assert not inside(Q_(-6, "mV/K"), chem.compensation.low, chem.compensation.high)


def test_agm_window_at_35_degc_moves_down_by_180_mv():
    # 10 K warmer at -18 mV/K for six cells (BU-403): 14.40-14.70 V becomes 14.22-14.52 V.
    window = AGM.absorption_at(Q_(35, "degC")).scaled(SIX_CELLS)
    assert (volts(window.low), volts(window.high)) == pytest.approx((14.22, 14.52))


def test_window_at_reference_temperature_is_unmoved():
    assert AGM.absorption_at(REFERENCE_TEMPERATURE) == AGM.absorption


@pytest.mark.parametrize("chem", [FLOODED, AGM], ids=lambda c: c.key)
def test_charge_current_is_10_to_30_percent_of_capacity(chem):
    # BU-403 (Battery University): charge current 10-30 % of the rated capacity; sealed types often at most 0.3 C.
    assert (chem.charge_rate.low.to("1/h").magnitude, chem.charge_rate.high.to("1/h").magnitude) == pytest.approx((0.10, 0.30))


def test_gel_takes_less_current_than_agm():
    # Makers' gel guides (GNB/Exide Handbook for Gel-VRLA-Batteries; from memory): gel charges at lower currents.
    assert GEL.charge_rate.high < AGM.charge_rate.high


@pytest.mark.parametrize("chem", CHEMISTRIES, ids=lambda c: c.key)
def test_every_window_cites_bu_403_and_says_where_figures_are_from_memory(chem):
    windows = [chem.absorption, chem.float_charge, chem.compensation, chem.charge_rate]
    for window in windows:
        assert BU_403 in window.sources
        for source in window.sources:
            assert source.publisher, source.title
            assert source is BU_403 or "from memory" in source.clause


def test_the_registry_serves_the_same_data():
    assert chemistry("agm") is AGM


def test_window_edges_are_free_of_rounding_noise():
    # 2.35 x 6 would otherwise be 14.100000000000001 and refuse a setpoint of exactly 14.1 V.
    window = FLOODED.absorption.scaled(SIX_CELLS)
    assert judge_window(Q_(14.1, "V"), window, "flooded absorption").verdict is Verdict.PASS


def test_judge_window_names_the_edge_a_value_misses():
    window = AGM.absorption.scaled(SIX_CELLS)
    low = judge_window(Q_(14.0, "V"), window, "agm")
    high = judge_window(Q_(15.0, "V"), window, "agm")
    assert (low.verdict, low.relation, volts(low.limit.quantity)) == (Verdict.FAIL, ">=", pytest.approx(14.4))
    assert (high.verdict, high.relation, volts(high.limit.quantity)) == (Verdict.FAIL, "<=", pytest.approx(14.7))


def test_a_tolerance_band_crossing_an_edge_is_marginal():
    window = AGM.absorption.scaled(SIX_CELLS)
    band = tolerance_band(Q_(14.55, "V"), Q_(1, "percent"))
    assert judge_window(Q_(14.55, "V"), window, "agm", band=band).verdict is Verdict.PASS
    band = tolerance_band(Q_(14.45, "V"), Q_(1, "percent"))
    assert judge_window(Q_(14.45, "V"), window, "agm", band=band).verdict is Verdict.MARGINAL


def test_nearer_edge_inside_the_window():
    window = AGM.absorption.scaled(SIX_CELLS)
    measure, relation = nearer_edge(Q_(14.65, "V"), window, "agm")
    assert relation == "<=" and "high end" in measure.label
