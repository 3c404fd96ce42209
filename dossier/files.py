"""Files as dossier keeps them: written whole or not at all (the one way it replaces a file it keeps: ledger,
caches), and known by their size and hash."""

from __future__ import annotations

import hashlib
import os
import tempfile
from dataclasses import dataclass
from pathlib import Path


def write_whole(path: Path, content: str | bytes) -> Path:
    """Write content to path so that a crash leaves the old file or the new one, never a part of either.

    The content goes to a temporary file beside the target, is flushed to disk, and then takes the target's
    place in one rename; a failed write removes the temporary file. Text is written as UTF-8 with the line
    endings it has.
    """
    path = Path(path)
    data = content.encode("utf-8") if isinstance(content, str) else content
    handle, temporary = tempfile.mkstemp(dir=path.parent, prefix=f".{path.name}-", suffix=".tmp")
    try:
        with os.fdopen(handle, "wb") as stream:
            stream.write(data)
            stream.flush()
            os.fsync(stream.fileno())  # on disk before it takes the old file's place
        os.replace(temporary, path)
    except BaseException:
        Path(temporary).unlink(missing_ok=True)
        raise
    return path


@dataclass(frozen=True)
class FileFacts:
    """A file's size and sha256 (hex): what a tree's list of files keeps, so nobody reads the file again to know it."""

    size: int
    sha256: str

    @classmethod
    def of(cls, content: bytes) -> "FileFacts":
        return cls(len(content), hashlib.sha256(content).hexdigest())


class FolderMaker:
    """Makes the folder a file goes in, asking the file system once per folder: placing thousands of files
    would otherwise ask it once per file."""

    def __init__(self):
        self.made: set[Path] = set()

    def parent_of(self, path: Path) -> Path:
        parent = path.parent
        if parent not in self.made:
            parent.mkdir(parents=True, exist_ok=True)
            self.made.add(parent)
        return path
