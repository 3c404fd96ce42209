"""The checklist for one revision: the caution, what blocks a power-up, and the items in the order they are done."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.rails import HAZARDS
from dossier.calcs.rails.hazards import NAME as RAILS
from dossier.caution import POWER_UP_CAUTION, beyond_mains_caution, rail_label
from dossier.checklist import barriers, general, output_items, rails, soak, station
from dossier.checklist.fuse import fuse_item
from dossier.checklist.items import Item, Phase
from dossier.findings import Finding
from dossier.review import Review
from dossier.wording import signoff_line


@dataclass(frozen=True)
class Checklist:
    build: str
    revision: str
    title: str
    caution: str
    blockers: tuple[Finding, ...]
    items: tuple[Item, ...]
    signoff: str = ""  # the sign-off state in words, e.g. 'cleared for first power-up, by ... on ...'
    cleared: bool = False  # a current sign-off cleared the revision for first power-up
    ledger_head: str = ""  # the publication ledger's head when the sheet was made, to check the history against later

    @property
    def blocked(self) -> bool:
        """A failing finding means: do not power up."""
        return bool(self.blockers)

    def item(self, key: str) -> Item | None:
        return next((item for item in self.items if item.key == key), None)

    def in_phase(self, phase: Phase) -> list[Item]:
        return [item for item in self.items if item.phase is phase]

    @property
    def phases(self) -> list[Phase]:
        return [phase for phase in Phase if self.in_phase(phase)]


def build_checklist(record, review: Review, signoff=None, ledger_head: str = "") -> Checklist:
    """The checklist from the record, its review and its sign-off state (dossier.signoff.state.SignoffState);
    made once per revision and handed to every page and sheet."""
    return Checklist(
        signoff=signoff_line(signoff) if signoff is not None else "",
        cleared=signoff is not None and signoff.cleared_for_power_up,
        ledger_head=ledger_head,
        build=record.id,
        revision=record.revision,
        title=record.title,
        caution=_caution(review),
        blockers=tuple(f for f in review.findings if f.blocks_power_up),
        items=tuple(_ordered(all_items(record, review))),
    )


def all_items(record, review: Review) -> list[Item]:
    """Every item, listed in the order they are done within a phase."""
    findings = review.findings
    return [
        general.visual_inspection(record),
        *fuse_item(record, review),
        *general.earth_continuity(record),
        general.insulation_to_metal(record),
        general.insulation_to_output(record),
        *barriers.distance_items(record, findings),
        *barriers.hipot_items(record, findings),
        *barriers.tab_isolation_items(record),
        general.one_hand(),
        general.isolated_supply(),
        *output_items.minimum_load(record),
        general.series_lamp(record),
        *general.protective_conductor_current(record),
        *station.station_items(record),
        general.bleed_capacitors(record),
        *rails.rail_items(record, review),
        *output_items.setting_items(record),
        *output_items.battery_lead_items(record),
        *soak.soak_items(record, findings, hazardous_rails=bool(review.product(RAILS, HAZARDS))),
    ]


def _caution(review: Review) -> str:
    hazards = review.product(RAILS, HAZARDS) or ()
    return " ".join(part for part in (POWER_UP_CAUTION, beyond_mains_caution([rail_label(h) for h in hazards])) if part)


def _ordered(items: list[Item]) -> list[Item]:
    order = list(Phase)
    return sorted(items, key=lambda item: order.index(item.phase))
