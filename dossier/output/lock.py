"""One build at a time per output folder: a second build of the same output is refused, not left to race.

The lock is an advisory lock (flock) on a small file beside the output, removed when the build ends.
Where the system has no flock, builds are not locked and leftovers of killed builds are left alone.
"""

from __future__ import annotations

import os
from contextlib import contextmanager
from pathlib import Path

from dossier.output.atomic import OutputRefused, recover_leftovers, staging

try:
    import fcntl
except ImportError:  # Windows
    fcntl = None


@contextmanager
def building(output: Path):
    """The work folder of one build of output, with the output locked and any leftovers of a killed build
    put right first (only under the lock: without it, they could be another build's)."""
    with output_lock(output) as exclusive:
        if exclusive:
            recover_leftovers(output)
        with staging(output) as work:
            yield work


def lock_path(output: Path) -> Path:
    return output.parent / f".{output.name}.lock"


@contextmanager
def output_lock(output: Path):
    """Hold the output's lock for the block; yields True when the lock is held (False: no flock here)."""
    if fcntl is None:
        yield False
        return
    output.parent.mkdir(parents=True, exist_ok=True)
    handle = _locked(lock_path(output), output)
    try:
        yield True
    finally:
        lock_path(output).unlink(missing_ok=True)
        handle.close()


def _locked(path: Path, output: Path):
    """The open, locked lock file; retried when the file was removed by the build that held it last."""
    while True:
        handle = open(path, "a")
        try:
            fcntl.flock(handle, fcntl.LOCK_EX | fcntl.LOCK_NB)
        except BlockingIOError:
            handle.close()
            raise OutputRefused(f"another dossier build is writing {output} now; wait for it to finish") from None
        if _still_there(handle, path):
            return handle
        handle.close()


def _still_there(handle, path: Path) -> bool:
    try:
        return os.fstat(handle.fileno()).st_ino == os.stat(path).st_ino
    except FileNotFoundError:
        return False
