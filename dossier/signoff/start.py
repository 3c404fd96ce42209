"""Starting a sign-off file from a revision's findings: every finding that needs a decision is listed, open."""

from __future__ import annotations

import datetime
from pathlib import Path

from dossier.markup import yaml_string
from dossier.reading.archive import signoff_paths
from dossier.signoff.binding import content_digest, findings_digest, needing_decision

HEADER = """\
# Sign-off of {build} rev {revision}: the human review of this revision's findings.
# For each finding below, set decision to accept (give the reason, and for a finding that blocks power-up
# who takes responsibility) or fix (say what must change). Then set clearance:
#   not-cleared      changes are needed, or the review is not finished
#   enclosure        cleared to go into its enclosure
#   first-power-up   cleared for first power-up (nothing may block power-up unaccepted)
# reviewed_content binds this file to the record and attachments as they are now: after any edit the
# sign-off is stale and its clearance no longer counts. Write a new sign-off for the new content.
# reviewed_findings binds it to the findings listed below: when newer checks change them, the review is
# outdated and nothing is cleared until a new sign-off reviews them. Do not edit either digest.
# CAUTION: mains voltages can kill. This review supports, and does not replace, local codes, the
# standards and inspection by a licensed, qualified person.
"""


def next_signoff_path(build_dir: Path, revision: str) -> Path:
    """signoff-C.yaml, then signoff-C-2.yaml, signoff-C-3.yaml, ...: never a name already taken."""
    taken = {p.name for p in signoff_paths(build_dir, revision)}
    for number in range(1, 1000):
        name = f"signoff-{revision}.yaml" if number == 1 else f"signoff-{revision}-{number}.yaml"
        if name not in taken and not (build_dir / name).exists() and not (build_dir / name).is_symlink():
            return build_dir / name
    raise FileExistsError(f"{build_dir}: no free sign-off name for rev {revision}")


def signoff_text(loaded, findings, reviewer: str, today: datetime.date) -> str:
    record = loaded.record
    lines = [HEADER.format(build=record.id, revision=record.revision).rstrip("\n"), ""]
    lines += [f"build: {record.id}", f"revision: {record.revision}", f"reviewer: {yaml_string(reviewer)}", 'qualification: ""',
              f"date: {today.isoformat()}", f"reviewed_content: {content_digest(loaded.path, record.attachments)}",
              f"reviewed_findings: {findings_digest(findings)}"]
    needing = needing_decision(findings)
    lines.append("decisions:" if needing else "decisions: []")
    for finding in needing:
        lines += [f"  # {finding.verdict.value}: {finding.title}" + ("; blocks power-up" if finding.blocks_power_up else ""),
                  f"  - code: {yaml_string(finding.code)}", f"    subject: {yaml_string(finding.subject)}",
                  "    decision:           # accept | fix", '    reason: ""', '    responsible: ""']
    lines += ["clearance: not-cleared", 'notes: ""', ""]
    return "\n".join(lines)
