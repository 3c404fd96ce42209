"""What a sign-off is bound to: one digest of the record file and every file it attaches, and one digest of the
findings it judged.

The findings digest covers only what a reviewer decides on (each fail, check not made and marginal; every
finding that blocks power-up is one of them), and of each only what sets its verdict: code, subject, verdict,
whether it blocks power-up, the relation, and the figures of its values and limit. A figure counts in SI base
units at three significant figures (about as precise as the report prints it), so a change of display unit,
rounding noise or a reworded sentence leaves the digest alone; a measure that is a word counts only as 'a word'
(it is the record's own text, bound by the content digest, or the calc's wording). Labels, titles,
explanations, methods and sources are words and do not count.
"""

from __future__ import annotations

import hashlib
import math
from pathlib import Path

from dossier.findings import Finding, Verdict
from dossier.ledger import file_digest, record_digest

NEEDS_DECISION = (Verdict.FAIL, Verdict.NOT_ASSESSED, Verdict.MARGINAL)
FINDINGS_DIGEST_FORMAT = "dossier findings needing a decision, format 1"
WORD = "~"  # a measure that is a word
NONE = "-"  # no measure


def content_digest(record_path: Path, attachments) -> str:
    """'sha256:...' over the record (line endings folded) and each attachment by name, in name order."""
    lines = [f"record {record_digest(record_path)}"]
    lines += [f"file {a.path} {file_digest(record_path.parent / a.path)}" for a in sorted(attachments, key=lambda a: a.path)]
    return _digest(lines)


def needing_decision(findings) -> list[Finding]:
    """The findings a reviewer decides on, worst first: each fail, check not made and marginal."""
    return sorted((f for f in findings if f.verdict in NEEDS_DECISION), key=lambda f: (f.verdict.rank, f.code, f.subject))


def findings_digest(findings) -> str:
    """'sha256:...' over what sets the verdict of each finding that needs a decision, in a stable order."""
    return _digest([FINDINGS_DIGEST_FORMAT, *sorted(_verdict_line(f) for f in needing_decision(findings))])


def _verdict_line(finding: Finding) -> str:
    figures = " ".join(_figure(m.quantity) for m in finding.values) or NONE
    limit = _figure(finding.limit.quantity) if finding.limit is not None else NONE
    blocks = "blocks" if finding.blocks_power_up else "open"
    return "\t".join((finding.code, finding.subject, finding.verdict.value, blocks, finding.relation, figures, limit))


def _figure(quantity) -> str:
    if quantity is None:
        return NONE
    if hasattr(quantity, "dimensionality") and hasattr(quantity, "to_base_units"):
        dimensions = " ".join(f"{name}^{power:g}" for name, power in sorted(quantity.dimensionality.items()))
        number = _number(quantity.to_base_units().magnitude)
        return f"{number} {dimensions}" if dimensions else number
    if isinstance(quantity, (int, float)) and not isinstance(quantity, bool):
        return _number(quantity)
    return WORD


def _number(magnitude) -> str:
    try:
        value = float(magnitude)
    except (TypeError, ValueError):
        return WORD
    if value == 0 or math.isnan(value):
        return "0" if value == 0 else "nan"
    return f"{value:.3g}"


def _digest(lines: list[str]) -> str:
    return "sha256:" + hashlib.sha256("\n".join(lines).encode("utf-8")).hexdigest()
