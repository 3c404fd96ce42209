"""`dossier serve`: preview over HTTP, rebuild once per change, never in a loop."""

from __future__ import annotations

import threading
from contextlib import contextmanager
import re
import time
import urllib.request

from dossier.commands.serve import Watcher, serve
from tests.fixtures.site_kit import write_record

DEADLINE = 30.0


def test_watcher_sees_added_changed_and_removed_files_but_not_hidden_ones(tmp_path):
    (tmp_path / "rev-A.yaml").write_text("a", encoding="utf-8")
    watcher = Watcher([tmp_path])
    assert not watcher.changed()
    (tmp_path / "rev-A.yaml").write_text("ab", encoding="utf-8")
    assert watcher.changed() and not watcher.changed()
    (tmp_path / ".hidden").mkdir()
    (tmp_path / ".hidden" / "x").write_text("x", encoding="utf-8")
    (tmp_path / "__pycache__").mkdir()
    (tmp_path / "__pycache__" / "y.pyc").write_text("y", encoding="utf-8")
    (tmp_path / "rev-A.yaml~").write_text("backup", encoding="utf-8")
    assert not watcher.changed()
    (tmp_path / "rev-A.yaml").unlink()
    assert watcher.changed()


def _wait(condition, what: str) -> None:
    ends = time.monotonic() + DEADLINE
    while not condition():
        assert time.monotonic() < ends, f"timed out waiting for {what}"
        time.sleep(0.05)


@contextmanager
def serving(archive, build, pause: float):
    """serve() on a free port in a thread; yields the base address once the first build is up."""
    ready, stop = [], threading.Event()
    thread = threading.Thread(target=serve, args=(archive, "127.0.0.1", 0), kwargs={"build": build, "stop": stop, "on_ready": ready.append, "pause": pause})
    thread.start()
    try:
        _wait(lambda: ready, "the server")
        yield ready[0]
    finally:
        stop.set()
        thread.join(DEADLINE)
    assert not thread.is_alive()


def test_serve_rebuilds_once_when_a_record_changes(tmp_path):
    archive = tmp_path / "archive"
    record = write_record(archive, "amp", "A")
    built = []

    def build(source, output):
        (output / "index.html").write_text(record.read_text(encoding="utf-8"), encoding="utf-8")
        built.append(time.monotonic())
        return True

    with serving(archive, build, pause=0.05) as address:
        assert "Test build amp" in _get(address + "index.html")
        record.write_text(record.read_text(encoding="utf-8").replace("Test build amp", "Changed title"), encoding="utf-8")
        _wait(lambda: len(built) == 2, "the rebuild")
        assert "Changed title" in _get(address + "index.html")
        time.sleep(0.5)
        assert len(built) == 2, "a rebuild must not trigger another"


def _get(url: str) -> str:
    with urllib.request.urlopen(url, timeout=5) as response:
        return response.read().decode("utf-8")


def test_serve_with_the_real_build_shows_the_edited_record(tmp_path):
    from dossier.commands.build import build_site
    from tests.fixtures.site_kit import TEST_CALC

    archive = tmp_path / "archive"
    record = write_record(archive, "amp", "A")
    builds = []

    def build(source, output):
        builds.append(build_site(source, output, calcs=[TEST_CALC]))
        return True

    with serving(archive, build, pause=0.1) as address:
        assert "Test build amp" in _get(address + "builds/amp/index.html")
        record.write_text(record.read_text(encoding="utf-8").replace("Test build amp", "Rewound amp"), encoding="utf-8")
        _wait(lambda: len(builds) == 2, "the rebuild")
        assert "Rewound amp" in _get(address + "builds/amp/index.html")
        time.sleep(1.0)
        assert len(builds) == 2


def test_a_port_in_use_is_a_message_not_a_traceback(tmp_path):
    import socket

    from click.testing import CliRunner

    from dossier.cli import main

    write_record(tmp_path / "archive", "amp", "A")
    with socket.socket() as taken:
        taken.bind(("127.0.0.1", 0))
        taken.listen()
        port = taken.getsockname()[1]
        result = CliRunner().invoke(main, ["serve", str(tmp_path / "archive"), "--port", str(port)])
    assert result.exit_code == 2 and "choose another --port" in result.stderr
    assert "Traceback" not in result.output


def test_the_preview_renders_only_the_edited_pages_and_says_which(tmp_path, monkeypatch, capsys):
    from dossier.collect.caches import Caches
    from dossier.commands.serve import preview_build

    def caches(use_cache=True, pdfs=True):
        kept = Caches.in_folder(tmp_path / "caches")
        return kept if pdfs else Caches(kept.drawings, None, kept.builds, kept.renders)

    monkeypatch.setattr("dossier.collect.caches.user_caches", caches)
    archive = tmp_path / "archive"
    write_record(archive, "amp")
    write_record(archive, "psu")
    assert preview_build(archive, tmp_path / "preview")
    write_record(archive, "psu", notes="Rewound the transformer.")
    assert preview_build(archive, tmp_path / "preview")
    first, second = capsys.readouterr().err.splitlines()[-2:]
    assert first.startswith("built ") and "rendered every page" in first
    assert re.fullmatch(r"built \d+ pages in \d+\.\d s: re-rendered \d+ changed pages? \(builds/psu/[^)]*\); kept the other \d+", second), second
    assert "builds/amp" not in second
    assert not list((tmp_path / "preview").rglob("*.pdf"))  # the preview leaves the PDFs to `dossier build`
