"""Calc plugins are validated when loaded; a broken one is named with the reason."""

from __future__ import annotations

import pytest

from conftest import FakeEntryPoint
from dossier.findings import Finding, Verdict
from dossier.plugins import Calc, PluginError, load_calcs
from dossier.review import review


def good_run(record):
    return [Finding(code="DEMO-OK", calc="demo", subject="unit", title="fine", verdict=Verdict.PASS)]


GOOD = Calc(name="demo", title="Demo", run=good_run, summary="A demo.", codes={"DEMO-OK": "always fine"})


def test_builtin_calcs_load_through_entry_points_like_any_other():
    names = [calc.name for calc in load_calcs()]
    assert {"isolation", "protection", "magnetics", "stress", "thermal", "charge"} <= set(names)


def test_a_valid_third_party_calc_loads():
    assert load_calcs([FakeEntryPoint("demo", GOOD)]) == [GOOD]


@pytest.mark.parametrize(
    "point, reason",
    [
        (FakeEntryPoint("broken", error=ImportError("no module named x")), "could not be loaded: ImportError: no module named x"),
        (FakeEntryPoint("demo", target=good_run), "entry point must name a dossier.plugins.Calc, found function"),
        (FakeEntryPoint("other", GOOD), "its Calc is named 'demo'; the entry point and the Calc must share one name"),
        (FakeEntryPoint("demo", Calc("demo", "D", lambda a, b: [], "s", {"X": "x"})), "run must take exactly one argument (the record), takes 2"),
        (FakeEntryPoint("demo", Calc("demo", "D", good_run, "s", {})), "declares no finding codes"),
    ],
)
def test_a_broken_plugin_is_named_at_load_time(point, reason):
    with pytest.raises(PluginError) as raised:
        load_calcs([point])
    assert str(raised.value) == f"calc plugin '{point.name}': {reason}"


def test_a_calc_that_crashes_becomes_a_failing_finding_and_others_still_run():
    def crash(record):
        raise ZeroDivisionError("division by zero")

    crashing = Calc("crashy", "Crashy", crash, "s", {"C-X": "x"})
    findings = review(object(), [crashing, GOOD])
    assert [f.code for f in findings] == ["CALC-ERROR", "DEMO-OK"]
    assert findings[0].verdict is Verdict.FAIL
    assert "ZeroDivisionError" in findings[0].explanation


def test_undeclared_codes_are_reported():
    sloppy = Calc("demo", "Demo", good_run, "s", {"OTHER": "x"})
    codes = [f.code for f in review(object(), [sloppy])]
    assert codes == ["DEMO-OK", "CALC-ERROR"]


def test_the_cli_names_a_broken_plugin_without_a_traceback(monkeypatch):
    from click.testing import CliRunner

    from dossier import plugins
    from dossier.cli import main
    from conftest import DEMO

    monkeypatch.setattr(plugins, "entry_points", lambda group: [FakeEntryPoint("broken", error=ImportError("no module named x"))])
    result = CliRunner().invoke(main, ["check", str(DEMO / "solar-bank-charger" / "rev-A.yaml")])
    assert result.exit_code == 3
    assert "Error: calc plugin 'broken': could not be loaded: ImportError: no module named x" in result.output
