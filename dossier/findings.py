"""Findings: what a calc concluded, as structured data (words are made in dossier.wording)."""

from __future__ import annotations

import enum
from dataclasses import dataclass, field


class Verdict(str, enum.Enum):
    """In order of severity. NOT_ASSESSED: the record does not give what the check needs."""

    FAIL = "fail"
    NOT_ASSESSED = "not-assessed"
    MARGINAL = "marginal"
    PASS = "pass"
    INFO = "info"

    @property
    def rank(self) -> int:
        return list(Verdict).index(self)


@dataclass(frozen=True)
class Source:
    """Where a limit or method comes from.

    kind is 'standard', 'handbook', 'application-note', 'reference' or 'common-practice'.
    A common-practice source names the usual practice and has no publisher.
    """

    title: str
    publisher: str = ""
    edition: str = ""
    clause: str = ""
    kind: str = "standard"

    @property
    def is_common_practice(self) -> bool:
        return self.kind == "common-practice"


def common_practice(what: str) -> Source:
    return Source(title=what, kind="common-practice")


@dataclass(frozen=True)
class Measure:
    """A named value with its unit, e.g. ('declared clearance', 3.2 mm)."""

    label: str
    quantity: object


@dataclass(frozen=True)
class Finding:
    code: str
    calc: str
    subject: str
    title: str
    verdict: Verdict
    values: tuple[Measure, ...] = ()
    limit: Measure | None = None
    relation: str = ">="
    method: str = ""
    explanation: str = ""
    keys: tuple[tuple, ...] = ()
    sources: tuple[Source, ...] = ()
    extra: tuple[Measure, ...] = field(default=())
    # guards against a hazard (a safety barrier, the mains protection): when not assessed, it blocks power-up
    guards_hazard: bool = False

    @property
    def blocks_power_up(self) -> bool:
        """A fail blocks power-up; so does a check guarding a hazard (a safety barrier, the mains protection) that was not made."""
        return self.verdict is Verdict.FAIL or (self.verdict is Verdict.NOT_ASSESSED and self.guards_hazard)

    @property
    def value(self) -> Measure | None:
        return self.values[0] if self.values else None

    @property
    def identity(self) -> tuple[str, str]:
        """What stays the same across revisions, so the same finding can be compared."""
        return (self.code, self.subject)


def worst(findings) -> Verdict | None:
    verdicts = [f.verdict for f in findings if f.verdict is not Verdict.INFO]
    return min(verdicts, key=lambda v: v.rank) if verdicts else None


def judge(value, limit, relation: str = ">=", marginal_within: float = 0.0) -> Verdict:
    """Pass when value meets the limit; marginal when it does, but by less than the given fraction."""
    meets = value >= limit if relation == ">=" else value <= limit
    if not meets:
        return Verdict.FAIL
    headroom = (value - limit) / limit if relation == ">=" else (limit - value) / limit
    return Verdict.MARGINAL if float(headroom.to("").magnitude) < marginal_within else Verdict.PASS


def counts(findings) -> dict[Verdict, int]:
    tally = {verdict: 0 for verdict in Verdict}
    for finding in findings:
        tally[finding.verdict] += 1
    return tally
