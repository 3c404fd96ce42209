"""The command line: a thin layer that hands each command to its module in dossier.commands."""

from __future__ import annotations

import os
import sys
from pathlib import Path

import click

from dossier import __version__


class Commands(click.Group):
    """Every command ends the same way on an error it does not handle itself: the words and the exit status
    from dossier.commands.exits, never a traceback."""

    def invoke(self, ctx: click.Context):
        from dossier.commands.exits import HANDLED, message_of, status_of

        try:
            return super().invoke(ctx)
        except HANDLED as error:
            click.echo(message_of(error, f"dossier {ctx.invoked_subcommand}"), err=True)
            ctx.exit(status_of(error))


@click.group(cls=Commands, context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(__version__, prog_name="dossier")
def main() -> None:
    """Checked, versioned build records for hand-built mains equipment.

    Mains voltages can kill: dossier's findings support a review and do not replace
    local codes, the standards or a licensed person's inspection.
    """


def _print(text: str, nl: bool = True) -> None:
    """Standard output that cannot be written (a full device, a closed pipe) is a message and exit 2."""
    try:
        click.echo(text, nl=nl)
        sys.stdout.flush()
    except OSError as error:
        os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())  # nothing more to lose at exit
        click.echo(f"dossier: cannot write the output: {error.strerror or error}", err=True)
        from dossier.commands.exits import Exit

        sys.exit(Exit.REFUSED)


@main.command()
@click.argument("paths", nargs=-1, required=True, type=click.Path(path_type=Path))
@click.option("--format", "output_format", type=click.Choice(["text", "json"]), default="text", help="text for people, json for machines.")
@click.option("--all", "verbose", is_flag=True, help="Also list the findings that pass.")
def check(paths: tuple[Path, ...], output_format: str, verbose: bool) -> None:
    """Validate records and run every calc.

    Exit status: 0 clean, 1 a check failed, 2 a record or the commissioning file beside it is invalid or
    unreadable, 3 a calc or chemistry plugin is broken.
    """
    from dossier.commands.check import run_check
    from dossier.commands.exits import check_status
    from dossier.report.json_report import check_json
    from dossier.report.text_report import check_text

    result = run_check(list(paths))
    status = check_status(result)
    _print(check_json(result, int(status)) if output_format == "json" else check_text(result, verbose))
    sys.exit(status)


@main.command()
@click.option("-o", "--output", type=click.Path(path_type=Path), help="Write to this file instead of standard output.")
@click.option("--of", "kind", type=click.Choice(["record", "signoff"]), default="record", show_default=True, help="Which file's schema: a record or a sign-off.")
def schema(output: Path | None, kind: str) -> None:
    """Print the JSON Schema of a record (or of a sign-off file)."""
    from dossier.commands.schema import schema_text

    text = schema_text(kind)
    if output is None:
        _print(text, nl=False)
        return
    output.write_text(text, encoding="utf-8")  # a folder or a full device: OSError, a message and exit 2


@main.command()
@click.argument("build_id")
@click.option("--archive", type=click.Path(path_type=Path, file_okay=False), default=Path("."), show_default=True, help="The archive folder; started (with archive.yaml) if it does not exist yet.")
@click.option("--start", metavar="KIND", help="Begin from a worked, commented record of a common unit kind instead of the blank one: "
              "linear-supply, amplifier-supply or switch-mode-supply.")
def new(build_id: str, archive: Path, start: str | None) -> None:
    """Start a new build: writes BUILD_ID/rev-A.yaml, a commented record to fill in.

    With --start KIND the record is a starting point: a complete, valid example unit of that kind
    (linear-supply: a mains toroid, bridge, reservoir and series regulator; amplifier-supply: a
    toroid feeding split +/- rails for a class-AB amplifier; switch-mode-supply: a controller-driven
    half-bridge), with the working of every figure and what to change beside each key.
    Walk-through: docs/first-record.md.

    Also writes record.schema.json beside the builds (kept current on every run), which the record's
    first line names, so an editor with a YAML language server checks the record as it is typed.
    """
    from dossier.commands.new import scaffold

    path = scaffold(archive, build_id, start=start)
    click.echo(f"wrote {path}")


@main.command()
@click.argument("archive", type=click.Path(path_type=Path, file_okay=False))
@click.option("-o", "--output", type=click.Path(path_type=Path), help="Folder for the site; default: 'site' beside the archive folder. Replaced whole on success.")
@click.option("--pages-only", is_flag=True, help="Write only the Markdown page tree (e.g. into another MkDocs project's docs), not the rendered site.")
@click.option("--no-cache", is_flag=True, help="Draw every schematic, render every PDF and render the site again instead of reusing unchanged ones.")
@click.option("-j", "--jobs", type=click.IntRange(1, 64), help="Processes for reviewing and drawing builds; default: every core for archives of 8 builds or more.")
@click.option("--no-pdf", is_flag=True, help="Skip the checklist PDFs (quicker previews); the printable pages are still written.")
@click.option("-q", "--quiet", is_flag=True, help="No progress bar on long builds.")
def build(archive: Path, output: Path | None, pages_only: bool, no_cache: bool, no_pdf: bool, quiet: bool, jobs: int | None) -> None:
    """Build ARCHIVE into a static site that works offline, from a folder or any web server.

    Exit status: 0 built, 1 MkDocs failed (the previous site is untouched), 2 a record is invalid,
    a published revision was edited or the output cannot be replaced, 3 a calc plugin is broken.
    """
    from dossier.commands.build import run_build

    sys.exit(run_build(archive, output, pages_only, quiet, not no_cache, not no_pdf, jobs))


@main.command()
@click.argument("archive", type=click.Path(path_type=Path, file_okay=False, exists=True))
@click.option("--host", default="127.0.0.1", show_default=True, help="Address to listen on.")
@click.option("--port", default=8000, show_default=True, type=click.IntRange(0, 65535), help="Port to listen on.")
def serve(archive: Path, host: str, port: int) -> None:
    """Preview ARCHIVE's site and rebuild it whenever a record or template changes."""
    from dossier.commands.serve import run_serve

    sys.exit(run_serve(archive, host, port))


@main.command()
@click.argument("old", type=click.Path(path_type=Path))
@click.argument("new", type=click.Path(path_type=Path))
def diff(old: Path, new: Path) -> None:
    """Show what changed from record OLD to record NEW: values (old -> new, with units) and findings."""
    from dossier.commands.diff import diff_text

    click.echo(diff_text(old, new))


@main.command()
@click.argument("archive", type=click.Path(path_type=Path, file_okay=False, exists=True))
@click.argument("targets", nargs=-1)
@click.option("--amend", "amend_target", metavar="BUILD:REV", help="Accept an edit of a published revision (typo fixes only); recorded and shown on the site.")
@click.option("--reason", help="With --amend: what the edit fixed.")
@click.option("--check", "check_only", is_flag=True, help="Only check that published revisions are unchanged (exit 1 if one changed).")
@click.option("--even-if-blocked", is_flag=True, help="Publish revisions whose findings block power-up too (they are refused without it).")
@click.option("--since", metavar="HEAD", default="", help="With --check: a ledger head shown on an earlier site or printed checklist; exit 1 unless the chain still holds it.")
def publish(archive: Path, targets: tuple[str, ...], amend_target: str | None, reason: str | None, check_only: bool, even_if_blocked: bool,
            since: str) -> None:
    """Freeze revisions: record the content hash of every unpublished revision (or of TARGETS: BUILD or BUILD:REV).

    A published revision cannot be edited any more: `dossier build` refuses until the edit is undone
    or put into a new revision. A revision whose findings block power-up is published only with
    --even-if-blocked, so freezing a failing revision is always a choice.
    """
    import datetime

    from dossier.commands.publish import run_publish

    sys.exit(run_publish(archive, list(targets), amend_target, reason, check_only, datetime.date.today(), even_if_blocked, since))


@main.command("sign-off")
@click.argument("record", type=click.Path(path_type=Path, exists=True, dir_okay=False))
@click.option("--reviewer", required=True, help="Who reviews the revision.")
def sign_off(record: Path, reviewer: str) -> None:
    """Start a sign-off of RECORD (BUILD/rev-X.yaml): writes signoff-X.yaml beside it, never over another file.

    The file lists every finding that needs a decision and binds the review to the record and its
    attachments as they are now, and to those findings (when newer checks change them, the review is
    outdated and clears nothing); fill in the decisions and the clearance, then `dossier check` it.
    """
    import datetime

    from dossier.commands.signoff import start_signoff

    path = start_signoff(record, reviewer, datetime.date.today())
    click.echo(f"wrote {path}")
