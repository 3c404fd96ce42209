"""What a revision's overview says about its commissioning: who powered it up, when, how it went, its status."""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from dossier.checklist.load import Commissioning, commissioning_path, load_commissioning
from dossier.checklist.outcome import Summary, outcomes, summarise
from dossier.checklist.sheet import Checklist
from dossier.checklist.status import ShownStatus, effective_status
from dossier import markup


@dataclass(frozen=True)
class CommissioningState:
    commissioning: Commissioning | None
    summary: Summary | None
    status: ShownStatus

    def overview_markdown(self) -> str:
        """One paragraph for the revision's overview page; '' when it has no commissioning record."""
        return self._sentence(lambda value: f"**{markup.text(value)}**")

    def overview_text(self) -> str:
        """The same paragraph as plain text, for the terminal."""
        return self._sentence(str)

    def _sentence(self, show) -> str:
        if self.commissioning is None:
            return ""
        entry = self.commissioning.entry
        line = f"Powered up on {show(entry.date.isoformat())} by {show(entry.tested_by)}, witnessed by {show(entry.witness)}."
        return f"{line} {self._result_text()} Status shown: {show(self.status.title)}."

    def _result_text(self) -> str:
        summary = self.summary
        if summary.passed:
            return "Every checklist item was done and in range."
        parts = []
        if summary.out_of_range:
            parts.append(f"{len(summary.out_of_range)} value{'s' if len(summary.out_of_range) != 1 else ''} out of range")
        if summary.incomplete:
            parts.append(f"{len(summary.incomplete)} item{'s' if len(summary.incomplete) != 1 else ''} not done or not recorded")
        if summary.blocked:
            parts.append("failing findings block the revision")
        return "Not passed: " + "; ".join(parts) + "."


def load_for_revision(loaded, checklist: Checklist) -> Commissioning | None:
    """The commissioning file beside a loaded record, validated against its checklist; None when there is none."""
    path = commissioning_path(loaded.path.parent, loaded.record.revision)
    if path is None:
        return None
    shown = str(Path(loaded.sources.file).parent / path.name)  # named the way the record itself is shown
    return load_commissioning(path, checklist, shown_as=shown)


def commissioning_state(loaded, checklist: Checklist, commissioning: Commissioning | None = None) -> CommissioningState:
    if commissioning is None:
        return CommissioningState(None, None, effective_status(loaded.record.status))
    summary = summarise(checklist, outcomes(checklist, commissioning))
    return CommissioningState(commissioning, summary, effective_status(loaded.record.status, summary, commissioning.entry.date))
