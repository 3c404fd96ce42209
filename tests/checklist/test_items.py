"""The checklist's items: the trade's general ones, and the ones derived from each demo build."""

from __future__ import annotations

import pytest
from tests.fixtures.checklists import DEMO_REVISIONS, checklist_of, demo

from dossier.calcs.protection import FUSE, NAME as PROTECTION
from dossier.checklist.items import Expected, Origin, Phase
from dossier.checklist.output_items import e12_at_most, resistor_rating
from dossier.checklist.sheet import build_checklist
from dossier.record.protection import Earth
from dossier.standards.fuses import marking
from dossier.units import Q_


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
    assert general == {"visual-inspection", "pe-continuity", "insulation-mains-metal", "insulation-mains-output",
                       "one-hand", "isolating-supply", "series-lamp", "bleed-capacitors"}
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
    entry = item("sw-charger-12v", "C", "pe-continuity")
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
    loaded, reviewed = demo("sw-charger-12v", "C")
    protection = loaded.record.protection.model_copy(update={"earth": Earth(protective_class="II", enclosure="plastic")})
    record = loaded.record.model_copy(update={"protection": protection})
    checklist = build_checklist(record, reviewed)
    assert checklist.item("pe-continuity") is None
    # DIN EN 50678:2021: class II at least 2.0 MOhm at 500 V DC.
    assert checklist.item("insulation-mains-metal").expected.low == Q_(2.0, "megaohm")



def test_a_declared_fuse_that_passes_is_the_one_to_fit():
    # demo rev C declares T2A, which passes every protection check; the smallest that would do is smaller
    _, reviewed = demo("sw-charger-12v", "C")
    choice = reviewed.product(PROTECTION, FUSE)
    assert choice.declared_fits
    entry = item("sw-charger-12v", "C", "mains-fuse")
    assert entry.title == "Mains fuse F1: fit T2A"
    assert "Fit F1: T2A 250 V ceramic, breaking capacity 1500 A, as the record declares" in entry.steps
    assert f"The smallest preferred rating that would also do is {marking(choice.rating, choice.speed)}" in entry.steps


def test_a_declared_fuse_that_fails_gives_way_to_the_recommendation():
    # demo rev A declares F1A fast-acting glass, which blows at every switch-on
    _, reviewed = demo("sw-charger-12v", "A")
    choice = reviewed.product(PROTECTION, FUSE)
    assert not choice.declared_fits
    entry = item("sw-charger-12v", "A", "mains-fuse")
    fit = marking(choice.rating, choice.speed)
    assert entry.title == f"Mains fuse F1: fit {fit}"
    assert fit.startswith("T")
    assert "The record declares F1A 250 V glass" in entry.steps
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
    assert [k for k in keys("sw-charger-12v", "C") if k.startswith("tab-isolation")] == ["tab-isolation-q1", "tab-isolation-q2"]
    entry = item("sw-charger-12v", "C", "tab-isolation-q1")
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
    entry = item("sw-charger-12v", "C", "minimum-load")
    assert entry.expected.low == Q_(0.1, "A")
    # 14.4 V / 0.1 A = 144 ohm -> 120 ohm (E12 below), 14.4^2 / 120 = 1.73 W -> a 5 W part.
    assert "120 Ω" in entry.steps and "5 W" in entry.steps and "1.73 W" in entry.steps
    assert "minimum-load" not in keys("bench-psu-13v8", "A")


def test_output_settings_with_their_ranges():
    voltage = item("sw-charger-12v", "C", "output-voltage")
    assert voltage.expected.low.to("V").magnitude == pytest.approx(14.4 * 0.98)
    assert voltage.expected.high.to("V").magnitude == pytest.approx(14.4 * 1.02)
    floating = item("sw-charger-12v", "C", "float-voltage")
    assert floating.expected.contains(Q_(13.6, "V")) and not floating.expected.contains(Q_(13.9, "V"))
    current = item("sw-charger-12v", "C", "output-current")
    assert current.expected.low.to("A").magnitude == pytest.approx(5.88) and current.unit == "A"
    bench = item("bench-psu-13v8", "A", "output-full-load")
    assert bench.expected.text("V") == "13.7 V to 13.9 V"
    assert "4.6 Ω" in bench.steps  # 13.8 V / 3 A


def test_an_output_without_a_tolerance_has_no_range_and_says_so():
    entry = item("rotator-control", "A", "output-voltage")
    assert entry.expected is None
    assert "no output tolerance" in entry.note


def test_a_chargers_battery_lead_fuse_and_polarity():
    fuse = item("sw-charger-12v", "C", "output-lead-fuse")
    assert fuse.expected.high == Q_(150, "mm")
    assert "F2" in fuse.title
    polarity = item("sw-charger-12v", "C", "output-polarity")
    assert "series Schottky D9" in polarity.steps
    assert item("sw-charger-12v", "A", "output-lead-fuse").title == "Battery-lead fuse: none recorded"
    assert "output-polarity" not in keys("bench-psu-13v8", "A")


def test_soak_points_and_their_limits():
    assert [k for k in keys("sw-charger-12v", "C") if k.startswith("soak-")] == [
        "soak-run", "soak-room", "soak-hs1", "soak-hs2", "soak-t1", "soak-t2", "soak-l1"]
    touchable = item("sw-charger-12v", "C", "soak-hs2")
    # Touch limit from the thermal calc (IEC 62368-1, accessible metal; the calc cites it) 60 degC,
    # less the record's highest ambient 35 degC: a rise of 25 K.
    assert touchable.expected.high == Q_(25, "K")
    assert "touch limit" in touchable.note
    enclosed = item("sw-charger-12v", "C", "soak-hs1")
    assert "junction" in enclosed.note and enclosed.expected.high > Q_(25, "K")
    # The magnetics calc's limit: 100 degC core material less 35 degC ambient.
    assert item("sw-charger-12v", "C", "soak-t1").expected.high == Q_(65, "K")
    assert item("bench-psu-13v8", "A", "soak-hs1").expected.high == Q_(30, "K")
    run = item("bench-psu-13v8", "A", "soak-run")
    assert run.expected.low == Q_(60, "minute") and "3 A" in run.title


def test_the_series_lamp_is_sized_from_the_input_power():
    # Common practice: a lamp of roughly the unit's input power. 14.4 V x 6 A / 0.8 = 108 W -> 100 W.
    assert "about 100 W" in item("sw-charger-12v", "C", "series-lamp").steps
    # 13.8 V x 3 A / 0.55 = 75 W -> 75 W; rated for the 120 V mains.
    lamp = item("bench-psu-13v8", "A", "series-lamp")
    assert "about 75 W" in lamp.steps and "120 V" in lamp.steps


def test_capacitors_to_bleed_and_their_peak_voltage():
    entry = item("sw-charger-12v", "C", "bleed-capacitors")
    assert "C5, C6" in entry.steps
    assert "358 V" in entry.steps  # 230 V + 10 % times the square root of 2


def test_a_chargers_own_current_limit_and_compensation_are_used():
    loaded, reviewed = demo("sw-charger-12v", "C")
    output = loaded.record.output
    battery = output.battery.model_copy(update={"charge_current": Q_(4, "A"), "compensation": Q_(-18, "mV/K")})
    record = loaded.record.model_copy(update={"output": output.model_copy(update={"battery": battery})})
    checklist = build_checklist(record, reviewed)
    current = checklist.item("output-current")
    assert current.title == "Charge current limit, 4 A"
    assert current.expected.contains(Q_(4.05, "A")) and not current.expected.contains(Q_(6, "A"))
    assert "-18 mV/K" in checklist.item("output-voltage").steps
    assert checklist.item("output-voltage").title == "Absorption (constant-voltage) setting, 14.4 V"


def test_a_live_tab_without_a_pad_makes_the_heatsink_live():
    loaded, reviewed = demo("sw-charger-12v", "C")
    devices = loaded.record.devices
    bare = [d.model_copy(update={"insulated": False}) if d.ref == "Q1" else d for d in devices.semiconductors]
    record = loaded.record.model_copy(update={"devices": devices.model_copy(update={"semiconductors": bare})})
    checklist = build_checklist(record, reviewed)
    live = checklist.item("tab-isolation-q1")
    assert live.title == "Heatsink HS1 is live through Q1's tab"
    assert not live.measured
    assert checklist.item("tab-isolation-q2").expected.low == Q_(1.0, "megaohm")
