"""`dossier new`: a commented record to start a build from, in an archive started on the way if need be."""

from __future__ import annotations

import datetime
import re
from pathlib import Path

from dossier.reading.settings import SETTINGS_FILE
from dossier.record.identity import BUILD_ID_PATTERN
from dossier.templates import template_text, templates_dir

# The JSON Schema an editor reads to check a record as it is typed; `dossier new` keeps it current.
SCHEMA_FILE = "record.schema.json"
# Worked, commented records of common unit kinds, one file each: templates/starts/<kind>.yaml.
STARTS_FOLDER = "starts"


class NewBuildRefused(Exception):
    """The new build cannot be written without losing or misplacing something."""


def starting_points() -> list[str]:
    """The unit kinds `dossier new --start` offers, in name order."""
    return sorted(path.stem for path in (templates_dir() / STARTS_FOLDER).glob("*.yaml"))


def _template_name(start: str | None) -> str:
    if start is None:
        return "new-record.yaml"
    kinds = starting_points()
    if start not in kinds:
        raise NewBuildRefused(f"no starting point {start!r}; the starting points are: {', '.join(kinds)}")
    return f"{STARTS_FOLDER}/{start}.yaml"


def scaffold(archive: Path, build_id: str, today: datetime.date | None = None, start: str | None = None) -> Path:
    """Write BUILD_ID/rev-A.yaml: the blank commented record, or the worked starting point of kind START."""
    if not re.match(BUILD_ID_PATTERN, build_id):
        raise NewBuildRefused(f"build id {build_id!r}: use lower-case letters, digits and hyphens, starting with a letter or digit")
    template = _template_name(start)
    _start_archive_if_new(archive)
    folder = archive / build_id
    if folder.exists() or folder.is_symlink():  # a link, even to nothing, is something the user made
        raise NewBuildRefused(f"{folder} already exists; add a revision there instead of starting a new build")
    path = folder / "rev-A.yaml"
    text = template_text(template).replace("{{ id }}", build_id).replace("{{ schema }}", f"../{SCHEMA_FILE}")
    try:
        refresh_schema(archive)
        folder.mkdir()
        path.write_text(text.replace("{{ date }}", (today or datetime.date.today()).isoformat()), encoding="utf-8")
    except OSError as error:
        raise NewBuildRefused(f"cannot write {path}: {error.strerror or error}") from None
    return path


def _start_archive_if_new(archive: Path) -> None:
    """A folder that does not exist yet becomes an archive with a commented archive.yaml; an existing one is left as it is."""
    if archive.is_dir():
        return
    if archive.exists() or archive.is_symlink():
        raise NewBuildRefused(f"{archive} is not a folder")
    archive.mkdir(parents=True)
    (archive / SETTINGS_FILE).write_text(template_text("new-archive.yaml"), encoding="utf-8")


def refresh_schema(archive: Path) -> Path:
    """Write the record schema beside the builds, so the records' first line points at a schema this dossier knows."""
    from dossier.commands.schema import schema_text

    path = archive / SCHEMA_FILE
    if path.is_symlink() or (path.exists() and not path.is_file()):
        raise NewBuildRefused(f"{path} is not a plain file; dossier keeps the editor schema there")
    text = schema_text()
    if not path.exists() or path.read_text(encoding="utf-8") != text:
        path.write_text(text, encoding="utf-8")
    return path
