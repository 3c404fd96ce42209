"""Thermal: losses, the junction-to-air path with shared heatsinks, live tabs and insulating pads."""

from __future__ import annotations

import pytest

from dossier.calcs import thermal
from dossier.calcs.thermal.path import switching_loss
from dossier.findings import Verdict
from dossier.record.devices import Switching
from dossier.record.model import Record

BASE = {"id": "unit", "title": "Test unit", "revision": "A", "date": "2026-01-01", "authors": ["Tester"], "status": "design"}


def unit(semiconductors, heatsinks=(), ambient="40 degC", margins=None, inside="same") -> Record:
    """A record whose enclosure air is the room's unless `inside` says otherwise (None: not declared), so the
    heat-path tests check the path alone; tests/calcs/thermal/test_air.py checks the air."""
    devices = {"semiconductors": list(semiconductors), "heatsinks": list(heatsinks)}
    if margins:
        devices["margins"] = margins
    protection = {"internal_ambient": ambient if inside == "same" else inside}
    return Record.model_validate({**BASE, "environment": {"max_ambient": ambient}, "devices": devices, "protection": protection})


def device(ref="Q1", **fields) -> dict:
    return {"ref": ref, "kind": "mosfet", "max_junction": "150 degC", "rth_jc": "1.0 K/W", **fields}


def sink(ref="HS1", rth="2.0 K/W", touchable=False, earthed=False) -> dict:
    return {"ref": ref, "rth_sa": rth, "touchable": touchable, "earthed": earthed}


def by(findings, code, subject):
    matches = [f for f in findings if f.code == code and f.subject == subject]
    assert len(matches) == 1, [(f.code, f.subject) for f in findings]
    return matches[0]


def degc(quantity) -> float:
    return float(quantity.to("degC").magnitude)


def test_junction_temperature_through_the_whole_path():
    # T_j = T_a + P (R_jc + R_cs + R_sa): Mohan, Undeland, Robbins, Power Electronics (Wiley, 3rd ed.),
    # heat sinks and thermal management. P = V_F x I = 0.55 V x 6 A = 3.3 W.
    record = unit([device("D5", kind="schottky", rth_jc="2.0 K/W", forward_voltage="0.55 V", current="6 A", heatsink="HS2", pad="0.3 K/W")],
                  [sink("HS2", "3.0 K/W")], ambient="35 degC")
    finding = by(thermal.run(record), "THERM-JUNCTION", "D5")
    assert degc(finding.value.quantity) == pytest.approx(35 + 3.3 * (2.0 + 0.3 + 3.0))
    assert finding.verdict is Verdict.PASS and "R_jc + R_cs" in finding.method


def test_devices_on_one_heatsink_share_its_rise():
    # Sink rise = R_sa x total loss: 2 K/W x (2 W + 1 W) = 6 K above 40 degC; Q1 adds 2 W x (1 + 1) K/W.
    record = unit([device("Q1", loss="2 W", heatsink="HS1", pad="1.0 K/W"), device("Q2", loss="1 W", heatsink="HS1", pad="1.0 K/W")], [sink()])
    findings = thermal.run(record)
    assert degc(by(findings, "THERM-HEATSINK", "HS1").value.quantity) == pytest.approx(46)
    assert degc(by(findings, "THERM-JUNCTION", "Q1").value.quantity) == pytest.approx(50)
    assert degc(by(findings, "THERM-JUNCTION", "Q2").value.quantity) == pytest.approx(48)


def test_switching_loss_linear_crossover_estimate():
    # P_sw = 1/2 V I (t_on + t_off) f for linear voltage and current transitions (Mohan et al., chapter 2,
    # switching power loss; from memory): 0.5 x 300 V x 1.5 A x 0.1 us x 50 kHz = 1.125 W.
    estimate = Switching(frequency="50 kHz", voltage="300 V", current="1.5 A", crossover_time="0.1 us")
    assert float(switching_loss(estimate).to("W").magnitude) == pytest.approx(1.125)


def test_switching_loss_from_energy_per_cycle():
    # E_sw x f: 50 uJ per cycle at 20 kHz is 1 W.
    assert float(switching_loss(Switching(frequency="20 kHz", energy="50 uJ")).to("W").magnitude) == pytest.approx(1.0)


def test_conduction_and_switching_add_up():
    # A MOSFET conducts as a resistor: I_rms^2 R_DS(on),hot = 0.6^2 A^2 x 2 ohm = 0.72 W conduction;
    # 1/2 x 300 V x 1.5 A x 0.1 us x 50 kHz = 1.125 W switching (Mohan et al., from memory)
    switching = {"frequency": "50 kHz", "voltage": "300 V", "current": "1.5 A", "crossover_time": "0.1 us"}
    record = unit([device(rds_on_hot="2 ohm", current_rms="0.6 A", heatsink="HS1", pad="1.5 K/W", switching=switching)], [sink()])
    finding = by(thermal.run(record), "THERM-JUNCTION", "Q1")
    losses = {m.label: float(m.quantity.to("W").magnitude) for m in finding.extra if m.label.endswith("loss")}
    assert losses == pytest.approx({"conduction loss": 0.72, "switching loss": 1.125, "loss": 1.845})


def test_switching_data_must_be_complete():
    with pytest.raises(ValueError, match="crossover_time"):
        Switching(frequency="50 kHz", voltage="300 V", current="1.5 A")


@pytest.mark.parametrize("loss, verdict", [("10 W", Verdict.PASS), ("25 W", Verdict.MARGINAL), ("30 W", Verdict.FAIL)])
def test_junction_verdict_bands(loss, verdict):
    # Path 4 K/W from 40 degC: 10 W -> 80, 25 W -> 140 (inside the 25 K allowance, common practice), 30 W -> 160.
    record = unit([device(loss=loss, heatsink="HS1", pad="1.0 K/W")], [sink()])
    assert by(thermal.run(record), "THERM-JUNCTION", "Q1").verdict is verdict


def test_club_junction_allowance_overrides_common_practice():
    # 25 W through 4 K/W from 40 degC = 140 degC; the club's 5 K allowance puts the limit at 150 - 5 = 145 degC
    record = unit([device(loss="25 W", heatsink="HS1", pad="1.0 K/W")], [sink()], margins={"junction": "5 K", "basis": "club sheet"})
    finding = by(thermal.run(record), "THERM-JUNCTION", "Q1")
    assert finding.verdict is Verdict.PASS and degc(finding.limit.quantity) == pytest.approx(145)
    default = by(thermal.run(unit([device(loss="25 W", heatsink="HS1", pad="1.0 K/W")], [sink()])), "THERM-JUNCTION", "Q1")
    assert default.sources[1].is_common_practice


def test_free_air_device_uses_junction_to_air():
    # T_j = T_a + P R_ja = 30 + 1 W x 60 K/W = 90 degC (Mohan et al., heat sinks and thermal management)
    record = unit([device("U1", kind="regulator", loss="1 W", rth_ja="60 K/W")], ambient="30 degC")
    assert degc(by(thermal.run(record), "THERM-JUNCTION", "U1").value.quantity) == pytest.approx(90)


def test_a_device_without_data_is_not_assessed():
    finding = by(thermal.run(unit([device("BR1", kind="bridge", forward_voltage="1 V", current="1 A")])), "THERM-JUNCTION", "BR1")
    assert finding.verdict is Verdict.NOT_ASSESSED and "rth_ja" in finding.explanation


# --- live tabs and pads --------------------------------------------------------------------------

def live(insulated: bool, pad="1.5 K/W") -> dict:
    fields = {"loss": "2 W", "heatsink": "HS1", "tab_live": True, "insulated": insulated}
    if pad:
        fields["pad"] = pad
    return device(**fields)


@pytest.mark.parametrize("touchable, earthed", [(True, False), (False, True), (True, True)])
def test_live_tab_without_a_pad_on_a_reachable_sink_fails(touchable, earthed):
    # A part at mains potential must not make an accessible or earthed conductive part live or short the mains
    # to earth: basic insulation between them (IEC 61140, protection against electric shock, class I equipment).
    record = unit([live(insulated=False, pad="0.2 K/W")], [sink(touchable=touchable, earthed=earthed)])
    assert by(thermal.run(record), "THERM-PAD", "Q1").verdict is Verdict.FAIL


def test_live_tab_with_a_pad_passes_and_the_pad_counts_in_the_path():
    findings = thermal.run(unit([live(insulated=True, pad="1.5 K/W")], [sink(earthed=True)]))
    assert by(findings, "THERM-PAD", "Q1").verdict is Verdict.PASS
    # 40 + 2 W x (2.0 sink + 1.0 jc + 1.5 pad) = 49 degC
    assert degc(by(findings, "THERM-JUNCTION", "Q1").value.quantity) == pytest.approx(49)


def test_live_tab_on_a_floating_unreachable_sink_is_information():
    finding = by(thermal.run(unit([live(insulated=False)], [sink(touchable=False, earthed=False)])), "THERM-PAD", "Q1")
    assert finding.verdict is Verdict.INFO and "live itself" in finding.explanation


def test_a_dead_tab_needs_no_pad_finding():
    record = unit([device(loss="2 W", heatsink="HS1", pad="0.3 K/W")], [sink(touchable=True)])
    assert not [f for f in thermal.run(record) if f.code == "THERM-PAD"]


def test_a_pad_without_a_figure_assumes_the_top_of_the_makers_range():
    # Insulating silicone pads under TO-220/TO-247: about 1-4 K/W (makers' pad listings); 4 K/W is assumed.
    finding = by(thermal.run(unit([live(insulated=True, pad=None)], [sink(earthed=True)])), "THERM-JUNCTION", "Q1")
    assert degc(finding.value.quantity) == pytest.approx(40 + 2 * (2.0 + 1.0 + 4.0))
    assert "assumed" in finding.explanation and finding.sources[-1].is_common_practice


# --- heatsinks --------------------------------------------------------------------------------------

def test_touchable_heatsink_against_the_touch_limit():
    # About 60 degC for metal touched up to 10 s: IEC 62368-1, touch-temperature limits (from memory).
    hot = unit([device(loss="12 W", heatsink="HS1", pad="1.0 K/W")], [sink(touchable=True)])  # 40 + 24 = 64 degC
    assert by(thermal.run(hot), "THERM-HEATSINK", "HS1").verdict is Verdict.FAIL
    club = unit([device(loss="12 W", heatsink="HS1", pad="1.0 K/W")], [sink(touchable=True)], margins={"touch_temperature": "70 degC"})
    assert by(thermal.run(club), "THERM-HEATSINK", "HS1").verdict is Verdict.PASS


def test_untouchable_heatsink_is_information_only():
    finding = by(thermal.run(unit([device(loss="12 W", heatsink="HS1", pad="1.0 K/W")], [sink()])), "THERM-HEATSINK", "HS1")
    assert finding.verdict is Verdict.INFO and finding.limit is None
