"""One build at a time per output folder: a second build of the same output is refused, not left to race.

The lock is an advisory lock (flock) on a small file beside the output, removed when the build ends. The
output is named by its real path (see real_output), so two names for one folder share one lock; the lock file
is opened without following a link, so it can never be made to open, create or truncate another file.
Where the system has no flock, builds are not locked and leftovers of killed builds are left alone.
"""

from __future__ import annotations

import errno
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
    put right first (only under the lock: without it, they could be another build's). output must be its
    real path (real_output): a link would be replaced by a folder and be locked apart from its target."""
    if output != real_output(output):
        raise ValueError(f"{output} is not a real path; pass real_output(output)")
    with output_lock(output) as exclusive:
        if exclusive:
            recover_leftovers(output)
        with staging(output) as work:
            yield work


def real_output(output: Path) -> Path:
    """The output as its real, absolute path: every link in it followed, so a site given through a link is
    built, locked and swapped where it really is, and the link itself is kept."""
    return Path(os.path.realpath(output))


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
        handle = _open_no_link(path)
        try:
            fcntl.flock(handle, fcntl.LOCK_EX | fcntl.LOCK_NB)
        except BlockingIOError:
            handle.close()
            raise OutputRefused(f"another dossier build is writing {output} now; wait for it to finish") from None
        if _still_there(handle, path):
            return handle
        handle.close()


def _open_no_link(path: Path):
    try:
        descriptor = os.open(path, os.O_RDWR | os.O_CREAT | os.O_NOFOLLOW | os.O_CLOEXEC, 0o644)
    except OSError as error:
        if error.errno == errno.ELOOP:
            raise OutputRefused(f"the lock file {path} is a symbolic link; dossier does not follow it. Remove it and build again") from None
        raise
    return os.fdopen(descriptor, "r+")


def _still_there(handle, path: Path) -> bool:
    """Whether the locked file is still the one at path (not removed, not replaced, not turned into a link)."""
    try:
        opened, named = os.fstat(handle.fileno()), os.lstat(path)
    except FileNotFoundError:
        return False
    return (opened.st_dev, opened.st_ino) == (named.st_dev, named.st_ino)
