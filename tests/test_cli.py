"""The command line: exit codes, output shapes, and no traceback for bad input."""

from __future__ import annotations

import json
import shutil

from click.testing import CliRunner

from dossier.cli import main
from conftest import DEMO


def run(*args):
    return CliRunner().invoke(main, [str(a) for a in args])


def test_check_on_a_clean_record_exits_0():
    result = run("check", DEMO / "solar-bank-charger" / "rev-C.yaml")
    assert result.exit_code == 0, result.output
    assert "rev C" in result.output
    assert "Mains voltages can kill" in result.output


def test_check_on_the_demo_archive_exits_1_because_rev_a_fails_on_purpose():
    result = run("check", DEMO)
    assert result.exit_code == 1
    assert "FAIL  ISO-CLEARANCE" in result.output and "FAIL  PROT-INRUSH" in result.output


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
    assert set(record) == {"file", "valid", "counts", "findings"}
    assert set(record["counts"]) == {"fail", "marginal", "pass", "info"}
    for finding in record["findings"]:
        assert {"code", "calc", "subject", "title", "verdict", "values", "limit", "relation", "method", "explanation", "keys", "sources"} == set(finding)


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
