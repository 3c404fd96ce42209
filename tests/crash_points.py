"""Run one page-tree build and kill the process at one step of putting it in place (a test helper).

python tests/crash_points.py ARCHIVE OUTPUT STEP before|after exchange|fallback

A step is a call to a rename, the atomic exchange or a folder removal. The process dies with os._exit,
as under SIGKILL: no cleanup of any kind runs. Exit 0 means the build finished before STEP came.
"""

from __future__ import annotations

import os
import shutil
import sys
from pathlib import Path

from dossier.commands.build import build_site
from dossier.output import atomic

KILLED = 9


def dying_at(step: int, when: str, calls: list):
    def wrap(function):
        def wrapped(*args, **kwargs):
            calls.append(function.__name__)
            if len(calls) == step and when == "before":
                os._exit(KILLED)
            result = function(*args, **kwargs)
            if len(calls) == step:
                os._exit(KILLED)
            return result

        return wrapped

    return wrap


def main(archive: str, output: str, step: str, when: str, mode: str) -> None:
    calls: list = []
    wrap = dying_at(int(step), when, calls)
    exchange = atomic.exchange if mode == "exchange" else (lambda first, second: False)
    atomic.exchange = wrap(exchange)
    os.rename = wrap(os.rename)
    shutil.rmtree = wrap(shutil.rmtree)
    build_site(Path(archive), Path(output), pages_only=True, jobs=1)


if __name__ == "__main__":
    main(*sys.argv[1:])
