"""Each checklist item against its commissioning result: measured versus expected."""

from __future__ import annotations

import enum
from dataclasses import dataclass

from dossier.checklist.items import Item


class Judgement(str, enum.Enum):
    IN_RANGE = "in range"
    OUT_OF_RANGE = "out of range"
    NO_RANGE = "recorded, no range to check"
    DONE = "done"
    SKIPPED = "not done"
    MISSING = "not recorded"

    @property
    def passed(self) -> bool:
        return self in (Judgement.IN_RANGE, Judgement.NO_RANGE, Judgement.DONE)


@dataclass(frozen=True)
class ItemOutcome:
    item: Item
    judgement: Judgement
    value: object = None
    note: str = ""
    date: object = None


def judge_item(item: Item, result, value) -> Judgement:
    """value is the parsed quantity (None when not measured); result the file's entry (None when absent)."""
    if result is None:
        return Judgement.MISSING
    if not result.done:
        return Judgement.SKIPPED
    if not item.measured:
        return Judgement.DONE
    if value is None:
        return Judgement.MISSING
    if item.expected is None:
        return Judgement.NO_RANGE
    return Judgement.IN_RANGE if item.expected.contains(value) else Judgement.OUT_OF_RANGE


def outcomes(checklist, commissioning) -> list[ItemOutcome]:
    results = commissioning.entry.results
    return [_outcome(item, results.get(item.key), commissioning.values.get(item.key)) for item in checklist.items]


def _outcome(item: Item, result, value) -> ItemOutcome:
    judgement = judge_item(item, result, value)
    if result is None:
        return ItemOutcome(item, judgement)
    return ItemOutcome(item, judgement, value, result.note, result.date)


@dataclass(frozen=True)
class Summary:
    """How the commissioning went as a whole."""

    out_of_range: tuple[ItemOutcome, ...]
    incomplete: tuple[ItemOutcome, ...]
    blocked: bool

    @property
    def passed(self) -> bool:
        return not (self.out_of_range or self.incomplete or self.blocked)


def summarise(checklist, item_outcomes: list[ItemOutcome]) -> Summary:
    return Summary(
        out_of_range=tuple(o for o in item_outcomes if o.judgement is Judgement.OUT_OF_RANGE),
        incomplete=tuple(o for o in item_outcomes if o.judgement in (Judgement.MISSING, Judgement.SKIPPED)),
        blocked=checklist.blocked,
    )
