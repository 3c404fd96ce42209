"""Every stage kind and topology the record accepts gets a drawing of its own: never the placeholder block,
always a well-formed SVG carrying each part's designator and value."""

from __future__ import annotations

import re
from xml.etree import ElementTree

import pytest
from tests.drawing.test_schematics import svg_lines, svg_words
from tests.fixtures.stage_samples import HT, kinds_and_topologies, sample_view

from dossier.drawing import schematics, sheet
from dossier.drawing.svg_text import finish
from dossier.record.stages import TOPOLOGIES

CASES = kinds_and_topologies()


def drawn(view) -> str:
    drawer, reason = schematics.plan(view)
    assert drawer is not None, reason
    return finish(sheet.svg_of(drawer.draw(view)), prefix=view.key, title=view.title)


def test_the_cases_cover_every_checked_topology():
    for kind, accepted in TOPOLOGIES.items():
        assert {topology for k, topology in CASES if k == kind} == {*accepted, ""}


@pytest.mark.parametrize("kind, topology", CASES, ids=[f"{k}:{t or 'none'}" for k, t in CASES])
def test_every_kind_and_topology_is_drawn_without_a_placeholder(kind, topology):
    view = sample_view(kind, topology)
    svg = drawn(view)
    root = ElementTree.fromstring(svg)
    assert root.tag == "{http://www.w3.org/2000/svg}svg" and root.get("viewBox")
    lines = svg_lines(svg)
    assert not any(line.startswith("not drawn:") for line in lines)
    words = svg_words(svg)
    for part in view.parts:
        assert re.search(rf"(?<![A-Za-z0-9]){re.escape(part.ref)}(?![0-9A-Za-z])", words), part.ref
        assert part.value in words, part.value
    assert schematics._notes([view]) == []


@pytest.mark.parametrize("kind, topology", [("filter", "clc"), ("rectifier", "valve-centre-tapped"), ("switch", "standby"),
                                            ("regulator", "shunt"), ("rectifier", "doubler")])
def test_a_stage_above_extra_low_voltage_is_hatched_and_names_its_rail(kind, topology):
    svg = drawn(sample_view(kind, topology, rails=(HT,)))
    lines = svg_lines(svg)
    assert "ABOVE EXTRA-LOW VOLTAGE (not mains): B+ 350 V DC" in lines
    assert sheet.HIGH_VOLTAGE_HATCH in svg and sheet.HIGH_VOLTAGE_FILL in svg
    assert sheet.MAINS_FILL not in svg and "MAINS-CONNECTED: hazardous voltage" not in lines


def test_a_bleeder_declared_on_the_rail_is_drawn_across_it():
    view = sample_view("filter", "lc", rails=(HT,))
    assert "bleeder 220 kohm" in svg_lines(drawn(view))


def test_a_series_bank_names_a_capacitor_left_without_its_balancing_resistor():
    view = sample_view("filter", "series-bank")
    short = view.__class__(**{**view.__dict__, "parts": tuple(p for p in view.parts if p.ref != "R2")})
    lines = svg_lines(drawn(short))
    assert "resistor across C2" in lines and "resistor across C1" not in lines


def test_mains_and_high_voltage_shading_look_different():
    mains = drawn(sample_view("mains-input", "direct"))
    assert sheet.MAINS_FILL in mains and sheet.HIGH_VOLTAGE_HATCH not in mains
