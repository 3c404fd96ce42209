"""The sign-off state of one loaded revision: its sign-off files, judged against its findings and its content now."""

from __future__ import annotations

from dossier.signoff.binding import content_digest
from dossier.signoff.load import load_signoffs
from dossier.signoff.state import SignoffState, judge_signoffs


def revision_signoffs(loaded, findings) -> SignoffState:
    """Raises InputError with every problem of every sign-off file of the revision."""
    record = loaded.record
    signoffs = load_signoffs(loaded.path.parent, record.id, record.revision)
    return judge_signoffs(signoffs, findings, content_digest(loaded.path, record.attachments))
