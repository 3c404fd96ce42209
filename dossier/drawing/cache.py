"""A content-addressed store of finished SVG drawings.

The key is the sha256 of a canonical JSON of everything a drawing is drawn from (its view),
the figure key and DRAWER_VERSION; an unchanged view is never drawn twice. The caller owns
the folder: there is no default location and no state outside the object.
"""

from __future__ import annotations

import dataclasses
import hashlib
import json
from pathlib import Path
from typing import Callable

from dossier.files import write_whole

# Raise when any drawer changes what it draws, so old drawings are not served from a cache.
DRAWER_VERSION = "schematics-3"
CACHE_FOLDER = Path(".cache") / "drawings"


def content_key(figure_key: str, view) -> str:
    payload = {"drawer": DRAWER_VERSION, "figure": figure_key, "view": _plain(view)}
    canonical = json.dumps(payload, sort_keys=True, separators=(",", ":"), ensure_ascii=False)
    return hashlib.sha256(canonical.encode("utf-8")).hexdigest()


def _plain(view):
    return dataclasses.asdict(view) if dataclasses.is_dataclass(view) else view


class DrawingCache:
    """SVG text by content key, one file per drawing, written atomically."""

    def __init__(self, folder: Path):
        self.folder = Path(folder)
        self.hits = 0
        self.misses = 0

    @classmethod
    def under(cls, root: Path) -> "DrawingCache":
        """The usual place: .cache/drawings under a folder the caller chooses (e.g. the site's build folder)."""
        return cls(Path(root) / CACHE_FOLDER)

    def path(self, key: str) -> Path:
        return self.folder / key[:2] / f"{key}.svg"

    def get_or_draw(self, key: str, draw: Callable[[], str]) -> str:
        stored = self._read(key)
        if stored is not None:
            self.hits += 1
            return stored
        self.misses += 1
        svg = draw()
        try:
            self._write(key, svg)
        except OSError:  # a cache that cannot be written (read-only, full) only costs time
            pass
        return svg

    def _read(self, key: str) -> str | None:
        """The stored drawing, or None when it is missing or was cut short."""
        try:
            text = self.path(key).read_text(encoding="utf-8")
        except (OSError, UnicodeDecodeError):
            return None
        return text if text.startswith("<svg") and text.rstrip().endswith("</svg>") else None

    def _write(self, key: str, svg: str) -> None:
        target = self.path(key)
        target.parent.mkdir(parents=True, exist_ok=True)
        write_whole(target, svg)


class NoCache:
    """Draws every time; used when the caller gives no folder."""

    hits = 0
    misses = 0

    def get_or_draw(self, key: str, draw: Callable[[], str]) -> str:
        return draw()
