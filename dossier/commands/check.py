"""`dossier check`: validate records and run every calc."""

from __future__ import annotations

import json
import math
from dataclasses import dataclass, field
from pathlib import Path

from dossier.reading.archive import expand, load_revision
from dossier.caution import MAINS_CAUTION
from dossier.findings import Finding, Verdict
from dossier.plugins import load_calcs
from dossier.problems import InputError
from dossier.report import json_report, text_report
from dossier.review import review

EXIT_CLEAN, EXIT_FAILED, EXIT_INVALID = 0, 1, 2


@dataclass
class Outcome:
    blocks: list[str] = field(default_factory=list)
    json: list[dict] = field(default_factory=list)
    failed: bool = False
    invalid: bool = False

    @property
    def exit_code(self) -> int:
        return EXIT_INVALID if self.invalid else EXIT_FAILED if self.failed else EXIT_CLEAN


def run_check(paths: list[Path], verbose: bool = False) -> Outcome:
    outcome = Outcome()
    try:
        revisions = expand(paths)
    except InputError as error:
        outcome.invalid = True
        outcome.blocks.extend(text_report.problem_block(error.problems))
        outcome.json.append(json_report.invalid_json(str(paths[0]), error.problems))
        return outcome
    calcs = load_calcs()
    for rev in revisions:
        _check_one(rev, calcs, outcome, verbose)
    return outcome


def _check_one(rev, calcs, outcome: Outcome, verbose: bool) -> None:
    try:
        loaded = load_revision(rev)
    except InputError as error:
        outcome.invalid = True
        outcome.blocks.extend(text_report.problem_block(error.problems))
        outcome.json.append(json_report.invalid_json(str(rev.path), error.problems))
        return
    findings = review(loaded.record, calcs)
    outcome.failed |= any(f.verdict is Verdict.FAIL for f in findings)
    title = f"{rev.path}  ({loaded.record.id} rev {loaded.record.revision}: {loaded.record.title})"
    outcome.blocks.extend(text_report.record_block(title, findings, loaded.locate, verbose))
    outcome.json.append(json_report.record_json(str(rev.path), findings, loaded.locate))
    _check_commissioning(loaded, findings, outcome)


def _check_commissioning(loaded, findings, outcome: Outcome) -> None:
    """A commissioning file beside the record is validated like the record itself."""
    from dossier.checklist.overview import commissioning_state, load_for_revision

    try:
        commissioning = load_for_revision(loaded, findings)
    except InputError as error:
        outcome.invalid = True
        outcome.blocks.extend(text_report.problem_block(error.problems))
        return
    if commissioning is not None:
        outcome.blocks.append("  commissioning: " + commissioning_state(loaded, findings, commissioning).overview_text())


def render(outcome: Outcome, as_json: bool) -> str:
    if as_json:
        body = {"shape": json_report.SHAPE_VERSION, "exit_code": outcome.exit_code, "records": outcome.json, "caution": MAINS_CAUTION}
        return json.dumps(finite(body), indent=2, ensure_ascii=False, allow_nan=False)
    return "\n".join(outcome.blocks + ["", f"Caution: {MAINS_CAUTION}"])


def finite(data):
    """The report with every infinite or NaN number as null: JSON has no such numbers, and a value that
    overflowed is no value (the record's ranges refuse the inputs that would overflow)."""
    if isinstance(data, float) and not math.isfinite(data):
        return None
    if isinstance(data, dict):
        return {key: finite(value) for key, value in data.items()}
    if isinstance(data, (list, tuple)):
        return [finite(item) for item in data]
    return data


def has_failures(findings: list[Finding]) -> bool:
    return any(f.verdict is Verdict.FAIL for f in findings)
