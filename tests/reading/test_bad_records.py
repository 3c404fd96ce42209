"""Every malformed record in tests/reading/cases/bad-records gives exactly the located problems its header expects."""

from __future__ import annotations

from pathlib import Path

import pytest

from dossier.problems import InputError
from dossier.reading.record import load_record
from dossier.wording import problem_line
from tests.fixtures.bad_input import tried

CASES = sorted((Path(__file__).parent / "cases" / "bad-records").glob("*.yaml"))


def expected_lines(path: Path) -> list[str]:
    return [line.removeprefix("# expect: ").rstrip() for line in path.read_text(encoding="utf-8").splitlines() if line.startswith("# expect: ")]


@pytest.mark.parametrize("case", CASES, ids=[c.stem for c in CASES])
def test_bad_record_reports_located_problems(case: Path):
    tried("malformed records kept in tests/reading/cases/bad-records")
    with pytest.raises(InputError) as raised:
        load_record(case, shown_as="CASE")
    assert sorted(problem_line(p) for p in raised.value.problems) == sorted(expected_lines(case))


def test_every_case_declares_what_it_expects():
    assert CASES and all(expected_lines(case) for case in CASES)


def test_a_record_whose_values_would_overflow_is_refused_before_any_calc(tmp_path):
    from dossier.commands.check import run_check
    from dossier.commands.exits import check_status
    from dossier.report.json_report import check_json

    tried("malformed records kept in tests/reading/cases/bad-records")
    folder = tmp_path / "case"
    folder.mkdir()
    case = Path(__file__).parent / "cases" / "bad-records" / "absurd-magnitudes.yaml"
    (folder / "rev-A.yaml").write_text(case.read_text(encoding="utf-8"), encoding="utf-8")
    result = run_check([folder / "rev-A.yaml"])
    text = check_json(result, int(check_status(result)))
    assert check_status(result) == 2 and "Infinity" not in text and "NaN" not in text
