"""The test-only records under tests/cases/records: each validates, reviews without a crashed calc and draws
every stage without a placeholder."""

from __future__ import annotations

import pytest
from tests.fixtures.demo import RECORDS, load_test_record

from dossier.drawing import schematics
from dossier.review import load_plugins, review

BUILDS = sorted(path.name for path in RECORDS.iterdir() if (path / "rev-A.yaml").is_file())


@pytest.mark.parametrize("build", BUILDS)
def test_record_reviews_and_draws_without_placeholders(build):
    record = load_test_record(build)
    findings = review(record, load_plugins())
    assert not [f for f in findings if f.code == "CALC-ERROR"]
    assert schematics.notes(record) == []


def test_the_corpus_holds_the_e_i_bench_supply():
    assert "linear-psu-ei" in BUILDS
