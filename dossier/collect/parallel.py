"""Collecting builds on every core: each build is reviewed, drawn and given its checklist in a worker.

Results come back in archive order, so the site is byte-identical to a one-process build, and at most a
few builds wait in memory at a time. Small archives are collected in one process: starting workers costs
more than it saves there.
"""

from __future__ import annotations

import multiprocessing
import os
from collections import deque
from concurrent.futures import ProcessPoolExecutor
from pathlib import Path
from typing import Iterator

MIN_BUILDS_FOR_WORKERS = 8
_WORKER_STATE: dict = {}


def worker_count(builds: int, jobs: int | None = None) -> int:
    """How many processes pay: 1 for a small archive, else the cores there are (or what --jobs says)."""
    if jobs is not None:
        return max(1, jobs)
    if builds < MIN_BUILDS_FOR_WORKERS:
        return 1
    return max(1, min(os.cpu_count() or 1, builds))


def collected(archive, folders: list[Path], cache, collect_one, jobs: int | None = None) -> Iterator[tuple]:
    """collect_one(archive, folder, cache) for each folder, in order: in this process for a few folders, else in
    workers on every core (or as many as jobs says)."""
    workers = worker_count(len(folders), jobs)
    if workers == 1:
        return (collect_one(archive, folder, cache) for folder in folders)
    return collect_in_workers(archive, folders, cache, workers, collect_one)


def collect_in_workers(archive, folders: list[Path], cache, workers: int, collect_one) -> Iterator[tuple]:
    """(build, problems) per folder, in order, collected by `workers` forked processes."""
    context = multiprocessing.get_context("fork")  # workers inherit the archive, the calcs and the caches
    _WORKER_STATE.update(archive=archive, cache=cache, collect_one=collect_one)
    with ProcessPoolExecutor(workers, mp_context=context) as pool:
        pending: deque = deque()
        for folder in folders:
            pending.append(pool.submit(_collect_in_worker, folder))
            if len(pending) >= 2 * workers:
                yield pending.popleft().result()
        while pending:
            yield pending.popleft().result()


def _collect_in_worker(folder: Path) -> tuple:
    state = _WORKER_STATE
    return state["collect_one"](state["archive"], folder, state["cache"])
