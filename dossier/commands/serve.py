"""`dossier serve ARCHIVE`: preview the site on this machine and rebuild it when a record or template changes.

A rebuild takes the path `dossier build` takes: unchanged builds come from the build cache and only the pages
whose Markdown changed are rendered again; each rebuild says which and how long it took. The preview leaves
out the checklist PDFs (they take a second or more each; `dossier build` writes them).

The site is built into a temporary folder outside the archive and the templates, and the watcher
ignores hidden folders and caches, so a rebuild never triggers another one. A failed rebuild keeps
the last good site on show and prints why.
"""

from __future__ import annotations

import functools
import http.server
import os
import tempfile
import threading
import time
from dataclasses import dataclass
from pathlib import Path
from typing import Callable

import click

from dossier.templates import templates_dir

IGNORED_PARTS = ("__pycache__",)
POLL_SECONDS = 0.25  # a save shows within half a second plus the rebuild


class Watcher:
    """Notices when any file under its folders is added, removed or changed (by size or time)."""

    def __init__(self, roots: list[Path]):
        self.roots = roots
        self.last = self.snapshot()

    def snapshot(self) -> dict[str, tuple[int, int]]:
        seen = {}
        for root in self.roots:
            for folder, subfolders, files in os.walk(root):
                subfolders[:] = sorted(d for d in subfolders if _watched(d))
                for name in filter(_watched, files):
                    seen[os.path.join(folder, name)] = _stamp(os.path.join(folder, name))
        return seen

    def changed(self) -> bool:
        current = self.snapshot()
        if current == self.last:
            return False
        self.last = current
        return True

    def settle(self, pause: float) -> None:
        """Wait until a burst of saves is over, so one edit gives one rebuild."""
        while True:
            time.sleep(pause)
            if not self.changed():
                return


def _watched(name: str) -> bool:
    return not name.startswith(".") and not name.endswith("~") and name not in IGNORED_PARTS


def _stamp(path: str) -> tuple[int, int]:
    try:
        status = os.stat(path)
    except OSError:
        return (0, -1)
    return (status.st_mtime_ns, status.st_size)


@dataclass
class Preview:
    archive: Path
    output: Path
    rebuild: Callable[[], bool]
    builds: int = 0


def serve(archive: Path, host: str = "127.0.0.1", port: int = 8000, *, build: Callable[[Path, Path], bool], stop: threading.Event | None = None, on_ready: Callable[[str], None] | None = None, pause: float = POLL_SECONDS) -> int:
    """Serve until stopped (Ctrl-C, or `stop` set); returns how many builds were made."""
    stop = stop or threading.Event()
    with tempfile.TemporaryDirectory(prefix="dossier-serve-") as scratch:
        output = Path(scratch) / "site"
        output.mkdir()
        preview = Preview(archive, output, lambda: build(archive, output))
        server = _server(host, port, output)
        try:
            _run(preview, server, stop, on_ready, pause)
        finally:
            server.shutdown()
            server.server_close()
    return preview.builds


def _server(host: str, port: int, output: Path) -> http.server.ThreadingHTTPServer:
    handler = functools.partial(_QuietHandler, directory=str(output))
    server = http.server.ThreadingHTTPServer((host, port), handler)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    return server


class _QuietHandler(http.server.SimpleHTTPRequestHandler):
    def log_message(self, format, *args):  # one line per request would bury the rebuild messages
        pass


def _run(preview: Preview, server, stop: threading.Event, on_ready, pause: float) -> None:
    watcher = Watcher([preview.archive, templates_dir()])
    _rebuild(preview)
    host, port = server.server_address[:2]
    if on_ready is not None:
        on_ready(f"http://{host}:{port}/")
    while not stop.wait(pause):
        if watcher.changed():
            watcher.settle(pause)
            _rebuild(preview)
            watcher.changed()  # take the post-build state as the new base


def _rebuild(preview: Preview) -> None:
    preview.rebuild()
    preview.builds += 1


def run_serve(archive: Path, host: str, port: int) -> int:
    from dossier.commands.exits import Exit

    def ready(url: str) -> None:
        click.echo(f"serving {archive} at {url} (Ctrl-C to stop); saving a record or template rebuilds the site (without checklist PDFs)", err=True)

    try:
        serve(archive, host, port, build=preview_build, on_ready=ready)
    except KeyboardInterrupt:
        click.echo("stopped", err=True)
    except OSError as error:
        click.echo(f"dossier serve: cannot listen on {host}:{port}: {error.strerror or error}; choose another --port", err=True)
        return Exit.REFUSED
    return Exit.DONE


def preview_build(source: Path, output: Path) -> bool:
    """One build for the preview; on failure say why and keep the last good site."""
    from dossier.commands.build import build_site, rendered_text
    from dossier.collect.caches import user_caches
    from dossier.problems import InputError
    from dossier.output.atomic import OutputRefused
    from dossier.render.mkdocs_run import RenderError
    from dossier.wording import problem_line

    try:
        built = build_site(source, output, cache=user_caches(pdfs=False))
    except InputError as error:
        click.echo("\n".join(problem_line(problem) for problem in error.problems), err=True)
        click.echo("not rebuilt: put the problems right and save again", err=True)
        return False
    except (OutputRefused, RenderError) as error:
        click.echo(getattr(error, "output", "") or str(error), err=True)
        return False
    except OSError as error:
        click.echo(f"cannot write {error.filename or output}: {error.strerror or error}; the preview stays as it was", err=True)
        return False
    if built.replaced:
        click.echo(f"built {built.pages} pages in {built.seconds:.1f} s: {rendered_text(built)}", err=True)
    else:
        click.echo(f"no page changed; the preview stays as it was ({built.seconds:.1f} s)", err=True)
    return True
