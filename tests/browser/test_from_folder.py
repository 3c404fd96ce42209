"""The built site in a real browser, opened from a folder (file://): search works, nothing comes from the network.

Each check runs Playwright in a thread of its own: Playwright's sync API refuses to start in a thread
where another test's browser session is still open.
"""

from __future__ import annotations

import threading

import pytest

from tests.fixtures.prerequisites import CHROMIUM

pytestmark = pytest.mark.needs("chromium")


def in_browser(url: str, check):
    """Open url in headless Chromium and return check(page, requests), run in a fresh thread."""
    outcome: dict = {}

    def run():
        from playwright.sync_api import sync_playwright

        try:
            with sync_playwright() as driver:
                browser = driver.chromium.launch(executable_path=CHROMIUM, args=["--no-sandbox"])
                page = browser.new_page()
                requests: list[str] = []
                page.on("request", lambda request: requests.append(request.url))
                page.goto(url)
                outcome["value"] = check(page, requests)
                browser.close()
        except BaseException as error:  # handed to the test's own thread
            outcome["error"] = error

    worker = threading.Thread(target=run)
    worker.start()
    worker.join(120)
    if "error" in outcome:
        raise outcome["error"]
    return outcome["value"]


def search(page, words: str) -> list[str]:
    page.focus("input[data-md-component=search-query]")
    page.keyboard.type(words, delay=20)
    page.wait_for_selector(".md-search-result__link", timeout=15000)
    return [link.get_attribute("href") for link in page.query_selector_all(".md-search-result__link")]


def outside(requests: list[str]) -> list[str]:
    return [url for url in requests if not url.startswith("file:")]


def test_search_over_file_urls_finds_a_build_by_designator(demo_site):
    found, requests = in_browser((demo_site / "builds" / "rotator-control" / "index.html").as_uri(), lambda page, requests: (search(page, "RT1"), requests))
    assert any("builds/solar-bank-charger/" in href for href in found)
    assert outside(requests) == []


def test_search_over_file_urls_finds_a_build_by_note_text(demo_site):
    found = in_browser((demo_site / "index.html").as_uri(), lambda page, requests: search(page, "mast-team"))
    assert any("builds/rotator-control/" in href for href in found)


def test_schematics_load_from_the_folder(demo_site):
    def widths(page, requests):
        page.wait_for_load_state("load")
        return page.eval_on_selector_all("article img", "images => images.map(image => image.naturalWidth)"), requests

    loaded, requests = in_browser((demo_site / "builds" / "solar-bank-charger" / "schematics.html").as_uri(), widths)
    assert loaded and all(width > 0 for width in loaded)
    assert outside(requests) == []
