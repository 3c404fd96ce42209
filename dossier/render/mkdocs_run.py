"""Rendering the page tree with MkDocs and mkdocs-material, as a separate process.

Only MkDocs' command line and its standard configuration are used (no plugin of our own, no hooks),
so the generated tree stays a plain input that any MkDocs 1.x can build. SOURCE_DATE_EPOCH is set
to the newest record date so the rendered site carries no build-time timestamp.
"""

from __future__ import annotations

import ctypes
import datetime
import os
import re
import signal
import subprocess
import sys
from pathlib import Path

from dossier.pages import layout
from dossier.pages.env import render
from dossier.pages.tree import StatusLink, TreeSummary
from dossier.reading.settings import ArchiveSettings

CONFIG_NAME = "mkdocs.yml"


class RenderError(Exception):
    """MkDocs could not build the site (or warned, which a strict build counts as failing)."""

    def __init__(self, output: str):
        super().__init__("MkDocs could not build the site")
        self.output = output


def config_text(settings: ArchiveSettings, statuses: list[StatusLink], docs_dir: str, site_dir: str) -> str:
    return render(
        "mkdocs.yml.j2",
        settings=settings,
        docs_dir=docs_dir,
        site_dir=site_dir,
        shim=layout.WORKER_SHIM,
        stylesheet=layout.STYLESHEET,
        statuses=statuses,
    )


def write_config(settings: ArchiveSettings, tree: TreeSummary, work: Path, docs_dir: str, site_dir: str) -> Path:
    path = work / CONFIG_NAME
    path.write_text(config_text(settings, tree.statuses, docs_dir, site_dir), encoding="utf-8", newline="\n")
    return path


def source_epoch(newest: datetime.date | None) -> int:
    """Midnight UTC of the newest record date: the only date the rendered site may carry."""
    day = newest or datetime.date(1970, 1, 1)
    return int(datetime.datetime.combine(day, datetime.time(), tzinfo=datetime.timezone.utc).timestamp())


def run_mkdocs(config: Path, epoch: int) -> None:
    config = config.resolve()  # mkdocs runs in the config's folder; a relative path would point elsewhere
    command = [sys.executable, "-m", "mkdocs", "build", "--strict", "--clean", "--config-file", str(config)]
    environment = dict(os.environ, SOURCE_DATE_EPOCH=str(epoch), NO_MKDOCS_2_WARNING="1")
    result = subprocess.run(command, capture_output=True, text=True, env=environment, cwd=config.parent, preexec_fn=die_with_parent)
    if result.returncode != 0:
        output = (result.stdout + result.stderr).strip()
        raise write_failure(output) or RenderError(output)


# MkDocs reports a failed write (a full disk, no permission) as a Python traceback ending in the OSError.
_OS_ERROR = re.compile(r"(?:OSError|PermissionError|FileNotFoundError|IsADirectoryError): \[Errno (?P<errno>\d+)\] (?P<reason>[^:\n]+)(?:: '(?P<path>[^'\n]*)')?")


def write_failure(output: str) -> OSError | None:
    """The system's error behind a failed MkDocs run, when it was one: a write problem, not a page problem."""
    match = None
    for match in _OS_ERROR.finditer(output):
        pass  # the last one is the cause
    if match is None:
        return None
    return OSError(int(match["errno"]), match["reason"].strip(), match["path"])


_PR_SET_PDEATHSIG = 1


def die_with_parent() -> None:
    """In the child, before MkDocs starts: on Linux, be killed when dossier dies (even by kill -9), so no
    renderer outlives the build it belonged to. Elsewhere the child is left as it is."""
    if not sys.platform.startswith("linux"):
        return
    try:
        libc = ctypes.CDLL(None, use_errno=True)
        libc.prctl(_PR_SET_PDEATHSIG, signal.SIGKILL, 0, 0, 0)
    except (OSError, AttributeError):
        return
    if os.getppid() == 1:  # the parent died before prctl took effect
        os._exit(1)
