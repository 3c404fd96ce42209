"""The archive's own settings (archive.yaml at the archive's root): who publishes it and what it is."""

from __future__ import annotations

from pathlib import Path

from pydantic import BaseModel, ConfigDict, Field, model_validator

from dossier.reading.model_file import load_model_file
from dossier.record.standard import StandardChoice

SETTINGS_FILE = "archive.yaml"
SETTINGS_EXAMPLE = "club: ..., title: ..."


class TableInterpolation(BaseModel):
    """Interpolating between the rows of the insulation tables, on the club's own authority."""

    model_config = ConfigDict(extra="forbid", frozen=True)

    allowed: bool = Field(False, description="Interpolate linearly between table rows instead of taking the next row up.")
    clause: str = Field("", max_length=300, description="The clause or note of the standard that permits it, as the club reads it.")

    @model_validator(mode="after")
    def _clause_named(self):
        if self.allowed and not self.clause.strip():
            raise ValueError("name the clause that permits interpolation (clause: ...) to allow it")
        return self


class ArchiveSettings(BaseModel):
    model_config = ConfigDict(extra="forbid", frozen=True)

    club: str = Field("", max_length=200, description="Who keeps the archive, shown on every page.")
    title: str = Field("Build archive", min_length=1, max_length=200, description="The site's name.")
    description: str = Field("", max_length=2000, description="One paragraph of Markdown for the archive's front page.")
    table_interpolation: TableInterpolation = Field(
        default_factory=TableInterpolation,
        description="IEC 60664-1 tables: interpolate between rows (allowed: true, with the clause relied on); default: the next row up.",
    )
    standard: StandardChoice | None = Field(
        None,
        description="The product standard for every record that names none, e.g. {name: iec-60335-1, edition: 5}; default: IEC 60664-1 edition 3.",
    )


def load_settings(archive: Path) -> ArchiveSettings:
    """The settings of an archive; an archive without archive.yaml, or with an empty one, gets the defaults."""
    path = archive / SETTINGS_FILE
    if not path.is_file():
        return ArchiveSettings()
    return load_model_file(path, ArchiveSettings, SETTINGS_EXAMPLE, when_empty=ArchiveSettings()).model
