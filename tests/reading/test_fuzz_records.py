"""Property-based mutation of the demo records: every mutant is either valid or refused with located problems.

Never a traceback: a mutant that validates must also pass through every calc without a calc crashing.
The number of cases tried is set by EXAMPLES below (three strategies, so 3 x EXAMPLES mutants per run).
"""

from __future__ import annotations

import os
import shutil
import string
from pathlib import Path

import yaml
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from dossier.reading.archive import RevisionFile, load_revision
from dossier.plugins import load_calcs
from dossier.problems import InputError
from dossier.review import review
from tests.fixtures.demo import DEMO
from tests.fixtures.bad_input import tried

EXAMPLES = int(os.environ.get("DOSSIER_FUZZ_EXAMPLES", "150"))
SOURCE = (DEMO / "solar-bank-charger" / "rev-C.yaml").read_text(encoding="utf-8")
LINES = SOURCE.splitlines()
CALCS = load_calcs()
FUZZ = settings(max_examples=EXAMPLES, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture, HealthCheck.too_slow])

junk = st.one_of(
    st.text(alphabet=string.printable, max_size=12),
    st.sampled_from(["", "-1 mm", "1e999 V", "nan", "[", "{", ": :", "&a", "*a", "!!binary xx", "0x10", "~", "true", "2026-02-30", "AWG 99", "5 degC", "-40 K"]),
)


ATTACHED = ("photos", "sheets")  # the folders rev C's attachments live in


def demo_build_in(tmp: Path) -> Path:
    build = tmp / "solar-bank-charger"
    build.mkdir(parents=True, exist_ok=True)
    for folder in ATTACHED:
        shutil.copytree(DEMO / "solar-bank-charger" / folder, build / folder, dirs_exist_ok=True)
    return build


def check_mutant(tmp: Path, text: str) -> None:
    tried("mutated records (hypothesis: line edits and value replacements)")
    build = demo_build_in(tmp)
    path = build / "rev-C.yaml"
    path.write_text(text, encoding="utf-8")
    try:
        loaded = load_revision(RevisionFile("solar-bank-charger", "C", path))
    except InputError as error:
        assert error.problems and all(p.location.file and p.location.line >= 1 for p in error.problems)
        return
    crashed = [f for f in review(loaded.record, CALCS) if f.code == "CALC-ERROR"]
    assert not crashed, crashed[0].explanation


def test_the_unmutated_record_loads_and_runs_every_calc(tmp_path):
    """Guards the fuzzing itself: if the untouched record did not load, every mutant would 'pass'."""
    build = demo_build_in(tmp_path)
    (build / "rev-C.yaml").write_text(SOURCE, encoding="utf-8")
    loaded = load_revision(RevisionFile("solar-bank-charger", "C", build / "rev-C.yaml"))
    assert len(review(loaded.record, CALCS)) > 50


@FUZZ
@given(st.data())
def test_line_edits(tmp_path_factory, data):
    lines = list(LINES)
    index = data.draw(st.integers(0, len(lines) - 1))
    action = data.draw(st.sampled_from(["delete", "duplicate", "replace-value", "indent", "dedent"]))
    line = lines[index]
    if action == "delete":
        del lines[index]
    elif action == "duplicate":
        lines.insert(index, line)
    elif action == "replace-value" and ":" in line:
        lines[index] = line.split(":", 1)[0] + ": " + data.draw(junk)
    elif action == "indent":
        lines[index] = "  " + line
    else:
        lines[index] = line.lstrip()
    check_mutant(tmp_path_factory.mktemp("m"), "\n".join(lines) + "\n")


def leaf_paths(node, path=()):
    if isinstance(node, dict):
        for key, value in node.items():
            yield from leaf_paths(value, path + (key,))
    elif isinstance(node, list):
        for i, value in enumerate(node):
            yield from leaf_paths(value, path + (i,))
    else:
        yield path


DATA = yaml.safe_load(SOURCE)
LEAVES = list(leaf_paths(DATA))
values = st.one_of(junk, st.integers(-10**6, 10**6), st.floats(allow_nan=True), st.booleans(), st.none(), st.lists(st.integers(), max_size=3), st.dictionaries(st.text(max_size=5), st.integers(), max_size=2))


def replaced(data, path, value):
    if not path:
        return value
    copy = dict(data) if isinstance(data, dict) else list(data)
    copy[path[0]] = replaced(data[path[0]], path[1:], value)
    return copy


@FUZZ
@given(st.sampled_from(LEAVES), values)
def test_value_replacements(tmp_path_factory, path, value):
    mutant = replaced(DATA, path, value)
    check_mutant(tmp_path_factory.mktemp("m"), yaml.safe_dump(mutant, sort_keys=False, allow_unicode=True))


@FUZZ
@given(st.integers(0, len(SOURCE) - 1), st.binary(min_size=1, max_size=4))
def test_byte_splices(tmp_path_factory, offset, chunk):
    tried("mutated records (hypothesis: random bytes spliced in)")
    raw = SOURCE.encode("utf-8")
    mutant = raw[:offset] + chunk + raw[offset:]
    build = demo_build_in(tmp_path_factory.mktemp("m"))
    (build / "rev-C.yaml").write_bytes(mutant)
    try:
        load_revision(RevisionFile("solar-bank-charger", "C", build / "rev-C.yaml"))
    except InputError as error:
        assert all(p.location.line >= 1 or p.code == "file_unreadable" for p in error.problems)
