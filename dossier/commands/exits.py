"""The exit status of every command, and the words for an error that ends one: one mapping for them all.

    0  done, and nothing failed
    1  a finding failed (check), a published revision changed (publish --check), or MkDocs failed (build)
    2  the input is refused: a file that is invalid or unreadable, a path that is missing, an output that
       cannot be replaced without losing something
    3  an installed plugin (a calc or a battery chemistry) cannot be used: the installation's fault, not the record's
"""

from __future__ import annotations

from enum import IntEnum

from dossier.commands.new import NewBuildRefused
from dossier.commands.signoff import SignoffRefused
from dossier.output.atomic import OutputRefused
from dossier.plugins import PluginError
from dossier.problems import InputError
from dossier.render.mkdocs_run import RenderError
from dossier.report.result import CheckResult
from dossier.standards.chemistries import ChemistryError
from dossier.wording import help_lines, problem_line


class Exit(IntEnum):
    DONE = 0
    FAILED = 1
    REFUSED = 2
    BROKEN_PLUGIN = 3


STATUS_BY_ERROR: tuple[tuple[tuple[type[BaseException], ...], Exit], ...] = (
    ((PluginError, ChemistryError), Exit.BROKEN_PLUGIN),
    ((InputError, OutputRefused, NewBuildRefused, SignoffRefused, OSError), Exit.REFUSED),
    ((RenderError,), Exit.FAILED),
)
HANDLED = tuple(kind for kinds, _ in STATUS_BY_ERROR for kind in kinds)


def status_of(error: BaseException) -> Exit:
    """The exit status for an error that ends a command; an error not listed here is a bug in dossier."""
    for kinds, status in STATUS_BY_ERROR:
        if isinstance(error, kinds):
            return status
    raise error


def message_of(error: BaseException, command: str) -> str:
    """What the user reads about an error that ends a command: located problem lines, or one line
    starting with the command ('dossier check: calc plugin ...')."""
    if isinstance(error, InputError):
        return "\n".join([problem_line(problem) for problem in error.problems] + help_lines(error.problems))
    if isinstance(error, RenderError):
        return f"{error.output}\n{command}: {error}".strip()
    if isinstance(error, OSError):
        return f"{command}: cannot write {error.filename or 'the output'}: {error.strerror or error}"
    return f"{command}: {error}"


def check_status(result: CheckResult) -> Exit:
    """`dossier check`: any problem in a record or beside it is 2, else any failing finding is 1."""
    if result.invalid:
        return Exit.REFUSED
    return Exit.FAILED if result.failed else Exit.DONE
