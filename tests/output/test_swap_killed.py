"""A build killed at any step of putting the new site in place: the output is always one whole site.

Each case runs a real build in its own process (tests/fixtures/crash_points.py) and kills it, as SIGKILL would,
before or after one rename, exchange or folder removal, until a run gets through every step. Where the
system swaps folders atomically, the output is the old site or the new one at every instant; with the
two-rename fallback it may be missing for a moment, and the next build puts the old one back first.
"""

from __future__ import annotations

import hashlib
import subprocess
import sys
from pathlib import Path

import pytest

from dossier.commands.build import build_site
from dossier.output.atomic import recover_leftovers
from dossier.output.exchange import exchange
from dossier.output.lock import output_lock
from tests.fixtures.site_kit import write_record

HELPER = Path(__file__).resolve().parents[1] / "fixtures" / "crash_points.py"
MOST_STEPS = 12  # a guard: the swap takes a handful of steps


def digest(root: Path) -> str | None:
    if not root.exists():
        return None
    total = hashlib.sha256()
    for path in sorted(p for p in root.rglob("*") if p.is_file()):
        total.update(path.relative_to(root).as_posix().encode() + hashlib.sha256(path.read_bytes()).digest())
    return total.hexdigest()


def exchange_works(tmp_path: Path) -> bool:
    first, second = tmp_path / "first", tmp_path / "second"
    first.mkdir(), second.mkdir()
    return exchange(first, second)


@pytest.fixture
def archive_and_sites(tmp_path):
    """An archive, its page tree as built now (the old site), and the tree it gives after an edit (the new)."""
    archive = tmp_path / "archive"
    record = write_record(archive, "amp")
    output = tmp_path / "out" / "site"
    build_site(archive, output, pages_only=True)
    old = digest(output)
    record.write_text(record.read_text(encoding="utf-8").replace("A unit for the tests.", "A unit for the tests, edited."), encoding="utf-8")
    build_site(archive, tmp_path / "clean" / "site", pages_only=True)
    return archive, output, old, digest(tmp_path / "clean" / "site")


def killed_build(archive: Path, output: Path, step: int, when: str, mode: str) -> int:
    command = [sys.executable, str(HELPER), str(archive), str(output), str(step), when, mode]
    return subprocess.run(command, capture_output=True, text=True, cwd=HELPER.parent).returncode


@pytest.mark.parametrize("mode", ["exchange", "fallback"])
def test_a_build_killed_at_any_step_of_the_swap_leaves_a_whole_site(archive_and_sites, tmp_path, mode):
    if mode == "exchange" and not exchange_works(tmp_path):
        pytest.skip("this system has no atomic folder exchange")
    archive, output, old, new = archive_and_sites
    kills = 0
    for step in range(1, MOST_STEPS):
        for when in ("before", "after"):
            status = killed_build(archive, output, step, when, mode)
            if status == 0:
                assert digest(output) == new and _leftovers(output) == []
                assert kills >= 2, "the build was never killed during the swap"
                return
            assert status == 9, f"the build failed on its own at step {step}"
            kills += 1
            _check_after_kill(output, old, new, mode, f"killed {when} step {step}")
            _restore(output, archive, old)
    pytest.fail(f"the build never finished within {MOST_STEPS} steps")


def _check_after_kill(output: Path, old: str, new: str, mode: str, where: str) -> None:
    now = digest(output)
    if mode == "exchange":
        assert now in (old, new), f"{where}: the output is not a whole site"
    else:
        assert now in (old, new) or (now is None and _leftovers(output)), f"{where}: the old site is lost"
    with output_lock(output):
        recover_leftovers(output)
    assert digest(output) in (old, new), f"{where}: the next build could not put a whole site back"
    assert _leftovers(output) == [], f"{where}: folders of the killed build are left behind"


def _leftovers(output: Path) -> list[str]:
    return sorted(p.name for p in output.parent.iterdir() if p.name != output.name)


def _restore(output: Path, archive: Path, old: str) -> None:
    """Back to the old site before the next kill, so every kill starts from the same state."""
    if digest(output) == old:
        return
    record = archive / "amp" / "rev-A.yaml"
    text = record.read_text(encoding="utf-8")
    record.write_text(text.replace("A unit for the tests, edited.", "A unit for the tests."), encoding="utf-8")
    build_site(archive, output, pages_only=True)
    record.write_text(text, encoding="utf-8")
    assert digest(output) == old


def test_a_second_build_of_the_same_output_is_refused_while_one_runs(tmp_path):
    from dossier.output.atomic import OutputRefused

    archive = tmp_path / "archive"
    write_record(archive, "amp")
    output = tmp_path / "site"
    with output_lock(output):
        with pytest.raises(OutputRefused, match="another dossier build is writing"):
            build_site(archive, output, pages_only=True)
    build_site(archive, output, pages_only=True)
    assert sorted(p.name for p in tmp_path.iterdir()) == ["archive", "site"], "the lock file is removed after the build"


def test_leftovers_of_other_outputs_and_other_files_are_never_touched(tmp_path):
    output = tmp_path / "site"
    kept = [tmp_path / ".site-x-abcdefgh.building", tmp_path / ".site-abcdefgh.old.keep", tmp_path / "notes.building"]
    for path in kept:
        path.mkdir()
    stale = tmp_path / ".site-abcd1234.building"
    stale.mkdir()
    with output_lock(output):
        recover_leftovers(output)
    assert all(path.is_dir() for path in kept) and not stale.exists()


def test_an_output_given_through_a_link_is_locked_as_its_target_and_the_link_is_kept(tmp_path):
    from dossier.output.atomic import OutputRefused

    archive = tmp_path / "archive"
    write_record(archive, "amp")
    site = tmp_path / "site"
    build_site(archive, site, pages_only=True)
    link = tmp_path / "site-link"
    link.symlink_to(site)
    with output_lock(site):
        with pytest.raises(OutputRefused, match="another dossier build is writing"):
            build_site(archive, link, pages_only=True)  # the same folder, named through a link
    build_site(archive, link, pages_only=True)
    assert link.is_symlink() and link.resolve() == site.resolve(), "the link is not replaced by a folder"
    assert any(site.rglob("index.md")), "the site was built in the link's target"


def test_a_lock_file_that_is_a_link_is_never_followed(tmp_path):
    from dossier.output.atomic import OutputRefused
    from dossier.output.lock import lock_path

    output, victim = tmp_path / "site", tmp_path / "victim.txt"
    victim.write_text("mine", encoding="utf-8")
    lock_path(output).symlink_to(victim)
    with pytest.raises(OutputRefused, match="is a symbolic link"):
        with output_lock(output):
            pass
    assert victim.read_text(encoding="utf-8") == "mine" and lock_path(output).is_symlink()
