"""The command line: exit codes, output shapes, and no traceback for bad input."""

from __future__ import annotations

import json
import shutil

from click.testing import CliRunner

from dossier.cli import main
from tests.fixtures.demo import DEMO


def run(*args):
    return CliRunner().invoke(main, [str(a) for a in args])


def test_check_on_a_clean_record_exits_0():
    result = run("check", DEMO / "solar-bank-charger" / "rev-D.yaml")
    assert result.exit_code == 0, result.output
    assert "rev D" in result.output
    assert "Mains voltages can kill" in result.output


def test_check_on_the_demo_archive_exits_1_because_rev_a_fails_on_purpose():
    result = run("check", DEMO)
    assert result.exit_code == 1
    marked = {tuple(line.split()[:2]) for line in result.output.splitlines() if line.startswith("  ")}
    assert ("FAIL", "ISO-CLEARANCE") in marked and ("FAIL", "PROT-INRUSH") in marked


def test_a_broken_commissioning_record_is_located(tmp_path):
    build = shutil.copytree(DEMO / "solar-bank-charger", tmp_path / "solar-bank-charger")
    path = build / "commissioning-C.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("witness:", "witnes:", 1), encoding="utf-8")
    result = run("check", build / "rev-C.yaml")
    assert result.exit_code == 2
    assert "commissioning-C.yaml:" in result.output and "witnes" in result.output
    assert "Traceback" not in result.output


def test_check_on_an_invalid_record_exits_2_with_located_problems(tmp_path):
    build = tmp_path / "broken"
    build.mkdir()
    (build / "rev-A.yaml").write_text("id: broken\ntitle: x\nrevision: A\ndate: 2026-01-01\nauthors: [a]\nstatus: design\nmains: {nominal: 230, frequency: 50 Hz}\n", encoding="utf-8")
    result = run("check", build)
    assert result.exit_code == 2
    assert f"{build / 'rev-A.yaml'}:7:18: mains.nominal: a unit is needed" in result.output
    assert "Traceback" not in result.output


def test_revision_must_match_its_file_name(tmp_path):
    build = tmp_path / "solar-bank-charger"
    shutil.copytree(DEMO / "solar-bank-charger", build)
    (build / "rev-A.yaml").rename(build / "rev-D.yaml")
    result = run("check", build / "rev-D.yaml")
    assert result.exit_code == 2
    assert "revision: revision does not match the file name; expected 'D', as in the file name rev-D.yaml, found 'A'" in result.output


def test_missing_path_exits_2():
    result = run("check", "/nonexistent/place")
    assert result.exit_code == 2
    assert "/nonexistent/place: no such file or folder" in result.output


def test_json_output_has_the_documented_shape():
    result = run("check", "--format", "json", DEMO / "solar-bank-charger" / "rev-A.yaml")
    body = json.loads(result.output)
    assert body["shape"] == 1 and body["exit_code"] == result.exit_code
    (record,) = body["records"]
    assert set(record) == {"file", "valid", "counts", "findings", "problems", "signoff"} and record["problems"] == []
    assert set(record["counts"]) == {"fail", "not-assessed", "marginal", "pass", "info"}
    for finding in record["findings"]:
        assert {"code", "calc", "subject", "title", "verdict", "values", "limit", "extra", "relation", "method", "explanation",
                "keys", "sources", "guards_hazard", "blocks_power_up"} == set(finding)


def test_schema_is_json_schema_with_units_described():
    body = json.loads(run("schema").output)
    assert body["$schema"].endswith("2020-12/schema")
    nominal = body["$defs"]["Mains"]["properties"]["nominal"]
    assert nominal["x-quantity"] == "voltage (e.g. 230 V)"


def test_new_scaffolds_a_record_that_validates(tmp_path):
    result = run("new", "bench-amp", "--archive", tmp_path)
    assert result.exit_code == 0, result.output
    path = tmp_path / "bench-amp" / "rev-A.yaml"
    assert path.exists()
    assert run("check", path).exit_code in (0, 1)


def test_new_never_overwrites(tmp_path):
    run("new", "bench-amp", "--archive", tmp_path)
    path = tmp_path / "bench-amp" / "rev-A.yaml"
    path.write_text("mine", encoding="utf-8")
    result = run("new", "bench-amp", "--archive", tmp_path)
    assert result.exit_code == 2
    assert "already exists" in result.output
    assert path.read_text(encoding="utf-8") == "mine"


def test_new_starts_an_archive_in_one_command(tmp_path):
    archive = tmp_path / "club" / "archive"
    result = run("new", "bench-amp", "--archive", archive)
    assert result.exit_code == 0, result.output
    assert (archive / "archive.yaml").is_file()
    assert run("check", archive).exit_code in (0, 1)
    assert run("build", archive, "--pages-only", "-o", tmp_path / "pages").exit_code == 0


def test_new_points_the_record_at_a_schema_the_archive_has(tmp_path):
    run("new", "bench-amp", "--archive", tmp_path)
    first = (tmp_path / "bench-amp" / "rev-A.yaml").read_text(encoding="utf-8").splitlines()[0]
    assert first == "# yaml-language-server: $schema=../record.schema.json"
    schema = json.loads((tmp_path / "record.schema.json").read_text(encoding="utf-8"))
    assert schema == json.loads(run("schema").output)


def test_new_refreshes_a_stale_schema_but_leaves_archive_settings_alone(tmp_path):
    (tmp_path / "archive.yaml").write_text("club: mine\n", encoding="utf-8")
    (tmp_path / "record.schema.json").write_text("{}", encoding="utf-8")
    run("new", "bench-amp", "--archive", tmp_path)
    assert (tmp_path / "archive.yaml").read_text(encoding="utf-8") == "club: mine\n"
    assert json.loads((tmp_path / "record.schema.json").read_text(encoding="utf-8")) == json.loads(run("schema").output)


def test_new_refuses_an_archive_path_that_is_a_file(tmp_path):
    (tmp_path / "taken").write_text("mine", encoding="utf-8")
    result = run("new", "bench-amp", "--archive", tmp_path / "taken")
    assert result.exit_code == 2 and "is a file" in result.output
    assert (tmp_path / "taken").read_text(encoding="utf-8") == "mine"
