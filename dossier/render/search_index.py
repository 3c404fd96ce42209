"""The theme's search index, merged from several MkDocs runs without holding it as Python objects.

A site's index holds every section of every page; for a large archive it is tens of megabytes, and parsed
whole it takes several times that in memory. Here it is held as each page's entries in the JSON text they
were written in (json.dumps with the theme's separators), read entry by entry, and written piece by piece;
the file comes out byte-identical to the theme's own for the same entries in the same order.
"""

from __future__ import annotations

import json
from pathlib import Path
from urllib.parse import quote

SEARCH_INDEX = "search/search_index.json"
SEARCH_SCRIPT = "search/search_index.js"  # the theme's offline plugin: the index inlined into a script
SEARCH_SCRIPT_PREFIX = "var __index = "
FILES = frozenset({SEARCH_INDEX, SEARCH_SCRIPT})
_HEAD, _DOCS, _TAIL = '{"config":', ',"docs":[', "]}"
_DECODER = json.JSONDecoder()


class IndexDisagrees(Exception):
    """Two indexes to be merged were made with other settings, or name a page the tree does not hold."""


class SearchPages:
    """A search index as its settings and, page by page (the page's HTML path, quoted as in the index), the JSON
    text of each of its entries, in the order they came."""

    def __init__(self, config: str):
        self.config = config
        self.pages: dict[str, list[str]] = {}

    @classmethod
    def read(cls, site: Path) -> "SearchPages | None":
        """The index a site holds; None when it has none or it cannot be read."""
        try:
            return cls.parse((site / SEARCH_INDEX).read_text(encoding="utf-8"))
        except (OSError, ValueError, KeyError, TypeError, AttributeError, IndexError):
            return None

    @classmethod
    def parse(cls, text: str) -> "SearchPages":
        if not text.startswith(_HEAD):
            return cls._parsed_whole(json.loads(text))
        config, at = _DECODER.raw_decode(text, len(_HEAD))
        if not text.startswith(_DOCS, at):
            return cls._parsed_whole(json.loads(text))
        index = cls(text[len(_HEAD):at])
        at += len(_DOCS)
        while text[at] != "]":
            entry, end = _DECODER.raw_decode(text, at)
            index.pages.setdefault(_page_of(entry), []).append(text[at:end])
            at = end + 1 if text[end] == "," else end
        if text[at:] != _TAIL:
            raise ValueError("the search index does not end as the theme writes it")
        return index

    @classmethod
    def _parsed_whole(cls, data: dict) -> "SearchPages":
        index = cls(_dumped(data["config"]))
        for entry in data["docs"]:
            index.pages.setdefault(_page_of(entry), []).append(_dumped(entry))
        return index

    def without(self, pages: set[str]) -> "SearchPages":
        """The index with the entries of these pages (paths of their HTML, unquoted) left out."""
        dropped = {quote(page) for page in pages}
        kept = SearchPages(self.config)
        kept.pages = {page: entries for page, entries in self.pages.items() if page not in dropped}
        return kept

    def write(self, site: Path, order: list[str]) -> None:
        """Write the index and its script into site, its pages in order (paths of their HTML, unquoted)."""
        position = {quote(page): number for number, page in enumerate(order)}
        unknown = [page for page in self.pages if page not in position]
        if unknown:
            raise IndexDisagrees(f"{SEARCH_INDEX}: {unknown[0]} is no page of the tree")
        pages = sorted(self.pages, key=position.__getitem__)
        (site / SEARCH_INDEX).parent.mkdir(parents=True, exist_ok=True)
        for name, prefix in ((SEARCH_INDEX, ""), (SEARCH_SCRIPT, SEARCH_SCRIPT_PREFIX)):
            with open(site / name, "w", encoding="utf-8") as stream:
                stream.write(f"{prefix}{_HEAD}{self.config}{_DOCS}")
                stream.write(",".join(entry for page in pages for entry in self.pages[page]))
                stream.write(_TAIL)


def merged(indexes: list[SearchPages]) -> SearchPages:
    """One index from several made with the same settings; a page's entries from the first index that has it."""
    if not indexes:
        raise ValueError("no index to merge")
    if any(index.config != indexes[0].config for index in indexes):
        raise IndexDisagrees(SEARCH_INDEX)
    whole = SearchPages(indexes[0].config)
    for index in indexes:
        for page, entries in index.pages.items():
            whole.pages.setdefault(page, entries)
    return whole


def _page_of(entry: dict) -> str:
    return entry["location"].split("#", 1)[0]


def _dumped(value) -> str:
    return json.dumps(value, separators=(",", ":"), default=str)
