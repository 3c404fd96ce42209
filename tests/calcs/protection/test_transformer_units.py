"""Transformer-input units: the switch-on surge bound, soft-starts, secondary banks, load kinds, what the mains fuse must
protect and clear, the rectifier's surge rating, and a test station's RCD, series lamp, variac and isolated output.

The records are the test-only toroidal amplifier supply and repair station under tests/cases/records (flawed rev A,
fixed rev B), changed here one key at a time.
"""

from __future__ import annotations

import copy
import math

import pytest
import yaml

from dossier.calcs.shared.core_geometry import effective_from_constants, toroid_constants
from dossier.calcs.protection import CALC, recommended_fuse
from dossier.calcs.protection.bounds import _rated_i2t
from dossier.calcs.protection.inrush import referred_capacitance
from dossier.calcs.shared.input_current import TRANSFORMER_CAPACITOR_INPUT, input_current, input_topology
from dossier.changes import finding_changes
from dossier.checklist.sheet import build_checklist
from dossier.findings import Verdict
from dossier.plugins import load_calcs
from dossier.record.model import Record
from dossier.record.devices import Semiconductor
from dossier.review import run_review
from dossier.units import Q_
from tests.fixtures.demo import RECORDS, load_test_record

AMP, STATION = "toroid-amp-supply", "repair-station"


def data(build: str, revision: str = "B") -> dict:
    return yaml.safe_load((RECORDS / build / f"rev-{revision}.yaml").read_text(encoding="utf-8"))


def record_of(build: str, revision: str = "B", **changes) -> Record:
    """The test record with dotted keys ('a__b') set; None removes the key."""
    found = copy.deepcopy(data(build, revision))
    for dotted, value in changes.items():
        *parents, last = dotted.split("__")
        target = found
        for key in parents:
            target = target[int(key)] if isinstance(target, list) else target.setdefault(key, {})
        if value is None:
            target.pop(last, None)
        else:
            target[last] = value
    return Record.model_validate(found)


def by_code(record) -> dict:
    return {(f.code, f.subject): f for f in CALC.run(record)}


def one(record, code: str):
    found = [f for f in CALC.run(record) if f.code == code]
    assert len(found) == 1, [f.subject for f in found]
    return found[0]


def values(finding) -> dict:
    return {m.label: m.quantity for m in finding.values}


# 1. The transformer's switch-on surge

def test_the_surge_bound_is_the_crest_of_high_line_over_the_path_resistance():
    # Elliott Sound Products, Project 39: the worst switch-on is at a zero crossing and is limited only by the wiring
    # and winding resistance. With a measured primary of 0.25 ohm, 0.3 ohm of supply and no soft-start:
    # sqrt 2 x 132 V / 0.55 ohm = 339.4 A; one half-sine of a 60 Hz half-cycle: 339.4^2 x 8.33 ms / 2 = 480 A^2 s.
    record = record_of(AMP, protection__inrush_limiter=None, magnetics__0__windings__0__resistance="0.25 ohm")
    surge = one(record, "PROT-SURGE-TRANSFORMER")
    found = values(surge)
    assert found["peak with the core taken as air"].to("A").magnitude == pytest.approx(math.sqrt(2) * 132 / 0.55, rel=1e-9)
    assert found["peak current (upper bound)"] <= found["peak with the core taken as air"]
    peak = found["peak current (upper bound)"].to("A").magnitude
    assert surge.value.quantity.to("A**2*s").magnitude == pytest.approx(peak**2 / (4 * 60) * found["later peaks' share (decay factor)"].magnitude, rel=1e-9)
    assert "upper bound" in surge.explanation
    assert any("Project 39" in s.title for s in surge.sources)


def test_a_surge_that_melts_the_fuse_is_not_recommended_on_the_checklist():
    # Without the soft-start the bound (above) melts the declared T6.3A (150 A^2 s at 10 ms on its curve): the
    # checklist must not tell the builder to fit it as it is.
    record = record_of(AMP, protection__inrush_limiter=None)
    surge = one(record, "PROT-SURGE-TRANSFORMER")
    assert surge.verdict is Verdict.MARGINAL and "melts F1" in surge.explanation
    choice = recommended_fuse(record)
    assert choice.surge_blows_declared and not choice.declared_fits
    item = build_checklist(record, run_review(record, load_calcs())).item("mains-fuse")
    assert "melting I^2 t at least" in item.title
    assert "Do not fit the declared" in item.steps


def test_the_soft_start_limits_the_surge_to_v_over_r():
    # Elliott Sound Products, Project 39: a series resistor limits the switch-on current to V / R (240 V / 60 ohm = 4 A RMS,
    # 5.66 A at the crest). Here the bound with R1 in series: sqrt 2 x 132 V / (0.25 + 0.3 + 15 ohm).
    record = record_of(AMP, magnetics__0__windings__0__resistance="0.25 ohm")
    found = values(one(record, "PROT-SURGE-TRANSFORMER"))
    assert found["peak with the core taken as air"].to("A").magnitude == pytest.approx(math.sqrt(2) * 132 / 15.55, rel=1e-9)
    assert one(record, "PROT-SURGE-TRANSFORMER").verdict is Verdict.PASS


def test_the_refinement_from_the_core_follows_the_saturated_air_core_formula():
    # Holcomb's form (from memory): I_pk = sqrt 2 V / sqrt((omega L_air)^2 + R^2) x (2 B_n + B_r - B_s) / B_n with
    # L_air = mu_0 N^2 A_e / l_e. A declared remanence of 1.2 T and 400 primary turns on the 140/80/50 mm toroid keep
    # B_n low enough for the refinement to fall below the bound.
    record = record_of(AMP, protection__inrush_limiter=None, magnetics__0__core__material__remanence="1.2 T",
                       magnetics__0__windings__0__turns=400, magnetics__0__windings__0__resistance="0.5 ohm")
    found = values(one(record, "PROT-SURGE-TRANSFORMER"))
    inductance = found["air-core inductance of the primary"].to("H").magnitude
    path, area, _ = effective_from_constants(*toroid_constants(Q_(140, "mm"), Q_(80, "mm"), Q_(50, "mm")))
    assert inductance == pytest.approx(4e-7 * math.pi * 400**2 * area.to("m**2").magnitude / path.to("m").magnitude, rel=1e-9)
    normal = math.sqrt(2) * 132 / (2 * math.pi * 60 * 400 * area.to("m**2").magnitude)
    resistance = 0.8
    expected = math.sqrt(2) * 132 / math.hypot(2 * math.pi * 60 * inductance, resistance) * (2 * normal + 1.2 - 1.8) / normal
    assert found["peak refined from the core"].to("A").magnitude == pytest.approx(expected, rel=1e-9)
    assert found["peak current (upper bound)"].to("A").magnitude == pytest.approx(min(expected, math.sqrt(2) * 132 / resistance), rel=1e-9)


# 2. The soft-start resistor bypassed by a relay

def test_a_bypass_with_no_thermal_cutoff_fails_and_the_fixed_one_passes():
    # P = I_run^2 R: the running current at high line, 200 W / 0.75 x 1.1^2 / (132 V x 0.7) = 3.492 A, through 15 ohm = 183 W
    # against 25 W (the bypass-failure case of Elliott Sound Products, Project 39).
    flawed = one(load_test_record(AMP, "A"), "PROT-SOFTSTART-BYPASS")
    assert flawed.verdict is Verdict.FAIL and flawed.guards_hazard
    assert flawed.value.quantity.to("W").magnitude == pytest.approx((200 / 0.75 * 1.21 / (132 * 0.7)) ** 2 * 15, rel=1e-9)
    assert "thermal cut-off" in flawed.explanation
    fixed = one(load_test_record(AMP, "B"), "PROT-SOFTSTART-BYPASS")
    assert fixed.verdict is Verdict.PASS and "130" in fixed.explanation


def test_a_short_across_the_load_puts_v_squared_over_r_into_the_resistor():
    # Elliott Sound Products, Project 39: 60 ohm on 240 V mains; if the bypass fails under a fault the resistor takes
    # V^2 / R = 960 W (the article quotes about 930 W for its 60 ohm).
    record = record_of(AMP, mains={"nominal": "240 V", "frequency": "50 Hz", "tolerance": "0 %"}, protection__inrush_limiter__cold_resistance="60 ohm")
    worst = values(one(record, "PROT-SOFTSTART-BYPASS"))["dissipation if the load shorts (V_high^2 / R)"].to("W").magnitude
    assert worst == pytest.approx(960, rel=1e-9)
    assert worst == pytest.approx(930, rel=0.05)


def test_a_cutoff_rated_below_the_running_current_fails():
    record = record_of(AMP, protection__inrush_limiter__thermal_cutoff={"temperature": "130 degC", "current_rating": "2 A"})
    assert one(record, "PROT-SOFTSTART-BYPASS").verdict is Verdict.FAIL


def test_the_pulse_energy_sums_charge_surge_and_delay():
    # Circuit theory: charging C to V through R puts 1/2 C V^2 into R; the surge's I^2 t x R; I_run^2 R t_delay.
    record = load_test_record(AMP, "B")
    energy = one(record, "PROT-SOFTSTART-ENERGY")
    found = values(energy)
    charge = 0.5 * referred_capacitance(record).to("F").magnitude * (132 * math.sqrt(2)) ** 2
    assert found["charging the capacitors"].to("J").magnitude == pytest.approx(charge, rel=1e-9)
    running = (200 / 0.75 * 1.21 / (132 * 0.7)) ** 2 * 15 * 0.150
    assert found["load current until the relay closes"].to("J").magnitude == pytest.approx(running, rel=1e-9)
    assert energy.verdict is Verdict.PASS
    assert one(record_of(AMP, protection__inrush_limiter__max_energy="60 J"), "PROT-SOFTSTART-ENERGY").verdict is Verdict.FAIL


def test_a_delay_shorter_than_the_charge_time_is_marginal():
    # 3 R C with R the soft-start plus windings and supply, C the banks referred to the primary; 5 mains cycles at least
    # (Elliott Sound Products, Project 39: about 100 ms, 5 cycles at 50 Hz).
    assert one(load_test_record(AMP, "B"), "PROT-SOFTSTART-DELAY").verdict is Verdict.PASS
    assert one(record_of(AMP, protection__inrush_limiter__bypass_delay="40 ms"), "PROT-SOFTSTART-DELAY").verdict is Verdict.MARGINAL


# 3. Secondary banks referred to the primary

def test_a_secondary_bank_is_referred_to_the_primary_and_keeps_the_transformer_input():
    # Equal energy: C_p = C_s (V_s / (sqrt 2 V_p))^2 = 40 000 uF x (41 / 169.7)^2 = 2335 uF; at high line its energy is
    # 1/2 x 0.04 F x (41 V x 1.1)^2 = 40.7 J (circuit theory), not the 697 J of 40 000 uF at the mains crest.
    record = load_test_record(AMP, "B")
    assert referred_capacitance(record).to("uF").magnitude == pytest.approx(40000 * (41 / (120 * math.sqrt(2))) ** 2, rel=1e-9)
    energy = values(one(record, "PROT-SOFTSTART-ENERGY"))["charging the capacitors"].to("J").magnitude
    assert energy == pytest.approx(0.5 * 0.04 * (41 * 1.1) ** 2, rel=1e-9)
    assert input_topology(record) == TRANSFORMER_CAPACITOR_INPUT
    declared = record_of(AMP, protection__secondary_banks=None, protection__bulk_capacitance="2335 uF")
    assert input_topology(declared) == TRANSFORMER_CAPACITOR_INPUT  # a declared bulk capacitance does not relabel it


def test_the_rectifier_carries_the_primary_pulse_scaled_by_the_turns_ratio():
    # A bridge data sheet's I^2 t rating for fusing is I_FSM^2 x 8.3 ms / 2 (JEDEC half-sine): 50 A gives 10.4 A^2 s,
    # printed as 10 A^2 s beside I_FSM 50 A on a 10 A bridge's data sheet (common practice).
    derived, _ = _rated_i2t(Semiconductor(ref="BR9", kind="bridge", surge_current="50 A"))
    assert derived.to("A**2*s").magnitude == pytest.approx(10.4, abs=0.05)
    record = load_test_record(AMP, "B")
    bridge = one(record, "PROT-BRIDGE-SURGE")
    scale = 120 * math.sqrt(2) / 41
    pulse = one(record, "PROT-INRUSH").value.quantity
    assert bridge.value.quantity.to("A**2*s").magnitude == pytest.approx(pulse.to("A**2*s").magnitude * scale**2, rel=1e-9)
    assert bridge.verdict is Verdict.PASS
    small = record_of(AMP, devices__semiconductors__0__surge_i2t=None, devices__semiconductors__0__surge_current="40 A")
    assert one(small, "PROT-BRIDGE-SURGE").verdict is Verdict.FAIL


# 4. Input current by load kind

def test_an_unregulated_load_draws_the_most_at_high_line_and_a_regulated_one_at_low_line():
    # P_in as V^2: I = P_in V / (pf V_nom^2), most at high line; constant power: I = P_in / (pf V), most at low line.
    unregulated = input_current(load_test_record(AMP, "B"))
    assert unregulated.line_name == "high" and unregulated.load_kind == "unregulated-linear"
    assert unregulated.rms.to("A").magnitude == pytest.approx(200 / 0.75 * 1.21 / (132 * 0.7), rel=1e-9)
    regulated = input_current(record_of(AMP, protection__load_kind="regulated"))
    assert regulated.line_name == "low"
    assert regulated.rms.to("A").magnitude == pytest.approx(200 / 0.75 / (108 * 0.7), rel=1e-9)
    silent = input_current(record_of(AMP, protection__load_kind=None))
    assert silent.rms == max(unregulated.rms, regulated.rms) and silent.load_assumed
    assert "load model" in values(one(load_test_record(AMP, "B"), "PROT-INPUT-CURRENT"))


def test_a_resistive_load_has_a_sine_input_current():
    # A resistive load draws a sine: crest factor sqrt 2, not the half-sine pulses of a capacitor input.
    running = input_current(record_of(AMP, protection__load_kind="resistive", output__power_factor=1))
    assert running.peak.to("A").magnitude == pytest.approx(running.rms.to("A").magnitude * math.sqrt(2), rel=1e-9)


# 5. What the mains fuse must protect and clear

def test_a_fuse_far_above_the_primary_rating_fails():
    # 300 VA at 120 V: 2.5 A rated primary; a T15A is above 2 x 2.5 A (transformer makers' guidance, from memory).
    record = record_of(AMP, magnetics__0__rated_power="300 VA", protection__fuse__rating="15 A")
    primary = one(record, "PROT-FUSE-PRIMARY")
    assert primary.verdict is Verdict.FAIL and primary.limit.quantity.to("A").magnitude == pytest.approx(5.0)
    assert one(load_test_record(AMP, "B"), "PROT-FUSE-PRIMARY").verdict is Verdict.PASS


def test_a_secondary_short_the_fuse_cannot_clear_needs_a_thermal_fuse():
    # I_sc = V_low / (R_source + R_p + R_s (N_p / N_s)^2) with measured windings: 108 V / (0.3 + 1.5 + 2.0 x (230/106)^2 ohm),
    # the resistances moved to 105 degC by copper's 0.00393 /K (IEC 60028).
    hot = 1 + 0.00393 * 85
    record = record_of(AMP, magnetics__0__windings__0__resistance="1.5 ohm", magnetics__0__windings__1__resistance="2.0 ohm")
    short = one(record, "PROT-FUSE-SHORT")
    expected = 108 / (0.3 + hot * (1.5 + 2.0 * (230 / 106) ** 2))
    assert short.value.quantity.to("A").magnitude == pytest.approx(expected, rel=1e-9)
    assert short.verdict is Verdict.FAIL  # about 7 A: barely above the 6.3 A fuse
    with_thermal = record_of(AMP, magnetics__0__windings__0__resistance="1.5 ohm", magnetics__0__windings__1__resistance="2.0 ohm",
                             protection__thermal_fuse={"ref": "TF2", "temperature": "130 degC"})
    assert one(with_thermal, "PROT-FUSE-SHORT").verdict is Verdict.PASS


# 6. The test station's parts

def test_the_flawed_station_fails_for_each_flaw_and_the_fixed_one_passes():
    flawed = [f for f in CALC.run(load_test_record(STATION, "A")) if f.verdict is Verdict.FAIL]
    assert sorted((f.code, f.subject) for f in flawed) == [
        ("PROT-ISOLATED-FUSE", "isolated output"), ("PROT-ISOLATED-SOCKET-EARTH", "SK1"), ("PROT-ISOLATED-SOCKET-EARTH", "SK2")]
    assert all(f.guards_hazard for f in flawed)


@pytest.mark.parametrize("build", [AMP, STATION])
def test_the_fixed_records_have_no_fail_in_any_calc(build):
    review = run_review(load_test_record(build, "B"), load_calcs())
    assert not [f.code for f in review.findings if f.blocks_power_up]


@pytest.mark.parametrize("build", [AMP, STATION])
def test_diff_shows_the_verdicts_the_fix_changed(build):
    calcs = load_calcs()
    before = run_review(load_test_record(build, "A"), calcs).findings
    after = run_review(load_test_record(build, "B"), calcs).findings
    changes = finding_changes(before, after)
    assert any(c.before is not None and c.before.verdict is Verdict.FAIL for c in changes)
    assert not any(c.after is not None and c.after.verdict is Verdict.FAIL for c in changes)


def test_socket_earth_not_declared_blocks_power_up():
    record = record_of(STATION, protection__isolating_output__sockets=[{"ref": "SK1"}])
    socket = one(record, "PROT-ISOLATED-SOCKET-EARTH")
    assert socket.verdict is Verdict.NOT_ASSESSED and socket.blocks_power_up


def test_rcd_above_30_ma_fails_and_one_behind_the_isolation_is_marginal():
    # IEC 60364-4-41, 415.1 (from memory): additional protection by RCDs of at most 30 mA.
    assert one(record_of(STATION, protection__rcd__residual_current="100 mA"), "PROT-RCD").verdict is Verdict.FAIL
    assert one(record_of(STATION, protection__rcd__position="isolated-output"), "PROT-RCD").verdict is Verdict.MARGINAL
    assert one(load_test_record(STATION, "B"), "PROT-RCD").verdict is Verdict.PASS


def test_series_lamp_hot_and_cold_resistance():
    # A 100 W 120 V lamp is 144 ohm hot and about 9.5 ohm cold, a fifteenth (the incandescent-lamp figures quoted
    # with the Wikipedia article 'Incandescent light bulb'); Lamptech: about 14 times the normal current at switch-on.
    record = record_of(STATION, protection__series_lamp={"ref": "LP1", "power": "100 W", "voltage": "120 V"}, protection__variac=None,
                       mains={"nominal": "120 V", "frequency": "60 Hz", "tolerance": "0 %"})
    found = values(one(record, "PROT-SERIES-LAMP"))
    assert found["hot resistance"].to("ohm").magnitude == pytest.approx(144)
    assert found["cold resistance"].to("ohm").magnitude == pytest.approx(9.6) and found["cold resistance"].to("ohm").magnitude == pytest.approx(9.5, rel=0.02)
    assert found["peak at first switch-on (cold filament)"].to("A").magnitude == pytest.approx(120 * math.sqrt(2) / 9.6)


def test_the_variac_top_of_scale_is_the_nominal_downstream():
    variac = one(load_test_record(STATION, "B"), "PROT-VARIAC")
    assert variac.verdict is Verdict.MARGINAL  # 250 V sockets below its 260 V top of scale
    assert values(variac)["top of scale at high line"].to("V").magnitude == pytest.approx(286)
    low_fuse = record_of(STATION, protection__isolating_output__fuse={"ref": "F2", "rating": "2 A", "voltage_rating": "250 V"})
    assert one(low_fuse, "PROT-ISOLATED-FUSE").verdict is Verdict.FAIL  # 250 V fuse on a 260 V output


def test_station_checklist_items():
    record = load_test_record(STATION, "B")
    sheet = build_checklist(record, run_review(record, load_calcs()))
    # IEC 61008-1 general-type limits, as RCD testers' manuals quote them: 300 ms at I_dn.
    assert sheet.item("rcd-trip-time").expected.high == Q_(300, "ms")
    assert "earthed supply" in sheet.item("rcd-trip-time").steps
    for key in ("rcd-test-button", "isolated-socket-earth", "isolated-output-insulation", "isolated-output-float", "variac-top-of-scale", "series-lamp-station"):
        assert sheet.item(key) is not None, key
    amp = load_test_record(AMP, "B")
    assert "thermal cut-off" in build_checklist(amp, run_review(amp, load_calcs())).item("soft-start").steps
