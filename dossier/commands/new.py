"""`dossier new`: a commented record to start a build from."""

from __future__ import annotations

import datetime
import re
from pathlib import Path

from dossier.record.identity import BUILD_ID_PATTERN
from dossier.templates import template_text


class NewBuildRefused(Exception):
    """The new build cannot be written without losing or misplacing something."""


def scaffold(archive: Path, build_id: str, today: datetime.date | None = None) -> Path:
    if not re.match(BUILD_ID_PATTERN, build_id):
        raise NewBuildRefused(f"build id {build_id!r}: use lower-case letters, digits and hyphens, starting with a letter or digit")
    if not archive.is_dir():
        raise NewBuildRefused(f"archive folder {archive} does not exist")
    folder = archive / build_id
    if folder.exists() or folder.is_symlink():  # a link, even to nothing, is something the user made
        raise NewBuildRefused(f"{folder} already exists; add a revision there instead of starting a new build")
    path = folder / "rev-A.yaml"
    text = template_text("new-record.yaml").replace("{{ id }}", build_id)
    try:
        folder.mkdir()
        path.write_text(text.replace("{{ date }}", (today or datetime.date.today()).isoformat()), encoding="utf-8")
    except OSError as error:
        raise NewBuildRefused(f"cannot write {path}: {error.strerror or error}") from None
    return path
