"""A build's finished pages kept between builds, keyed by everything that can change them.

The key of a build folder is a sha256 over: the fingerprint of the code (dossier, its templates, every calc
plugin's source and version, every installed distribution: see code_version), the archive's settings and
publication ledger as bytes, the options that change what is written (PDFs or not), the folder's name and
every file in it by name and bytes (records, attachments, sign-offs, commissioning records, anything else).
A build whose folder holds a link to a folder is never cached: what lies behind it could change unseen.

An entry is one zip file holding the build's files of the page tree and the summary the front pages need,
written whole (files.write_whole). On a hit the files are unpacked into the tree: an unchanged build costs a
file copy instead of a review. The store is bounded: past its size, the least recently used entries go.
A stale finding in a safety review is worse than a slow one, so anything unexpected (a damaged entry, an
unreadable file) counts as a miss.
"""

from __future__ import annotations

import hashlib
import io
import os
import pickle
import zipfile
from dataclasses import dataclass
from pathlib import Path

from dossier.files import write_whole
from dossier.ledger import LOCK_FILE
from dossier.reading.settings import SETTINGS_FILE

STORE_VERSION = "build-pages-1"  # raise when the entry's layout changes
SUMMARY = ".summary.pickle"
DEFAULT_LIMIT_MB = 1024
LIMIT_VARIABLE = "DOSSIER_CACHE_MB"
ARCHIVE_FILES = (SETTINGS_FILE, LOCK_FILE)
_SAFE_MODULES = ("dossier.", "datetime", "builtins", "collections", "copyreg", "pathlib", "enum")


@dataclass
class Entry:
    files: dict[str, bytes]  # path inside the build's folder of the page tree -> bytes
    summary: object  # what the front pages need from the build (pages.tree.BuildPages)


class BuildStore:
    """Finished builds by key, one zip per build, in a folder the caller chooses."""

    def __init__(self, folder: Path, limit_bytes: int | None = None):
        self.folder = Path(folder)
        self.limit = limit_bytes if limit_bytes is not None else _limit_from_environment()
        self.archive_key = ""  # set by prepare() before any build is keyed
        self.hits = 0
        self.misses = 0

    def prepare(self, archive_root: Path, code: str, options: str) -> None:
        """The part of every key shared by the whole archive: the code, the settings, the ledger, the options."""
        digest = hashlib.sha256()
        for part in (STORE_VERSION, code, options):
            digest.update(part.encode("utf-8") + b"\0")
        for name in ARCHIVE_FILES:
            digest.update(name.encode("utf-8") + b"\0" + _bytes_or_absent(archive_root / name) + b"\0")
        self.archive_key = digest.hexdigest()

    def key(self, build_folder: Path) -> str | None:
        """The key of one build folder, or None when it cannot be cached (not prepared, a linked folder, unreadable)."""
        if not self.archive_key:
            return None
        digest = hashlib.sha256(self.archive_key.encode("ascii") + b"\0" + build_folder.name.encode("utf-8") + b"\0")
        try:
            for path in _every_file(build_folder):
                digest.update(path.relative_to(build_folder).as_posix().encode("utf-8") + b"\0")
                digest.update(hashlib.sha256(path.read_bytes()).digest())
        except (OSError, _Uncachable):
            return None
        return digest.hexdigest()

    def path(self, key: str) -> Path:
        return self.folder / key[:2] / f"{key}.zip"

    def load(self, key: str) -> Entry | None:
        """The entry, or None (a miss) when there is none or it cannot be read whole."""
        path = self.path(key)
        try:
            with zipfile.ZipFile(path) as stored:
                names = [name for name in stored.namelist() if name != SUMMARY]
                if not all(_inside(name) for name in names):
                    raise ValueError("an entry names a file outside its build's folder")
                files = {name: stored.read(name) for name in names}
                summary = _SafeUnpickler(io.BytesIO(stored.read(SUMMARY))).load()
            os.utime(path)  # most recently used
        except Exception:  # a damaged, truncated or foreign entry is only a miss
            self.misses += 1
            return None
        self.hits += 1
        return Entry(files, summary)

    def save(self, key: str, entry: Entry) -> None:
        buffer = io.BytesIO()
        with zipfile.ZipFile(buffer, "w", zipfile.ZIP_STORED) as stored:
            for name in sorted(entry.files):
                stored.writestr(name, entry.files[name])
            stored.writestr(SUMMARY, pickle.dumps(entry.summary, protocol=pickle.HIGHEST_PROTOCOL))
        target = self.path(key)
        try:
            target.parent.mkdir(parents=True, exist_ok=True)
            write_whole(target, buffer.getvalue())
        except OSError:  # a cache that cannot be written (read-only, full) only costs time
            pass

    def trim(self) -> int:
        """Remove the least recently used entries until the store fits its limit; how many were removed."""
        entries = []
        for path in self.folder.glob("*/*.zip"):
            try:
                status = path.stat()
            except OSError:
                continue
            entries.append((status.st_mtime_ns, status.st_size, path))
        total = sum(size for _, size, _ in entries)
        removed = 0
        for _, size, path in sorted(entries):
            if total <= self.limit:
                break
            path.unlink(missing_ok=True)
            total -= size
            removed += 1
        return removed


class _Uncachable(Exception):
    """The build folder holds something the key cannot follow."""


def _every_file(folder: Path) -> list[Path]:
    found = []
    for parent, subfolders, names in os.walk(folder):
        subfolders.sort()
        for name in subfolders:
            if os.path.islink(os.path.join(parent, name)):
                raise _Uncachable(name)
        found.extend(Path(parent) / name for name in sorted(names))
    return found


def _inside(name: str) -> bool:
    parts = name.split("/")
    return bool(name) and not name.startswith("/") and "\\" not in name and all(part not in ("", ".", "..") for part in parts)


def _bytes_or_absent(path: Path) -> bytes:
    try:
        return b"present\0" + path.read_bytes()
    except FileNotFoundError:
        return b"absent"


def _limit_from_environment() -> int:
    try:
        megabytes = int(os.environ.get(LIMIT_VARIABLE, DEFAULT_LIMIT_MB))
    except ValueError:
        megabytes = DEFAULT_LIMIT_MB
    return max(0, megabytes) * 1024 * 1024


class _SafeUnpickler(pickle.Unpickler):
    """Only dossier's own data and plain Python types come out of a cache entry, never arbitrary code."""

    def find_class(self, module: str, name: str):
        if module == "builtins" and name in {"eval", "exec", "compile", "open", "getattr", "__import__", "input", "breakpoint"}:
            raise pickle.UnpicklingError(f"{module}.{name} is not allowed in a cache entry")
        if not (module == "dossier" or module.startswith(_SAFE_MODULES) or module in _SAFE_MODULES):
            raise pickle.UnpicklingError(f"{module}.{name} is not allowed in a cache entry")
        return super().find_class(module, name)
