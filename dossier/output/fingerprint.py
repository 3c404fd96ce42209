"""Whether a site must be rendered again: fingerprints of what MkDocs reads and of the site it wrote.

MkDocs' output depends only on the page tree, the configuration, SOURCE_DATE_EPOCH and the renderer's own
code. When all of these match the fingerprint stamped into the output folder by the last build, and the
output folder itself is still exactly what that build left, rendering again would give the same bytes, so
the site is kept as it is. dossier's own code needs no place in the fingerprint: everything it decides
is already in the page tree and the configuration.
"""

from __future__ import annotations

import hashlib
from importlib import metadata
from pathlib import Path

from dossier.output.atomic import MARKER, MARKER_TEXT

# Distributions whose code turns the tree into HTML; a new version of any of them means rendering again.
RENDERERS = ("mkdocs", "mkdocs-material", "markdown", "pymdown-extensions", "pygments")
_FIELDS = ("pages", "site")


def folder_digest(root: Path, leave_out: frozenset[str] = frozenset()) -> str:
    """sha256 over every file's relative path and bytes, in a fixed order; top-level names in leave_out skipped."""
    digest = hashlib.sha256()
    for path in sorted(p for p in root.rglob("*") if p.is_file() and p.relative_to(root).parts[0] not in leave_out):
        digest.update(path.relative_to(root).as_posix().encode("utf-8") + b"\0")
        digest.update(hashlib.sha256(path.read_bytes()).digest())
    return digest.hexdigest()


def render_inputs(pages: Path, config: Path, epoch: int) -> str:
    """The fingerprint of one render: the tree, the configuration, the epoch and the renderers' versions."""
    digest = hashlib.sha256()
    for part in (folder_digest(pages), config.read_text(encoding="utf-8"), str(epoch), *map(_version, RENDERERS)):
        digest.update(part.encode("utf-8") + b"\0")
    return digest.hexdigest()


def _version(distribution: str) -> str:
    try:
        return f"{distribution} {metadata.version(distribution)}"
    except metadata.PackageNotFoundError:
        return f"{distribution} absent"


def marker_text(site: Path, inputs: str) -> str:
    """The marker for a freshly rendered site: who wrote it, what it was rendered from, what it holds."""
    return f"{MARKER_TEXT}pages: {inputs}\nsite: {_site_digest(site)}\n"


def still_current(output: Path, inputs: str) -> bool:
    """True when output was rendered from these very inputs and nothing in it has changed since."""
    stamped = read_stamp(output / MARKER)
    return stamped.get("pages") == inputs and stamped.get("site") == _site_digest(output)


def _site_digest(site: Path) -> str:
    return folder_digest(site, frozenset({MARKER}))


def read_stamp(marker: Path) -> dict[str, str]:
    """The fields stamped into an output's marker file; empty when it has none (or cannot be read)."""
    try:
        lines = marker.read_text(encoding="utf-8").splitlines()
    except (OSError, UnicodeDecodeError):
        return {}
    pairs = (line.split(": ", 1) for line in lines if ": " in line)
    return {key: value.strip() for key, value in pairs if key in _FIELDS}
