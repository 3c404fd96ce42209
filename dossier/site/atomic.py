"""Writing a folder atomically: build beside the target, then swap; a failure leaves the old one whole."""

from __future__ import annotations

import os
import shutil
import tempfile
from contextlib import contextmanager
from pathlib import Path

MARKER = ".dossier-output"
MARKER_TEXT = "Written by dossier. This whole folder is replaced on every build; keep nothing of your own in it.\n"


class OutputRefused(Exception):
    """The chosen output folder cannot be replaced without losing something."""


def check_output(output: Path, archive: Path) -> None:
    """Refuse an output that is, holds or sits inside the archive, or that dossier did not write."""
    target, source = output.resolve(), archive.resolve()
    if target == source or source.is_relative_to(target):
        raise OutputRefused(f"{output} holds the archive {archive}; choose an output folder outside it")
    if target.is_relative_to(source):
        raise OutputRefused(f"{output} is inside the archive {archive}; dossier never writes into the archive")
    if target.exists() and not target.is_dir():
        raise OutputRefused(f"{output} is a file, not a folder")
    if target.is_dir() and any(target.iterdir()) and not (target / MARKER).is_file():
        raise OutputRefused(f"{output} exists and was not written by dossier; choose another output or remove it yourself")


@contextmanager
def staging(output: Path):
    """A fresh work folder beside the output (same file system, so the swap is a rename); always removed."""
    output.parent.mkdir(parents=True, exist_ok=True)
    work = Path(tempfile.mkdtemp(prefix=f".{output.name}-", suffix=".building", dir=output.parent))
    try:
        yield work
    finally:
        shutil.rmtree(work, ignore_errors=True)


def swap_in(new: Path, output: Path, marker: str = MARKER_TEXT) -> None:
    """Put the finished folder in place of the old one; if that fails, the old one is put back."""
    (new / MARKER).write_text(marker, encoding="utf-8")
    old = _move_aside(output)
    try:
        os.rename(new, output)
    except OSError:
        if old is not None:
            os.rename(old, output)
        raise
    if old is not None:
        shutil.rmtree(old, ignore_errors=True)


def _move_aside(output: Path) -> Path | None:
    if not output.exists():
        return None
    aside = Path(tempfile.mkdtemp(prefix=f".{output.name}-", suffix=".old", dir=output.parent))
    aside.rmdir()
    os.rename(output, aside)
    return aside
