"""The printable checklist, printed by Chromium itself: A4 and US Letter, no item split across pages."""

from __future__ import annotations

import re
import subprocess

import pytest

pytestmark = pytest.mark.needs("chromium", "poppler")

PAPERS = {"a4": (595, 842), "letter": (612, 792)}  # points: A4 210 x 297 mm, US Letter 8.5 x 11 in
PAGES = re.compile(r"^Pages:\s+(\d+)", re.MULTILINE)
SIZE = re.compile(r"^Page size:\s+([\d.]+) x ([\d.]+) pts", re.MULTILINE)


def pdf_pages(path) -> int:
    return int(PAGES.search(subprocess.run(["pdfinfo", str(path)], capture_output=True, text=True, check=True).stdout).group(1))


def page_text(path, number: int) -> str:
    return subprocess.run(["pdftotext", "-layout", "-f", str(number), "-l", str(number), str(path), "-"], capture_output=True, text=True, check=True).stdout


def printed(watched_page, sheet, out):
    watch = watched_page(("file://", "data:"))
    watch.page.goto(sheet.as_uri(), wait_until="load")
    watch.page.pdf(path=str(out), prefer_css_page_size=True, print_background=True)
    assert watch.errors == [] and watch.outside == []
    return out


@pytest.mark.parametrize("paper", PAPERS)
@pytest.mark.parametrize("revision", ["", "rev-A/"])
def test_printed_checklist_keeps_every_item_on_one_page(demo_site, watched_page, tmp_path, paper, revision):
    sheet = demo_site / "builds" / "solar-bank-charger" / f"{revision}checklist-{paper}.html"
    pdf = printed(watched_page, sheet, tmp_path / "sheet.pdf")
    info = subprocess.run(["pdfinfo", str(pdf)], capture_output=True, text=True, check=True).stdout
    width, height = (round(float(v)) for v in SIZE.search(info).groups())
    assert (width, height) == PAPERS[paper]
    pages = pdf_pages(pdf)
    assert 2 <= pages <= 12
    texts = [page_text(pdf, n) for n in range(1, pages + 1)]
    starts = [len(re.findall(r"^\s*(?:\S\s+)?\d+\. .*(?:GENERAL|THIS BUILD)", text, re.MULTILINE)) for text in texts]
    ends = [text.count("Done by") for text in texts]
    assert starts == ends, f"an item is split across pages: starts {starts}, sign-offs {ends}"
    assert sum(starts) >= 15
    assert "page 1 of" not in texts[0] or f"page 1 of {pages}" in texts[0]


def test_the_build_writes_the_checklist_as_pdf_too(demo_site):
    folder = demo_site / "builds" / "solar-bank-charger"
    for paper in PAPERS:
        pdf = folder / f"checklist-{paper}.pdf"
        assert pdf.read_bytes().startswith(b"%PDF")
        assert "Pre-power-up checklist" in page_text(pdf, 1)
        assert 'href="checklist-' + paper + '.pdf"' in (folder / "checklist.html").read_text(encoding="utf-8")


def test_a_failing_revision_is_blocked_on_paper(demo_site):
    # demo: solar-bank-charger rev A fails clearance, creepage and the switch-on pulse, among others
    first = page_text(demo_site / "builds" / "solar-bank-charger" / "rev-A" / "checklist-a4.pdf", 1)
    assert "Do not power up" in first or "DO NOT POWER UP" in first.upper()
