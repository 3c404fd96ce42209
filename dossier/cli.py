"""The command line: a thin layer that hands each command to its module in dossier.commands."""

from __future__ import annotations

import sys
from pathlib import Path

import click

from dossier import __version__


class Refused(click.ClickException):
    """Bad input from the user: a message and exit status 2, never a traceback."""

    exit_code = 2


@click.group(context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(__version__, prog_name="dossier")
def main() -> None:
    """Checked, versioned build records for hand-built mains equipment.

    Mains voltages can kill: dossier's findings support a review and do not replace
    local codes, the standards or a licensed person's inspection.
    """


@main.command()
@click.argument("paths", nargs=-1, required=True, type=click.Path(path_type=Path))
@click.option("--format", "output_format", type=click.Choice(["text", "json"]), default="text", help="text for people, json for machines.")
@click.option("--all", "verbose", is_flag=True, help="Also list the findings that pass.")
def check(paths: tuple[Path, ...], output_format: str, verbose: bool) -> None:
    """Validate records and run every calc. Exit 0 clean, 1 a check failed, 2 a record is invalid."""
    from dossier.commands.check import render, run_check

    outcome = run_check(list(paths), verbose)
    click.echo(render(outcome, output_format == "json"))
    sys.exit(outcome.exit_code)


@main.command()
@click.option("-o", "--output", type=click.Path(path_type=Path), help="Write to this file instead of standard output.")
def schema(output: Path | None) -> None:
    """Print the record's JSON Schema."""
    from dossier.commands.schema import schema_text

    text = schema_text()
    if output is None:
        click.echo(text, nl=False)
    else:
        output.write_text(text, encoding="utf-8")


@main.command()
@click.argument("build_id")
@click.option("--archive", type=click.Path(path_type=Path, file_okay=False), default=Path("."), show_default=True, help="The archive folder.")
def new(build_id: str, archive: Path) -> None:
    """Start a new build: writes BUILD_ID/rev-A.yaml, a commented record to fill in."""
    from dossier.commands.new import NewBuildRefused, scaffold

    try:
        path = scaffold(archive, build_id)
    except NewBuildRefused as refused:
        raise Refused(str(refused)) from None
    click.echo(f"wrote {path}")
