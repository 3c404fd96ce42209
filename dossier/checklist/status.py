"""The status shown for a revision: the record's own, advanced when its commissioning passed.

The record file is never rewritten. A revision whose record says 'design' or 'on-bench' and whose
commissioning record passed in full is shown as 'commissioned'. A later status in the record
('in-enclosure', 'in-service', 'retired') is kept, with the commissioning date beside it.
"""

from __future__ import annotations

import datetime
from dataclasses import dataclass

from dossier.record.identity import STATUS_TITLES

COMMISSIONED = "commissioned"
ORDER = ("design", "on-bench", COMMISSIONED, "in-enclosure", "in-service", "retired")
TITLES = {**STATUS_TITLES, COMMISSIONED: "Commissioned"}


@dataclass(frozen=True)
class ShownStatus:
    code: str
    record_code: str
    commissioned_on: datetime.date | None = None

    @property
    def advanced(self) -> bool:
        """True when the status shown is later than the one the record gives."""
        return self.code != self.record_code

    @property
    def title(self) -> str:
        """'Commissioned 2026-05-12', 'In its enclosure, commissioned 2026-05-12' or the record's own title."""
        if self.commissioned_on is None:
            return TITLES[self.code]
        if self.advanced:
            return f"{TITLES[self.code]} {self.commissioned_on.isoformat()}"
        return f"{TITLES[self.code]}, commissioned {self.commissioned_on.isoformat()}"


def effective_status(record_status: str, summary=None, date: datetime.date | None = None) -> ShownStatus:
    """summary is the commissioning Summary (None without a commissioning record); date its power-up date."""
    if summary is None or not summary.passed:
        return ShownStatus(record_status, record_status)
    code = COMMISSIONED if ORDER.index(record_status) < ORDER.index(COMMISSIONED) else record_status
    return ShownStatus(code, record_status, date)
