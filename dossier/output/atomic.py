"""Writing a folder atomically: build beside the target, then swap; a failure leaves the old one whole.

The swap is one atomic exchange where the system has one (see exchange). Elsewhere the old folder is
moved aside and the new one renamed in; a build killed between the two leaves the old folder aside,
and the next build puts it back (recover_leftovers) before it does anything else.
"""

from __future__ import annotations

import os
import re
import shutil
import tempfile
from contextlib import contextmanager
from pathlib import Path

from dossier.output.exchange import exchange

MARKER = ".dossier-output"
MARKER_TEXT = "Written by dossier. This whole folder is replaced on every build; keep nothing of your own in it.\n"
WORK, ASIDE = ".building", ".old"  # suffixes of the folders kept beside the output during a build


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
    blocking = next((parent for parent in target.parents if parent.exists() and not parent.is_dir()), None)
    if blocking is not None:
        raise OutputRefused(f"{output} cannot be made: {blocking} is a file, not a folder")
    if target.is_dir() and any(target.iterdir()) and not (target / MARKER).is_file():
        raise OutputRefused(f"{output} exists and was not written by dossier; choose another output or remove it yourself")


@contextmanager
def staging(output: Path):
    """A fresh work folder beside the output (same file system, so the swap is a rename); always removed."""
    output.parent.mkdir(parents=True, exist_ok=True)
    work = Path(tempfile.mkdtemp(prefix=f".{output.name}-", suffix=WORK, dir=output.parent))
    try:
        yield work
    finally:
        shutil.rmtree(work, ignore_errors=True)


def swap_in(new: Path, output: Path, marker: str = MARKER_TEXT) -> None:
    """Put the finished folder in place of the old one; if that fails, the old one is put back."""
    (new / MARKER).write_text(marker, encoding="utf-8")
    if output.exists() and exchange(new, output):
        return  # new now holds the old folder, and goes with the work folder
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
    aside = Path(tempfile.mkdtemp(prefix=f".{output.name}-", suffix=ASIDE, dir=output.parent))
    aside.rmdir()
    os.rename(output, aside)
    return aside


def recover_leftovers(output: Path) -> None:
    """After a build that was killed: put back an old site left aside, and remove unfinished work folders.

    Call only while holding the output's lock (see output_lock): then no other build owns these folders.
    """
    leftovers = _leftovers(output)
    asides = [path for path in leftovers if path.name.endswith(ASIDE) and (path / MARKER).is_file()]
    if asides and not output.exists():
        newest = max(asides, key=lambda path: path.stat().st_mtime_ns)
        os.rename(newest, output)
        leftovers.remove(newest)
    for path in leftovers:
        shutil.rmtree(path, ignore_errors=True)


def _leftovers(output: Path) -> list[Path]:
    """Folders named as this output's work or aside folders (tempfile's 8-character names), nothing else."""
    if not output.parent.is_dir():
        return []
    pattern = re.compile(rf"\.{re.escape(output.name)}-[a-z0-9_]{{8}}({re.escape(WORK)}|{re.escape(ASIDE)})")
    return [path for path in sorted(output.parent.iterdir()) if pattern.fullmatch(path.name) and path.is_dir() and not path.is_symlink()]
