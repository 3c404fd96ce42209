"""The stage graph and the rails: ids and fed_from default to one chain, branches are kept, bad graphs refused."""

from __future__ import annotations

from pathlib import Path

import pytest
from pydantic import ValidationError

from dossier.reading.record import load_record
from dossier.record.model import Record
from dossier.record.stages import TOPOLOGIES
from dossier.units import Q_

DEMO = Path(__file__).resolve().parents[2] / "demo" / "archive"
HEAD = {"id": "case", "title": "Case", "revision": "A", "date": "2026-01-01", "authors": ["A. Tester"], "status": "design"}


def stage(kind: str, **more) -> dict:
    return {"kind": kind, "name": more.pop("name", kind), "side": more.pop("side", "isolated"), **more}


def valve_supply(**more) -> Record:
    return Record(**HEAD, stages=[
        stage("mains-input", side="mains", id="input"),
        stage("magnetics", id="mains-transformer"),
        stage("rectifier", id="ht-rectifier", topology="bridge"),
        stage("filter", id="ht-filter", topology="clc"),
        stage("rectifier", id="bias-rectifier", topology="half-wave", fed_from=["mains-transformer"]),
        stage("output", id="heater", fed_from=["mains-transformer"]),
    ], **more)


def test_stages_without_ids_are_one_chain_numbered_by_position():
    record = Record(**HEAD, stages=[stage("mains-input", side="mains"), stage("rectifier", topology="bridge"), stage("regulator")])
    assert record.stage_ids == ["s1", "s2", "s3"]
    assert [s.feeds_from for s in record.stages] == [(), ("s1",), ("s2",)]


def test_a_stage_names_the_stages_it_is_fed_from_so_branches_are_kept():
    record = valve_supply()
    assert record.stage_by_id("ht-filter")[1].feeds_from == ("ht-rectifier",)
    assert record.stage_by_id("bias-rectifier")[1].feeds_from == ("mains-transformer",)
    assert record.stage_by_id("heater") == (5, record.stages[5])
    assert record.stage_by_id("nowhere") is None


def test_the_first_stage_is_fed_from_nothing_unless_it_says():
    assert valve_supply().stages[0].feeds_from == ()


def test_rails_name_their_stage_and_carry_units():
    record = valve_supply(rails=[{"name": "B+", "stage": "ht-filter", "voltage": "350 V", "current": "120 mA",
                                  "no_load_voltage": "390 V", "capacitance": "25 uF", "bleeder": "220 kohm"},
                                 {"name": "heater", "stage": "heater", "voltage": "6.3 V", "kind": "ac", "current": "3 A"},
                                 {"name": "bias", "stage": "bias-rectifier", "voltage": "45 V", "polarity": "negative"}])
    b_plus, heater, bias = record.rails
    assert b_plus.no_load_voltage == Q_(390, "V") and b_plus.bleeder == Q_(220, "kohm") and not b_plus.accessible
    assert heater.kind == "ac" and bias.polarity == "negative" and b_plus.polarity == "positive"


def test_a_rail_whose_no_load_voltage_is_below_its_loaded_voltage_is_refused():
    with pytest.raises(ValidationError, match="no_load_voltage at least the loaded voltage"):
        valve_supply(rails=[{"name": "B+", "stage": "ht-filter", "voltage": "350 V", "no_load_voltage": "300 V"}])


@pytest.mark.parametrize("kind", sorted(TOPOLOGIES))
def test_every_checked_kind_accepts_each_of_its_topologies_and_refuses_others(kind):
    for topology in TOPOLOGIES[kind]:
        assert Record(**HEAD, stages=[stage(kind, topology=topology)]).stages[0].topology_name == topology
    with pytest.raises(ValidationError, match=f"a {kind} topology"):
        Record(**HEAD, stages=[stage(kind, topology="no-such-topology")])


def test_older_spellings_read_as_the_topology_they_stand_for():
    record = Record(**HEAD, stages=[stage("regulator", topology="linear"), stage("rectifier", topology="voltage-doubler")])
    assert [s.topology_name for s in record.stages] == ["series-pass", "doubler"]


def test_free_text_topologies_stay_free_for_the_other_kinds():
    record = Record(**HEAD, stages=[stage("converter", topology="self-oscillating-half-bridge"), stage("other", topology="anything")])
    assert record.stages[0].topology_name == "self-oscillating-half-bridge"


def test_a_two_stage_circle_is_reported_once_at_the_entry_that_closes_it():
    with pytest.raises(ValidationError) as raised:
        Record(**HEAD, stages=[stage("mains-input", side="mains"), stage("rectifier", fed_from=["s3"]), stage("filter")])
    assert [error["loc"] for error in raised.value.errors()] == [("stages", 1, "fed_from", 0)]


@pytest.mark.parametrize("path", sorted(DEMO.glob("*/rev-*.yaml")), ids=lambda p: f"{p.parent.name}/{p.stem}")
def test_every_demo_record_is_still_one_chain(path):
    record = load_record(path).record
    assert all(s.feeds_from == ((record.stages[i - 1].id,) if i else ()) for i, s in enumerate(record.stages))
