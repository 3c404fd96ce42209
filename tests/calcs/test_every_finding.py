"""What every finding of the built-in calcs carries: documented codes, sources, a method, keys that exist.

These are checks on the shape of the findings; the numbers are checked against their sources in the
test file of each calc.
"""

from __future__ import annotations

from functools import lru_cache

import pytest

from tests.fixtures.demo import DEMO, ROOT
from dossier.reading.archive import RevisionFile, load_revision
from dossier.findings import Verdict
from dossier.plugins import load_calcs
from dossier.wording import comparison_text, margin_text

REVIEWED = ("isolation", "protection", "magnetics", "stress", "thermal")
DEMOS = [("solar-bank-charger", "A"), ("solar-bank-charger", "B"), ("solar-bank-charger", "C"), ("bench-psu-13v8", "A"), ("rotator-control", "A")]
WORDING_PHRASES = ("vs at least", "vs at most", "short by", "margin of")  # dossier.wording's comparison phrases
ASKS_TO_ADD = ("Add ", "add ", "Declare ", "declare ", "give ")


def reviewed_calcs():
    return [calc for calc in load_calcs() if calc.name in REVIEWED]


@lru_cache(maxsize=1)
def demo_findings() -> tuple:
    """(name, loaded record, calc, finding) for every finding of the reviewed calcs on every demo revision."""
    return tuple(_demo_findings())


def _demo_findings():
    for build, revision in DEMOS:
        loaded = load_revision(RevisionFile(build, revision, DEMO / build / f"rev-{revision}.yaml"))
        for calc in reviewed_calcs():
            for finding in calc.run(loaded.record):
                yield f"{build}-{revision}-{finding.code}-{finding.subject}", loaded, calc, finding


def assert_each_finding(check) -> None:
    """Run check(loaded, calc, finding) on every demo finding; fail naming each finding that broke it, and why."""
    found = demo_findings()
    assert found, "the demo revisions gave no findings to check"
    broken = []
    for name, loaded, calc, finding in found:
        try:
            check(loaded, calc, finding)
        except (AssertionError, LookupError) as error:
            broken.append(f"{name}: {type(error).__name__}: {error}".rstrip(": "))
    assert not broken, f"{len(broken)} of {len(found)} findings:\n" + "\n".join(broken)


def walk(record, path):
    """The value at a key path of the validated record; raises LookupError where the path does not exist."""
    value = record
    for part in path:
        if isinstance(part, int):
            if not isinstance(value, list) or part >= len(value):
                raise LookupError(f"no item {part} at {path}")
            value = value[part]
        elif value is None or not hasattr(value, part):
            raise LookupError(f"no key '{part}' at {path}")
        else:
            value = getattr(value, part)
    return value


@pytest.mark.parametrize("calc", load_calcs(), ids=lambda calc: calc.name)
def test_every_code_is_documented_on_the_calcs_page(calc):
    page = (ROOT / "docs" / "calcs" / f"{calc.name}.md").read_text(encoding="utf-8")
    missing = [code for code in calc.codes if f"`{code}`" not in page]
    assert not missing, f"docs/calcs/{calc.name}.md does not list {missing}"


def test_every_finding_is_declared_and_cites_a_source():
    assert_each_finding(declared_and_cited)


def declared_and_cited(loaded, calc, finding):
    assert finding.code in calc.codes
    assert finding.calc == calc.name
    assert finding.sources, "every finding names where its rule comes from"
    if finding.limit is not None:
        assert finding.method, "a judged finding names its formula"


def test_every_findings_keys_exist_and_the_first_locates_it():
    assert_each_finding(keys_locate)


def keys_locate(loaded, calc, finding):
    assert finding.keys
    for key in finding.keys:
        walk(loaded.record, key)
    first = tuple(finding.keys[0])
    if first not in loaded.sources:
        # a key not in the file is one the finding asks to add; the location falls back to its parent section
        assert any(word in finding.explanation for word in ASKS_TO_ADD), first
        assert first[:-1] in loaded.sources or first[:-2] in loaded.sources


def test_no_explanation_repeats_the_comparison():
    assert_each_finding(comparison_not_repeated)


def comparison_not_repeated(loaded, calc, finding):
    # the comparison and margin text come from dossier.wording; a calc's explanation adds to them
    comparison, margin = comparison_text(finding), margin_text(finding)
    if finding.limit is not None:
        assert comparison not in finding.explanation
        assert not margin or margin not in finding.explanation
    assert not any(words in finding.explanation for words in WORDING_PHRASES)


def test_a_missing_optional_input_is_information():
    # the rotator's declared core gives no surface_area: the temperature rise is not estimated, and says so
    loaded = load_revision(RevisionFile("rotator-control", "A", DEMO / "rotator-control" / "rev-A.yaml"))
    magnetics = next(calc for calc in reviewed_calcs() if calc.name == "magnetics")
    inputs = [f for f in magnetics.run(loaded.record) if f.code == "MAG-INPUT"]
    assert inputs and all(f.verdict is Verdict.INFO for f in inputs)
    assert any("core.surface_area" in f.explanation for f in inputs)
