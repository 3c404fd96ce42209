"""The corpus of test records under tests/cases/records: one unit of each kind a club builds (a
self-oscillating supply, a valve amplifier's supplies, a multi-rail linear bench supply, a doubler, a valve
preamplifier supply, a charger, an isolating-transformer bench unit). Each must validate, review with no
calc crashing and nothing left not assessed without saying why, draw every stage without a placeholder,
and build into a site."""

from __future__ import annotations

import shutil

import pytest
from tests.drawing.test_schematics import svg_lines
from tests.fixtures.demo import DEMO, RECORDS, load_demo, load_test_record

from dossier.drawing import schematics
from dossier.findings import Verdict
from dossier.review import CALC_ERROR, load_plugins, run_review

CORPUS = sorted(path.parent.name for path in RECORDS.glob("*/rev-*.yaml"))
DEMO_REVISIONS = sorted((path.parent.name, path.stem.removeprefix("rev-")) for path in DEMO.glob("*/rev-*.yaml"))


@pytest.fixture(scope="module")
def calcs():
    return load_plugins()


def test_the_corpus_holds_at_least_six_kinds_of_unit():
    kinds = {stage.topology_name for build in CORPUS for stage in load_test_record(build).stages if stage.topology}
    assert len(CORPUS) >= 6
    assert {"valve-centre-tapped", "valve-half-wave", "doubler", "series-bank", "clc", "lc", "shunt", "switching",
            "series-pass", "standby", "isolating-transformer", "variac", "half-wave"} <= kinds


@pytest.mark.parametrize("build", CORPUS)
def test_each_record_reviews_without_a_crash_or_an_unexplained_not_assessed(build, calcs):
    review = run_review(load_test_record(build), calcs)
    assert not [f for f in review.findings if f.code == CALC_ERROR]
    for finding in review.findings:
        if finding.verdict == Verdict.NOT_ASSESSED:
            assert finding.explanation.strip() and finding.keys, f"{finding.code} {finding.subject} does not say what is missing"


@pytest.mark.parametrize("build, revision", DEMO_REVISIONS)
def test_each_demo_revision_reviews_without_a_crash_or_an_unexplained_not_assessed(build, revision, calcs):
    review = run_review(load_demo(build, revision), calcs)
    assert not [f for f in review.findings if f.code == CALC_ERROR]
    for finding in review.findings:
        if finding.verdict == Verdict.NOT_ASSESSED:
            assert finding.explanation.strip() and finding.keys, f"{finding.code} {finding.subject} does not say what is missing"


@pytest.mark.parametrize("build", CORPUS)
def test_each_record_draws_every_stage_without_a_placeholder(build, calcs):
    record = load_test_record(build)
    result = schematics.draw(record, run_review(record, calcs).findings)
    assert result.notes == ()
    assert len(result.figures) == len(record.stages) + 1
    for figure in result.figures:
        assert not any(line.startswith("not drawn:") for line in svg_lines(figure.svg)), figure.key


@pytest.mark.parametrize("build", CORPUS)
def test_each_rail_is_named_at_its_stage_on_the_block_diagram(build):
    record = load_test_record(build)
    diagram = " ".join(svg_lines(schematics.figures(record)[0].svg))
    for rail in record.rails:
        assert f"\u2192 {rail.name} " in diagram


@pytest.fixture(scope="module")
def corpus_site(tmp_path_factory, drawing_cache):
    """The corpus as one archive, built into a site once."""
    from dossier.commands.build import build_site

    archive = tmp_path_factory.mktemp("corpus") / "archive"
    shutil.copytree(RECORDS, archive)
    (archive / "archive.yaml").write_text("club: Ferncombe Valley Radio and Makers Club\ntitle: Test corpus\n", encoding="utf-8")
    output = archive.parent / "site"
    build_site(archive, output, cache=drawing_cache)
    return output


def test_the_corpus_builds_into_a_site_with_every_schematic(corpus_site):
    for build in CORPUS:
        folder = corpus_site / "builds" / build
        html = (folder / "schematics.html").read_text(encoding="utf-8")
        record = load_test_record(build)
        for number, stage in enumerate(record.stages, start=1):
            figure = folder / "figures" / f"stage-{number}-{stage.kind}.svg"
            assert figure.is_file() and f"figures/{figure.name}" in html, figure
            assert "not drawn:" not in figure.read_text(encoding="utf-8")
        assert (folder / "figures" / "block-diagram.svg").is_file()
