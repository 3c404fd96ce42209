"""The checklist's items: the trade's general ones, and the ones derived from each demo build."""

from __future__ import annotations

import pytest
from tests.fixtures.checklists import DEMO_REVISIONS, checklist_of, demo

from tests.fixtures.demo import RECORDS

from dossier.reading.archive import RevisionFile, load_revision
from dossier.calcs.protection import recommended_fuse
from dossier.checklist.items import Expected, Origin, Phase
from dossier.checklist.output_items import e12_at_most, resistor_rating
from dossier.checklist.sheet import build_checklist
from dossier.record.protection import Earth
from dossier.standards.fuses import marking
from dossier.plugins import load_calcs
from dossier.review import run_review
from dossier.units import Q_


def selfosc_checklist():
    """The checklist of the test-only self-oscillating supply (its rectifier heatsink can be touched)."""
    loaded = load_revision(RevisionFile("selfosc-psu", "A", RECORDS / "selfosc-psu" / "rev-A.yaml"))
    return checklist_for(loaded.record)


def checklist_for(record):
    """The checklist of a (possibly changed) record, from its own review: findings and products agree with it."""
    return build_checklist(record, run_review(record, load_calcs()))


def keys(build, revision) -> list[str]:
    return [item.key for item in checklist_of(build, revision).items]


def item(build, revision, key):
    found = checklist_of(build, revision).item(key)
    assert found is not None, f"{build} rev {revision} has no item {key}"
    return found


@pytest.mark.parametrize("build, revision", DEMO_REVISIONS)
def test_every_sheet_has_the_general_items_in_phase_order(build, revision):
    checklist = checklist_of(build, revision)
    general = {i.key for i in checklist.items if i.origin is Origin.GENERAL}
    # every demo unit is class I, so each also gets the protective-conductor current item
    assert general == {"visual-inspection", "pe-continuity", "insulation-mains-metal", "insulation-mains-output",
                       "one-hand", "isolating-supply", "series-lamp", "pe-current", "bleed-capacitors"}
    phases = [i.phase for i in checklist.items]
    assert phases == sorted(phases, key=list(Phase).index)
    assert len(set(keys(build, revision))) == len(checklist.items), "item ids must be unique"


@pytest.mark.parametrize("build, revision", DEMO_REVISIONS)
def test_measured_items_carry_a_unit_and_ticked_items_none(build, revision):
    for entry in checklist_of(build, revision).items:
        if entry.expected is not None:
            assert entry.unit, entry.key
            assert entry.expected_text, entry.key
        if entry.unit:
            Q_(1, entry.unit)  # a unit the registry knows


def test_earth_continuity_limit_and_its_source():
    entry = item("solar-bank-charger", "C", "pe-continuity")
    # IET Code of Practice for In-service Inspection and Testing of Electrical Equipment (The IET):
    # protective-earth continuity at most 0.1 ohm plus the resistance of the supply cord's earth conductor.
    assert entry.expected == Expected(high=Q_(0.1, "ohm"))
    assert "The Institution of Engineering and Technology" in entry.sources[0].publisher
    assert "earth conductor" in entry.steps
    assert "heatsink HS1" in entry.steps  # the earthed heatsink is named among the parts to measure


def test_insulation_resistance_minimums_and_test_voltage():
    metal = item("bench-psu-13v8", "A", "insulation-mains-metal")
    output = item("bench-psu-13v8", "A", "insulation-mains-output")
    # DIN EN 50678:2021 (earlier DIN VDE 0701-0702:2008), DKE/VDE: insulation resistance at 500 V DC,
    # protective class I at least 1.0 MOhm, class II (double or reinforced insulation) at least 2.0 MOhm.
    assert metal.expected.low == Q_(1.0, "megaohm")
    assert output.expected.low == Q_(2.0, "megaohm")  # the transformer barrier is reinforced
    assert "500 V DC" in metal.steps and "500 V DC" in output.steps
    assert "DIN EN 50678" in metal.sources[0].title and "0701-0702:2008" in metal.sources[0].edition


def test_a_class_ii_unit_has_no_earth_item_and_the_higher_insulation_minimum():
    loaded, _ = demo("solar-bank-charger", "C")
    protection = loaded.record.protection.model_copy(update={"earth": Earth(protective_class="II", enclosure="plastic")})
    record = loaded.record.model_copy(update={"protection": protection})
    checklist = checklist_for(record)
    assert checklist.item("pe-continuity") is None
    # DIN EN 50678:2021: class II at least 2.0 MOhm at 500 V DC.
    assert checklist.item("insulation-mains-metal").expected.low == Q_(2.0, "megaohm")



def test_a_declared_fuse_that_passes_is_the_one_to_fit():
    # demo rev C declares T3.15A, which passes every protection check and is itself the smallest that would do
    loaded, _ = demo("solar-bank-charger", "C")
    choice = recommended_fuse(loaded.record)
    assert choice.declared_fits and marking(choice.rating, choice.speed) == "T3.15A"
    entry = item("solar-bank-charger", "C", "mains-fuse")
    assert entry.title == "Mains fuse F1: fit T3.15A"
    assert "Fit F1: T3.15A 250 V ceramic, breaking capacity 1500 A, as the record declares" in entry.steps
    assert "would also do" not in entry.steps


def test_a_declared_fuse_larger_than_needed_names_the_smallest_that_would_do():
    loaded, _ = demo("solar-bank-charger", "C")
    fuse = loaded.record.protection.fuse.model_copy(update={"rating": Q_(4, "A")})
    record = loaded.record.model_copy(update={"protection": loaded.record.protection.model_copy(update={"fuse": fuse})})
    choice = recommended_fuse(record)
    entry = checklist_for(record).item("mains-fuse")
    assert entry.title == "Mains fuse F1: fit T4A"
    assert f"The smallest preferred rating that would also do is {marking(choice.rating, choice.speed)}" in entry.steps


def test_a_declared_fuse_that_fails_gives_way_to_the_recommendation():
    # demo rev A declares F2.5A fast-acting ceramic, which blows at every switch-on
    loaded, _ = demo("solar-bank-charger", "A")
    choice = recommended_fuse(loaded.record)
    assert not choice.declared_fits
    entry = item("solar-bank-charger", "A", "mains-fuse")
    fit = marking(choice.rating, choice.speed)
    assert entry.title == f"Mains fuse F1: fit {fit}"
    assert fit.startswith("T")
    assert "The record declares F2.5A 250 V ceramic" in entry.steps
    assert "melting I^2 t is at least" in entry.steps


@pytest.mark.parametrize("build, revision", DEMO_REVISIONS)
def test_clearance_and_creepage_at_every_barrier_come_from_the_isolation_findings(build, revision):
    loaded, reviewed = demo(build, revision)
    for barrier in loaded.record.barriers:
        for kind, code in (("clearance", "ISO-CLEARANCE"), ("creepage", "ISO-CREEPAGE")):
            finding = next(f for f in reviewed.findings if f.code == code and f.subject == barrier.name)
            entry = next(i for i in checklist_of(build, revision).items if i.key.startswith(kind) and f"'{barrier.name}'" in i.title)
            assert entry.expected.low == finding.limit.quantity
            assert entry.unit == "mm"
            assert entry.sources == finding.sources
            assert f"declares {getattr(barrier, kind).magnitude:g} mm" in entry.steps


def test_live_tabs_on_heatsinks_get_an_isolation_test():
    assert [k for k in keys("solar-bank-charger", "C") if k.startswith("tab-isolation")] == ["tab-isolation-q1", "tab-isolation-q2"]
    entry = item("solar-bank-charger", "C", "tab-isolation-q1")
    # DIN EN 50678:2021: 1.0 MOhm for basic insulation to earthed metal (HS1 is earthed).
    assert entry.expected.low == Q_(1.0, "megaohm")
    assert "HS1" in entry.title
    assert not [k for k in keys("bench-psu-13v8", "A") if k.startswith("tab-isolation")]  # its pass transistor's tab is not live
    assert not [k for k in keys("rotator-control", "A") if k.startswith("tab-isolation")]


def test_e12_values_and_resistor_ratings():
    # IEC 60063, E12 series: 1.0 1.2 1.5 1.8 2.2 2.7 3.3 3.9 4.7 5.6 6.8 8.2 per decade.
    assert e12_at_most(144) == pytest.approx(120)
    assert e12_at_most(120) == pytest.approx(120)
    assert e12_at_most(0.9) == pytest.approx(0.82)
    assert e12_at_most(4_700) == pytest.approx(4_700)
    # Common practice: a load resistor rated for at least twice what it dissipates.
    assert resistor_rating(1.73) == 5
    assert resistor_rating(0.2) == 0.5


def test_minimum_load_when_the_record_needs_one():
    entry = item("solar-bank-charger", "C", "minimum-load")
    assert entry.expected.low == Q_(0.05, "A")
    # 29 V / 0.05 A = 580 ohm -> 560 ohm (E12 below), 29^2 / 560 = 1.50 W -> a 5 W part (twice 1.5 W is above 2 W).
    assert "560 Ω" in entry.steps and "5 W" in entry.steps and "1.5 W" in entry.steps
    assert "minimum-load" not in keys("bench-psu-13v8", "A")


def test_output_settings_with_their_ranges():
    voltage = item("solar-bank-charger", "C", "output-voltage")
    assert voltage.expected.low.to("V").magnitude == pytest.approx(29.0 * 0.995)
    assert voltage.expected.high.to("V").magnitude == pytest.approx(29.0 * 1.005)
    floating = item("solar-bank-charger", "C", "float-voltage")
    assert floating.expected.contains(Q_(27.3, "V")) and not floating.expected.contains(Q_(27.5, "V"))
    current = item("solar-bank-charger", "C", "output-current")
    assert current.expected.low.to("A").magnitude == pytest.approx(7 * 0.995) and current.unit == "A"
    bench = item("bench-psu-13v8", "A", "output-full-load")
    assert bench.expected.text("V") == "13.7 V to 13.9 V"
    assert "4.6 Ω" in bench.steps  # 13.8 V / 3 A


def test_an_output_without_a_tolerance_has_no_range_and_says_so():
    entry = item("rotator-control", "A", "output-voltage")
    assert entry.expected is None
    assert "no output tolerance" in entry.note


def test_a_chargers_battery_lead_fuse_and_polarity():
    fuse = item("solar-bank-charger", "C", "output-lead-fuse")
    assert fuse.expected.high == Q_(120, "mm")
    assert "F2" in fuse.title
    polarity = item("solar-bank-charger", "C", "output-polarity")
    assert "diode D9 across the output" in polarity.steps
    loaded, _ = demo("solar-bank-charger", "A")
    unfused = loaded.record.model_copy(update={"protection": loaded.record.protection.model_copy(update={"output_fuse": None})})
    assert checklist_for(unfused).item("output-lead-fuse").title == "Battery-lead fuse: none recorded"
    assert "output-polarity" not in keys("bench-psu-13v8", "A")


def test_soak_points_and_their_limits():
    assert [k for k in keys("solar-bank-charger", "C") if k.startswith("soak-")] == [
        "soak-run", "soak-room", "soak-hs1", "soak-hs2", "soak-t1", "soak-t2", "soak-l1"]
    touchable = selfosc_checklist().item("soak-hs2")
    # Touch limit from the thermal calc (IEC 62368-1, accessible metal; the calc cites it) 60 degC,
    # less the test record's highest ambient 30 degC: a rise of 30 K.
    assert touchable.expected.high == Q_(30, "K")
    assert "touch limit" in touchable.note
    for enclosed in (item("solar-bank-charger", "C", "soak-hs1"), item("solar-bank-charger", "C", "soak-hs2")):
        assert "junction" in enclosed.note and enclosed.expected.high > Q_(30, "K")
    # The magnetics calc's limit: 100 degC core material less 40 degC ambient.
    assert item("solar-bank-charger", "C", "soak-t1").expected.high == Q_(60, "K")
    assert item("bench-psu-13v8", "A", "soak-hs1").expected.high == Q_(30, "K")
    run = item("bench-psu-13v8", "A", "soak-run")
    assert run.expected.low == Q_(60, "minute") and "3 A" in run.title


def test_the_series_lamp_is_sized_from_the_input_power():
    # Common practice: a lamp of roughly the unit's input power. 29 V x 7 A / 0.86 = 236 W -> 200 W.
    assert "about 200 W" in item("solar-bank-charger", "C", "series-lamp").steps
    # 13.8 V x 3 A / 0.55 = 75 W -> 75 W; rated for the 120 V mains.
    lamp = item("bench-psu-13v8", "A", "series-lamp")
    assert "about 75 W" in lamp.steps and "120 V" in lamp.steps


def test_capacitors_to_bleed_and_their_peak_voltage():
    entry = item("solar-bank-charger", "C", "bleed-capacitors")
    assert "C2, C5, C6" in entry.steps
    assert "358 V" in entry.steps  # 230 V + 10 % times the square root of 2


def test_a_chargers_own_current_limit_and_compensation_are_used():
    loaded, _ = demo("solar-bank-charger", "C")
    output = loaded.record.output
    battery = output.battery.model_copy(update={"charge_current": Q_(5, "A"), "compensation": Q_(-30, "mV/K")})
    record = loaded.record.model_copy(update={"output": output.model_copy(update={"battery": battery})})
    checklist = checklist_for(record)
    current = checklist.item("output-current")
    assert current.title == "Charge current limit, 5 A"
    assert current.expected.contains(Q_(5.02, "A")) and not current.expected.contains(Q_(7, "A"))
    assert "-30 mV/K" in checklist.item("output-voltage").steps
    assert checklist.item("output-voltage").title == "Absorption (constant-voltage) setting, 29 V"


def test_a_live_tab_without_a_pad_makes_the_heatsink_live():
    loaded, _ = demo("solar-bank-charger", "C")
    devices = loaded.record.devices
    bare = [d.model_copy(update={"insulated": False}) if d.ref == "Q1" else d for d in devices.semiconductors]
    record = loaded.record.model_copy(update={"devices": devices.model_copy(update={"semiconductors": bare})})
    checklist = checklist_for(record)
    live = checklist.item("tab-isolation-q1")
    assert live.title == "Heatsink HS1 is live through Q1's tab"
    assert not live.measured
    assert checklist.item("tab-isolation-q2").expected.low == Q_(1.0, "megaohm")
