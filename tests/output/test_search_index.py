"""The search index merged from several runs, held as JSON text: the same bytes the theme writes."""

from __future__ import annotations

import json

import pytest

from dossier.render.search_index import SEARCH_INDEX, SEARCH_SCRIPT, IndexDisagrees, SearchPages, merged

CONFIG = {"lang": ["en"], "separator": "[\\s\\-]+", "pipeline": ["stopWordFilter"], "fields": {"title": {"boost": 1000.0}}}


def _entry(page: str, section: str = "", text: str = "") -> dict:
    return {"location": f"{page}#{section}" if section else page, "title": f"Title of {page} {section}", "text": text or f"Text of {page} ünïcode \"quoted\" 5 µF"}


def _theme_text(entries: list[dict]) -> str:
    """The index as mkdocs-material's search plugin writes it (json.dumps, compact separators)."""
    return json.dumps({"config": CONFIG, "docs": entries}, separators=(",", ":"), default=str)


def _site(tmp_path, name: str, entries: list[dict]):
    site = tmp_path / name
    (site / "search").mkdir(parents=True)
    (site / SEARCH_INDEX).write_text(_theme_text(entries), encoding="utf-8")
    return site


def test_an_index_read_and_written_again_is_the_same_bytes(tmp_path):
    entries = [_entry("index.html"), _entry("builds/amp/calcs.html", "isolation"), _entry("builds/amp/calcs.html", "fuse"), _entry("builds/a%20b/index.html")]
    index = SearchPages.read(_site(tmp_path, "site", entries))
    out = tmp_path / "out"
    index.write(out, ["index.html", "builds/a b/index.html", "builds/amp/calcs.html"][::1])
    expected = [entries[0], entries[3], entries[1], entries[2]]
    assert (out / SEARCH_INDEX).read_text(encoding="utf-8") == _theme_text(expected)
    assert (out / SEARCH_SCRIPT).read_text(encoding="utf-8") == "var __index = " + _theme_text(expected)


def test_parts_merge_in_reading_order_and_an_edit_replaces_a_page(tmp_path):
    first = SearchPages.read(_site(tmp_path, "one", [_entry("b.html"), _entry("index.html")]))
    second = SearchPages.read(_site(tmp_path, "two", [_entry("a.html", "x"), _entry("a.html", "y")]))
    merged(([first, second])).write(tmp_path / "out", ["index.html", "a.html", "b.html"])
    assert json.loads((tmp_path / "out" / SEARCH_INDEX).read_text(encoding="utf-8"))["docs"] == [_entry("index.html"), _entry("a.html", "x"), _entry("a.html", "y"), _entry("b.html")]
    edited = SearchPages.read(_site(tmp_path, "edit", [_entry("a.html", "z", "rewritten")]))
    merged([SearchPages.read(tmp_path / "out").without({"a.html"}), edited]).write(tmp_path / "again", ["index.html", "a.html", "b.html"])
    assert [entry["location"] for entry in json.loads((tmp_path / "again" / SEARCH_INDEX).read_text(encoding="utf-8"))["docs"]] == ["index.html", "a.html#z", "b.html"]


def test_an_index_laid_out_otherwise_is_read_whole(tmp_path):
    site = tmp_path / "site"
    (site / "search").mkdir(parents=True)
    (site / SEARCH_INDEX).write_text(json.dumps({"docs": [_entry("index.html")], "config": CONFIG}, indent=1), encoding="utf-8")
    SearchPages.read(site).write(tmp_path / "out", ["index.html"])
    assert (tmp_path / "out" / SEARCH_INDEX).read_text(encoding="utf-8") == _theme_text([_entry("index.html")])


def test_other_settings_or_an_unknown_page_are_refused(tmp_path):
    one = SearchPages.read(_site(tmp_path, "one", [_entry("index.html")]))
    other = SearchPages(json.dumps({"lang": ["de"]}))
    with pytest.raises(IndexDisagrees):
        merged([one, other])
    with pytest.raises(IndexDisagrees):
        one.write(tmp_path / "out", ["about.html"])


def test_a_damaged_index_is_none(tmp_path):
    site = _site(tmp_path, "site", [_entry("index.html")])
    (site / SEARCH_INDEX).write_text(_theme_text([_entry("index.html")])[:-5], encoding="utf-8")
    assert SearchPages.read(site) is None and SearchPages.read(tmp_path / "nowhere") is None
