"""The demo site in headless Chromium, over file:// and over HTTP: it loads cleanly and stays on this machine."""

from __future__ import annotations

import pytest

from tests.browser.conftest import html_pages

LOCAL_FILE = ("file://", "data:", "blob:")


def visit_all(watched_page, base: str, pages, prefixes):
    watch = watched_page(prefixes)
    problems = {}
    for relative in pages:
        watch.errors.clear()
        watch.page.goto(f"{base}/{relative}", wait_until="load")
        if watch.errors:
            problems[relative] = list(watch.errors)
    return watch, problems


def test_every_page_loads_over_file_with_no_errors_and_no_outside_requests(demo_site, watched_page):
    pages = [p.relative_to(demo_site).as_posix() for p in html_pages(demo_site)]
    assert len(pages) > 20
    watch, problems = visit_all(watched_page, demo_site.as_uri(), pages, LOCAL_FILE)
    assert problems == {}
    assert watch.outside == []


def test_every_page_loads_over_http_with_no_errors_and_no_outside_requests(demo_site, served_site, watched_page):
    pages = [p.relative_to(demo_site).as_posix() for p in html_pages(demo_site)]
    watch, problems = visit_all(watched_page, served_site, pages, (served_site, "data:", "blob:"))
    assert problems == {}
    assert watch.outside == []


def test_schematics_are_visible(demo_site, watched_page):
    watch = watched_page(LOCAL_FILE)
    watch.page.goto((demo_site / "builds" / "solar-bank-charger" / "schematics.html").as_uri(), wait_until="load")
    figures = watch.page.locator("article img[src$='.svg']")
    assert figures.count() >= 6
    for index in range(figures.count()):
        figure = figures.nth(index)
        figure.scroll_into_view_if_needed()
        box = figure.bounding_box()
        assert box and box["width"] > 200 and box["height"] > 80
        assert figure.evaluate("img => img.complete && img.naturalWidth > 0")


@pytest.mark.parametrize("width", [1280, 390])
def test_schematic_labels_are_shown_at_their_drawn_size_at_desktop_and_phone_widths(demo_site, watched_page, width):
    # the drawings' text is 9.5 to 11 px in the SVG; shown scaled down to fit a column it fell to about 6 px
    watch = watched_page(LOCAL_FILE)
    watch.page.set_viewport_size({"width": width, "height": 900})
    watch.page.goto((demo_site / "builds" / "solar-bank-charger" / "schematics.html").as_uri(), wait_until="load")
    scales = watch.page.evaluate("""() => [...document.querySelectorAll('article img[src$=".svg"]')]
        .map(img => img.getBoundingClientRect().width / img.naturalWidth)""")
    assert scales and min(scales) > 0.99


# demo: bench-psu-13v8's current revision fails THERM-HEATSINK; every checklist has the series-lamp item
@pytest.mark.parametrize("query, expected", [
    ("RT1", "solar-bank-charger"), ("rotator", "rotator-control"), ("mill", "solar-bank-charger"),
    ("THERM-HEATSINK", "bench-psu-13v8/calcs.html#hs1-temperature-hs1"), ("series lamp", "/checklist.html#"),
])
def test_search_finds_a_build_a_finding_by_its_code_and_a_checklist_item(served_site, watched_page, query, expected):
    watch = watched_page((served_site, "data:", "blob:"))
    watch.page.goto(f"{served_site}/index.html", wait_until="load")
    box = watch.page.locator("input[data-md-component='search-query']")
    results = watch.page.locator(".md-search-result__item a")
    # a result's link carries the words to highlight (?h=...) before its anchor
    found = "expected => [...document.querySelectorAll('.md-search-result__item a')].some(a => a.href.replace(/[?]h=[^#]*/, '').includes(expected))"
    for attempt in range(12):  # a query typed before the index has loaded is not run again: type it again
        box.click()
        box.fill("")
        box.type(query)
        try:
            watch.page.wait_for_function(found, arg=expected, timeout=5_000)
            break
        except Exception:
            continue
    else:
        pytest.fail(f"search for {query!r} never listed {expected}")
    assert results.count() >= 1


def test_attached_photos_show_and_datasheets_link(demo_site, watched_page):
    # demo: solar-bank-charger rev C attaches photos/t1-winding-plan.png (a drawing, 900 px wide) and sheets/t1-winding-sheet.pdf
    watch = watched_page(LOCAL_FILE)
    watch.page.goto((demo_site / "builds" / "solar-bank-charger" / "index.html").as_uri(), wait_until="load")
    photo = watch.page.locator("article img[src$='t1-winding-plan.png']")
    photo.scroll_into_view_if_needed()
    assert photo.evaluate("img => img.complete && img.naturalWidth === 900")
    sheet = watch.page.locator("article a[href$='t1-winding-sheet.pdf']")
    assert sheet.count() == 1
    assert (demo_site / "builds" / "solar-bank-charger" / sheet.get_attribute("href")).read_bytes().startswith(b"%PDF")


def test_the_archive_table_fits_its_column_at_desktop_width(demo_site, watched_page):
    # before: the table ran about 20 px past its box and the build column wrapped one word per line
    watch = watched_page(LOCAL_FILE)
    watch.page.set_viewport_size({"width": 1280, "height": 900})
    watch.page.goto((demo_site / "index.html").as_uri(), wait_until="load")
    fits = watch.page.evaluate("""() => [...document.querySelectorAll('article table')].map(t => {
        const wrap = t.closest('.md-typeset__scrollwrap') || t.parentElement;
        return wrap.scrollWidth <= wrap.clientWidth + 1; })""")
    assert fits and all(fits)


def test_verdicts_read_as_a_mark_and_a_word_in_colour(demo_site, watched_page):
    watch = watched_page(LOCAL_FILE)
    watch.page.goto((demo_site / "builds" / "solar-bank-charger" / "rev-A" / "index.html").as_uri(), wait_until="load")
    badge = watch.page.locator(".dossier-verdict-fail").first
    assert badge.inner_text().strip() == "\u2717 fail"
    colour = badge.evaluate("b => getComputedStyle(b).color")
    assert colour != watch.page.locator("article p").first.evaluate("p => getComputedStyle(p).color")


def test_the_checklist_page_shows_one_caution(demo_site, watched_page):
    watch = watched_page(LOCAL_FILE)
    watch.page.goto((demo_site / "builds" / "solar-bank-charger" / "checklist.html").as_uri(), wait_until="load")
    titles = watch.page.locator("article .admonition-title").all_inner_texts()
    assert [t.strip().lower() for t in titles].count("caution") == 1
