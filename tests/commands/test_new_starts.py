"""`dossier new --start KIND`: each starting point is a valid, worked record that checks clean and builds with real drawings."""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner

from dossier.cli import main
from dossier.commands.new import starting_points
from dossier.drawing.schematics import notes as placeholder_notes
from dossier.reading.record import load_record

KINDS = ("amplifier-supply", "linear-supply", "switch-mode-supply")
BLOCKING = {"fail", "not-assessed", "marginal"}


def run(*args):
    return CliRunner().invoke(main, [str(a) for a in args])


def test_the_starting_points_offered_are_the_three_kinds():
    assert tuple(starting_points()) == KINDS


@pytest.fixture(scope="module", params=KINDS)
def started(request, tmp_path_factory):
    archive = tmp_path_factory.mktemp(request.param) / "archive"
    result = run("new", "my-unit", "--archive", archive, "--start", request.param)
    assert result.exit_code == 0, result.output
    return request.param, archive, archive / "my-unit" / "rev-A.yaml"


def test_a_starting_point_names_its_build_and_schema(started):
    _, _, path = started
    text = path.read_text(encoding="utf-8")
    assert text.splitlines()[0] == "# yaml-language-server: $schema=../record.schema.json"
    assert "{{" not in text
    assert load_record(path).record.id == "my-unit"


def test_a_starting_point_checks_with_nothing_failing_or_located_wrong(started):
    kind, _, path = started
    result = run("check", path, "--format", "json")
    assert result.exit_code == 0, result.output
    (record,) = json.loads(result.output)["records"]
    assert record["valid"]
    codes = [finding["code"] for finding in record["findings"]]
    assert "CALC-ERROR" not in codes
    blocking = [(f["code"], f["subject"]) for f in record["findings"] if f["verdict"] in BLOCKING]
    assert blocking == [], f"{kind}: {blocking}"
    # every calc that applies to the kind ran and found something to say
    calcs = {finding["calc"] for finding in record["findings"]}
    assert {"isolation", "protection", "magnetics", "stress", "thermal"} <= calcs


def test_a_starting_point_carries_the_mains_caution_and_its_working(started):
    _, _, path = started
    text = path.read_text(encoding="utf-8")
    assert "CAUTION: mains voltages can kill" in text
    assert "licensed, qualified person" in text
    assert "Faraday" in text and "IEC 60664-1" in text


def test_a_starting_point_draws_every_stage(started):
    _, _, path = started
    assert placeholder_notes(load_record(path).record) == []


def test_a_starting_point_builds_a_site(started, tmp_path):
    kind, archive, _ = started
    pages = tmp_path / "pages"
    result = run("build", archive, "--pages-only", "--no-pdf", "-q", "-o", pages)
    assert result.exit_code == 0, result.output
    build_pages = [p for p in pages.rglob("*.md") if "my-unit" in p.as_posix()]
    assert build_pages, f"{kind}: no pages for the build"
    assert not any("placeholder" in p.read_text(encoding="utf-8").lower() for p in build_pages)


def test_new_without_start_still_writes_the_blank_record(tmp_path):
    assert run("new", "bench-amp", "--archive", tmp_path).exit_code == 0
    text = (tmp_path / "bench-amp" / "rev-A.yaml").read_text(encoding="utf-8")
    assert "title: Describe the unit in a few words" in text


def test_an_unknown_start_is_refused_naming_the_kinds_and_writes_nothing(tmp_path):
    archive = tmp_path / "archive"
    result = run("new", "bench-amp", "--archive", archive, "--start", "valve-amp")
    assert result.exit_code == 2
    assert "no starting point 'valve-amp'" in result.output
    assert "amplifier-supply, linear-supply, switch-mode-supply" in result.output
    assert not archive.exists()


def test_new_help_names_the_starting_points():
    result = run("new", "--help")
    assert all(kind in result.output for kind in KINDS)
