"""Calc plugins are validated when loaded; a broken one is named with the reason."""

from __future__ import annotations

import pytest

from tests.fixtures.entry_points import FakeEntryPoint
from dossier.findings import Finding, Verdict
from dossier.plugins import Calc, CalcResult, PluginError, load_calcs
from dossier.review import review, run_review


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
        (FakeEntryPoint("demo", Calc("demo", "D", good_run, "s", {"X": "x"}, products=["curve"])),
         "its products must map each product's name to its meaning, found list"),
        (FakeEntryPoint("demo", Calc("demo", "D", good_run, "s", {"X": "x"}, products={"curve": ""})),
         "product 'curve' needs a non-empty name and a one-line meaning"),
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
    from tests.fixtures.demo import DEMO

    monkeypatch.setattr(plugins, "entry_points", lambda group: [FakeEntryPoint("broken", error=ImportError("no module named x"))])
    result = CliRunner().invoke(main, ["check", str(DEMO / "solar-bank-charger" / "rev-A.yaml")])
    assert result.exit_code == 3
    assert "dossier check: calc plugin 'broken': could not be loaded: ImportError: no module named x" in result.output


def producing_run(record):
    return CalcResult(good_run(record), {"gap": 4.2})


PRODUCER = Calc(name="producer", title="Producer", run=producing_run, summary="s", codes={"DEMO-OK": "fine"},
                products={"gap": "a number later stages use"})


def test_a_third_party_calc_hands_on_products_beside_its_findings():
    reviewed = run_review(object(), [PRODUCER, GOOD])
    assert [f.code for f in reviewed.findings] == ["DEMO-OK", "DEMO-OK"]
    assert reviewed.product("producer", "gap") == 4.2
    assert reviewed.product("demo", "gap") is None  # a calc of findings alone hands on nothing
    assert list(producing_run(None)) == good_run(None)  # read as findings, a CalcResult is its findings


def test_an_undeclared_product_is_reported_and_not_handed_on():
    sloppy = Calc("producer", "Producer", producing_run, "s", {"DEMO-OK": "fine"})
    reviewed = run_review(object(), [sloppy])
    assert [f.code for f in reviewed.findings] == ["DEMO-OK", "CALC-ERROR"]
    assert "handed on undeclared products gap" in reviewed.findings[1].explanation
    assert reviewed.product("producer", "gap") is None


def test_a_crashed_calc_hands_on_no_product():
    def crash(record):
        raise ZeroDivisionError("division by zero")

    crashing = Calc("producer", "Producer", crash, "s", {"DEMO-OK": "fine"}, products={"gap": "g"})
    reviewed = run_review(object(), [crashing])
    assert [f.code for f in reviewed.findings] == ["CALC-ERROR"] and reviewed.products == {}


def test_the_code_and_product_names_calcs_export_are_the_ones_they_declare():
    from dossier.calcs import charge, isolation, magnetics, protection, thermal

    exported = {isolation: (isolation.CLEARANCE, isolation.CREEPAGE), protection: (protection.FUSE_RECOMMENDED,),
                thermal: (thermal.JUNCTION, thermal.HEATSINK), magnetics: (magnetics.TEMP_RISE,)}
    for module, codes in exported.items():
        assert set(codes) <= set(module.CALC.codes), f"{module.__name__} exports a code its calc does not declare"
    assert charge.CURVE in charge.CALC.products and protection.FUSE in protection.CALC.products
    assert (charge.NAME, protection.NAME) == (charge.CALC.name, protection.CALC.name)
