"""The staged first power-up follows the unit's input: a variac (or a variac ahead of an isolating transformer)
brought up in steps with each rail's reading at every step, else a series lamp; valves and load out first."""

from __future__ import annotations

import pytest

from dossier.checklist.sheet import build_checklist
from dossier.plugins import load_calcs
from dossier.record.model import Record
from dossier.review import run_review
from dossier.units import Q_

HEAD = {"id": "case", "title": "Case", "revision": "A", "date": "2026-01-01", "authors": ["A. Tester"], "status": "design",
        "mains": {"nominal": "230 V", "frequency": "50 Hz", "tolerance": "10 %"}}


def unit(input_topology: str) -> Record:
    stages = [{"id": "input", "kind": "mains-input", "name": "Input", "side": "mains", "topology": input_topology},
              {"id": "pt", "kind": "magnetics", "name": "Transformer", "side": "isolated"},
              {"id": "ht", "kind": "rectifier", "name": "HT", "side": "isolated", "topology": "bridge"},
              {"id": "heater", "kind": "output", "name": "Heaters", "side": "isolated", "fed_from": ["pt"]}]
    rails = [{"name": "HT", "stage": "ht", "voltage": "300 V", "current": "50 mA", "no_load_voltage": "340 V", "capacitance": "47 uF", "bleeder": "47 kohm"},
             {"name": "heater", "stage": "heater", "voltage": "6.3 V", "kind": "ac", "no_load_voltage": "7 V"}]
    return Record(**HEAD, stages=stages, rails=rails)


def checklist(record):
    return build_checklist(record, run_review(record, load_calcs()))


@pytest.mark.parametrize("topology, device", [("variac", "its variac"), ("isolating-transformer", "a variac ahead of its isolating transformer")])
def test_a_variac_input_is_brought_up_in_steps_with_the_readings_at_each(topology, device):
    sheet = checklist(unit(topology))
    first = sheet.item("staged-power-up")
    assert device in first.title and "steps of a quarter" in first.steps and "series lamp" not in first.steps
    assert "pull the valves" in first.steps
    # with no load a rectified rail follows the mains in proportion (common practice): at half the mains, 340 V / 2
    half = sheet.item("variac-step-50")
    assert "115 V" in half.title and half.unit == "V"
    assert half.expected.high == Q_(170, "V") and half.expected.low == Q_(150, "V")
    assert "heater about 3.5 V" in half.steps
    assert [item.key for item in sheet.items if item.key.startswith("variac-step-")] == [f"variac-step-{n}" for n in (25, 50, 75, 100)]


def test_a_direct_input_is_switched_on_through_a_series_lamp():
    sheet = checklist(unit("direct"))
    first = sheet.item("staged-power-up")
    assert "series lamp" in first.title and "stays bright" in first.steps and "pull the valves" in first.steps
    assert not [item for item in sheet.items if item.key.startswith("variac-step-")]


def test_a_bench_unit_with_its_own_variac_and_only_an_ac_rail_gets_the_steps_too():
    from tests.fixtures.demo import load_test_record

    sheet = checklist(load_test_record("iso-variac-bench"))
    first = sheet.item("staged-power-up")
    assert "its variac" in first.title and "valves" not in first.steps
    assert sheet.item("variac-step-100").expected.high == Q_(260, "V")
