"""`dossier publish ARCHIVE`: freeze revisions by recording their content hashes in published.yaml."""

from __future__ import annotations

import datetime
from pathlib import Path

import click

from dossier.reading.archive import build_dirs, revision_files
from dossier.ledger import LOCK_FILE, Target, amend, frozen_problems, history_problems, load_ledger, publish, save_ledger
from dossier.commands.exits import HANDLED, Exit, message_of, status_of
from dossier.wording import problem_line


def run_publish(archive: Path, targets: list[str], amend_target: str | None, reason: str | None, check_only: bool, today: datetime.date,
                even_if_blocked: bool = False, since: str = "") -> int:
    try:
        if check_only:
            return _check(archive, since)
        if amend_target is not None:
            return _amend(archive, Target.parse(amend_target), reason or "", today)
        return _publish(archive, [Target.parse(t) for t in targets], today, even_if_blocked)
    except HANDLED as error:
        click.echo(message_of(error, "dossier publish"), err=True)
        click.echo(f"dossier publish: {LOCK_FILE} left as it was.", err=True)
        return status_of(error)


def _publish(archive: Path, targets: list[Target], today: datetime.date, even_if_blocked: bool) -> int:
    ledger, published = publish(archive, targets, today)
    if not published:
        click.echo("nothing new to publish: every revision named is published already")
        return Exit.DONE
    blocked = _blocked(published)
    for rev, findings in blocked:
        click.echo(f"{rev.build_id} rev {rev.letter}: {len(findings)} finding(s) block power-up: "
                   + ", ".join(f"{f.code} ({f.subject})" for f in findings), err=True)
    if blocked and not even_if_blocked:
        click.echo("dossier publish: nothing published. Publishing freezes a revision as it is; to freeze these with their "
                   "failing findings (e.g. to keep a failed design on record), run again with --even-if-blocked.", err=True)
        return Exit.REFUSED
    path = save_ledger(archive, ledger)
    for rev in published:
        click.echo(f"published {rev.build_id} rev {rev.letter}")
    click.echo(f"recorded in {path}; these revisions are now frozen")
    return Exit.DONE


def _blocked(revisions) -> list[tuple]:
    """Each revision to be published whose findings block power-up, with those findings."""
    from dossier.plugins import load_calcs
    from dossier.reading.archive import load_revision
    from dossier.review import review

    calcs = load_calcs()
    found = []
    for rev in revisions:
        blocking = [f for f in review(load_revision(rev).record, calcs) if f.blocks_power_up]
        if blocking:
            found.append((rev, blocking))
    return found


def _amend(archive: Path, target: Target, reason: str, today: datetime.date) -> int:
    if not target.letter or not reason.strip():
        raise click.UsageError("--amend needs BUILD:REV and --reason 'what was fixed'")
    path = save_ledger(archive, amend(archive, target, reason, today))
    click.echo(f"recorded the edit of {target.build_id} rev {target.letter} in {path}; the changes page will show it")
    return Exit.DONE


def _check(archive: Path, since: str = "") -> int:
    ledger = load_ledger(archive)
    problems = frozen_problems(archive, ledger) + history_problems(ledger, since)
    for problem in problems:
        click.echo(problem_line(problem), err=True)
    waiting = [f"{rev.build_id} rev {rev.letter}" for build in build_dirs(archive) for rev in revision_files(build) if ledger.entry(rev.build_id, rev.letter) is None]
    published = sum(len(revisions) for revisions in ledger.builds.values())
    click.echo(f"{published} published revision(s), {len(problems)} changed since publication; not yet published: {', '.join(waiting) or 'none'}")
    click.echo(f"ledger head: {ledger.head}")
    return Exit.FAILED if problems else Exit.DONE
