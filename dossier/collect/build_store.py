"""A build's finished pages kept between builds, keyed by everything that can change them.

The key of a build folder is a sha256 over: the fingerprint of the code (dossier, its templates, every calc
plugin's source and version, every installed distribution: see code_version), the archive's settings and
publication ledger as bytes, the options that change what is written (PDFs or not), the folder's name and
every file in it by name and bytes (records, attachments, sign-offs, commissioning records, anything else).
A build whose folder holds a link to a folder is never cached: what lies behind it could change unseen.

An entry is a folder named by its key: the build's files of the page tree under `pages/`, the list of them
with their sizes and sha256 (`files.json`), and the summary the front pages need (`summary.pickle`). It is
made in a scratch folder and renamed into place whole. On a hit the files are placed into the tree as hard
links where the tree is thrown away after rendering (a site build), else copied: an unchanged build costs a
link per file instead of a review, and nothing written by the user can reach into the store. The store is
bounded: past its size, the least recently used entries go. A stale finding in a safety review is worse
than a slow one, so anything unexpected (a missing or resized file, an unreadable list) counts as a miss.
"""

from __future__ import annotations

import errno
import hashlib
import io
import json
import os
import pickle
import shutil
import tempfile
from dataclasses import dataclass
from pathlib import Path

from dossier.files import FileFacts, FolderMaker
from dossier.ledger import LOCK_FILE
from dossier.reading.settings import SETTINGS_FILE

STORE_VERSION = "build-pages-2"  # raise when the entry's layout changes
PAGES, FILES, SUMMARY = "pages", "files.json", "summary.pickle"
DEFAULT_LIMIT_MB = 1024
LIMIT_VARIABLE = "DOSSIER_CACHE_MB"
ARCHIVE_FILES = (SETTINGS_FILE, LOCK_FILE)
_SAFE_MODULES = ("dossier.", "datetime", "builtins", "collections", "copyreg", "pathlib", "enum")


@dataclass
class Entry:
    folder: Path  # the build's files, by their path inside the build's folder of the page tree
    files: dict[str, FileFacts]
    summary: object  # what the front pages need from the build (pages.tree.BuildPages)


class EntryDamaged(Exception):
    """An entry's files are not what its list says: a miss."""


class BuildStore:
    """Finished builds by key, one folder per build, in a folder the caller chooses."""

    def __init__(self, folder: Path, limit_bytes: int | None = None, link: bool = False):
        self.folder = Path(folder)
        self.limit = limit_bytes if limit_bytes is not None else _limit_from_environment()
        self.link = link  # hard links between the store and the tree: only for a tree that is thrown away
        self.archive_key = ""  # set by prepare() before any build is keyed
        self.hits = 0
        self.misses = 0
        self.saved = 0

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
        return self.folder / key[:2] / key

    def load(self, key: str) -> Entry | None:
        """The entry, or None (a miss) when there is none or its list and summary cannot be read."""
        folder = self.path(key)
        try:
            files = _read_list(folder / FILES)
            summary = _SafeUnpickler(io.BytesIO((folder / SUMMARY).read_bytes())).load()
            os.utime(folder / FILES)  # most recently used
        except Exception:  # a damaged, truncated or foreign entry is only a miss
            self.misses += 1
            return None
        return Entry(folder / PAGES, files, summary)

    def place(self, entry: Entry, target: Path) -> bool:
        """Put the entry's files under target; False (a miss, target removed) when a file is missing or resized."""
        folders = FolderMaker()
        try:
            for name, facts in entry.files.items():
                destination = folders.parent_of(target / name)
                self._bring(entry.folder / name, destination)
                if destination.stat().st_size != facts.size:
                    raise EntryDamaged(name)
        except (OSError, EntryDamaged):
            shutil.rmtree(target, ignore_errors=True)
            self.misses += 1
            return False
        self.hits += 1
        return True

    def save(self, key: str, source: Path, files: dict[str, FileFacts], summary: object) -> None:
        """Keep the files listed (found under source) and the summary as the entry for key; a store that cannot be
        written only costs time, and an entry another build saved first is kept."""
        target = self.path(key)
        try:
            target.parent.mkdir(parents=True, exist_ok=True)
            scratch = Path(tempfile.mkdtemp(prefix=".new-", dir=target.parent))
        except OSError:
            return
        folders = FolderMaker()
        try:
            for name in files:
                self._bring(source / name, folders.parent_of(scratch / PAGES / name))
            (scratch / SUMMARY).write_bytes(pickle.dumps(summary, protocol=pickle.HIGHEST_PROTOCOL))
            (scratch / FILES).write_text(json.dumps({name: [f.size, f.sha256] for name, f in sorted(files.items())}), encoding="utf-8")
            os.rename(scratch, target)
            self.saved += 1
        except OSError:
            pass
        finally:
            shutil.rmtree(scratch, ignore_errors=True)

    def _bring(self, source: Path, destination: Path) -> None:
        if self.link:
            try:
                os.link(source, destination)
                return
            except OSError as error:  # another file system, or links not allowed: copy (and stop trying to link)
                self.link = error.errno not in (errno.EXDEV, errno.EPERM, errno.ENOTSUP)
        shutil.copyfile(source, destination)

    def trim(self) -> int:
        """Remove the least recently used entries until the store fits its limit; how many were removed."""
        entries = []
        for listing in self.folder.glob(f"*/*/{FILES}"):
            try:
                entries.append((listing.stat().st_mtime_ns, _entry_size(listing), listing.parent))
            except (OSError, ValueError):
                continue
        total = sum(size for _, size, _ in entries)
        removed = 0
        for _, size, folder in sorted(entries):
            if total <= self.limit:
                break
            shutil.rmtree(folder, ignore_errors=True)
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


def _read_list(path: Path) -> dict[str, FileFacts]:
    listed = json.loads(path.read_text(encoding="utf-8"))
    if not all(_inside(name) for name in listed):
        raise ValueError("an entry names a file outside its build's folder")
    return {name: FileFacts(int(size), str(sha)) for name, (size, sha) in listed.items()}


def _entry_size(listing: Path) -> int:
    return sum(size for size, _ in json.loads(listing.read_text(encoding="utf-8")).values())


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
