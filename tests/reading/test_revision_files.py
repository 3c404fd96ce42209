"""Every file that spells a revision is read or reported: links to nothing, folders, FIFOs, devices, links
out of the archive and second spellings of one revision are problems, never skipped in silence."""

from __future__ import annotations

import os
import tracemalloc

import pytest

from dossier.commands.check import run_check
from dossier.commands.exits import check_status
from dossier.report.text_report import check_text
from dossier.problems import InputError
from dossier.reading.archive import revision_files
from dossier.reading.yaml_source import MAX_BYTES, read_document
from dossier.wording import problem_line
from tests.fixtures.bad_input import tried
from tests.fixtures.site_kit import write_record


def checked(archive) -> tuple[int, str]:
    tried("revision files that cannot be read (links, folders, FIFOs, devices, second spellings)")
    result = run_check([archive])
    return int(check_status(result)), check_text(result, verbose=False)


@pytest.fixture
def archive(tmp_path):
    root = tmp_path / "archive"
    write_record(root, "unit")
    return root


def test_a_dangling_link_is_reported(archive):
    (archive / "unit" / "rev-B.yaml").symlink_to(archive / "unit" / "gone.yaml")
    code, text = checked(archive)
    assert code == 2 and "rev-B.yaml: file cannot be read; expected a record file, found a link to nothing" in text


def test_a_folder_is_reported(archive):
    (archive / "unit" / "rev-B.yaml").mkdir()
    code, text = checked(archive)
    assert code == 2 and "rev-B.yaml: file cannot be read; expected a record file, found a folder" in text


def test_a_fifo_is_reported_without_waiting_for_a_writer(archive):
    os.mkfifo(archive / "unit" / "rev-B.yaml")
    code, text = checked(archive)
    assert code == 2 and "found a FIFO (named pipe)" in text


def test_a_link_to_a_device_is_refused(archive):
    (archive / "unit" / "rev-B.yaml").symlink_to("/dev/zero")
    code, text = checked(archive)
    assert code == 2 and "rev-B.yaml: path leaves the archive; expected a record file inside the archive, found a link to a file outside it" in text


def test_a_record_linked_from_outside_the_archive_is_refused(tmp_path, archive):
    outside = write_record(tmp_path / "elsewhere", "unit", "B")
    (archive / "unit" / "rev-B.yaml").symlink_to(outside)
    code, text = checked(archive)
    assert code == 2 and "rev-B.yaml: path leaves the archive" in text


def test_a_build_folder_linked_from_outside_the_archive_is_refused(tmp_path, archive):
    write_record(tmp_path / "elsewhere", "other")
    (archive / "other").symlink_to(tmp_path / "elsewhere" / "other")
    code, text = checked(archive)
    assert code == 2 and "other/rev-A.yaml: path leaves the archive" in text


def test_a_link_inside_the_archive_is_read(archive):
    (archive / "unit" / "rev-A.yaml").rename(archive / "unit" / "kept.yaml")
    (archive / "unit" / "rev-A.yaml").symlink_to("kept.yaml")
    code, _ = checked(archive)
    assert code in (0, 1)


def test_two_spellings_of_one_revision_are_an_error(archive):
    record = archive / "unit" / "rev-A.yaml"
    (archive / "unit" / "rev-A.yml").write_bytes(record.read_bytes())
    [rev] = revision_files(archive / "unit")
    assert rev.twins == (archive / "unit" / "rev-A.yml",)
    code, text = checked(archive)
    assert code == 2
    assert "one revision in two files; expected one file for revision A, found rev-A.yaml, rev-A.yml (keep one and delete the others)" in text


def test_a_huge_sparse_file_is_refused_before_it_is_read(tmp_path):
    tried("hostile or broken files (encodings, size, nesting, tags, aliases, control characters, missing)")
    path = tmp_path / "rev-A.yaml"
    with open(path, "wb") as stream:
        stream.truncate(1_500_000_000)  # sparse: 1.5 GB long, no disk used
    tracemalloc.start()
    with pytest.raises(InputError) as raised:
        read_document(path, "R")
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    assert problem_line(raised.value.problems[0]) == "R: file too large; expected at most 1,000,000 bytes, found 1,500,000,000 bytes"
    assert peak < MAX_BYTES  # not even the limit's worth was read
