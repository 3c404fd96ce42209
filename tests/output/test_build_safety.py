"""Builds are atomic and never write into the records: interrupting one leaves the previous site intact."""

from __future__ import annotations

import hashlib
import os
import shutil
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest

from tests.fixtures.demo import DEMO

INTERRUPT_AFTER = [0.3, 0.8, 1.5, 2.5, 4.0]  # seconds into a build of about 5 s


def tree_digest(root: Path) -> str:
    digest = hashlib.sha256()
    for path in sorted(p for p in root.rglob("*") if p.is_file()):
        digest.update(path.relative_to(root).as_posix().encode())
        digest.update(hashlib.sha256(path.read_bytes()).digest())
    return digest.hexdigest()


def build_command(archive: Path, out: Path) -> list[str]:
    return [sys.executable, "-m", "dossier", "build", str(archive), "-o", str(out), "-q"]


@pytest.fixture(scope="module")
def archive_and_site(tmp_path_factory):
    work = tmp_path_factory.mktemp("atomic")
    archive = shutil.copytree(DEMO, work / "archive")
    site = work / "site"
    subprocess.run(build_command(archive, site), check=True, capture_output=True)
    return archive, site


def test_building_never_changes_the_archive(archive_and_site, tmp_path):
    archive, _ = archive_and_site
    before = tree_digest(archive)
    subprocess.run(build_command(archive, tmp_path / "other-site"), check=True, capture_output=True)
    subprocess.run([sys.executable, "-m", "dossier", "check", str(archive)], capture_output=True)
    assert tree_digest(archive) == before


def test_an_unchanged_archive_builds_byte_identical(archive_and_site, tmp_path):
    archive, site = archive_and_site
    again = tmp_path / "again"
    subprocess.run(build_command(archive, again), check=True, capture_output=True)
    assert tree_digest(again) == tree_digest(site)


@pytest.mark.parametrize("delay", INTERRUPT_AFTER)
def test_an_interrupted_build_leaves_the_previous_site_whole(archive_and_site, tmp_path, delay):
    archive, site = archive_and_site
    previous = tree_digest(site)
    changed = shutil.copytree(archive, tmp_path / "archive")
    record = changed / "rotator-control" / "rev-A.yaml"
    record.write_text(record.read_text(encoding="utf-8").replace("Antenna rotator control box", "Rotator control box (edited)"), encoding="utf-8")
    target = shutil.copytree(site, tmp_path / "site")
    process = subprocess.Popen(build_command(changed, target), stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, start_new_session=True)
    time.sleep(delay)
    if process.poll() is None:
        os.killpg(process.pid, signal.SIGKILL)
    process.wait()
    now = tree_digest(target)
    if now == previous:
        return
    clean = tmp_path / "clean"
    subprocess.run(build_command(changed, clean), check=True, capture_output=True)
    assert now == tree_digest(clean), "the site is neither the previous one nor a complete new one"


def test_collecting_on_two_cores_gives_the_same_pages_as_one(tmp_path):
    from dossier.commands.build import build_site
    from dossier.collect.caches import Caches

    caches = Caches.in_folder(tmp_path / "caches")
    build_site(DEMO, tmp_path / "one", pages_only=True, cache=caches, jobs=1)
    build_site(DEMO, tmp_path / "two", pages_only=True, cache=caches, jobs=2)
    assert tree_digest(tmp_path / "two") == tree_digest(tmp_path / "one")


def test_workers_pay_only_for_larger_archives():
    from dossier.collect.parallel import MIN_BUILDS_FOR_WORKERS, worker_count

    assert worker_count(MIN_BUILDS_FOR_WORKERS - 1) == 1
    assert worker_count(MIN_BUILDS_FOR_WORKERS) == min(os.cpu_count() or 1, MIN_BUILDS_FOR_WORKERS)
    assert worker_count(3, jobs=2) == 2


def test_a_relative_output_folder_works(tmp_path, monkeypatch):
    archive = shutil.copytree(DEMO, tmp_path / "archive")
    monkeypatch.chdir(tmp_path)
    result = subprocess.run([sys.executable, "-m", "dossier", "build", "archive", "-o", "out/site", "-q", "--no-pdf"], capture_output=True, text=True)
    assert result.returncode == 0, result.stderr
    assert (tmp_path / "out" / "site" / "index.html").exists()
    assert archive.exists()
