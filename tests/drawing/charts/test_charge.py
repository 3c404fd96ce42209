"""The charge chart: a well-formed, deterministic SVG with units on its axes, a legend and a time-to-full marker."""

from __future__ import annotations

import re
from xml.etree import ElementTree

import pytest
from tests.fixtures.chargers import DROP, charger
from tests.fixtures.demo import load_demo

from dossier.calcs.charge.curve import charge_curve
from dossier.drawing.charts.charge import BOTTOM, LEFT, RIGHT, TOP, axes_for, charge_chart_svg, figures
from dossier.drawing.charts.scale import at_most, decimals, fixed_intervals
from dossier.drawing.svg_writer import SvgWriter, id_safe, number

SVG = "{http://www.w3.org/2000/svg}"


def chart(record) -> str | None:
    """The chart drawn from the curve the charge calc computes for the record."""
    return charge_chart_svg(record, charge_curve(record))


def parsed(svg: str):
    return ElementTree.fromstring(svg.encode("utf-8"))


def texts(root) -> list[str]:
    return [element.text or "" for element in root.iter(f"{SVG}text")]


@pytest.fixture(scope="module")
def demo_svg() -> str:
    return chart(load_demo("solar-bank-charger", "C"))


def test_chart_is_well_formed_svg_with_a_title(demo_svg):
    root = parsed(demo_svg)
    assert root.tag == f"{SVG}svg"
    assert "AGM 65 Ah" in root.find(f"{SVG}title").text


def test_axis_titles_carry_units(demo_svg):
    titles = [t for t in texts(parsed(demo_svg)) if re.fullmatch(r"\w+ \((V|A|h)\)", t)]
    assert sorted(titles) == ["Current (A)", "Time (h)", "Voltage (V)"]


def test_legend_names_both_curves_and_the_marker(demo_svg):
    found = texts(parsed(demo_svg))
    assert {"Voltage (left axis)", "Current (right axis)", "Estimated time to full"} <= set(found)


def test_time_to_full_marker_stands_at_the_estimate(demo_svg):
    curve = charge_curve(load_demo("solar-bank-charger", "C"))
    x = number(axes_for(curve).x(curve.estimate.full_hours))
    root = parsed(demo_svg)
    verticals = [line for line in root.iter(f"{SVG}line") if line.get("x1") == x == line.get("x2")]
    assert verticals, "no vertical marker line at the time to full"
    assert "full in about 11.3 h" in texts(root)


def test_ids_are_unique_and_belong_to_the_chart(demo_svg):
    ids = re.findall(r'\bid="([^"]+)"', demo_svg)
    assert ids and len(ids) == len(set(ids))
    assert all(i.startswith("charge-solar-bank-charger-rev-C-") for i in ids)
    other = re.findall(r'\bid="([^"]+)"', chart(load_demo("solar-bank-charger", "B")))
    assert not set(ids) & set(other)


def test_output_is_deterministic(demo_svg):
    assert chart(load_demo("solar-bank-charger", "C")) == demo_svg


def test_curves_stay_inside_the_plot_area(demo_svg):
    for polyline in parsed(demo_svg).iter(f"{SVG}polyline"):
        for pair in polyline.get("points").split():
            x, y = (float(v) for v in pair.split(","))
            assert LEFT - 0.01 <= x <= RIGHT + 0.01 and TOP - 0.01 <= y <= BOTTOM + 0.01


def test_tick_labels_cover_the_data():
    curve = charge_curve(load_demo("solar-bank-charger", "C"))
    axes = axes_for(curve)
    assert axes.volts.low <= min(p.volts for p in curve.points) and axes.volts.high >= 29.36
    assert axes.amps.low == 0 and axes.amps.high >= 7
    assert axes.time.high >= curve.estimate.full_hours


def test_figures_for_a_charger_and_for_other_builds():
    record = load_demo("solar-bank-charger", "C")
    [figure] = figures(record, charge_curve(record))
    assert (figure.key, figure.section) == ("charge-curve", "charge")
    assert figure.svg.startswith("<?xml")
    assert figures(load_demo("bench-psu-13v8"), None) == []
    assert chart(load_demo("rotator-control")) is None


@pytest.mark.parametrize("changes", [
    {"float_voltage": DROP},
    {"start_state_of_charge": "90 %"},
    {"charge_current": "1 A"},
    {"chemistry": "gel", "absorption_voltage": "28.2 V", "capacity": "7 Ah", "charge_current": "1.4 A"},
], ids=["no-float", "nearly-full", "trickle", "small-gel"])
def test_unusual_chargers_still_draw(changes):
    root = parsed(chart(charger(**changes)))
    assert len(list(root.iter(f"{SVG}polyline"))) == 2


def test_no_float_stage_is_labelled_as_the_end_of_charge():
    assert "charge ended" in texts(parsed(chart(charger(float_voltage=DROP))))


def test_fixed_intervals_give_round_covering_scales():
    scale = fixed_intervals(12.6, 14.8, 5)
    assert (scale.low, scale.step, scale.high) == (12.5, 0.5, 15.0)
    assert fixed_intervals(0, 6.7, 5, from_zero=True).ticks == [0, 2, 4, 6, 8, 10]


def test_at_most_limits_the_tick_count():
    scale = at_most(10.2, 10)
    assert scale.intervals <= 10 and scale.high >= 10.2 and scale.step == 2


@pytest.mark.parametrize("step, places", [(1.0, 0), (0.5, 1), (0.25, 2), (2.5, 1), (20.0, 0)])
def test_tick_labels_have_just_enough_decimals(step, places):
    assert decimals(step) == places


def test_writer_escapes_text_and_rounds_numbers():
    svg = SvgWriter(10, 10, "9 odd/prefix")
    svg.text(1.23456, -0.001, "a < b & c")
    document = svg.document("t & u")
    assert parsed(document).find(f"{SVG}text").text == "a < b & c"
    assert 'x="1.23"' in document and 'y="0"' in document
    assert id_safe("9 odd/prefix") == "f-9-odd-prefix"


def test_a_long_heading_shrinks_to_fit_the_chart():
    long = charger(chemistry="flooded", capacity="110 Ah", charge_current="16.5 A", output={"current": "20 A"},
                   absorption_voltage="29.1 V", float_voltage="26.9 V", temperature="12.5 degC")
    heading = next(parsed(chart(long)).iter(f"{SVG}text"))
    demo_heading = next(parsed(chart(load_demo("solar-bank-charger", "C"))).iter(f"{SVG}text"))
    assert float(heading.get("font-size")) < float(demo_heading.get("font-size")) <= 15
