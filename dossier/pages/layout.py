"""Where every page of the site lives: one place for the addresses, so links and files agree.

    index.md                          the archive: every build, filterable by status
    status/<status>.md                the builds in one status
    about.md                          how to read the site
    builds/<id>/index.md              the current revision's overview (a stable address)
    builds/<id>/calcs.md              ... its calculations, schematics.md, checklist.md
    builds/<id>/changes.md            revision by revision: what changed
    builds/<id>/rev-<X>/index.md      an earlier revision, frozen; for the current one, a pointer
    builds/<id>/files/<path>          attachments, as kept in the build's folder
"""

from __future__ import annotations

import posixpath
from urllib.parse import quote

INDEX = "index.md"
ABOUT = "about.md"
ASSETS = "assets/dossier"
STYLESHEET = f"{ASSETS}/dossier.css"
WORKER_SHIM = f"{ASSETS}/vendor/iframe-worker/shim.js"
REVISION_PAGES = ("index", "calcs", "schematics", "checklist")


def build_root(build_id: str) -> str:
    return f"builds/{build_id}"


def permanent_root(build_id: str, letter: str) -> str:
    return f"{build_root(build_id)}/rev-{letter}"


def revision_root(build_id: str, letter: str, is_current: bool) -> str:
    """The current revision lives at the build's stable address; earlier ones under rev-<X>/."""
    return build_root(build_id) if is_current else permanent_root(build_id, letter)


def page(root: str, name: str) -> str:
    return f"{root}/{name}.md"


def changes_page(build_id: str) -> str:
    return f"{build_root(build_id)}/changes.md"


def status_page(status: str) -> str:
    return f"status/{status}.md"


def signoff_page(state: str) -> str:
    return f"signoff/{state}.md"


def attachment_path(build_id: str, relative: str) -> str:
    return f"{build_root(build_id)}/files/{relative}"


def figure_path(root: str, key: str) -> str:
    return f"{root}/figures/{key}.svg"


def href(from_page: str, target: str) -> str:
    """A relative link from one page (or file) of the tree to another, percent-encoded for Markdown."""
    relative = posixpath.relpath(target, posixpath.dirname(from_page) or ".")
    path, hash_mark, anchor = relative.partition("#")
    return quote(path, safe="/-._~") + (hash_mark + anchor if hash_mark else "")
