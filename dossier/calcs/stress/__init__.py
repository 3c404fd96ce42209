"""Voltage stress at the worst case (high line, no load): the bus, switches, diodes and capacitors against their ratings."""

from __future__ import annotations

from dataclasses import replace

from dossier.calcs.shared.finding_kit import not_assessed
from dossier.calcs.shared.margins import margin
from dossier.calcs.stress import capacitors, roles, switches, words
from dossier.calcs.stress.judging import NAME, finding, rating_finding
from dossier.calcs.shared.stage_graph import stage_of
from dossier.calcs.stress.voltages import RECTIFIER_KINDS, Voltages
from dossier.citations import ARRL_HANDBOOK, IEC_60384_14, MOHAN_POWER_ELECTRONICS
from dossier.findings import Finding, Measure, Verdict
from dossier.plugins import Calc

SWITCH_KINDS = ("bjt", "mosfet", "igbt")
NOT_ASSESSED_SOURCES = {
    "STRESS-SWITCH": (MOHAN_POWER_ELECTRONICS,),
    "STRESS-RECTIFIER": (ARRL_HANDBOOK,),
    "STRESS-CAPACITOR": (IEC_60384_14,),
}


def run(record, windings=None):
    voltages = Voltages(record) if windings is None else Voltages(record, windings)
    findings = _bus(voltages)
    for index, device in enumerate(record.devices.semiconductors):
        findings += _semiconductor(voltages, index, device)
    for index, capacitor in enumerate(record.devices.capacitors):
        findings += capacitors.capacitor_findings(voltages, index, capacitor)
    return findings


def _bus(voltages: Voltages) -> list[Finding]:
    rail = voltages.bus()
    if rail is None:
        return []
    return [finding(
        code="STRESS-BUS", subject="DC bus", title="DC bus voltage at high line", verdict=Verdict.INFO,
        values=(Measure("DC bus at high line", rail.voltage),), method=rail.formula,
        explanation=words.bus(rail), keys=(rail.key,), sources=(MOHAN_POWER_ELECTRONICS,),
    )]


def _not_assessed(code, subject, title, why, key) -> list[Finding]:
    return [not_assessed(NAME, code, subject, title, why, (key,), NOT_ASSESSED_SOURCES[code])]


def _semiconductor(voltages: Voltages, index: int, device) -> list[Finding]:
    key = ("devices", "semiconductors", index, "voltage_rating")
    if device.kind in SWITCH_KINDS:
        return _switch(voltages, device, key)
    if device.kind in RECTIFIER_KINDS:
        return _diode(voltages, index, device, key)
    return []


def _missing(device, found) -> str:
    return words.NO_RATING if device.voltage_rating is None else words.no_stage(device.ref)


# --- switches -----------------------------------------------------------------------------------

def _switch(voltages: Voltages, device, key) -> list[Finding]:
    title = f"{device.ref} switch voltage rating"
    found = stage_of(voltages.record, device.ref)
    if device.voltage_rating is None or found is None:
        return _not_assessed("STRESS-SWITCH", device.ref, title, _missing(device, found), key)
    rail = switches.blocking(voltages, *found)
    if rail is None:
        return _not_assessed("STRESS-SWITCH", device.ref, title, words.unknown_topology(found[1].topology), ("stages", found[0], "topology"))
    doubt = switches.rating_doubt(device)
    index = key[2]
    return [rating_finding(
        "STRESS-SWITCH", device.ref, title, device.voltage_rating, rail, margin(voltages.record, "switch_voltage"),
        words.blocking_label(device.kind), key, (MOHAN_POWER_ELECTRONICS,),
        doubts=(words.RATING_KIND_NOTES[doubt],) if doubt else (),
        extra=(Measure("rating compared", switches.rating_name(device)),),
        keys=(("devices", "semiconductors", index, "voltage_rating_kind"),) if doubt else (),
    )]


# --- diodes -------------------------------------------------------------------------------------

def _diode(voltages: Voltages, index: int, device, key) -> list[Finding]:
    title = f"{device.ref} reverse-voltage rating"
    found = stage_of(voltages.record, device.ref)
    if device.voltage_rating is None or found is None:
        return _not_assessed("STRESS-RECTIFIER", device.ref, title, _missing(device, found), key)
    stage_index, stage = found
    role, how = roles.role_of(device, stage)
    rail = roles.inverse(voltages, stage_index, stage, role)
    if rail is None:
        return _not_assessed("STRESS-RECTIFIER", device.ref, title, words.no_inverse(stage), ("stages", stage_index))
    if role is not None:
        rail = replace(rail, basis=f"{rail.basis}; {words.role_basis(role, how)}")
    return [rating_finding(
        "STRESS-RECTIFIER", device.ref, title, device.voltage_rating, rail, margin(voltages.record, "rectifier_voltage"),
        "peak inverse voltage", key, (ARRL_HANDBOOK, MOHAN_POWER_ELECTRONICS),
        extra=(Measure("role", role or "unknown: harshest reading"),),
        keys=(("devices", "semiconductors", index, "role"),),
    )]


CALC = Calc(
    name=NAME,
    title="Voltage stress",
    run=run,
    summary=(
        "Works out the highest voltage each power part sees at the worst case: the mains at the top of its tolerance "
        "(high line) and no load. The DC bus; what each switch blocks in its topology, against the rating the record "
        "says it gives (V_CEO, V_CES, V_DSS); what each diode blocks in its role (bridge, centre-tapped, half-wave, "
        "doubler, reset, clamp, freewheel); what each capacitor holds, and its share of a series string with its "
        "balancing resistors. Each is judged against the part's rating with a margin for switching spikes (common "
        "practice unless the record sets its own); each X or Y capacitor against the nominal supply and the class its "
        "position needs (IEC 60384-14)."
    ),
    codes={
        "STRESS-BUS": "the DC bus voltage at high line (information for the other checks)",
        "STRESS-SWITCH": "a switch's collector-emitter or drain-source rating against what it blocks",
        "STRESS-RECTIFIER": "a diode's reverse-voltage rating against what it blocks in its role",
        "STRESS-CAPACITOR": "a capacitor's rated voltage against the voltage it sees (its share, in a series string)",
        "STRESS-SAFETY-CLASS": "an X or Y capacitor's class against the class its position needs",
    },
    order=40,
)
