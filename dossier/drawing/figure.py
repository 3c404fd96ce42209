"""A figure drawn for a page: an SVG with a stable key and a title."""

from __future__ import annotations

from dataclasses import dataclass


@dataclass(frozen=True)
class Figure:
    key: str  # stable file-name stem, e.g. 'block-diagram', 'stage-2-converter', 'charge-curve'
    title: str
    svg: str  # a complete, well-formed SVG document; ids inside are unique to this figure
    section: str = "schematics"  # page section it belongs to: 'schematics' or a calc name
