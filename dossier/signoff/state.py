"""A revision's sign-offs judged against its findings now: stale or current, what is accepted, the state shown.

Rules, each a located problem in the sign-off file when broken (only for a sign-off that is not stale):
- a decision names a finding of this revision (code and subject);
- accepting a finding needs a reason; accepting one that blocks power-up also needs who takes responsibility;
- a sign-off that clears the revision has no decision 'fix' and leaves no finding that blocks power-up unaccepted.
"""

from __future__ import annotations

import enum
from dataclasses import dataclass

from dossier.findings import Finding, Verdict
from dossier.problems import InputError, Problem
from dossier.signoff.load import LoadedSignoff
from dossier.signoff.model import Choice, Clearance, Decision

NEEDS_DECISION = (Verdict.FAIL, Verdict.NOT_ASSESSED, Verdict.MARGINAL)


class ReviewState(str, enum.Enum):
    NOT_REVIEWED = "not-reviewed"
    STALE = "stale"
    CHANGES_REQUESTED = "changes-requested"
    CLEARED_FOR_ENCLOSURE = "cleared-for-enclosure"
    CLEARED_FOR_POWER_UP = "cleared-for-power-up"


@dataclass(frozen=True)
class Judged:
    """One sign-off as it stands against the revision now."""

    signoff: LoadedSignoff
    stale: bool

    @property
    def entry(self):
        return self.signoff.entry

    def decision_for(self, finding: Finding) -> Decision | None:
        return next((d for d in self.entry.decisions if (d.code, d.subject) == finding.identity), None)


@dataclass(frozen=True)
class SignoffState:
    state: ReviewState
    signoffs: tuple[Judged, ...]
    deciding: Judged | None  # the newest sign-off that is not stale; it sets the state

    def decided(self, finding: Finding) -> Decision | None:
        """The deciding sign-off's decision on a finding (accept or fix), if it made one."""
        decision = self.deciding.decision_for(finding) if self.deciding else None
        return decision if decision is not None and decision.decision is not None else None

    def accepted(self, finding: Finding) -> Decision | None:
        """The deciding sign-off's acceptance of a finding, if it accepted it."""
        decision = self.decided(finding)
        return decision if decision is not None and decision.decision is Choice.ACCEPT else None

    @property
    def cleared_for_power_up(self) -> bool:
        return self.state is ReviewState.CLEARED_FOR_POWER_UP


def judge_signoffs(signoffs: list[LoadedSignoff], findings: list[Finding], digest: str) -> SignoffState:
    judged = tuple(Judged(s, s.entry.reviewed_content != digest) for s in signoffs)
    problems = [p for j in judged if not j.stale for p in rule_problems(j, findings)]
    if problems:
        raise InputError(problems)
    current = sorted((j for j in judged if not j.stale), key=lambda j: (j.entry.date, j.signoff.path.name))
    deciding = current[-1] if current else None
    return SignoffState(_state(judged, deciding), judged, deciding)


def _state(judged: tuple[Judged, ...], deciding: Judged | None) -> ReviewState:
    if not judged:
        return ReviewState.NOT_REVIEWED
    if deciding is None:
        return ReviewState.STALE
    return {
        Clearance.NOT_CLEARED: ReviewState.CHANGES_REQUESTED,
        Clearance.ENCLOSURE: ReviewState.CLEARED_FOR_ENCLOSURE,
        Clearance.FIRST_POWER_UP: ReviewState.CLEARED_FOR_POWER_UP,
    }[deciding.entry.clearance]


def rule_problems(judged: Judged, findings: list[Finding]) -> list[Problem]:
    by_identity = {f.identity: f for f in findings}
    problems = []
    for index, decision in enumerate(judged.entry.decisions):
        problems += _decision_problems(judged, index, decision, by_identity.get((decision.code, decision.subject)))
    if judged.entry.clearance is not Clearance.NOT_CLEARED:
        problems += _clearance_problems(judged, findings)
    return problems


def _decision_problems(judged: Judged, index: int, decision: Decision, finding: Finding | None) -> list[Problem]:
    at = ("decisions", index)
    if finding is None:
        return [Problem("unknown_finding", judged.signoff.locate((*at, "code")), key=f"decisions[{index}].code",
                        expected="the code and subject of a finding of this revision (see `dossier check --all`)",
                        found=f"{decision.code} ({decision.subject})")]
    if decision.decision is not Choice.ACCEPT:
        return []
    problems = []
    if not decision.reason.strip():
        problems.append(Problem("accept_without_reason", judged.signoff.locate((*at, "decision")), key=f"decisions[{index}].reason",
                                expected="the reason the finding is accepted", found="no reason"))
    if finding.blocks_power_up and not decision.responsible.strip():
        problems.append(Problem("accept_without_responsible", judged.signoff.locate((*at, "decision")), key=f"decisions[{index}].responsible",
                                expected=f"who takes responsibility for accepting {finding.code}, which blocks power-up", found="nobody named"))
    return problems


def _clearance_problems(judged: Judged, findings: list[Finding]) -> list[Problem]:
    where = judged.signoff.locate(("clearance",))
    open_blockers = [f for f in findings if f.blocks_power_up and not _accepted(judged, f)]
    to_fix = [d for d in judged.entry.decisions if d.decision is Choice.FIX]
    problems = []
    if open_blockers:
        problems.append(Problem("cleared_over_blocker", where, key="clearance", expected="not-cleared while findings block power-up unaccepted",
                                found=f"{judged.entry.clearance.value}, with " + ", ".join(f"{f.code} ({f.subject})" for f in open_blockers) + " open"))
    if to_fix:
        problems.append(Problem("cleared_over_fix", where, key="clearance", expected="not-cleared while a decision says 'fix'",
                                found=f"{judged.entry.clearance.value}, with " + ", ".join(f"{d.code} ({d.subject})" for d in to_fix) + " to fix"))
    return problems


def _accepted(judged: Judged, finding: Finding) -> bool:
    decision = judged.decision_for(finding)
    return decision is not None and decision.decision is Choice.ACCEPT
