"""Rendering the page tree with MkDocs and mkdocs-material, as a separate process.

Only MkDocs' command line and its standard configuration are used (no plugin of our own, no hooks),
so the generated tree stays a plain input that any MkDocs 1.x can build. SOURCE_DATE_EPOCH is set
to the newest record date so the rendered site carries no build-time timestamp.
"""

from __future__ import annotations

import datetime
import os
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
    result = subprocess.run(command, capture_output=True, text=True, env=environment, cwd=config.parent)
    if result.returncode != 0:
        raise RenderError((result.stdout + result.stderr).strip())
