"""Whether a site must be rendered again: fingerprints of what MkDocs reads and of the site it wrote.

MkDocs' output depends only on the page tree, the configuration, SOURCE_DATE_EPOCH and the renderer's own
code. When all of these match the fingerprint stamped into the output folder by the last build, and the
output folder itself is still exactly what that build left, rendering again would give the same bytes, so
the site is kept as it is. dossier's own code needs no place in the fingerprint: everything it decides
is already in the page tree and the configuration. Everything else installed is in it (harsher than
needed: a new version of anything renders every page again).
"""

from __future__ import annotations

import hashlib
import os
import sys
from importlib import metadata
from pathlib import Path

from dossier.collect.code_version import installed_distributions
from dossier.output.atomic import MARKER, MARKER_TEXT

# Distributions whose code turns the tree into HTML; a new version of any of them means rendering again.
RENDERERS = ("mkdocs", "mkdocs-material", "markdown", "pymdown-extensions", "pygments")
_FIELDS = ("pages", "site")


def file_hashes(root: Path, leave_out: frozenset[str] = frozenset()) -> dict[str, str]:
    """sha256 (hex) of every file under root by its relative path; top-level names in leave_out skipped."""
    hashes = {}
    for path in sorted(p for p in root.rglob("*") if p.is_file() and p.relative_to(root).parts[0] not in leave_out):
        hashes[path.relative_to(root).as_posix()] = hashlib.sha256(path.read_bytes()).hexdigest()
    return hashes


def file_stats(root: Path, leave_out: frozenset[str] = frozenset()) -> dict[str, tuple[int, int]]:
    """(size, modification time in ns) of every file under root by its relative path, as file_hashes names them."""
    stats = {}
    for folder, _, names in os.walk(root):
        relative = Path(folder).relative_to(root).as_posix()
        for name in names:
            path = name if relative == "." else f"{relative}/{name}"
            if path.split("/", 1)[0] not in leave_out:
                status = os.stat(os.path.join(folder, name))
                stats[path] = (status.st_size, status.st_mtime_ns)
    return stats


def digest_of(hashes: dict[str, str]) -> str:
    """sha256 over every file's relative path and hash, in a fixed order (as folder_digest)."""
    digest = hashlib.sha256()
    for path in sorted(hashes):
        digest.update(path.encode("utf-8") + b"\0")
        digest.update(bytes.fromhex(hashes[path]))
    return digest.hexdigest()


def folder_digest(root: Path, leave_out: frozenset[str] = frozenset()) -> str:
    """sha256 over every file's relative path and bytes, in a fixed order; top-level names in leave_out skipped."""
    return digest_of(file_hashes(root, leave_out))


def shared_context(config: str, epoch: int) -> str:
    """What every page's HTML depends on besides its own Markdown: the configuration (the sidebar is in it), the
    epoch, the renderers' versions and everything else installed (a template engine, an extension)."""
    return hashlib.sha256(f"{config}\0{epoch}\0{renderer_versions()}\0".encode("utf-8")).hexdigest()


def renderer_versions() -> str:
    """Python's and the renderers' versions and everything installed: what shapes the HTML besides the tree."""
    return "\0".join((sys.version, *map(_version, RENDERERS), *installed_distributions()))


def archive_inputs(archive_key: str, build_keys: list[tuple[str, str]]) -> str:
    """The fingerprint of everything a site is made from, without writing its tree: the build cache's archive
    key (code, settings, ledger, options), every build folder's key in order, and the renderers."""
    digest = hashlib.sha256(f"{archive_key}\0{renderer_versions()}\0".encode("utf-8"))
    for name, key in build_keys:
        digest.update(f"{name}\0{key}\0".encode("utf-8"))
    return digest.hexdigest()


def render_inputs(sources: dict[str, str], shared: str) -> str:
    """The fingerprint of one render: the page tree (by its files' hashes) and the shared context."""
    return hashlib.sha256(f"{digest_of(sources)}\0{shared}".encode("utf-8")).hexdigest()


def _version(distribution: str) -> str:
    try:
        return f"{distribution} {metadata.version(distribution)}"
    except metadata.PackageNotFoundError:
        return f"{distribution} absent"


def marker_text(site_hashes: dict[str, str], inputs: str) -> str:
    """The marker for a freshly rendered site: who wrote it, what it was rendered from, what it holds."""
    return f"{MARKER_TEXT}pages: {inputs}\nsite: {digest_of(site_hashes)}\n"


def still_current(output: Path, inputs: str, hashes: dict[str, str]) -> bool:
    """True when output was rendered from these very inputs and its files (hashes) are the ones it was left with."""
    stamped = read_stamp(output / MARKER)
    if stamped.get("pages") != inputs:
        return False
    return stamped.get("site") == digest_of(hashes)


def read_stamp(marker: Path) -> dict[str, str]:
    """The fields stamped into an output's marker file; empty when it has none (or cannot be read)."""
    try:
        lines = marker.read_text(encoding="utf-8").splitlines()
    except (OSError, UnicodeDecodeError):
        return {}
    pairs = (line.split(": ", 1) for line in lines if ": " in line)
    return {key: value.strip() for key, value in pairs if key in _FIELDS}
