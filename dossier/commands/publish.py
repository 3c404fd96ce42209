"""`dossier publish ARCHIVE`: freeze revisions by recording their content hashes in published.yaml."""

from __future__ import annotations

import datetime
from pathlib import Path

import click

from dossier.reading.archive import build_dirs, revision_files
from dossier.ledger import LOCK_FILE, Target, amend, frozen_problems, history_problems, load_ledger, publish, save_ledger
from dossier.problems import InputError
from dossier.wording import problem_line

EXIT_DONE, EXIT_CHANGED, EXIT_REFUSED = 0, 1, 2


def run_publish(archive: Path, targets: list[str], amend_target: str | None, reason: str | None, check_only: bool, today: datetime.date, since: str = "") -> int:
    try:
        if check_only:
            return _check(archive, since)
        if amend_target is not None:
            return _amend(archive, Target.parse(amend_target), reason or "", today)
        return _publish(archive, [Target.parse(t) for t in targets], today)
    except InputError as error:
        for problem in error.problems:
            click.echo(problem_line(problem), err=True)
        click.echo(f"dossier publish: {LOCK_FILE} left as it was.", err=True)
        return EXIT_REFUSED


def _publish(archive: Path, targets: list[Target], today: datetime.date) -> int:
    ledger, published = publish(archive, targets, today)
    if not published:
        click.echo("nothing new to publish: every revision named is published already")
        return EXIT_DONE
    path = save_ledger(archive, ledger)
    for rev in published:
        click.echo(f"published {rev.build_id} rev {rev.letter}")
    click.echo(f"recorded in {path}; these revisions are now frozen")
    return EXIT_DONE


def _amend(archive: Path, target: Target, reason: str, today: datetime.date) -> int:
    if not target.letter or not reason.strip():
        raise click.UsageError("--amend needs BUILD:REV and --reason 'what was fixed'")
    path = save_ledger(archive, amend(archive, target, reason, today))
    click.echo(f"recorded the edit of {target.build_id} rev {target.letter} in {path}; the changes page will show it")
    return EXIT_DONE


def _check(archive: Path, since: str = "") -> int:
    ledger = load_ledger(archive)
    problems = frozen_problems(archive, ledger) + history_problems(ledger, since)
    for problem in problems:
        click.echo(problem_line(problem), err=True)
    waiting = [f"{rev.build_id} rev {rev.letter}" for build in build_dirs(archive) for rev in revision_files(build) if ledger.entry(rev.build_id, rev.letter) is None]
    published = sum(len(revisions) for revisions in ledger.builds.values())
    click.echo(f"{published} published revision(s), {len(problems)} changed since publication; not yet published: {', '.join(waiting) or 'none'}")
    click.echo(f"ledger head: {ledger.head}")
    return EXIT_CHANGED if problems else EXIT_DONE
