"""Attachments must stay inside the archive: no absolute paths, no '..', no links out."""

from __future__ import annotations

import os

import pytest

from dossier.reading.archive import RevisionFile, load_revision
from dossier.problems import InputError
from dossier.wording import problem_line
from tests.fixtures.bad_input import tried

RECORD = """id: unit
title: Attachment test
revision: A
date: 2026-01-01
authors: [A. Tester]
status: design
attachments:
  - {{path: {path!r}, kind: photo}}
"""


def load_with(tmp_path, path: str):
    build = tmp_path / "archive" / "unit"
    build.mkdir(parents=True, exist_ok=True)
    record = build / "rev-A.yaml"
    record.write_text(RECORD.format(path=path), encoding="utf-8")
    return load_revision(RevisionFile("unit", "A", record), shown_as="R")


def problem_for(tmp_path, path: str) -> str:
    tried("attachment paths (absolute, with .., linked out, missing)")
    with pytest.raises(InputError) as raised:
        load_with(tmp_path, path)
    (problem,) = raised.value.problems
    return problem_line(problem)


@pytest.mark.parametrize(
    "path, found",
    [
        ("/etc/passwd", "absolute path '/etc/passwd'"),
        ("../other/secret.txt", "'..' in '../other/secret.txt'"),
        ("photos/../../x.jpg", "'..' in 'photos/../../x.jpg'"),
        ("C:/Windows/win.ini", "absolute path 'C:/Windows/win.ini'"),
    ],
)
def test_paths_that_leave_the_build_are_refused(tmp_path, path, found):
    line = problem_for(tmp_path, path)
    assert line.startswith("R:8:12: attachments[0].path: ")
    assert line.endswith(f"expected a path inside the build folder, found {found}")


def test_a_missing_attachment_is_located(tmp_path):
    assert problem_for(tmp_path, "photos/top.jpg") == "R:8:12: attachments[0].path: attachment not found; expected a file inside the build folder, found no file at 'photos/top.jpg'"


def test_a_link_out_of_the_archive_is_refused(tmp_path):
    outside = tmp_path / "outside.txt"
    outside.write_text("secret", encoding="utf-8")
    build = tmp_path / "archive" / "unit"
    build.mkdir(parents=True)
    os.symlink(outside, build / "link.txt")
    assert problem_for(tmp_path, "link.txt").endswith("found 'link.txt' links outside it")


def test_an_attachment_inside_the_build_is_accepted(tmp_path):
    build = tmp_path / "archive" / "unit" / "photos"
    build.mkdir(parents=True)
    (build / "top.jpg").write_bytes(b"\xff\xd8")
    assert load_with(tmp_path, "photos/top.jpg").record.attachments[0].path == "photos/top.jpg"
