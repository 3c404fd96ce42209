"""Faults outside dossier's control give a message and the documented exit status, never a traceback, and
leave no process behind: a full disk under MkDocs, a cache folder that cannot be written, outputs that
cannot be written, a link in the way of `new`, and dossier killed while MkDocs renders."""

from __future__ import annotations

import os
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest
from click.testing import CliRunner

from dossier.cli import main
from dossier.commands.build import run_build
from dossier.render import mkdocs_run
from tests.fixtures.bad_input import tried
from tests.fixtures.site_kit import write_record

FULL_DISK_TRACEBACK = """INFO    -  Building documentation...
Traceback (most recent call last):
  File ".../mkdocs/commands/build.py", line 300, in _build_page
    utils.write_file(output.encode('utf-8', errors='xmlcharrefreplace'), page.file.abs_dest_path)
OSError: [Errno 28] No space left on device: '/srv/site.work/site/builds/amp/index.html'
"""


def dossier(*args: str, env: dict | None = None, stdout=subprocess.PIPE) -> subprocess.CompletedProcess:
    tried("faults (full disk, unwritable cache and outputs, links in the way, killed builds)")
    return subprocess.run([sys.executable, "-m", "dossier", *args], stdout=stdout, stderr=subprocess.PIPE, text=True, env=env, timeout=600)


@pytest.fixture
def archive(tmp_path):
    write_record(tmp_path / "archive", "amp")
    return tmp_path / "archive"


def test_a_full_disk_under_mkdocs_is_a_write_failure_with_exit_2(archive, tmp_path, monkeypatch, capsys):
    tried("faults (full disk, unwritable cache and outputs, links in the way, killed builds)")
    failed = subprocess.CompletedProcess([], 1, stdout="", stderr=FULL_DISK_TRACEBACK)
    monkeypatch.setattr(mkdocs_run.subprocess, "run", lambda *args, **kwargs: failed)
    assert run_build(archive, tmp_path / "site", pages_only=False, quiet=True, use_cache=False, pdfs=False) == 2
    said = capsys.readouterr().err
    assert "No space left on device" in said and "/srv/site.work/site/builds/amp/index.html" in said
    assert "Traceback" not in said and not (tmp_path / "site").exists()


def test_the_cause_of_a_failed_mkdocs_run_is_read_from_its_last_os_error():
    error = mkdocs_run.write_failure(FULL_DISK_TRACEBACK)
    assert (error.errno, error.strerror, error.filename) == (28, "No space left on device", "/srv/site.work/site/builds/amp/index.html")
    assert mkdocs_run.write_failure("WARNING -  Doc file 'x.md' contains a link to 'y.md', not found") is None


def test_a_cache_folder_that_cannot_be_made_slows_check_and_build_but_fails_neither(archive, tmp_path):
    blocker = tmp_path / "a-file"
    blocker.write_text("not a folder", encoding="utf-8")
    env = dict(os.environ, XDG_CACHE_HOME=str(blocker / "cache"))
    checked = dossier("check", str(archive), env=env)
    assert checked.returncode in (0, 1) and "Traceback" not in checked.stderr
    built = dossier("build", str(archive), "-o", str(tmp_path / "site"), "--no-pdf", env=env)
    assert built.returncode == 0 and "Traceback" not in built.stderr and "could not be made" not in built.stderr


def test_schema_to_a_folder_is_refused_with_the_reason(tmp_path):
    tried("faults (full disk, unwritable cache and outputs, links in the way, killed builds)")
    result = CliRunner().invoke(main, ["schema", "-o", str(tmp_path)])
    assert result.exit_code == 2 and "cannot write" in result.output and "Is a directory" in result.output


@pytest.mark.skipif(not Path("/dev/full").exists(), reason="needs /dev/full")
@pytest.mark.parametrize("args", [("schema", "-o", "/dev/full"), ("schema",), ("check", "ARCHIVE")])
def test_writing_to_a_full_device_is_a_message_and_exit_2(archive, args):
    args = tuple(str(archive) if arg == "ARCHIVE" else arg for arg in args)
    with open("/dev/full", "w") as full:
        result = dossier(*args, stdout=full if "-o" not in args else subprocess.PIPE)
    assert result.returncode == 2 and "No space left on device" in result.stderr and "Traceback" not in result.stderr


def test_new_over_a_dangling_link_is_refused_and_leaves_the_link(tmp_path):
    tried("faults (full disk, unwritable cache and outputs, links in the way, killed builds)")
    (tmp_path / "amp").symlink_to(tmp_path / "nowhere")
    result = CliRunner().invoke(main, ["new", "amp", "--archive", str(tmp_path)])
    assert result.exit_code == 2 and "already exists" in result.output
    assert (tmp_path / "amp").is_symlink() and not (tmp_path / "nowhere").exists()


def _children(pid: int) -> list[int]:
    found = []
    for entry in Path("/proc").iterdir():
        if entry.name.isdigit():
            try:
                fields = (entry / "stat").read_text().rsplit(")", 1)[1].split()
            except OSError:
                continue
            if int(fields[1]) == pid:
                found.append(int(entry.name))
    return found


def _is_mkdocs(pid: int) -> bool:
    try:
        return b"mkdocs" in Path(f"/proc/{pid}/cmdline").read_bytes()
    except OSError:
        return False


def _alive(pid: int) -> bool:
    try:
        return Path(f"/proc/{pid}/stat").read_text().rsplit(")", 1)[1].split()[0] != "Z"
    except OSError:
        return False


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="the parent-death signal is Linux's")
def test_mkdocs_dies_with_a_killed_build_and_the_next_build_cleans_up(archive, tmp_path):
    tried("faults (full disk, unwritable cache and outputs, links in the way, killed builds)")
    site = tmp_path / "site"
    build = subprocess.Popen([sys.executable, "-m", "dossier", "build", str(archive), "-o", str(site), "--no-pdf", "--no-cache"],
                             stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
    deadline, renderer = time.monotonic() + 300, None
    while renderer is None and time.monotonic() < deadline and build.poll() is None:
        renderer = next((pid for pid in _children(build.pid) if _is_mkdocs(pid)), None)
        time.sleep(0.05)
    assert renderer is not None, "the build ended before MkDocs was seen"
    os.kill(build.pid, signal.SIGKILL)
    build.wait()
    deadline = time.monotonic() + 1  # at once: MkDocs left alone would run on for seconds
    while _alive(renderer) and time.monotonic() < deadline:
        time.sleep(0.05)
    assert not _alive(renderer)
    again = dossier("build", str(archive), "-o", str(site), "--no-pdf")
    assert again.returncode == 0, again.stderr
    assert sorted(p.name for p in tmp_path.iterdir()) == ["archive", "site"]  # no work folder left beside it
