"""Drawings are cached by what they are drawn from, come out byte for byte the same, keep their
ids to themselves, and leave schemdraw's module-wide settings alone."""

from __future__ import annotations

import re
from xml.etree import ElementTree

import pytest
import schemdraw
import schemdraw.elements as elm
from tests.fixtures.demo import load_demo

from dossier.drawing import schematics, sheet
from dossier.drawing.cache import DRAWER_VERSION, DrawingCache, content_key
from dossier.drawing.reading import stage_views
from dossier.drawing.svg_text import finish, with_unique_ids
from dossier.findings import Finding, Measure, Verdict
from dossier.units import Q_


def ids_and_references(svg: str) -> tuple[list[str], set[str]]:
    ids = re.findall(r'\bid="([^"]+)"', svg)
    references = set(re.findall(r'url\(#([^)]+)\)', svg)) | set(re.findall(r'href="#([^"]+)"', svg))
    return ids, references


def drawing_with_clip_and_hatch() -> str:
    """schemdraw names hatch patterns 'hatch' and numbers clip paths across the whole process."""
    drawing = sheet.new_drawing()
    drawing.add(elm.Rect(corner1=(0, 0), corner2=(2, 1), fill="white").at((0, 0)))
    drawing.add(elm.Line().at((0, 0)).to((2, 0)))
    figure = drawing.draw(show=False)
    figure.poly([(0, 0), (1, 0), (1, 1)], hatch=True)
    figure.plot([0, 1], [0, 1], clip=schemdraw.types.BBox(0, 0, 1, 1))
    figure.plot([0, 2], [0, 2], clip=schemdraw.types.BBox(0, 0, 2, 2))
    return figure.getimage().decode()


def test_every_id_is_prefixed_unique_and_its_references_follow():
    raw = drawing_with_clip_and_hatch()
    assert 'id="hatch"' in raw  # what schemdraw writes, the reason for the renaming
    first, second = with_unique_ids(raw, "stage-1-a"), with_unique_ids(raw, "stage-2-b")
    for svg, prefix in ((first, "stage-1-a"), (second, "stage-2-b")):
        ids, references = ids_and_references(svg)
        assert len(ids) == len(set(ids)) >= 3
        assert all(i.startswith(f"{prefix}-") for i in ids)
        assert references and references <= set(ids)
    assert not set(ids_and_references(first)[0]) & set(ids_and_references(second)[0])


def test_the_renaming_does_not_depend_on_schemdraw_s_global_counter():
    assert with_unique_ids(drawing_with_clip_and_hatch(), "k") == with_unique_ids(drawing_with_clip_and_hatch(), "k")


def test_finish_adds_an_escaped_title_and_rejects_broken_svg():
    svg = finish('<svg xmlns="http://www.w3.org/2000/svg"><text>R1</text></svg>', "k", 'Stage 1: "A & B"')
    root = ElementTree.fromstring(svg)
    assert root.find("{http://www.w3.org/2000/svg}title").text == 'Stage 1: "A & B"'
    assert root.get("aria-label") == 'Stage 1: "A & B"'
    with pytest.raises(ElementTree.ParseError):
        finish('<svg xmlns="http://www.w3.org/2000/svg"><text>R1</svg>', "k", "t")


def test_all_demo_figures_on_one_page_have_distinct_ids():
    seen: list[str] = []
    for build, rev in (("solar-bank-charger", "B"), ("bench-psu-13v8", "A")):
        for figure in schematics.figures(load_demo(build, rev)):
            seen += ids_and_references(figure.svg)[0]
    assert len(seen) == len(set(seen))


def test_the_same_record_draws_byte_identical_svg():
    record = load_demo("solar-bank-charger", "C")
    first = [f.svg for f in schematics.figures(record)]
    schematics.figures(load_demo("bench-psu-13v8", "A"))  # other drawings in between change nothing
    assert [f.svg for f in schematics.figures(record)] == first


def test_an_unchanged_record_redraws_nothing(tmp_path):
    record = load_demo("solar-bank-charger", "B")
    cold = DrawingCache.under(tmp_path)
    first = schematics.figures(record, [], cold)
    assert (cold.hits, cold.misses) == (0, len(first))
    warm = DrawingCache.under(tmp_path)
    assert schematics.figures(record, [], warm) == first
    assert (warm.hits, warm.misses) == (len(first), 0)
    assert len(list((tmp_path / ".cache" / "drawings").rglob("*.svg"))) == len(first)


def test_a_changed_value_redraws_only_its_stage(tmp_path):
    record = load_demo("solar-bank-charger", "B")
    schematics.figures(record, [], DrawingCache(tmp_path))
    output = record.stages[-1]
    parts = [p.model_copy(update={"value": "30 A blade"}) if p.ref == "F2" else p for p in output.parts]
    changed = record.model_copy(update={"stages": [*record.stages[:-1], output.model_copy(update={"parts": parts})]})
    cache = DrawingCache(tmp_path)
    figures = schematics.figures(changed, [], cache)
    assert (cache.misses, cache.hits) == (1, len(figures) - 1)
    assert "30 A blade" in figures[-1].svg


def test_a_new_verdict_redraws_the_drawings_that_show_the_barrier(tmp_path):
    record = load_demo("rotator-control", "A")
    schematics.figures(record, [], DrawingCache(tmp_path))
    cache = DrawingCache(tmp_path)
    verdict = Finding(code="ISO-CLEARANCE", calc="isolation", subject=record.barriers[0].name, title="Clearance",
                      verdict=Verdict.FAIL, limit=Measure("required clearance", Q_(5.5, "mm")))
    schematics.figures(record, [verdict], cache)
    assert cache.misses == 2  # the block diagram and the transformer stage


def test_a_damaged_cache_entry_is_drawn_again(tmp_path):
    record = load_demo("rotator-control", "A")
    cache = DrawingCache(tmp_path)
    figures = schematics.figures(record, [], cache)
    victim = next(tmp_path.rglob("*.svg"))
    victim.write_text("<svg><text>cut sh", encoding="utf-8")
    again = DrawingCache(tmp_path)
    assert schematics.figures(record, [], again) == figures
    assert again.misses == 1


def test_the_content_key_covers_the_drawer_version_and_the_figure():
    record = load_demo("rotator-control", "A")
    view = stage_views(record, [])[0]
    key = content_key(view.key, view)
    assert re.fullmatch(r"[0-9a-f]{64}", key)
    assert key != content_key("another-figure", view)
    assert DRAWER_VERSION


def test_drawing_changes_no_module_wide_schemdraw_setting():
    style_before = dict(schemdraw.schemdraw.schemdrawstyle)
    resistor_before = elm.Resistor
    canvas_before = schemdraw.default_canvas.default_canvas
    schematics.figures(load_demo("solar-bank-charger", "C"))
    assert dict(schemdraw.schemdraw.schemdrawstyle) == style_before
    assert elm.Resistor is resistor_before
    assert schemdraw.default_canvas.default_canvas == canvas_before


def test_drawings_do_not_follow_a_module_wide_schemdraw_setting():
    record = load_demo("bench-psu-13v8", "A")
    before = [f.svg for f in schematics.figures(record)]
    saved = dict(schemdraw.schemdraw.schemdrawstyle)
    try:
        schemdraw.config(fontsize=30, lw=5, unit=6)
        assert [f.svg for f in schematics.figures(record)] == before
    finally:
        schemdraw.schemdraw.schemdrawstyle.clear()
        schemdraw.schemdraw.schemdrawstyle.update(saved)


def test_the_svg_namespace_survives_other_code_changing_elementtree_s_registry():
    """schemdraw relies on ElementTree's prefix registry; other libraries in the process may change it."""
    record = load_demo("rotator-control", "A")
    expected = [f.svg for f in schematics.figures(record)]
    saved = dict(ElementTree._namespace_map)
    try:
        ElementTree._namespace_map.pop("http://www.w3.org/2000/svg", None)
        assert sheet.svg_of(sheet.new_drawing()).startswith("<ns0:svg")  # what schemdraw then writes
        assert [f.svg for f in schematics.figures(record)] == expected
    finally:
        ElementTree._namespace_map.clear()
        ElementTree._namespace_map.update(saved)
