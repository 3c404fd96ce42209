"""Loading commissioning files: the demo ones load, bad ones give one located line per problem."""

from __future__ import annotations

import textwrap

import pytest
from tests.fixtures.checklists import checklist_of, commissioning_of

from dossier.checklist.load import commissioning_path, load_commissioning
from dossier.problems import InputError
from dossier.units import Q_
from dossier.wording import problem_line

HEADER = """\
build: solar-bank-charger
revision: C
date: 2026-06-23
tested_by: Ilse Varga-Mbeki
witness: Rhodri Castellanos
"""


def problems_in(tmp_path, text: str, name: str = "commissioning-C.yaml") -> list[str]:
    path = tmp_path / name
    path.write_text(textwrap.dedent(text), encoding="utf-8")
    with pytest.raises(InputError) as caught:
        load_commissioning(path, checklist_of("solar-bank-charger", "C"), shown_as=name)
    return [problem_line(problem) for problem in caught.value.problems]


def test_the_demo_commissioning_files_load_with_values_in_their_items_units():
    charger = commissioning_of("solar-bank-charger", "C")
    assert charger.entry.tested_by == "Ilse Varga-Mbeki"
    assert charger.values["insulation-mains-output"] == Q_(200, "megaohm")
    assert str(charger.values["pe-continuity"].units) == "Ω"
    assert charger.values["soak-hs2"] == Q_(23, "K")
    bench = commissioning_of("bench-psu-13v8", "A")
    assert bench.entry.witness == "Priya Vanterpool"


def test_revisions_without_a_commissioning_file_have_none(demo_archive):
    assert commissioning_of("solar-bank-charger", "B") is None
    assert commissioning_path(demo_archive / "rotator-control", "A") is None
    assert commissioning_path(demo_archive / "solar-bank-charger", "C").name == "commissioning-C.yaml"


def test_loading_leaves_the_file_as_it_was(tmp_path):
    text = HEADER + "results:\n  pe-continuity: {value: 0.04 ohm}\n"
    path = tmp_path / "commissioning-C.yaml"
    path.write_text(text, encoding="utf-8")
    before = path.read_bytes()
    load_commissioning(path, checklist_of("solar-bank-charger", "C"))
    assert path.read_bytes() == before


def test_unknown_keys_and_items_are_located_with_a_suggestion(tmp_path):
    lines = problems_in(tmp_path, HEADER + "witnes: Olek Marsh-Iwasaki\nresults:\n  pe-continuty: {value: 0.04 ohm}\n")
    assert lines == [
        "commissioning-C.yaml:6:1: witnes: unknown key; expected a known key, found 'witnes' (did you mean 'witness'?)",
    ]
    lines = problems_in(tmp_path, HEADER + "results:\n  pe-continuty: {value: 0.04 ohm}\n")
    assert lines == [
        "commissioning-C.yaml:7:3: results.pe-continuty: no such item on this revision's checklist; expected an item id "
        "printed on the checklist of solar-bank-charger rev C, found 'pe-continuty' (did you mean 'pe-continuity'?)",
    ]


def test_values_are_checked_against_their_items(tmp_path):
    lines = problems_in(tmp_path, HEADER + textwrap.dedent("""\
        results:
          output-voltage: {value: 14.4 A}
          output-current: {value: 6}
          visual-inspection: {value: 3 V}
          soak-t1: {value: 41 degC}
        """))
    assert lines == [
        "commissioning-C.yaml:7:27: results.output-voltage.value: wrong kind of unit; expected voltage (e.g. 230 V), found 14.4 A (current)",
        "commissioning-C.yaml:8:27: results.output-current.value: a unit is needed; expected current (e.g. 1.6 A), found bare number 6 (write it with a unit, e.g. '1 A')",
        "commissioning-C.yaml:9:30: results.visual-inspection.value: this item takes no measured value; expected no value: this item is only ticked (done: true), found '3 V'",
        "commissioning-C.yaml:10:20: results.soak-t1.value: a temperature rise is needed, not a reading; expected a temperature rise in K (the reading less the room temperature), found 41 °C, a reading",
    ]


def test_the_witness_must_be_a_second_person(tmp_path):
    text = HEADER.replace("witness: Rhodri Castellanos", "witness: ilse varga-mbeki")
    assert problems_in(tmp_path, text) == [
        "commissioning-C.yaml:5:10: witness: the witness must be a second person; expected a second person, not the tester, found 'ilse varga-mbeki'",
    ]


def test_missing_keys_and_bad_dates(tmp_path):
    lines = problems_in(tmp_path, "build: solar-bank-charger\nrevision: C\ndate: 12 May\n")
    assert lines[0].startswith("commissioning-C.yaml:1:1: tested_by: required key is missing")
    assert any(line.startswith("commissioning-C.yaml:3:7: date:") for line in lines)
    assert len(lines) == 3  # tested_by, witness, date


def test_a_file_for_another_build_or_revision(tmp_path):
    text = HEADER.replace("build: solar-bank-charger", "build: bench-psu-13v8").replace("revision: C", "revision: B")
    assert problems_in(tmp_path, text) == [
        "commissioning-C.yaml:1:8: build: build does not match the folder; expected 'solar-bank-charger', the build this file sits with, found 'bench-psu-13v8'",
        "commissioning-C.yaml:2:11: revision: revision does not match the file name; expected 'C', the revision this file records, found 'B'",
    ]


def test_yaml_errors_and_empty_files(tmp_path):
    assert problems_in(tmp_path, "") == [
        "commissioning-C.yaml:1:1: no keys at the top of the file; expected a mapping of keys (build: ..., revision: ...), found an empty file",
    ]
    lines = problems_in(tmp_path, HEADER + "results: {pe-continuity: {value: 0.04 ohm}\n")
    assert len(lines) == 1 and lines[0].startswith("commissioning-C.yaml:7:") and "YAML syntax error" in lines[0]
