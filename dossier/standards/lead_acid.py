"""Charging windows of lead-acid batteries (flooded, AGM, gel), per cell at 25 degC, as data.

General figures (absorption about 2.40 V/cell, valve-regulated cyclic 2.40-2.45 V/cell, float
2.25-2.30 V/cell, about -3 mV per cell per kelvin, charge current 10-30 % of capacity) are from
Battery University's BU-403. Where a chemistry's own figures narrow or move these, they come from
the makers' charging guides named beside them, recalled from memory; the sources say so.
"""

from __future__ import annotations

from dossier.citations import BU_403, BU_410, GEL_VRLA_HANDBOOK, LINDEN_BATTERIES, TROJAN_USERS_GUIDE, YUASA_NP_MANUAL
from dossier.findings import common_practice
from dossier.standards.battery import Chemistry, CurveModel, Window
from dossier.units import Q_


def volts_per_cell(low: float, high: float, *sources) -> Window:
    return Window(Q_(low, "V"), Q_(high, "V"), tuple(sources))


def charge_rate(low: float, high: float, *sources) -> Window:
    return Window(Q_(low, "1/h"), Q_(high, "1/h"), tuple(sources))


TYPICAL_COMPENSATION = Q_(-3, "mV/K")  # per cell, BU-403

def compensation(*sources) -> Window:
    """Per cell: makers go up to -5 mV/K; BU-403 gives about -3 mV/K, taken down to -2.5 for its rounding."""
    return Window(Q_(-5, "mV/K"), Q_(-2.5, "mV/K"), (BU_403, *sources))


# Charging temperature range of lead-acid: -20 to 50 degC (BU-410, Table 1; from memory). Makers' guides for valve-regulated
# batteries give about the same upper end and warn that charging hot invites thermal runaway (from memory).
def charge_temperature(*sources) -> Window:
    return Window(Q_(-20, "degC"), Q_(50, "degC"), (BU_410, *sources))


LEAD_ACID_CURVE = CurveModel(
    cv_onset=0.70,
    termination=Q_(0.03, "1/h"),
    efficiency=0.85,
    start_voltage=Q_(2.00, "V"),
    sources=(
        BU_403,
        common_practice("constant current to about 70 % charge, then a tapering topping charge (recalled from memory)"),
        common_practice("full when the taper current falls to about 0.02-0.03 C; charge efficiency about 85 % (from memory)"),
    ),
)

FLOODED = Chemistry(
    key="flooded",
    title="flooded (vented) lead-acid",
    label="flooded",
    absorption=volts_per_cell(2.35, 2.45, BU_403, TROJAN_USERS_GUIDE),
    float_charge=volts_per_cell(2.20, 2.27, BU_403, TROJAN_USERS_GUIDE),
    compensation=compensation(TROJAN_USERS_GUIDE),
    typical_compensation=TYPICAL_COMPENSATION,
    charge_rate=charge_rate(0.10, 0.30, BU_403),
    curve=LEAD_ACID_CURVE,
    charge_temperature=charge_temperature(TROJAN_USERS_GUIDE),
)

AGM = Chemistry(
    key="agm",
    title="AGM (absorbent glass mat, valve-regulated) lead-acid",
    label="AGM",
    absorption=volts_per_cell(2.40, 2.45, BU_403, YUASA_NP_MANUAL),
    float_charge=volts_per_cell(2.25, 2.30, BU_403, YUASA_NP_MANUAL),
    compensation=compensation(YUASA_NP_MANUAL),
    typical_compensation=TYPICAL_COMPENSATION,
    charge_rate=charge_rate(0.10, 0.30, BU_403, LINDEN_BATTERIES),
    curve=LEAD_ACID_CURVE,
    charge_temperature=charge_temperature(YUASA_NP_MANUAL),
    valve_regulated=True,
)

GEL = Chemistry(
    key="gel",
    title="gel (valve-regulated) lead-acid",
    label="gel",
    absorption=volts_per_cell(2.35, 2.40, BU_403, GEL_VRLA_HANDBOOK),
    float_charge=volts_per_cell(2.25, 2.30, BU_403, GEL_VRLA_HANDBOOK),
    compensation=compensation(GEL_VRLA_HANDBOOK),
    typical_compensation=TYPICAL_COMPENSATION,
    charge_rate=charge_rate(0.10, 0.20, BU_403, GEL_VRLA_HANDBOOK),
    curve=LEAD_ACID_CURVE,
    charge_temperature=charge_temperature(GEL_VRLA_HANDBOOK),
    valve_regulated=True,
)

CHEMISTRIES = (FLOODED, AGM, GEL)
