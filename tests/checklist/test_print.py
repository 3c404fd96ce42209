"""The printed checklist: rendered to PDF by the build's renderer, then read back with poppler's tools.

Each item's start and end are named destinations in the PDF (anchors item-<id> and end-<id>); an item is
whole when both sit on the same page. The pages are also rendered to PNG and checked for ink.
"""

from __future__ import annotations

import re
import subprocess
from pathlib import Path

import pytest
from tests.fixtures.checklists import checklist_of, commissioning_of, demo
from PIL import Image

from dossier.checklist.page import checklist_html
from dossier.checklist.pdf import render_pdf

pytestmark = pytest.mark.needs("pango", "poppler")

# Paper sizes in PostScript points: ISO 216 A4 is 210 x 297 mm; US Letter is 8.5 x 11 in.
PAPER_POINTS = {"a4": (595.28, 841.89), "letter": (612.0, 792.0)}
SHEETS = [("solar-bank-charger", "C", "a4"), ("solar-bank-charger", "C", "letter"), ("bench-psu-13v8", "A", "a4"), ("rotator-control", "A", "letter")]


def poppler(*args) -> str:
    return subprocess.run(args, capture_output=True, text=True, check=True).stdout


def page_count(pdf: Path) -> int:
    return int(re.search(r"^Pages:\s+(\d+)", poppler("pdfinfo", str(pdf)), re.MULTILINE)[1])


def page_size(pdf: Path) -> tuple[float, float]:
    match = re.search(r"^Page size:\s+([\d.]+) x ([\d.]+) pts", poppler("pdfinfo", str(pdf)), re.MULTILINE)
    return float(match[1]), float(match[2])


def destinations(pdf: Path) -> dict[str, int]:
    """Named destination -> page number, from the PDF itself."""
    found = {}
    for line in poppler("pdfinfo", "-dests", str(pdf)).splitlines()[1:]:
        match = re.match(r'\s*(\d+)\s+\[.*\]\s+"(.+)"$', line)
        if match:
            found[match[2]] = int(match[1])
    return found


def page_text(pdf: Path, number: int) -> str:
    return poppler("pdftotext", "-layout", "-f", str(number), "-l", str(number), str(pdf), "-")


@pytest.fixture(scope="module")
def printed(tmp_path_factory) -> dict:
    """(build, revision, paper) -> PDF path, rendered once for the module with the renderer the build's PDF cache
    uses: the charger's rev C sheet (with its commissioning record) on both papers, the filled-in bench supply on A4
    and the blocked rotator on Letter."""
    folder = tmp_path_factory.mktemp("sheets")
    rendered = {}
    for build, revision, paper in SHEETS:
        loaded, _ = demo(build, revision)
        html = checklist_html(loaded, checklist_of(build, revision), paper, commissioning_of(build, revision))
        rendered[build, revision, paper] = folder / f"{build}-{revision}-{paper}.pdf"
        rendered[build, revision, paper].write_bytes(render_pdf(html))
    return rendered


@pytest.mark.parametrize("build, revision, paper", SHEETS)
def test_the_paper_size_and_the_page_count(printed, build, revision, paper):
    pdf = printed[build, revision, paper]
    width, height = page_size(pdf)
    assert (width, height) == pytest.approx(PAPER_POINTS[paper], abs=0.5)
    pages = page_count(pdf)
    items = len(checklist_of(build, revision).items)
    assert 2 <= pages <= items // 3 + 2, f"{pages} pages for {items} items"
    assert f"page {pages} of {pages}" in page_text(pdf, pages)
    assert "Sign-off" in page_text(pdf, pages)  # the last page holds the sign-off, not a blank


@pytest.mark.parametrize("build, revision, paper", SHEETS)
def test_no_item_is_cut_across_pages(printed, build, revision, paper):
    pdf = printed[build, revision, paper]
    places = destinations(pdf)
    cut = []
    for entry in checklist_of(build, revision).items:
        start, end = places.get(f"item-{entry.key}"), places.get(f"end-{entry.key}")
        assert start is not None and end is not None, f"{entry.key} is missing from the PDF"
        if start != end:
            cut.append(f"{entry.key}: pages {start}-{end}")
    assert not cut, cut
    assert len({page for page in places.values()}) >= page_count(pdf) - 1  # items fill every page but the sign-off's


def test_each_items_text_is_on_its_page(printed):
    pdf = printed["bench-psu-13v8", "A", "a4"]
    places = destinations(pdf)
    text = page_text(pdf, places["item-soak-hs1"])
    assert "Temperature rise of heatsink HS1" in text
    assert re.search(r"Expected: at most 30 K\s+Measured:\s+33\.5 K\s+OUT OF RANGE", text)
    first = page_text(pdf, 1)
    assert "CAUTION." in first and "Commissioning not passed" in first


def test_a_blocked_sheet_says_do_not_power_up_on_its_first_page(printed):
    pdf = printed["rotator-control", "A", "letter"]
    first = page_text(pdf, 1)
    assert "DO NOT POWER UP" in first
    assert "PROT-EARTH-BOND" in first


@pytest.mark.parametrize("paper", list(PAPER_POINTS))
def test_every_page_as_a_picture_has_the_papers_shape_and_ink(printed, tmp_path, paper):
    pdf = printed["solar-bank-charger", "C", paper]
    subprocess.run(["pdftoppm", "-r", "40", "-png", str(pdf), str(tmp_path / "page")], check=True)
    pictures = sorted(tmp_path.glob("page-*.png"))
    assert len(pictures) == page_count(pdf)
    width, height = PAPER_POINTS[paper]
    for picture in pictures:
        image = Image.open(picture).convert("L")
        assert image.height / image.width == pytest.approx(height / width, rel=0.02)
        dark = sum(image.histogram()[:128])
        assert dark > 0.005 * image.width * image.height, f"{picture.name} is nearly blank"


def test_the_pdf_renderer_fetches_nothing_the_html_names(tmp_path):
    """Defence in depth: even if markup slipped through escaping, printing makes no request."""
    import http.server
    import threading

    from dossier.checklist.pdf import render_pdf

    requests = []

    class Counting(http.server.BaseHTTPRequestHandler):
        def do_GET(self):
            requests.append(self.path)
            self.send_response(404)
            self.end_headers()

        def log_message(self, *args):
            pass

    server = http.server.HTTPServer(("127.0.0.1", 0), Counting)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    local = tmp_path / "local.png"
    local.write_bytes(b"not an image")
    address = f"http://127.0.0.1:{server.server_port}"
    html = f'<html><head><link rel="stylesheet" href="{address}/a.css"></head><body><img src="{address}/b.png"><img src="{local.as_uri()}"><p style="background: url({address}/c.png)">x</p></body></html>'
    try:
        assert render_pdf(html).startswith(b"%PDF")
    finally:
        server.shutdown()
    assert requests == []
