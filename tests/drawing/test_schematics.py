"""Schematics drawn from the demo records: every figure renders, is well formed, and carries the
record's designators and values, the barrier with its verdict, and the hazardous-side mark."""

from __future__ import annotations

import re
from xml.etree import ElementTree

import pytest
from tests.fixtures.demo import DEMO, load_demo, load_test_record

from dossier.drawing import schematics
from dossier.drawing.figure import Figure
from dossier.findings import Finding, Measure, Verdict
from dossier.record.stages import Part, Stage
from dossier.units import Q_

SVG = "{http://www.w3.org/2000/svg}"
DEMO_REVISIONS = sorted((path.parent.name, path.stem.split("-")[1]) for path in DEMO.glob("*/rev-*.yaml"))


def svg_lines(svg: str) -> list[str]:
    """Every line of text in the drawing, as a reader (or a search) sees it."""
    root = ElementTree.fromstring(svg)
    lines = []
    for text in root.iter(f"{SVG}text"):
        spans = list(text.iter(f"{SVG}tspan"))
        lines += [span.text or "" for span in spans] if spans else [text.text or ""]
    return lines


def svg_words(svg: str) -> str:
    return "\n".join(svg_lines(svg))


def has_designator(svg: str, ref: str) -> bool:
    return re.search(rf"(?<![A-Za-z0-9]){re.escape(ref)}(?![0-9A-Za-z])", svg_words(svg)) is not None


def barrier_findings(name: str, creepage: Verdict, clearance: Verdict) -> list[Finding]:
    """Findings as the isolation calc makes them: subject is the barrier, limit is the requirement."""
    return [
        Finding(code="ISO-CREEPAGE", calc="isolation", subject=name, title="Creepage", verdict=creepage,
                values=(Measure("declared creepage", Q_(6.4, "mm")),), limit=Measure("required creepage", Q_(5.0, "mm"))),
        Finding(code="ISO-CLEARANCE", calc="isolation", subject=name, title="Clearance", verdict=clearance,
                values=(Measure("declared clearance", Q_(4.0, "mm")),), limit=Measure("required clearance", Q_(3.6, "mm"))),
    ]


@pytest.fixture(scope="module")
def drawn():
    """Every demo revision drawn once, without findings."""
    return {(build, rev): schematics.draw(load_demo(build, rev), []) for build, rev in DEMO_REVISIONS}


def test_the_demo_archive_is_all_drawn(drawn):
    assert len(DEMO_REVISIONS) >= 5
    assert all(result.figures for result in drawn.values())


@pytest.mark.parametrize("build, rev", DEMO_REVISIONS)
def test_a_block_diagram_then_one_drawing_per_stage(drawn, build, rev):
    record = load_demo(build, rev)
    keys = [figure.key for figure in drawn[build, rev].figures]
    assert keys == ["block-diagram"] + [f"stage-{i}-{stage.kind}" for i, stage in enumerate(record.stages, start=1)]
    assert all(isinstance(f, Figure) and f.section == "schematics" for f in drawn[build, rev].figures)


@pytest.mark.parametrize("build, rev", DEMO_REVISIONS)
def test_every_demo_stage_has_a_real_drawing_not_a_placeholder(drawn, build, rev):
    assert drawn[build, rev].notes == ()
    # a placeholder says 'not drawn: <reason>' on a line of its own; parts a drawer leaves are listed under 'Also in ...'
    assert not any(line.startswith("not drawn:") for f in drawn[build, rev].figures for line in svg_lines(f.svg))


@pytest.mark.parametrize("build, rev", DEMO_REVISIONS)
def test_each_svg_is_well_formed_with_a_title(drawn, build, rev):
    for figure in drawn[build, rev].figures:
        root = ElementTree.fromstring(figure.svg)
        assert root.tag == f"{SVG}svg"
        assert root.find(f"{SVG}title").text == figure.title
        assert root.get("viewBox")


@pytest.mark.parametrize("build, rev", DEMO_REVISIONS)
def test_each_stage_drawing_carries_its_designators_and_values(drawn, build, rev):
    record = load_demo(build, rev)
    for stage, figure in zip(record.stages, drawn[build, rev].figures[1:]):
        words = svg_words(figure.svg)
        for part in stage.parts:
            assert has_designator(figure.svg, part.ref), f"{figure.key} lacks {part.ref}"
            assert part.value in words, f"{figure.key} lacks the value {part.value!r} of {part.ref}"


@pytest.mark.parametrize("build, rev", DEMO_REVISIONS)
def test_the_block_diagram_names_every_stage_and_designator(drawn, build, rev):
    record = load_demo(build, rev)
    diagram = drawn[build, rev].figures[0].svg
    flat = " ".join(svg_lines(diagram))
    for index, stage in enumerate(record.stages, start=1):
        assert f"{index}. {stage.name}" in flat
        assert all(has_designator(diagram, part.ref) for part in stage.parts)


def test_windings_are_labelled_with_turns_and_stranded_wire(drawn):
    record = load_demo("solar-bank-charger", "C")
    magnetics = next(f for f in drawn["solar-bank-charger", "C"].figures if f.key.endswith("magnetics"))
    lines = svg_lines(magnetics.svg)
    secondary = next(w for w in record.magnetics[0].windings if w.role == "secondary")
    assert f"secondary: {secondary.turns:g} t" in lines
    assert f"{secondary.strands} \u00d7 {secondary.wire.to('mm').magnitude:g} mm" in lines
    assert "CT" not in lines


def test_a_centre_tapped_winding_is_labelled_so():
    record = load_test_record("selfosc-psu")
    magnetics = next(f for f in schematics.figures(record) if f.key.endswith("magnetics"))
    lines = svg_lines(magnetics.svg)
    assert "secondary: 14 t, centre tap" in lines and "0.9 mm" in lines and "CT" in lines


def test_the_base_drive_windings_carry_their_turns():
    record = load_test_record("selfosc-psu")
    converter = next(f for f in schematics.figures(record) if f.key.endswith("converter"))
    drive = next(m for m in record.magnetics if m.role == "base-drive")
    flat = " ".join(svg_lines(converter.svg))
    for winding in drive.windings:
        assert f"{drive.ref} {winding.name}: {winding.turns:g} t" in flat
    assert "T2 current feedback: 1.5 t" in flat  # a fractional turn keeps its fraction
    assert "D7" in flat and "diac 36 V" in flat  # the start-up trigger is drawn


def test_the_gate_drive_windings_carry_their_turns_and_the_controller_is_drawn(drawn):
    record = load_demo("solar-bank-charger", "C")
    converter = next(f for f in drawn["solar-bank-charger", "C"].figures if f.key.endswith("converter"))
    drive = next(m for m in record.magnetics if m.role == "gate-drive")
    lines = svg_lines(converter.svg)
    flat = " ".join(lines)
    for winding in drive.windings:
        assert f"{drive.ref} {winding.name}: {winding.turns:g} t" in flat
    assert "U1" in lines and "PWM controller with two alternating outputs" in lines
    # the half-bridge drawer has no symbol for rev C's balancing resistors: they, and only they, are listed as not drawn
    start = lines.index("Also in this stage, not drawn:")
    listed = [line for line in lines[start + 1:] if not line.startswith("MAINS-CONNECTED")]
    assert listed == ["R5 220 kohm (balancing resistor across C5)", "R6 220 kohm (balancing resistor across C6)"]


def test_the_barrier_label_carries_the_isolation_verdict_and_distances():
    record = load_demo("solar-bank-charger", "B")
    barrier = record.barriers[0]
    result = schematics.draw(record, barrier_findings(barrier.name, Verdict.PASS, Verdict.MARGINAL))
    magnetics = next(f for f in result.figures if f.key.endswith("magnetics"))
    for figure in (result.figures[0], magnetics):
        lines = svg_lines(figure.svg)
        assert "isolation verdict: MARGINAL" in lines
        assert f"{barrier.grade} barrier: {barrier.name}" in lines
        assert f"creepage {barrier.creepage.magnitude:g} mm declared, 5 mm required" in lines
        assert f"clearance {barrier.clearance.magnitude:g} mm declared, 3.6 mm required" in lines


def test_a_failing_barrier_says_fail_and_an_unchecked_one_says_so():
    record = load_demo("bench-psu-13v8", "A")
    transformer, chassis = record.barriers
    findings = barrier_findings(transformer.name, Verdict.FAIL, Verdict.PASS)
    diagram = svg_lines(schematics.figures(record, findings)[0].svg)
    assert diagram.count("isolation verdict: FAIL") == 1
    assert diagram.count("isolation verdict: not checked") == 1  # the mains-to-chassis barrier
    assert "creepage 3 mm declared (required: not checked)" in diagram


def test_findings_of_other_barriers_and_calcs_do_not_colour_the_verdict():
    record = load_demo("rotator-control", "A")
    unrelated = barrier_findings("some other barrier", Verdict.FAIL, Verdict.FAIL)
    diagram = svg_lines(schematics.figures(record, unrelated)[0].svg)
    assert "isolation verdict: not checked" in diagram
    assert "isolation verdict: FAIL" not in diagram


@pytest.mark.parametrize("build, rev", DEMO_REVISIONS)
def test_the_mains_side_is_marked_and_the_isolated_side_is_not(drawn, build, rev):
    record = load_demo(build, rev)
    figures = drawn[build, rev].figures
    assert "MAINS-CONNECTED: hazardous voltage" in " ".join(svg_lines(figures[0].svg))
    for stage, figure in zip(record.stages, figures[1:]):
        marked = any("hazardous" in line for line in svg_lines(figure.svg))
        straddles = any(part.ref in barrier.parts for barrier in record.barriers for part in stage.parts if part.kind == "transformer")
        assert marked == (stage.side == "mains" or straddles), figure.key


def test_the_transformer_drawing_splits_mains_and_isolated_sides():
    figure = next(f for f in schematics.figures(load_demo("bench-psu-13v8", "A")) if f.key.endswith("magnetics"))
    lines = svg_lines(figure.svg)
    assert "mains side (hazardous)" in lines and "isolated side" in lines
    assert 'stroke-dasharray' in figure.svg


def test_a_stage_of_kind_other_is_drawn_as_a_block_with_its_parts_not_a_placeholder():
    record = load_demo("solar-bank-charger", "B")
    fan = Stage(kind="other", name="Fan controller", side="isolated",
                parts=[Part(ref="U7", kind="ic", value="fan controller IC"), Part(ref="M1", kind="fan", value="80 mm 12 V"),
                       Part(ref="R9", kind="resistor", value="10 k", role="speed set")])
    changed = record.model_copy(update={"stages": [*record.stages, fan]})
    result = schematics.draw(changed, [])
    block = result.figures[-1]
    lines = svg_lines(block.svg)
    assert block.key == f"stage-{len(changed.stages)}-other"
    assert not any(line.startswith("not drawn:") for line in lines)
    assert "Its parts (the record does not say how they connect):" in lines
    assert {"U7", "fan controller IC", "M1", "80 mm 12 V", "R9", "10 k", "(speed set)"} <= set(lines)
    assert result.notes == () and schematics.notes(changed) == []


@pytest.mark.parametrize("record, words, subject", [
    (lambda: load_demo("solar-bank-charger", "B"), "controller-driven half-bridge", "stage 2: Controller-driven half-bridge"),
    (lambda: load_test_record("selfosc-psu"), "self-oscillating half-bridge", "stage 2: Self-oscillating half-bridge"),
], ids=["controller-driven", "self-oscillating"])
def test_a_half_bridge_without_its_lower_switch_gets_a_placeholder(record, words, subject):
    record = record()
    converter = record.stages[1]
    short = converter.model_copy(update={"parts": [p for p in converter.parts if p.role != "lower switch"]})
    changed = record.model_copy(update={"stages": [record.stages[0], short, *record.stages[2:]]})
    result = schematics.draw(changed, [])
    assert f"not drawn: the {words} drawing needs a lower switch" in svg_lines(result.figures[2].svg)
    assert [n.subject for n in result.notes] == [subject]


def test_a_converter_of_a_topology_with_no_drawing_of_its_own_is_drawn_as_a_block():
    record = load_demo("solar-bank-charger", "C")
    flyback = record.stages[1].model_copy(update={"topology": "flyback"})
    changed = record.model_copy(update={"stages": [record.stages[0], flyback, *record.stages[2:]]})
    assert schematics.notes(changed) == []
    lines = svg_lines(schematics.figures(changed)[2].svg)
    assert "(converter, flyback)" in lines
    assert all(part.ref in lines for part in flyback.parts)


def test_parts_a_drawer_does_not_place_are_listed_not_dropped():
    record = load_demo("bench-psu-13v8", "A")
    mains = record.stages[0]
    extra = Part(ref="C9", kind="capacitor", value="2.2 nF Y1", role="Y capacitor")
    changed = record.model_copy(update={"stages": [mains.model_copy(update={"parts": [*mains.parts, extra]}), *record.stages[1:]]})
    lines = svg_lines(schematics.figures(changed)[1].svg)
    assert "Also in this stage, not drawn:" in lines
    assert "C9 2.2 nF Y1 (Y capacitor)" in lines


def test_a_record_with_no_stages_still_draws_a_block_diagram():
    record = load_demo("rotator-control", "A").model_copy(update={"stages": []})
    (diagram,) = schematics.figures(record)
    assert "The record lists no stages, so there is nothing to draw." in svg_lines(diagram.svg)


def test_an_ac_output_is_not_labelled_with_polarity(drawn):
    output = drawn["rotator-control", "A"].figures[-1]
    lines = svg_lines(output.svg)
    assert "~ from stage 2" in lines
    assert not any(line.startswith("+") for line in lines)


def test_a_bridge_of_fewer_than_four_diodes_gets_a_placeholder():
    record = load_demo("solar-bank-charger", "C")
    rectifier = record.stages[3]
    short = rectifier.model_copy(update={"parts": [p for p in rectifier.parts if p.ref != "D8"]})
    changed = record.model_copy(update={"stages": [*record.stages[:3], short, *record.stages[4:]]})
    result = schematics.draw(changed, [])
    assert "not drawn: the rectifier drawing needs a bridge rectifier part or four diodes" in svg_lines(result.figures[4].svg)


def test_a_diode_across_the_output_is_drawn_across_the_rails_after_the_fuse(drawn):
    output = next(f for f in drawn["solar-bank-charger", "C"].figures if f.key.endswith("output"))
    root = ElementTree.fromstring(output.svg)
    where = {}
    for text in root.iter(f"{SVG}text"):
        first = next(text.iter(f"{SVG}tspan"), None)
        if first is not None and first.text in ("F2", "D9"):
            where[first.text] = (float(text.get("x")), float(text.get("y")))
    # a series part is labelled above the positive lead; a part across the rails beside it, lower down
    assert where["F2"][0] < where["D9"][0]
    assert where["D9"][1] > where["F2"][1] + 30


@pytest.mark.parametrize("build, drawn_refs", [("toroid-amp-supply", ("F1", "S1", "R1", "K1")), ("repair-station", ("F1", "RCD1", "RT1"))])
def test_the_mains_input_draws_an_rcd_and_a_bypassed_soft_start_in_the_line(build, drawn_refs):
    # test records: a relay contact across a soft-start resistor; a residual-current device breaking L and N
    from tests.fixtures.demo import load_test_record

    first = schematics.figures(load_test_record(build))[1]
    lines = svg_lines(first.svg)
    assert not any("not drawn" in line for line in lines)
    for ref in drawn_refs:
        assert ref in lines


def test_a_thermal_cut_off_clamped_to_the_soft_start_resistor_is_drawn_in_series_inside_the_bypass():
    # demo pa-amp-supply rev B: TF2 clamped to R1, K1's contact across both (a stuck-open relay leaves R1 carrying
    # the load until TF2 opens, so TF2 must sit in R1's branch, not in the main line)
    from tests.fixtures.demo import load_demo

    mains = next(f for f in schematics.figures(load_demo("pa-amp-supply", "B")) if f.key == "stage-1-mains-input")
    lines = svg_lines(mains.svg)
    assert not any("not drawn" in line for line in lines)
    where = {}
    for text in ElementTree.fromstring(mains.svg).iter(f"{SVG}text"):
        first = next(text.iter(f"{SVG}tspan"), None)
        if first is not None and first.text in ("R1", "TF2", "K1"):
            where[first.text] = float(text.get("x"))
    assert where["R1"] < where["TF2"] and where["K1"] < where["TF2"]  # TF2 after R1, under the bypass's span
