"""The stage-kinds page shows every kind and topology the record accepts, each with a drawing that exists,
is well formed and is no placeholder."""

from __future__ import annotations

from pathlib import Path
from xml.etree import ElementTree

from tests.fixtures.stage_samples import kinds_and_topologies

DOCS = Path(__file__).resolve().parents[1] / "docs"
REGENERATE = "regenerate with `.venv/bin/python scripts/stage_figures.py`"


def test_every_kind_and_topology_has_its_figure_on_the_page():
    page = (DOCS / "stage-kinds.md").read_text(encoding="utf-8")
    for kind, topology in kinds_and_topologies():
        name = f"{kind}-{topology or 'none'}.svg".replace(" ", "-")
        assert f"(figures/stages/{name})" in page, REGENERATE
        svg = (DOCS / "figures" / "stages" / name).read_text(encoding="utf-8")
        assert ElementTree.fromstring(svg).tag.endswith("svg")
        assert "not drawn:" not in svg, REGENERATE


def test_the_page_is_in_the_docs_and_linked_from_writing_records():
    assert "stage-kinds.md" in (DOCS.parent / "mkdocs.yml").read_text(encoding="utf-8")
    assert "(stage-kinds.md)" in (DOCS / "writing-records.md").read_text(encoding="utf-8")
