"""Who built what, which revision, and where it stands."""

from __future__ import annotations

import datetime
from typing import Literal

from pydantic import Field

from dossier.record.fields import Section

Status = Literal["design", "on-bench", "in-enclosure", "in-service", "retired"]
STATUS_TITLES = {
    "design": "Design",
    "on-bench": "On the bench",
    "in-enclosure": "In its enclosure",
    "in-service": "In service",
    "retired": "Retired",
}

BUILD_ID_PATTERN = r"^[a-z0-9][a-z0-9-]{0,62}$"
REVISION_PATTERN = r"^[A-Z]{1,2}$"


class Attachment(Section):
    """A photo, datasheet or other file kept beside the record, by path relative to the build folder."""

    path: str = Field(description="Path relative to the build's folder; must stay inside the archive.")
    kind: Literal["photo", "datasheet", "drawing", "other"] = "other"
    caption: str = ""


class Identity(Section):
    id: str = Field(pattern=BUILD_ID_PATTERN, description="Build id; the same as the build's folder name.")
    title: str = Field(min_length=1, max_length=200)
    revision: str = Field(pattern=REVISION_PATTERN, description="Revision letter: A, B, ... (the file is rev-A.yaml).")
    date: datetime.date = Field(description="Date of this revision, YYYY-MM-DD.")
    authors: list[str] = Field(min_length=1, description="Who built or changed the unit in this revision.")
    status: Status = Field(description="design, on-bench, in-enclosure, in-service or retired.")
    summary: str = Field("", description="What the unit is, one paragraph of Markdown.")
    changes: str = Field("", description="What this revision changed, in Markdown.")
