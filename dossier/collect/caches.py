"""Work kept between builds: finished drawings, checklist PDFs and whole builds' pages, by the hash of what they are made from."""

from __future__ import annotations

import os
from dataclasses import dataclass
from pathlib import Path

from dossier.checklist.pdf import PdfCache
from dossier.collect.build_store import BuildStore
from dossier.drawing.cache import DrawingCache


@dataclass(frozen=True)
class Caches:
    drawings: DrawingCache | None = None
    pdfs: PdfCache | None = None  # None: the build writes no PDFs
    builds: BuildStore | None = None  # None: every build is reviewed and its pages written afresh
    renders: Path | None = None  # what each site was rendered from (output.incremental); None: render every page

    @classmethod
    def in_folder(cls, folder: Path) -> "Caches":
        return cls(DrawingCache(Path(folder) / "drawings"), PdfCache(Path(folder) / "pdfs"), BuildStore(Path(folder) / "builds"), Path(folder) / "renders")


def user_cache_folder() -> Path:
    """The user's cache folder (never the archive): $XDG_CACHE_HOME/dossier or ~/.cache/dossier."""
    return Path(os.environ.get("XDG_CACHE_HOME") or Path.home() / ".cache") / "dossier"


def user_caches(use_cache: bool = True, pdfs: bool = True) -> Caches:
    """With use_cache false, every build is reviewed, every drawing and PDF made again, and nothing is kept."""
    if use_cache:
        caches = Caches.in_folder(user_cache_folder())
        return caches if pdfs else Caches(caches.drawings, None, caches.builds, caches.renders)
    return Caches(None, PdfCache(None) if pdfs else None)
