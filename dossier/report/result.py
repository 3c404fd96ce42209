"""What `dossier check` found, as one result object that both the text and the JSON report are made from."""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Callable

from dossier.checklist.overview import CommissioningState
from dossier.findings import Finding
from dossier.problems import Location, Problem


@dataclass
class RecordCheck:
    """One record file checked: its findings if it could be read, and every problem in it or beside it."""

    file: str
    title: str = ""
    findings: list[Finding] | None = None  # None: the record itself could not be read
    locate: Callable[[tuple], Location] | None = None
    problems: list[Problem] = field(default_factory=list)  # the record's, or its commissioning file's
    commissioning: CommissioningState | None = None
    signoff: object = None  # dossier.signoff.state.SignoffState, when the sign-off files could be judged

    @property
    def valid(self) -> bool:
        return not self.problems

    @property
    def failed(self) -> bool:
        return any(finding.blocks_power_up for finding in self.findings or ())


@dataclass
class CheckResult:
    records: list[RecordCheck] = field(default_factory=list)

    @property
    def invalid(self) -> bool:
        return any(not record.valid for record in self.records)

    @property
    def failed(self) -> bool:
        return any(record.failed for record in self.records)
