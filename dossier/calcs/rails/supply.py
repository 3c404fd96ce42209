"""What the rectifiers, filters and regulators make of the rails: ripple, ripple current, pass-device dissipation,
each rectifier's output and peak inverse voltage, and a word for every stage kind and topology dossier accepts.

  V_r = I / (f_r C)                      peak-to-peak ripple of a capacitor-input filter, f_r = 2 f full-wave, f half-wave
  I_C,rms = I sqrt(1/d - 1)              capacitor ripple current for rectangular charging pulses of duty d,
  d = arccos(1 - V_r / V_pk) / pi        the conduction angle over the ripple period
  P = (V_in,max - V_out) I               a series-pass regulator's pass device at high line
Rectifiers (output V_o from the winding's peak V_pk; PIV per diode or anode): bridge V_o = V_pk, PIV = V_o;
centre-tapped V_o = V_pk of one half, PIV = 2 V_o; half-wave V_o = V_pk, PIV = 2 V_o; doubler V_o = 2 V_pk, PIV = V_o;
a bridge across a centre-tapped winding feeding a + and a - rail V_o = V_pk of one half, PIV = 2 V_o.
"""

from __future__ import annotations

import math

from dossier.calcs.rails import words
from dossier.calcs.rails.hazards import NAME, finding
from dossier.calcs.rails.valves import valve_findings, valves_in
from dossier.calcs.shared.finding_kit import not_assessed
from dossier.calcs.shared.rail_voltage import RailVoltage
from dossier.calcs.shared.stage_graph import rectifier_of, upstream
from dossier.citations import ARRL_FILTERS, MOHAN_POWER_ELECTRONICS
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.record.stages import TOPOLOGIES

HALF_WAVE = ("half-wave", "valve-half-wave", "doubler")  # a doubler read as the half-wave kind: ripple at f (harsher)
VALVES = ("valve-centre-tapped", "valve-half-wave")
# PIV per diode or anode as a multiple of the rectifier's no-load output (ARRL Handbook, rectifier circuits).
PIV_PER_OUTPUT = {"bridge": 1, "centre-tapped": 2, "valve-centre-tapped": 2, "half-wave": 2, "valve-half-wave": 2, "doubler": 1}
RIPPLE_PRACTICE = common_practice(
    "capacitor ripple current of a capacitor-input rectifier from rectangular charging pulses over the conduction "
    "angle arccos(1 - V_r / V_pk); real pulses are peakier, so the estimate is low by some tens of per cent (from memory)")
DIODE_KINDS = ("diode", "schottky", "bridge")
SPLIT_WORDS = " feeding + and - rails from its centre"


# --- ripple -----------------------------------------------------------------------------------------------

def ripple_findings(record, found: RailVoltage) -> list[Finding]:
    rail = record.rails[found.index]
    source = rectifier_of(record, rail.stage)
    if rail.kind != "dc" or source is None or found.how == "regulated":
        return []
    key = ("rails", found.index)
    if rail.current is None or rail.capacitance is None or record.mains is None:
        return [not_assessed(NAME, "RAILS-RIPPLE", found.name, f"Rail {found.name}: ripple", words.NO_RIPPLE_INPUTS,
                             (key + ("current",), key + ("capacitance",)), (ARRL_FILTERS,))]
    topology = source[1].topology_name
    frequency = record.mains.frequency * (1 if topology in HALF_WAVE or not topology else 2)
    volts = (rail.current / (frequency * rail.capacitance)).to("V")
    out = [finding(code="RAILS-RIPPLE", subject=found.name, title=f"Rail {found.name}: ripple", verdict=Verdict.INFO,
                   values=(Measure("ripple, peak to peak", volts),), extra=(Measure("ripple frequency", frequency),),
                   method="V_r = I / (f_r C)", explanation=words.ripple(found.name, volts, frequency, rail.capacitance, topology),
                   keys=(key + ("current",), key + ("capacitance",), ("stages", source[0], "topology")), sources=(ARRL_FILTERS,))]
    return out + _ripple_currents(record, found, source, volts)


def ripple_current(current, ripple, peak):
    """RMS ripple current of the reservoir for rectangular charging pulses."""
    drop = min((ripple / peak).to("").magnitude, 1.0)
    duty = math.acos(1 - drop) / math.pi
    return (current * math.sqrt(1 / duty - 1)).to("A") if duty > 0 else None


def _ripple_currents(record, found, source, ripple) -> list[Finding]:
    rail = record.rails[found.index]
    current = ripple_current(rail.current, ripple, found.loaded)
    if current is None:
        return []
    refs = {part.ref for _, stage in upstream(record, rail.stage) for part in stage.parts}
    reservoirs = [(i, c) for i, c in enumerate(record.devices.capacitors) if c.ref in refs and c.position == "bulk"]
    return [_ripple_current(found, index, capacitor, current) for index, capacitor in reservoirs]


def _ripple_current(found, index, capacitor, current) -> Finding:
    rating = capacitor.ripple_current
    verdict = Verdict.INFO if rating is None else (Verdict.PASS if current <= rating else Verdict.FAIL)
    return finding(code="RAILS-RIPPLE-CURRENT", subject=capacitor.ref, title=f"{capacitor.ref} ripple current", verdict=verdict,
                   values=(Measure("ripple current, RMS", current),), limit=Measure("rated ripple current", rating) if rating is not None else None,
                   relation="<=", method="I_C = I sqrt(1/d - 1), d = arccos(1 - V_r / V_pk) / pi",
                   explanation=words.ripple_current(capacitor.ref, current, rating),
                   keys=(("devices", "capacitors", index, "ripple_current"), ("rails", found.index, "current")), sources=(RIPPLE_PRACTICE,))


# --- regulators -------------------------------------------------------------------------------------------

def regulator_findings(record, voltages: dict[str, RailVoltage]) -> list[Finding]:
    out = []
    for index, stage in enumerate(record.stages):
        if stage.kind == "regulator" and stage.topology_name in ("series-pass", "shunt"):
            out += _regulator(record, index, stage, voltages)
    return out


def _regulator(record, index, stage, voltages) -> list[Finding]:
    own = [v for v in voltages.values() if record.rails[v.index].stage == stage.id and record.rails[v.index].current is not None]
    title = f"Stage '{stage.name}': regulator dissipation"
    if not record.rails:
        return [_stage_info(index, stage, words.NO_RAILS_REGULATOR)]
    if not own:
        return [not_assessed(NAME, "RAILS-REGULATOR", stage.name, title, words.NO_REGULATOR_INPUT, (("stages", index),), (MOHAN_POWER_ELECTRONICS,))]
    out_rail = own[0]
    current = record.rails[out_rail.index].current
    if stage.topology_name == "shunt":
        power = (out_rail.loaded * current).to("W")
        return [finding(code="RAILS-REGULATOR", subject=stage.name, title=title, verdict=Verdict.INFO, values=(Measure("shunt dissipation, no load", power),),
                        method="P = V_out x I (the whole current in the shunt with no load)", explanation=words.shunt(out_rail.name, power, current, out_rail.loaded),
                        keys=(("rails", out_rail.index, "current"),), sources=(MOHAN_POWER_ELECTRONICS,))]
    feeding = [v for v in voltages.values() if record.rails[v.index].stage in stage.feeds_from]
    if not feeding:
        return [not_assessed(NAME, "RAILS-REGULATOR", stage.name, title, words.NO_REGULATOR_INPUT, (("stages", index, "fed_from"),), (MOHAN_POWER_ELECTRONICS,))]
    supply = max(feeding, key=lambda v: v.worst)
    # loaded at high line: the rail's loaded voltage carried to high line (the no-load rise does not apply under load)
    high = supply.loaded * ((record.mains.high / record.mains.nominal).to("").magnitude if record.mains else 1)
    power = ((high - out_rail.loaded) * current).to("W")
    return [_pass_device(record, stage, out_rail, supply, high, current, power)]


def _pass_device(record, stage, out_rail, supply, high, current, power) -> Finding:
    refs = {part.ref for part in stage.parts}
    declared = [(i, d) for i, d in enumerate(record.devices.semiconductors) if d.ref in refs and d.loss is not None and d.kind not in DIODE_KINDS]
    understated = [(i, d) for i, d in declared if d.loss < power]
    explanation = words.pass_device(out_rail.name, power, high, out_rail.loaded, current)
    explanation += "".join(words.understated_loss(d.ref, d.loss, power) for _, d in understated)
    return finding(code="RAILS-REGULATOR", subject=stage.name, title=f"Stage '{stage.name}': regulator dissipation",
                   verdict=Verdict.FAIL if understated else Verdict.INFO,
                   values=(Measure("pass-device dissipation, high line", power),),
                   extra=(Measure("input at high line, loaded", high), Measure("output", out_rail.loaded), Measure("current", current)),
                   method="P = (V_in,max - V_out) I, V_in,max the feeding rail's loaded voltage at high line",
                   explanation=explanation,
                   keys=(("rails", supply.index, "voltage"), ("rails", out_rail.index, "current")) + tuple(("devices", "semiconductors", i, "loss") for i, _ in understated),
                   sources=(MOHAN_POWER_ELECTRONICS,))


# --- rectifiers and the other stages ----------------------------------------------------------------------

def stage_findings(record, voltages: dict[str, RailVoltage]) -> list[Finding]:
    out = []
    for index, stage in enumerate(record.stages):
        topology = stage.topology_name
        if stage.kind == "rectifier" and topology:
            out += _rectifier(record, index, stage, voltages)
        elif stage.kind in TOPOLOGIES and not topology:
            out.append(_stage_info(index, stage, words.empty_topology(stage.kind)))
        elif (stage.kind, topology) in words.STAGE_NOTES:
            out.append(_stage_info(index, stage, words.stage_note(stage.kind, topology)))
    return out


def _stage_info(index, stage, text) -> Finding:
    return finding(code="RAILS-STAGE", subject=stage.name, title=f"Stage '{stage.name}' ({stage.kind}, {stage.topology or 'no topology'})",
                   verdict=Verdict.INFO, explanation=text, keys=(("stages", index, "topology"),), sources=(ARRL_FILTERS,))


def _piv_times(record, topology: str, fed) -> int:
    """PIV over one rail's output: a bridge whose rails go both ways from its centre (a + and a - rail across a
    centre-tapped winding or a series pair) blocks the whole winding, twice each rail (ARRL Handbook)."""
    polarities = {record.rails[v.index].polarity for v in fed}
    return 2 if topology == "bridge" and polarities == {"positive", "negative"} else PIV_PER_OUTPUT[topology]


def _rectifier(record, index, stage, voltages) -> list[Finding]:
    fed = [v for v in voltages.values() if v.kind == "dc" and v.how != "regulated" and (rectifier_of(record, record.rails[v.index].stage) or (None,))[0] == index]
    title = f"Stage '{stage.name}': rectifier output and peak inverse voltage"
    if not fed:
        return [_stage_info(index, stage, words.no_rectifier_rail(stage.name))]
    rail = max(fed, key=lambda v: v.worst)
    topology = stage.topology_name
    times = _piv_times(record, topology, fed)
    piv = rail.worst * times
    valve = topology in VALVES
    rated = valve_findings(record, index, stage, rail, piv) if valve else []
    return [finding(code="RAILS-RECTIFIER", subject=stage.name, title=title, verdict=Verdict.INFO,
                    values=(Measure("output, no load, high line", rail.worst), Measure("peak inverse voltage", piv)),
                    method=f"PIV = {times} x V_out ({topology}{SPLIT_WORDS if times != PIV_PER_OUTPUT[topology] else ''}); V_out from rail {rail.name} at its worst case",
                    explanation=words.rectifier(stage.name, topology, rail.worst, piv, valve, bool(valves_in(record, stage))),
                    keys=(("stages", index, "topology"),) + rail.keys + ((("devices", "valves"),) if valve else ()),
                    sources=(ARRL_FILTERS,) + rail.sources)] + rated

