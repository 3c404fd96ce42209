"""Every file kind dossier reads goes one way from YAML to a model: the same mistake gets the same located words."""

from __future__ import annotations

from pathlib import Path

import pytest
import yaml

from tests.fixtures.bad_input import tried
from tests.fixtures.site_kit import record_data

from dossier.checklist.load import load_commissioning
from dossier.checklist.sheet import build_checklist
from dossier.review import Review
from dossier.ledger import LOCK_FILE, load_ledger
from dossier.problems import InputError
from dossier.reading.record import load_record
from dossier.reading.settings import SETTINGS_FILE, load_settings
from dossier.wording import problem_line

DIGEST = "0" * 64
COMMISSIONING = "build: amp\nrevision: A\ndate: 2026-01-02\ntested_by: A. Tester\nwitness: B. Witness\n"
LEDGER = f"format: 1\nbuilds:\n  amp:\n    A:\n      published: 2026-01-02\n      sha256: '{DIGEST}'\n"


def record_text(**changes) -> str:
    data = record_data("amp", "A")
    data.update(changes)
    return yaml.safe_dump({key: value for key, value in data.items() if value is not None}, sort_keys=False)


def lines_for(kind: str, text: str, folder: Path) -> list[str]:
    """The problem lines of a file of this kind holding this text, the file shown as 'FILE'."""
    tried(f"one mistake in each file kind ({kind})")
    name = {"record": "rev-A.yaml", "settings": SETTINGS_FILE, "ledger": LOCK_FILE, "commissioning": "commissioning-A.yaml"}[kind]
    path = folder / name
    path.write_text(text, encoding="utf-8")
    with pytest.raises(InputError) as refused:
        _load(kind, path, folder)
    return [problem_line(problem).replace(str(path), "FILE") for problem in refused.value.problems]


def _load(kind: str, path: Path, folder: Path):
    if kind == "record":
        return load_record(path)
    if kind == "settings":
        return load_settings(folder)
    if kind == "ledger":
        return load_ledger(folder)
    record = load_record(_write(folder / "rev-A.yaml", record_text())).record
    return load_commissioning(path, build_checklist(record, Review(())))


def _write(path: Path, text: str) -> Path:
    path.write_text(text, encoding="utf-8")
    return path


UNKNOWN_KEY = [
    ("record", record_text() + "titel: Amp\n", 31),
    ("settings", "club: Test club\ntitel: Amp\n", 2),
    ("ledger", LEDGER.replace("format: 1\n", "format: 1\ntitel: Amp\n"), 2),
    ("commissioning", COMMISSIONING + "titel: Amp\n", 6),
]


@pytest.mark.parametrize("kind,text,line", UNKNOWN_KEY, ids=[case[0] for case in UNKNOWN_KEY])
def test_an_unknown_key_is_worded_alike_in_every_file_kind(kind, text, line, tmp_path):
    expected_key = {"record": "title", "settings": "title", "ledger": "", "commissioning": ""}[kind]
    hint = f" (did you mean '{expected_key}'?)" if expected_key else ""
    assert lines_for(kind, text, tmp_path) == [f"FILE:{line}:1: titel: unknown key; expected a known key, found 'titel'{hint}"]


def test_an_unknown_key_in_the_ledger_names_the_key_not_its_value(tmp_path):
    text = LEDGER.replace("      sha256:", "      publisehd: 2026-01-02\n      sha256:").replace("      published: 2026-01-02\n", "")
    assert lines_for("ledger", text, tmp_path) == [
        "FILE:5:7: builds.amp.A.published: required key is missing; expected this key, found nothing",
        "FILE:5:7: builds.amp.A.publisehd: unknown key; expected a known key, found 'publisehd' (did you mean 'published'?)",
    ]


def test_an_unknown_key_in_the_settings_is_not_pydantic_s_message(tmp_path):
    assert lines_for("settings", "titel: Amp\n", tmp_path) == ["FILE:1:1: titel: unknown key; expected a known key, found 'titel' (did you mean 'title'?)"]


MISSING_KEY = [
    ("record", record_text(date=None), "FILE:1:1: date: required key is missing; expected this key, found nothing"),
    ("ledger", LEDGER.replace("      published: 2026-01-02\n", ""), "FILE:5:7: builds.amp.A.published: required key is missing; expected this key, found nothing"),
    ("commissioning", COMMISSIONING.replace("date: 2026-01-02\n", ""), "FILE:1:1: date: required key is missing; expected this key, found nothing"),
]


@pytest.mark.parametrize("kind,text,line", MISSING_KEY, ids=[case[0] for case in MISSING_KEY])
def test_a_missing_key_is_worded_alike_in_every_file_kind(kind, text, line, tmp_path):
    # archive.yaml has no required key: every setting has a default.
    assert lines_for(kind, text, tmp_path) == [line]


WRONG_TYPE = [
    ("record", record_text(authors="A. Tester").replace("authors: A. Tester", "authors: {name: A. Tester}"), "FILE:5:10: authors: wrong type of value; expected a list, found a mapping"),
    ("settings", "title: [Amp, Preamp]\n", "FILE:1:8: title: wrong type of value; expected text, found a list"),
    ("ledger", LEDGER.replace("format: 1", "format: first"), "FILE:1:9: format: wrong type of value; expected a whole number, found 'first'"),
    ("commissioning", COMMISSIONING + "instruments: {meter: yes}\n", "FILE:6:14: instruments: wrong type of value; expected a list, found a mapping"),
]


@pytest.mark.parametrize("kind,text,line", WRONG_TYPE, ids=[case[0] for case in WRONG_TYPE])
def test_a_value_of_the_wrong_type_is_worded_alike_in_every_file_kind(kind, text, line, tmp_path):
    assert lines_for(kind, text, tmp_path) == [line]


@pytest.mark.parametrize("kind,text", [("record", "- id: amp\n"), ("settings", "- club\n"), ("ledger", "- 1\n"), ("commissioning", "- build\n")])
def test_a_file_that_is_not_a_mapping_is_worded_alike(kind, text, tmp_path):
    (line,) = lines_for(kind, text, tmp_path)
    assert line.startswith("FILE:1:1: no keys at the top of the file; expected a mapping of keys (") and line.endswith("), found list")


def test_a_value_that_fits_none_of_a_union_s_types_is_one_problem(tmp_path):
    text = COMMISSIONING + "results:\n  visual-inspection: {value: [1, 2]}\n"
    assert lines_for("commissioning", text, tmp_path) == [
        "FILE:7:30: results.visual-inspection.value: wrong type of value; expected text, a whole number or a number, found a list",
    ]
