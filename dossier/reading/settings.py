"""The archive's own settings (archive.yaml at the archive's root): who publishes it and what it is."""

from __future__ import annotations

from pathlib import Path

from pydantic import BaseModel, ConfigDict, Field

from dossier.reading.model_file import load_model_file

SETTINGS_FILE = "archive.yaml"
SETTINGS_EXAMPLE = "club: ..., title: ..."


class ArchiveSettings(BaseModel):
    model_config = ConfigDict(extra="forbid", frozen=True)

    club: str = Field("", max_length=200, description="Who keeps the archive, shown on every page.")
    title: str = Field("Build archive", min_length=1, max_length=200, description="The site's name.")
    description: str = Field("", max_length=2000, description="One paragraph of Markdown for the archive's front page.")


def load_settings(archive: Path) -> ArchiveSettings:
    """The settings of an archive; an archive without archive.yaml, or with an empty one, gets the defaults."""
    path = archive / SETTINGS_FILE
    if not path.is_file():
        return ArchiveSettings()
    return load_model_file(path, ArchiveSettings, SETTINGS_EXAMPLE, when_empty=ArchiveSettings()).model
