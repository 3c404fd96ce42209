"""What a sign-off is bound to: one digest of the record file and every file it attaches."""

from __future__ import annotations

import hashlib
from pathlib import Path

from dossier.ledger import file_digest, record_digest


def content_digest(record_path: Path, attachments) -> str:
    """'sha256:...' over the record (line endings folded) and each attachment by name, in name order."""
    lines = [f"record {record_digest(record_path)}"]
    lines += [f"file {a.path} {file_digest(record_path.parent / a.path)}" for a in sorted(attachments, key=lambda a: a.path)]
    return "sha256:" + hashlib.sha256("\n".join(lines).encode("utf-8")).hexdigest()
