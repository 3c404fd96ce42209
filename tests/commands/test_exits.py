"""One mapping from errors to exit statuses for every command, and one result behind both check reports."""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner

from tests.fixtures.entry_points import FakeEntryPoint
from tests.fixtures.site_kit import write_record

from dossier import plugins
from dossier.cli import main
from dossier.standards import chemistries

BATTERY_OUTPUT = {
    "voltage": "14.4 V", "current": "6 A", "efficiency": "80 %", "power_factor": 0.6, "tolerance": "2 %",
    "battery": {"chemistry": "agm", "capacity": "40 Ah", "absorption_voltage": "14.4 V", "float_voltage": "13.6 V", "temperature": "25 degC"},
}


def run(*args):
    return CliRunner().invoke(main, [str(a) for a in args])


@pytest.fixture
def archive(tmp_path):
    root = tmp_path / "archive"
    write_record(root, "amp", "A", output=BATTERY_OUTPUT)
    write_record(root, "amp", "B", output=BATTERY_OUTPUT)
    return root


@pytest.fixture
def broken_calc_plugin(monkeypatch):
    monkeypatch.setattr(plugins, "entry_points", lambda group: [FakeEntryPoint("broken", error=ImportError("no module named x"))])


@pytest.fixture
def broken_chemistry_plugin(monkeypatch):
    monkeypatch.setattr(chemistries, "entry_points", lambda group: [FakeEntryPoint("nicd", error=ImportError("no module named cells"))])
    chemistries.registry.cache_clear()
    yield
    chemistries.registry.cache_clear()


def commands(archive):
    """Every command that reads records, with the arguments to run it on this archive."""
    return {
        "check": ["check", archive / "amp" / "rev-A.yaml"],
        "check --format json": ["check", "--format", "json", archive],
        "diff": ["diff", archive / "amp" / "rev-A.yaml", archive / "amp" / "rev-B.yaml"],
        "build": ["build", archive, "--pages-only", "-o", archive.parent / "site", "-q"],
    }


@pytest.mark.parametrize("command", ["check", "check --format json", "diff", "build"])
def test_a_broken_calc_plugin_exits_3_from_every_command_without_a_traceback(command, archive, broken_calc_plugin):
    result = run(*commands(archive)[command])
    assert result.exit_code == 3, result.output
    assert "calc plugin 'broken': could not be loaded: ImportError: no module named x" in result.stderr
    assert "Traceback" not in result.output


@pytest.mark.parametrize("command", ["check", "check --format json", "diff", "build"])
def test_a_broken_chemistry_plugin_is_the_installation_s_fault_not_the_record_s(command, archive, broken_chemistry_plugin):
    result = run(*commands(archive)[command])
    assert result.exit_code == 3, result.output
    assert "chemistry plugin 'nicd': could not be loaded: ImportError: no module named cells" in result.stderr
    assert "rev-A.yaml:" not in result.output  # not reported as a problem at a place in the user's record


def test_a_broken_chemistry_plugin_stops_publish_with_3(archive, broken_chemistry_plugin):
    result = run("publish", archive)
    assert result.exit_code == 3 and "chemistry plugin 'nicd'" in result.stderr
    assert not (archive / "published.yaml").exists()


def test_an_invalid_commissioning_file_makes_the_record_invalid_in_both_reports(archive):
    (archive / "amp" / "commissioning-A.yaml").write_text("build: amp\nrevision: A\ndate: 2026-01-02\ntested_by: A. Tester\nwitnes: B. Witness\n", encoding="utf-8")
    text = run("check", archive / "amp" / "rev-A.yaml")
    as_json = run("check", "--format", "json", archive / "amp" / "rev-A.yaml")
    assert text.exit_code == as_json.exit_code == 2
    body = json.loads(as_json.stdout)
    (record,) = body["records"]
    assert body["exit_code"] == 2 and record["valid"] is False
    assert [(p["key"], p["code"]) for p in record["problems"]] == [("witness", "missing"), ("witnes", "extra_forbidden")]
    assert record["findings"], "the record itself was read, so its findings are still reported"
    for problem in record["problems"]:
        assert f"{problem['file']}:{problem['line']}:{problem['column']}: {problem['key']}:" in text.stdout


def test_a_valid_commissioning_file_is_in_both_reports(archive):
    (archive / "amp" / "commissioning-A.yaml").write_text("build: amp\nrevision: A\ndate: 2026-01-02\ntested_by: A. Tester\nwitness: B. Witness\n", encoding="utf-8")
    text = run("check", archive / "amp" / "rev-A.yaml")
    (record,) = json.loads(run("check", "--format", "json", archive / "amp" / "rev-A.yaml").stdout)["records"]
    assert record["valid"] is True and record["commissioning"]["witness"] == "B. Witness"
    assert "  commissioning: " + record["commissioning"]["text"] in text.stdout


def test_a_missing_path_is_refused_alike_in_both_reports(tmp_path):
    text, as_json = run("check", tmp_path / "nothing"), run("check", "--format", "json", tmp_path / "nothing")
    assert text.exit_code == as_json.exit_code == 2
    (record,) = json.loads(as_json.stdout)["records"]
    assert record["valid"] is False and record["problems"][0]["code"] == "path_missing"
    assert "no such file or folder" in text.stdout


def test_diff_of_a_missing_record_exits_2_with_a_located_line(archive):
    result = run("diff", archive / "amp" / "rev-A.yaml", archive / "amp" / "rev-Z.yaml")
    assert result.exit_code == 2 and "rev-Z.yaml: no such file or folder" in result.stderr


def test_new_refused_exits_2(archive):
    result = run("new", "amp", "--archive", archive)
    assert result.exit_code == 2 and "dossier new:" in result.stderr and "already exists" in result.stderr


@pytest.mark.parametrize("named", ["rev-A.yaml", "."])
def test_a_relative_path_inside_a_build_folder_resolves_to_its_folder(named, archive, monkeypatch):
    monkeypatch.chdir(archive / "amp")
    result = run("check", named)
    assert result.exit_code in (0, 1), result.output
    assert "id_mismatch" not in result.output and "does not match the build folder" not in result.output
    assert "amp rev A" in result.stdout


def test_the_text_report_marks_each_verdict_with_the_word_the_summary_and_json_use(archive):
    text = run("check", "--all", archive / "amp" / "rev-A.yaml").stdout
    (record,) = json.loads(run("check", "--format", "json", archive / "amp" / "rev-A.yaml").stdout)["records"]
    marks = {line.split()[0] for line in text.splitlines() if line.startswith("  ") and not line.startswith("   ") and line.split()[1][:1].isupper()}
    assert marks and {mark.lower() for mark in marks} <= {finding["verdict"] for finding in record["findings"]}
    assert "ok" not in {mark.lower() for mark in marks}
