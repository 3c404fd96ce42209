"""Barriers as drawings label them: declared distances from the record, required ones and the
verdict from the isolation findings (codes ISO-CREEPAGE and ISO-CLEARANCE, subject = barrier name)."""

from __future__ import annotations

from dossier.calcs.isolation import CLEARANCE, CREEPAGE, NAME as ISOLATION
from dossier.drawing.views import BarrierView, quantity_text
from dossier.findings import Finding, worst

NOT_CHECKED = "not checked"
NOT_ASSESSED = "not assessed"


def barrier_view(barrier, findings) -> BarrierView:
    own = [f for f in findings if f.subject == barrier.name and f.calc == ISOLATION]
    return BarrierView(
        name=barrier.name,
        grade=barrier.grade,
        between=tuple(barrier.between),
        parts=tuple(barrier.parts),
        creepage=quantity_text(barrier.creepage),
        clearance=quantity_text(barrier.clearance),
        creepage_required=_required(own, CREEPAGE),
        clearance_required=_required(own, CLEARANCE),
        verdict=verdict_text(own),
    )


def _required(findings: list[Finding], code: str) -> str:
    for finding in findings:
        if finding.code == code and finding.limit is not None:
            return quantity_text(finding.limit.quantity)
    return ""


def verdict_text(findings: list[Finding]) -> str:
    """The worst verdict among a barrier's findings, in capitals; 'not checked' when there are none,
    'not assessed' when the calc could only report why it could not judge."""
    verdict = worst(findings)
    if verdict is None:
        return NOT_ASSESSED if findings else NOT_CHECKED
    return verdict.value.upper()


CHASSIS_WORDS = ("chassis", "enclosure", "earth", "case", "frame")


def crosses_chain(barrier) -> bool:
    """A barrier between the mains and the circuit's own output side, not the mains-to-chassis kind."""
    others = [side.lower() for side in barrier.between if side.lower() != "mains"]
    return bool(barrier.parts) or not any(word in side for side in others for word in CHASSIS_WORDS)
