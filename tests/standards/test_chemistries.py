"""Chemistries are a registry: built-ins plus plugins from the 'dossier.chemistries' entry-point group."""

from __future__ import annotations

from dataclasses import replace

import pytest
from tests.fixtures.chargers import charger, findings_by_code
from tests.fixtures.entry_points import FakeEntryPoint

from dossier.findings import Verdict, common_practice
from dossier.standards import chemistries
from dossier.standards.battery import CurveModel, Window
from dossier.standards.chemistries import GROUP, ChemistryError, load_chemistries
from dossier.standards.lead_acid import AGM
from dossier.units import Q_


TEST_SOURCE = common_practice("invented test chemistry, not real data")

# An invented chemistry for the tests only: no float stage, no temperature coefficient.
NO_FLOAT = chemistries.Chemistry(
    key="testcell",
    title="invented test chemistry",
    label="test",
    absorption=Window(Q_(3.50, "V"), Q_(3.60, "V"), (TEST_SOURCE,)),
    float_charge=None,
    compensation=None,
    typical_compensation=Q_(0, "mV/K"),
    charge_rate=Window(Q_(0.2, "1/h"), Q_(1.0, "1/h"), (TEST_SOURCE,)),
    curve=CurveModel(cv_onset=0.9, termination=Q_(0.05, "1/h"), efficiency=0.98, start_voltage=Q_(3.0, "V"), sources=(TEST_SOURCE,)),
)


def test_group_name_is_the_documented_one():
    assert GROUP == "dossier.chemistries"


def test_builtins_are_there_without_any_plugin():
    assert list(load_chemistries([])) == ["flooded", "agm", "gel"]


def test_a_plugin_chemistry_is_added():
    found = load_chemistries([FakeEntryPoint("testcell", NO_FLOAT)])
    assert found["testcell"] is NO_FLOAT and "agm" in found


@pytest.mark.parametrize("point, reason", [
    (FakeEntryPoint("odd", object()), "must name a dossier.standards.chemistries.Chemistry"),
    (FakeEntryPoint("other", NO_FLOAT), "has key 'testcell'"),
    (FakeEntryPoint("agm", replace(AGM)), "already taken"),
    (FakeEntryPoint("broken", error=ImportError("no module named cells")), "could not be loaded: ImportError"),
])
def test_a_broken_plugin_is_named_with_the_reason(point, reason):
    with pytest.raises(ChemistryError) as raised:
        load_chemistries([point])
    assert f"chemistry plugin '{point.name}'" in str(raised.value) and reason in str(raised.value)


def test_the_registry_cannot_be_changed_by_a_caller():
    with pytest.raises(TypeError):
        chemistries.registry()["mine"] = NO_FLOAT


@pytest.fixture
def with_test_chemistry(monkeypatch):
    found = dict(chemistries.registry(), testcell=NO_FLOAT)
    monkeypatch.setattr(chemistries, "registry", lambda: found)


def test_a_record_may_name_a_plugin_chemistry_and_the_calc_uses_it(with_test_chemistry):
    record = charger(chemistry="testcell", cells=4, absorption_voltage="14.2 V", float_voltage=None, output={"tolerance": None})
    found = findings_by_code(record)
    # 4 x 3.50-3.60 V = 14.0-14.4 V: 14.2 V is inside; 7 A on 65 Ah is 0.11 C, below 0.2 C.
    assert found["CHG-SETPOINT"].verdict is Verdict.PASS
    assert found["CHG-CURRENT"].verdict is Verdict.MARGINAL
    assert "CHG-FLOAT" not in found and "CHG-COMPENSATION" not in found
    assert found["CHG-TIME"].verdict is Verdict.INFO


def test_a_float_stage_on_a_chemistry_without_one_is_marginal(with_test_chemistry):
    record = charger(chemistry="testcell", cells=4, absorption_voltage="14.2 V", float_voltage="13.6 V")
    assert findings_by_code(record)["CHG-FLOAT"].verdict is Verdict.MARGINAL


def test_compensation_on_a_chemistry_without_a_coefficient_is_marginal(with_test_chemistry):
    record = charger(chemistry="testcell", cells=4, absorption_voltage="14.2 V", float_voltage=None, compensation="-12 mV/K")
    assert findings_by_code(record)["CHG-COMPENSATION"].verdict is Verdict.MARGINAL
