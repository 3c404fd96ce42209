"""The commissioning record's file format: who powered the revision up, when, and what they measured."""

from __future__ import annotations

from pydantic import Field, ValidationInfo, field_validator
from pydantic_core import PydanticCustomError

from dossier.record.fields import Date, Name, Section
from dossier.record.identity import BUILD_ID_PATTERN, REVISION_PATTERN


class Result(Section):
    """The outcome of one checklist item, under the item's id."""

    done: bool = Field(True, description="Whether the item was done; false records that it was skipped.")
    value: str | int | float | None = Field(None, description="The measured value with its unit, e.g. '0.04 ohm' or '12 Mohm'.")
    date: Date | None = Field(None, description="When this item was done, if not on the record's date.")
    note: str = Field("", description="Anything worth keeping: the instrument's range, a retest, a remark.")


class CommissioningFile(Section):
    """commissioning-<REV>.yaml beside rev-<REV>.yaml in the build's folder."""

    build: str = Field(pattern=BUILD_ID_PATTERN, description="The build id, as in the record.")
    revision: str = Field(pattern=REVISION_PATTERN, description="The revision powered up.")
    date: Date = Field(description="Date of the first power-up, YYYY-MM-DD.")
    tested_by: Name = Field(description="Who did the checks and powered the unit up.")
    witness: Name = Field(description="A second person present throughout.")
    instruments: list[str] = Field(default_factory=list, description="Meters and testers used, e.g. 'insulation tester, 500 V range'.")
    results: dict[str, Result] = Field(default_factory=dict, description="Each item's result, under the id printed on the checklist.")
    notes: str = Field("", description="Free notes in Markdown.")

    @field_validator("witness")
    @classmethod
    def _second_person(cls, witness: str, info: ValidationInfo) -> str:
        if witness.strip().casefold() == str(info.data.get("tested_by", "")).strip().casefold():
            raise PydanticCustomError("same_person", "expected {expected}, found {found}", {"expected": "a second person, not the tester", "found": repr(witness)})
        return witness
