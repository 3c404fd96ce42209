"""The built site in a real browser, opened from a folder (file://): search works, nothing comes from the network."""

from __future__ import annotations

import shutil

import pytest

from test_site_kit import demo_site, drawing_cache  # noqa: F401  (fixtures)

CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")
playwright = pytest.importorskip("playwright.sync_api")
pytestmark = pytest.mark.skipif(CHROMIUM is None, reason="needs Debian's chromium")


@pytest.fixture(scope="module")
def browser():
    with playwright.sync_playwright() as driver:
        launched = driver.chromium.launch(executable_path=CHROMIUM, args=["--no-sandbox"])
        yield launched
        launched.close()


@pytest.fixture
def page(browser):
    opened = browser.new_page()
    opened.requests = []
    opened.on("request", lambda request: opened.requests.append(request.url))
    yield opened
    opened.close()


def search(page, words: str) -> list[str]:
    page.focus("input[data-md-component=search-query]")
    page.keyboard.type(words, delay=20)
    page.wait_for_selector(".md-search-result__link", timeout=15000)
    return [link.get_attribute("href") for link in page.query_selector_all(".md-search-result__link")]


def test_search_over_file_urls_finds_a_build_by_designator(page, demo_site):
    page.goto((demo_site / "builds" / "rotator-control" / "index.html").as_uri())
    found = search(page, "RT1")
    assert any("builds/sw-charger-12v/" in href for href in found)
    assert [url for url in page.requests if not url.startswith("file:")] == []


def test_search_finds_a_build_by_note_text(page, demo_site):
    page.goto((demo_site / "index.html").as_uri())
    assert any("builds/rotator-control/" in href for href in search(page, "mast-team"))


def test_schematics_load_from_the_folder(page, demo_site):
    page.goto((demo_site / "builds" / "sw-charger-12v" / "schematics.html").as_uri())
    widths = page.eval_on_selector_all("article img", "images => images.map(image => image.naturalWidth)")
    assert widths and all(width > 0 for width in widths)
    assert [url for url in page.requests if not url.startswith("file:")] == []
