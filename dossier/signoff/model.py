"""The sign-off file's format: the reviewer, what was reviewed, decisions on findings, and the clearance given."""

from __future__ import annotations

import datetime
import enum

from pydantic import Field

from dossier.record.fields import Section
from dossier.record.identity import BUILD_ID_PATTERN, REVISION_PATTERN

DIGEST_PATTERN = r"^sha256:[0-9a-f]{64}$"


class Clearance(str, enum.Enum):
    NOT_CLEARED = "not-cleared"
    ENCLOSURE = "enclosure"
    FIRST_POWER_UP = "first-power-up"


class Choice(str, enum.Enum):
    ACCEPT = "accept"
    FIX = "fix"


class Decision(Section):
    """What the reviewer decided about one finding that needs a decision (a fail, a check not made, a marginal)."""

    code: str = Field(min_length=1, description="The finding's code, e.g. ISO-CREEPAGE.")
    subject: str = Field(min_length=1, description="The finding's subject, e.g. the barrier's name or the part's designator.")
    decision: Choice | None = Field(None, description="accept (with a reason) or fix (the revision must change); left empty, the finding is still open.")
    reason: str = Field("", description="Why it is accepted, or what must change.")
    responsible: str = Field("", description="Who takes responsibility for accepting a finding that blocks power-up (required then).")


class SignoffFile(Section):
    """signoff-<REV>.yaml (or signoff-<REV>-<anything>.yaml) beside rev-<REV>.yaml in the build's folder."""

    build: str = Field(pattern=BUILD_ID_PATTERN, description="The build id, as in the record.")
    revision: str = Field(pattern=REVISION_PATTERN, description="The revision reviewed.")
    reviewer: str = Field(min_length=1, description="Who reviewed the revision.")
    qualification: str = Field("", description="The reviewer's standing for this review, e.g. 'qualified electrician'.")
    date: datetime.date = Field(description="Date of the review, YYYY-MM-DD.")
    reviewed_content: str = Field(pattern=DIGEST_PATTERN, description="Digest of the record and its attachments as reviewed; written by `dossier sign-off`.")
    reviewed_findings: str | None = Field(
        None, pattern=DIGEST_PATTERN,
        description="Digest of the findings that needed a decision when the review began (code, subject, verdict and the figures that set it); "
                    "written by `dossier sign-off`. When a newer dossier's checks change them, the sign-off no longer decides and the revision needs a re-review.")
    decisions: list[Decision] = Field(default_factory=list, description="A decision for each finding that needs one.")
    clearance: Clearance = Field(description="not-cleared, enclosure (cleared to go into its enclosure) or first-power-up (cleared for first power-up).")
    notes: str = Field("", description="Free notes in Markdown.")
