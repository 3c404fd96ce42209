"""A revision's sign-offs judged against its findings now: stale, outdated or current, what is accepted, the state shown.

A sign-off is stale when the record or an attachment changed after it (reviewed_content), and outdated when the
record is as it was but the checks changed the findings it judged (reviewed_findings differs from the findings
now, e.g. after an upgrade of dossier or a new calc plugin). Neither decides; the newest sign-off that is not
stale sets the state, and when it is outdated the state is 'review outdated': nothing is cleared.

Rules, each a located problem in the sign-off file when broken (only for a sign-off that is current):
- a decision names a finding of this revision (code and subject);
- accepting a finding needs a reason; accepting one that blocks power-up also needs who takes responsibility;
- a sign-off that clears the revision has no decision 'fix' and leaves no finding that blocks power-up unaccepted.

A sign-off without reviewed_findings (written before the key existed) cannot say which findings it judged. It is
held to the rules for everything it names. A clearance over findings that block power-up and that it does not
name, with nothing else wrong, is judged outdated rather than refused: those findings come from checks added
since it was written (or from a list trimmed by hand), and either way the revision is not cleared.
"""

from __future__ import annotations

import enum
from dataclasses import dataclass

from dossier.findings import Finding
from dossier.problems import InputError, Problem
from dossier.signoff.binding import NEEDS_DECISION, findings_digest, needing_decision
from dossier.signoff.load import LoadedSignoff
from dossier.signoff.model import Choice, Clearance, Decision

__all__ = ["NEEDS_DECISION", "Judged", "Outdated", "ReviewState", "SignoffState", "judge_signoffs", "rule_problems"]


class ReviewState(str, enum.Enum):
    NOT_REVIEWED = "not-reviewed"
    STALE = "stale"
    REVIEW_OUTDATED = "review-outdated"
    CHANGES_REQUESTED = "changes-requested"
    CLEARED_FOR_ENCLOSURE = "cleared-for-enclosure"
    CLEARED_FOR_POWER_UP = "cleared-for-power-up"


@dataclass(frozen=True)
class Outdated:
    """What changed since a sign-off's review, as far as the sign-off itself shows it."""

    unnamed: tuple[Finding, ...]  # need a decision now (without the digest: block power-up) and the sign-off does not name them
    settled: tuple[Decision, ...] = ()  # the sign-off names them, and they no longer need a decision
    without_digest: bool = False  # the file has no reviewed_findings; judged by the blocking findings it does not name


@dataclass(frozen=True)
class Judged:
    """One sign-off as it stands against the revision now."""

    signoff: LoadedSignoff
    stale: bool
    outdated: Outdated | None = None  # set when the checks changed the findings since the review

    @property
    def entry(self):
        return self.signoff.entry

    def decision_for(self, finding: Finding) -> Decision | None:
        return next((d for d in self.entry.decisions if (d.code, d.subject) == finding.identity), None)

    def names(self, finding: Finding) -> bool:
        return self.decision_for(finding) is not None


@dataclass(frozen=True)
class SignoffState:
    state: ReviewState
    signoffs: tuple[Judged, ...]
    deciding: Judged | None  # the newest sign-off that is not stale, when its review is not outdated; it sets the state
    outdated: Judged | None = None  # the newest sign-off that is not stale, when the checks changed since its review

    def decided(self, finding: Finding) -> Decision | None:
        """The deciding sign-off's decision on a finding (accept or fix), if it made one. When the review is
        outdated its acceptances lapse, but a change it asked for still stands: a request to fix is never unsafe."""
        if self.deciding is not None:
            decision = self.deciding.decision_for(finding)
        elif self.outdated is not None:
            decision = self.outdated.decision_for(finding)
            decision = decision if decision is not None and decision.decision is Choice.FIX else None
        else:
            decision = None
        return decision if decision is not None and decision.decision is not None else None

    def accepted(self, finding: Finding) -> Decision | None:
        """The deciding sign-off's acceptance of a finding, if it accepted it."""
        decision = self.decided(finding)
        return decision if decision is not None and decision.decision is Choice.ACCEPT else None

    @property
    def cleared_for_power_up(self) -> bool:
        return self.state is ReviewState.CLEARED_FOR_POWER_UP


def judge_signoffs(signoffs: list[LoadedSignoff], findings: list[Finding], digest: str) -> SignoffState:
    """Raises InputError with every rule broken by a current sign-off; digest is the revision's content digest now."""
    now = findings_digest(findings)
    judged, problems = [], []
    for signoff in signoffs:
        one, broken = _judge_one(signoff, findings, digest, now)
        judged.append(one)
        problems += broken
    if problems:
        raise InputError(problems)
    fresh = sorted((j for j in judged if not j.stale), key=lambda j: (j.entry.date, j.signoff.path.name))
    newest = fresh[-1] if fresh else None
    if newest is not None and newest.outdated is not None:
        return SignoffState(ReviewState.REVIEW_OUTDATED, tuple(judged), None, newest)
    return SignoffState(_state(judged, newest), tuple(judged), newest)


def _judge_one(signoff: LoadedSignoff, findings: list[Finding], content: str, now: str) -> tuple[Judged, list[Problem]]:
    entry = signoff.entry
    if entry.reviewed_content != content:
        return Judged(signoff, stale=True), []
    if entry.reviewed_findings is None:
        return _judge_without_digest(Judged(signoff, stale=False), findings)
    if entry.reviewed_findings != now:
        return Judged(signoff, stale=False, outdated=_changed_since(signoff, findings)), []
    judged = Judged(signoff, stale=False)
    return judged, rule_problems(judged, findings)


def _judge_without_digest(judged: Judged, findings: list[Finding]) -> tuple[Judged, list[Problem]]:
    """Held to the rules for what it names; a clearance over blocking findings it does not name is outdated."""
    problems = rule_problems(judged, findings, unnamed_blockers=False)
    unnamed = [f for f in _open_blockers(judged, findings) if not judged.names(f)]
    if problems or not unnamed or judged.entry.clearance is Clearance.NOT_CLEARED:
        return judged, problems
    return Judged(judged.signoff, stale=False, outdated=Outdated(tuple(unnamed), without_digest=True)), []


def _changed_since(signoff: LoadedSignoff, findings: list[Finding]) -> Outdated:
    needing = needing_decision(findings)
    named = {(d.code, d.subject) for d in signoff.entry.decisions}
    still = {f.identity for f in needing}
    return Outdated(tuple(f for f in needing if f.identity not in named),
                    tuple(d for d in signoff.entry.decisions if (d.code, d.subject) not in still))


def _state(judged: list[Judged], deciding: Judged | None) -> ReviewState:
    if not judged:
        return ReviewState.NOT_REVIEWED
    if deciding is None:
        return ReviewState.STALE
    return {
        Clearance.NOT_CLEARED: ReviewState.CHANGES_REQUESTED,
        Clearance.ENCLOSURE: ReviewState.CLEARED_FOR_ENCLOSURE,
        Clearance.FIRST_POWER_UP: ReviewState.CLEARED_FOR_POWER_UP,
    }[deciding.entry.clearance]


def rule_problems(judged: Judged, findings: list[Finding], unnamed_blockers: bool = True) -> list[Problem]:
    """Every rule the sign-off breaks; unnamed_blockers=False leaves out blocking findings it does not name."""
    by_identity = {f.identity: f for f in findings}
    problems = []
    for index, decision in enumerate(judged.entry.decisions):
        problems += _decision_problems(judged, index, decision, by_identity.get((decision.code, decision.subject)))
    if judged.entry.clearance is not Clearance.NOT_CLEARED:
        open_blockers = [f for f in _open_blockers(judged, findings) if unnamed_blockers or judged.names(f)]
        problems += _clearance_problems(judged, open_blockers)
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


def _clearance_problems(judged: Judged, open_blockers: list[Finding]) -> list[Problem]:
    where = judged.signoff.locate(("clearance",))
    to_fix = [d for d in judged.entry.decisions if d.decision is Choice.FIX]
    problems = []
    if open_blockers:
        problems.append(Problem("cleared_over_blocker", where, key="clearance", expected="not-cleared while findings block power-up unaccepted",
                                found=f"{judged.entry.clearance.value}, with " + ", ".join(f"{f.code} ({f.subject})" for f in open_blockers) + " open"))
    if to_fix:
        problems.append(Problem("cleared_over_fix", where, key="clearance", expected="not-cleared while a decision says 'fix'",
                                found=f"{judged.entry.clearance.value}, with " + ", ".join(f"{d.code} ({d.subject})" for d in to_fix) + " to fix"))
    return problems


def _open_blockers(judged: Judged, findings: list[Finding]) -> list[Finding]:
    return [f for f in findings if f.blocks_power_up and not _accepted(judged, f)]


def _accepted(judged: Judged, finding: Finding) -> bool:
    decision = judged.decision_for(finding)
    return decision is not None and decision.decision is Choice.ACCEPT
