"""Incremental and chunked rendering give the very bytes of a whole render of the same archive.

Random (seeded) sequences of edits, additions and deletions of builds and revisions are built twice after
every step: incrementally into one site (the build cache and the record of the last render in use) and from
nothing into another (--no-cache), and the two sites must be the same file for file. Rendering in parts is
held to one run's bytes on the demo archive.
"""

from __future__ import annotations

import os
import random
import shutil

import pytest

from dossier.collect.caches import Caches
from dossier.commands.build import build_site
from dossier.output import incremental
from tests.fixtures.site_kit import TEST_CALC, copy_demo, write_record

NAMES = ("amp", "psu", "tuner", "scope", "charger", "clock", "meter", "rotator")
STATUSES = ("design", "on-bench", "in-enclosure")


def _files(root):
    return {path.relative_to(root).as_posix(): path.read_bytes() for path in sorted(root.rglob("*")) if path.is_file()}


def _same_sites(first, second) -> None:
    one, other = _files(first), _files(second)
    assert sorted(one) == sorted(other), set(one) ^ set(other)
    differing = [path for path in one if one[path] != other[path]]
    assert differing == []


class Story:
    """An archive changed step by step at random: what it holds, and the steps taken (to read a failure by)."""

    def __init__(self, root, seed: int):
        self.root = root
        self.random = random.Random(seed)
        self.revisions: dict[str, int] = {}
        self.steps: list[str] = []
        self.plan = ["edit", "status", "add revision", "delete revision", "add build", "delete build"]
        self.random.shuffle(self.plan)
        for name in NAMES[:3]:
            self.add_build(name)

    def write(self, name: str, count: int, **changes) -> None:
        for index in range(count):
            letter = "ABCDEFGH"[index]
            write_record(self.root, name, letter, notes=f"Notes of {name} rev {letter}: {self.random.randrange(1000)}.", **changes)

    def add_build(self, name: str) -> None:
        self.revisions[name] = 1
        write_record(self.root, name, "A")
        self.steps.append(f"add build {name}")

    def step(self) -> None:
        """The next kind of change of a shuffled plan that holds each kind once, where it can be made now."""
        possible = {"edit", "status", "add revision", "nothing"}
        if len(self.revisions) < len(NAMES):
            possible.add("add build")
        if len(self.revisions) > 2:
            possible.add("delete build")
        if any(count > 1 for count in self.revisions.values()):
            possible.add("delete revision")
        planned = [kind for kind in self.plan if kind in possible]
        kind = planned[0] if planned else self.random.choice(sorted(possible))
        if kind in self.plan:
            self.plan.remove(kind)
        getattr(self, "_" + kind.replace(" ", "_"))()

    def _pick(self, with_revisions: int = 1) -> str:
        return self.random.choice(sorted(name for name, count in self.revisions.items() if count >= with_revisions))

    def _edit(self) -> None:
        name = self._pick()
        letter = "ABCDEFGH"[self.revisions[name] - 1]
        write_record(self.root, name, letter, notes=f"Edited {self.random.randrange(10**6)}.")
        self.steps.append(f"edit {name} rev {letter}")

    def _status(self) -> None:
        name = self._pick()
        letter = "ABCDEFGH"[self.revisions[name] - 1]
        status = self.random.choice(STATUSES)
        write_record(self.root, name, letter, status=status)
        self.steps.append(f"status of {name} rev {letter}: {status}")

    def _add_revision(self) -> None:
        name = self._pick()
        letter = "ABCDEFGH"[self.revisions[name]]
        self.revisions[name] += 1
        write_record(self.root, name, letter, notes=f"Revision {letter}.", barriers=[{"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced", "material_group": "II", "creepage": "6 mm", "clearance": f"{3 + self.revisions[name]} mm"}])
        self.steps.append(f"add {name} rev {letter}")

    def _delete_revision(self) -> None:
        name = self._pick(2)
        letter = "ABCDEFGH"[self.revisions[name] - 1]
        (self.root / name / f"rev-{letter}.yaml").unlink()
        self.revisions[name] -= 1
        self.steps.append(f"delete {name} rev {letter}")

    def _add_build(self) -> None:
        self.add_build(next(name for name in NAMES if name not in self.revisions))

    def _delete_build(self) -> None:
        name = self._pick()
        shutil.rmtree(self.root / name)
        del self.revisions[name]
        self.steps.append(f"delete build {name}")

    def _nothing(self) -> None:
        self.steps.append("nothing")


SEEDS = [int(seed) for seed in os.environ.get("DOSSIER_INCREMENTAL_SEEDS", "18").split(",")]  # more for a longer run


@pytest.mark.parametrize("seed", SEEDS)
def test_every_incremental_build_equals_a_whole_build(tmp_path, seed):
    story = Story(tmp_path / "archive", seed)
    caches = Caches.in_folder(tmp_path / "caches")
    caches = Caches(caches.drawings, None, caches.builds, caches.renders)
    how = []
    for number in range(7):
        if number:
            story.step()
        built = build_site(story.root, tmp_path / "incremental", calcs=[TEST_CALC], cache=caches, jobs=2)
        build_site(story.root, tmp_path / "whole", calcs=[TEST_CALC], cache=Caches(), reuse=False, jobs=2)
        how.append(built.rendered.how if built.rendered else "kept")
        _same_sites(tmp_path / "incremental", tmp_path / "whole")
    assert "changed" in how, (story.steps, how)  # the sequence did take the incremental path
    assert story.plan == [], story.steps  # and made every kind of change


def test_rendering_in_parts_equals_one_run(tmp_path, demo_archive, calcs, monkeypatch):
    archive = copy_demo(tmp_path / "archive")
    build_site(archive, tmp_path / "one", calcs=calcs, cache=Caches(), reuse=False, jobs=1)
    monkeypatch.setattr(incremental, "PARTS_FROM_PAGES", 1)
    built = build_site(archive, tmp_path / "parts", calcs=calcs, cache=Caches(), reuse=False, jobs=3)
    assert built.rendered.how == "parts" and built.rendered.parts >= 2
    _same_sites(tmp_path / "one", tmp_path / "parts")


def test_an_edit_renders_only_that_builds_pages_and_the_front_pages(tmp_path):
    root = tmp_path / "archive"
    for name in NAMES[:3]:
        write_record(root, name)
    caches = Caches.in_folder(tmp_path / "caches")
    build_site(root, tmp_path / "site", calcs=[TEST_CALC], cache=caches)
    write_record(root, "psu", notes="Rewound the transformer.")
    built = build_site(root, tmp_path / "site", calcs=[TEST_CALC], cache=caches)
    assert built.rendered.how == "changed"
    assert all(page.startswith("builds/psu/") for page in built.rendered.rendered), built.rendered.rendered


def test_a_site_changed_by_hand_is_rendered_whole(tmp_path):
    root = tmp_path / "archive"
    for name in NAMES[:2]:
        write_record(root, name)
    caches = Caches.in_folder(tmp_path / "caches")
    build_site(root, tmp_path / "site", calcs=[TEST_CALC], cache=caches)
    (tmp_path / "site" / "about.html").write_text("changed by hand", encoding="utf-8")
    write_record(root, "psu", notes="Rewound the transformer.")
    built = build_site(root, tmp_path / "site", calcs=[TEST_CALC], cache=caches)
    assert built.rendered.how == "whole"
    assert "changed by hand" not in (tmp_path / "site" / "about.html").read_text(encoding="utf-8")
