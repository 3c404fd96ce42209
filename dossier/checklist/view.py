"""What the checklist templates show: the sheet, and with a commissioning record, the sheet as filled in."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.checklist.items import Item, Origin
from dossier.checklist.outcome import ItemOutcome, Judgement, Summary, outcomes, summarise
from dossier.checklist.sheet import Checklist
from dossier.checklist.status import ShownStatus, effective_status
from dossier.findings import Finding
from dossier.units import fmt
from dossier.wording import comparison_text, source_text

MARKS = {
    Judgement.IN_RANGE: "in range",
    Judgement.OUT_OF_RANGE: "OUT OF RANGE",
    Judgement.NO_RANGE: "recorded (no range)",
    Judgement.DONE: "done",
    Judgement.SKIPPED: "NOT DONE",
    Judgement.MISSING: "not recorded",
}


@dataclass(frozen=True)
class Blocker:
    code: str
    subject: str
    title: str
    comparison: str


@dataclass(frozen=True)
class ItemView:
    number: int
    item: Item
    sources: list[str]
    outcome: ItemOutcome | None = None

    @property
    def general(self) -> bool:
        return self.item.origin is Origin.GENERAL

    @property
    def value_text(self) -> str:
        if self.outcome is None or self.outcome.value is None:
            return ""
        return fmt(self.outcome.value.to(self.item.unit), digits=4)

    @property
    def mark(self) -> str:
        return MARKS[self.outcome.judgement] if self.outcome else ""

    @property
    def flagged(self) -> bool:
        return self.outcome is not None and not self.outcome.judgement.passed

    @property
    def ticked(self) -> bool:
        return self.outcome is not None and self.outcome.judgement.passed


@dataclass(frozen=True)
class PhaseView:
    title: str
    items: list[ItemView]


@dataclass(frozen=True)
class Filled:
    """The commissioning record's header and how it went."""

    date: object
    tested_by: str
    witness: str
    instruments: list[str]
    notes: str
    summary: Summary
    file_name: str


@dataclass(frozen=True)
class SheetView:
    build: str
    revision: str
    title: str
    caution: str
    blockers: list[Blocker]
    phases: list[PhaseView]
    status: ShownStatus
    filled: Filled | None = None
    commissioning_file: str = ""
    signoff: str = ""
    cleared: bool = False
    ledger_head: str = ""


def sheet_view(checklist: Checklist, record_status: str, commissioning=None) -> SheetView:
    item_outcomes = {o.item.key: o for o in outcomes(checklist, commissioning)} if commissioning else {}
    filled = _filled(checklist, commissioning, list(item_outcomes.values())) if commissioning else None
    return SheetView(
        build=checklist.build,
        revision=checklist.revision,
        title=checklist.title,
        caution=checklist.caution,
        blockers=[_blocker(f) for f in checklist.blockers],
        phases=_phases(checklist, item_outcomes),
        status=effective_status(record_status, filled.summary, filled.date) if filled else effective_status(record_status),
        filled=filled,
        commissioning_file=f"commissioning-{checklist.revision}.yaml",
        signoff=checklist.signoff or "not reviewed",
        cleared=checklist.cleared,
        ledger_head=checklist.ledger_head,
    )


def _blocker(finding: Finding) -> Blocker:
    return Blocker(finding.code, finding.subject, finding.title, comparison_text(finding))


def _phases(checklist: Checklist, item_outcomes: dict) -> list[PhaseView]:
    numbers = {item.key: n for n, item in enumerate(checklist.items, start=1)}
    return [
        PhaseView(phase.title, [_item_view(item, numbers[item.key], item_outcomes.get(item.key)) for item in checklist.in_phase(phase)])
        for phase in checklist.phases
    ]


def _item_view(item: Item, number: int, outcome: ItemOutcome | None) -> ItemView:
    return ItemView(number, item, [source_text(source) for source in item.sources], outcome)


def _filled(checklist: Checklist, commissioning, item_outcomes: list[ItemOutcome]) -> Filled:
    entry = commissioning.entry
    return Filled(
        date=entry.date,
        tested_by=entry.tested_by,
        witness=entry.witness,
        instruments=list(entry.instruments),
        notes=entry.notes,
        summary=summarise(checklist, item_outcomes),
        file_name=commissioning.path.name,
    )
