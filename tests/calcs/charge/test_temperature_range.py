"""Battery temperature: the charging range, the clamped compensation, and sentences that hold for the record.

Charging range of lead-acid, -20 to 50 degC: Battery University, BU-410 "Charging at High and Low Temperatures",
Table 1 (from memory). Compensation about -3 mV per cell per kelvin: BU-403 "Charging Lead Acid" (confirmed).
"""

from __future__ import annotations

import math

import pytest
from tests.fixtures.site_kit import write_record

from dossier.calcs.charge import run
from dossier.findings import Verdict
from dossier.reading.record import load_record


def charger_record(tmp_path, environment=None, **battery):
    """An AGM 40 Ah charger, 14.4 V / 13.6 V at 25 degC, 6 A, invented for the tests."""
    spec = {"chemistry": "agm", "capacity": "40 Ah", "absorption_voltage": "14.4 V", "float_voltage": "13.6 V"}
    spec.update(battery)
    changes = {"output": {"voltage": "14.4 V", "current": "6 A", "battery": spec}}
    if environment is not None:
        changes["environment"] = environment
    return load_record(write_record(tmp_path, "charger", **changes)).record


def by_code(record):
    return {f.code: f for f in run(record)}


def test_compensation_over_minus_30_to_60_degc_is_not_a_pass(tmp_path):
    # -18 mV/K (-3 mV per cell per kelvin, BU-403) tracks the windows at every temperature, so before the range was
    # applied it passed "at any temperature". Charging is allowed only from -20 to 50 degC (BU-410, Table 1).
    found = by_code(charger_record(tmp_path, compensation="-18 mV/K", lowest_temperature="-30 degC", highest_temperature="60 degC"))
    compensation = found["CHG-COMPENSATION"]
    assert compensation.verdict is Verdict.FAIL
    assert "any" not in compensation.explanation and "from -20 to 50 °C" in compensation.explanation
    charging = found["CHG-TEMPERATURE"]
    assert charging.verdict is Verdict.FAIL and "thermal" in charging.explanation
    assert charging.limit.quantity.to("degC").magnitude == 50


def test_compensated_setpoint_is_clamped_at_the_range(tmp_path):
    # 14.4 V at 25 degC, -18 mV/K: at -30 degC unclamped it would be 14.4 + 0.018 x 55 = 15.39 V; the charger stops
    # compensating at the range's -20 degC: 14.4 + 0.018 x 45 = 15.21 V (BU-410 range; clamp: common practice).
    found = by_code(charger_record(tmp_path, compensation="-18 mV/K", lowest_temperature="-30 degC", highest_temperature="60 degC"))
    cold = next(m for m in found["CHG-COMPENSATION"].extra if m.label.endswith("-30 °C"))
    assert cold.quantity.to("V").magnitude == pytest.approx(14.4 + 0.018 * 45)
    hot = next(m for m in found["CHG-COMPENSATION"].extra if m.label.endswith("60 °C"))
    assert hot.quantity.to("V").magnitude == pytest.approx(14.4 - 0.018 * 25)


def test_a_hot_room_is_taken_for_the_battery_when_its_warmest_is_not_declared(tmp_path):
    # no highest_temperature: the warmer of 25 degC and the 55 degC highest ambient is taken (harsher reading),
    # above the 50 degC end of the charging range (BU-410, Table 1; from memory)
    found = by_code(charger_record(tmp_path, environment={"max_ambient": "55 degC"}))
    assert found["CHG-TEMPERATURE"].verdict is Verdict.FAIL
    assert "highest_temperature" in found["CHG-TEMPERATURE"].method


def test_a_battery_inside_the_range_passes(tmp_path):
    found = by_code(charger_record(tmp_path, compensation="-18 mV/K", lowest_temperature="0 degC", highest_temperature="40 degC"))
    assert found["CHG-TEMPERATURE"].verdict is Verdict.PASS


def test_time_to_full_worked_by_hand(tmp_path):
    # The CC-then-CV model (docs/calcs/charge.md; figures common practice, from memory): 40 Ah from 20 % at 6 A,
    # CV onset 70 %, efficiency 85 %, full at 0.03 C = 1.2 A.
    # CC: (0.70 - 0.20) x 40 / 0.85 / 6 = 3.9216 h; tau = (1 - 0.70) x 40 / 0.85 / (6 - 1.2) = 2.9412 h;
    # CV: tau ln(6 / 1.2) = 4.7337 h; total 8.655 h.
    cc = (0.70 - 0.20) * 40 / 0.85 / 6
    tau = (1 - 0.70) * 40 / 0.85 / (6 - 1.2)
    expected = cc + tau * math.log(6 / 1.2)
    assert expected == pytest.approx(8.655, abs=0.001)
    finding = by_code(charger_record(tmp_path))["CHG-TIME"]
    assert finding.value.quantity.to("h").magnitude == pytest.approx(expected, abs=0.005)
