"""Who built what, which revision, and where it stands."""

from __future__ import annotations

import posixpath
from typing import Literal

from pydantic import Field, field_validator
from pydantic_core import PydanticCustomError

from dossier.record.fields import Date, Name, Section

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


# The only attachment types published: a browser shows or downloads them and runs nothing in them. HTML,
# XML (.xht, .xml), server-side includes (.shtml) and every type not named here are refused. An SVG is
# allowed as a drawing; the pages leave out any SVG that holds script, event handlers or outside links.
ATTACHMENT_TYPES = (".jpg", ".jpeg", ".png", ".gif", ".webp", ".svg", ".pdf", ".txt", ".csv", ".zip", ".odt", ".ods", ".odg", ".docx", ".xlsx")
_LINK_BREAKERS = "#?%"  # they would end or re-encode the link to the file


def relative_path_problem(path: str) -> str:
    """Why a path could leave the build folder, or '' when it cannot."""
    if path.startswith(("/", "\\")) or (len(path) > 1 and path[1] == ":"):
        return f"absolute path {path!r}"
    parts = path.replace("\\", "/").split("/")
    if ".." in parts:
        return f"'..' in {path!r}"
    if any(ord(ch) < 32 for ch in path):
        return f"control character in {path!r}"
    return ""


class Attachment(Section):
    """A photo, datasheet or other file kept beside the record, by path relative to the build folder."""

    path: str = Field(min_length=1, max_length=255, description="Path relative to the build's folder, with forward slashes; no absolute paths, no '..'.")
    kind: Literal["photo", "datasheet", "drawing", "other"] = Field("other", description="photo (shown on the page), datasheet, drawing or other (linked).")
    caption: str = Field("", description="One line shown under a photo or beside a link.")

    @field_validator("path")
    @classmethod
    def _stays_inside(cls, path: str) -> str:
        problem = relative_path_problem(path)
        if problem:
            raise PydanticCustomError("unsafe_path", "expected {expected}, found {found}", {"expected": "a path inside the build folder", "found": problem})
        return path

    @field_validator("path")
    @classmethod
    def _inert_type(cls, path: str) -> str:
        if posixpath.splitext(path.lower())[1] not in ATTACHMENT_TYPES:
            raise PydanticCustomError("attachment_type", "expected {expected}, found {found}", {"expected": "a file of an inert type: " + " ".join(ATTACHMENT_TYPES), "found": repr(path)})
        if any(ch in path for ch in _LINK_BREAKERS):
            raise PydanticCustomError("attachment_name", "expected {expected}, found {found}", {"expected": "a name without # ? or %", "found": repr(path)})
        return path


class Identity(Section):
    id: str = Field(pattern=BUILD_ID_PATTERN, description="Build id; the same as the build's folder name.")
    title: Name = Field(max_length=200, description="What the unit is, in a few words.")
    revision: str = Field(pattern=REVISION_PATTERN, description="Revision letter: A, B, ... (the file is rev-A.yaml).")
    date: Date = Field(description="Date of this revision, YYYY-MM-DD.")
    authors: list[Name] = Field(min_length=1, description="Who built or changed the unit in this revision.")
    status: Status = Field(description="design, on-bench, in-enclosure, in-service or retired.")
    summary: str = Field("", description="What the unit is, one paragraph of Markdown.")
    changes: str = Field("", description="What this revision changed, in Markdown.")
