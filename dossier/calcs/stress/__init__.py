"""Voltage stress at high line: the bus, switches, rectifiers and capacitors against their ratings."""

from __future__ import annotations

from dossier.calcs.shared import safety_class
from dossier.calcs.shared.finding_kit import banded, maker, not_assessed
from dossier.calcs.shared.margins import Margin, margin
from dossier.calcs.stress.voltages import RECTIFIER_KINDS, Rail, Voltages, stage_of
from dossier.citations import ARRL_HANDBOOK, IEC_60384_14, MOHAN_POWER_ELECTRONICS
from dossier.findings import Finding, Measure, Verdict
from dossier.plugins import Calc
from dossier.units import fmt

NAME = "stress"
SWITCH_KINDS = ("bjt", "mosfet", "igbt")
# Highest voltage a switch blocks, as a multiple of the voltage feeding its stage (Mohan et al., from memory).
BLOCKING_FACTOR = {
    "half-bridge": 1,
    "self-oscillating-half-bridge": 1,
    "full-bridge": 1,
    "push-pull": 2,
    "forward": 2,
    "buck": 1,
    "linear": 1,
}
AC_POSITIONS = ("across-line", "line-to-earth", "across-barrier")
MARGINS_KEY = ("devices", "margins")
finding = maker(NAME)


def run(record, windings=None):
    voltages = Voltages(record) if windings is None else Voltages(record, windings)
    findings = _bus(voltages)
    for index, device in enumerate(record.devices.semiconductors):
        findings += _semiconductor(voltages, index, device)
    for index, capacitor in enumerate(record.devices.capacitors):
        findings += _capacitor(voltages, index, capacitor)
    return findings


def _bus(voltages: Voltages) -> list[Finding]:
    rail = voltages.bus()
    if rail is None:
        return []
    return [finding(
        code="STRESS-BUS", subject="DC bus", title="DC bus voltage at high line", verdict=Verdict.INFO,
        values=(Measure("DC bus at high line", rail.voltage),), method=rail.formula,
        explanation=f"The {rail.basis}; switches and capacitors on the mains side are judged against it.",
        keys=(rail.key,), sources=(MOHAN_POWER_ELECTRONICS,),
    )]


# --- the rating check every part shares -------------------------------------------------------

def _rating_finding(code, subject, title, rating, rail: Rail, chosen: Margin, stressed: str, key, sources) -> Finding:
    required = rail.voltage * chosen.value.to("").magnitude
    # fail below the stress itself; marginal inside the spike margin; pass at or above the margin
    verdict = banded(rating, required, rail.voltage, ">=")
    return finding(
        code=code, subject=subject, title=title, verdict=verdict,
        values=(Measure("voltage rating", rating), Measure(stressed, rail.voltage)),
        limit=Measure(f"rating needed with x{fmt(chosen.value)} margin", required),
        method=f"rating >= margin x stress; {rail.formula}",
        explanation=_rating_words(verdict, subject, rating, rail, stressed, chosen),
        keys=(key, rail.key) + ((MARGINS_KEY,) if chosen.from_record else ()),
        sources=tuple(sources) + (chosen.source,),
    )


def _rating_words(verdict, subject, rating, rail: Rail, stressed: str, chosen: Margin) -> str:
    seen = f"{subject} sees {fmt(rail.voltage)} ({stressed}; {rail.basis})."
    if verdict is Verdict.FAIL:
        return f"{seen} Its rating is below even that: it will break down at high line. Fit a part rated for at least x{fmt(chosen.value)} the stress."
    if verdict is Verdict.MARGINAL:
        return f"{seen} Its rating covers the steady peak but not the x{fmt(chosen.value)} allowance for switching spikes and ringing."
    return seen


def _not_assessed(code, subject, title, why, key) -> list[Finding]:
    return [not_assessed(NAME, code, subject, title, why, (key,), NOT_ASSESSED_SOURCES[code])]


NOT_ASSESSED_SOURCES = {
    "STRESS-SWITCH": (MOHAN_POWER_ELECTRONICS,),
    "STRESS-RECTIFIER": (ARRL_HANDBOOK,),
    "STRESS-CAPACITOR": (IEC_60384_14,),
}


# --- switches and rectifiers --------------------------------------------------------------------

def _semiconductor(voltages: Voltages, index: int, device) -> list[Finding]:
    key = ("devices", "semiconductors", index, "voltage_rating")
    if device.kind in SWITCH_KINDS:
        return _switch(voltages, device, key)
    if device.kind in RECTIFIER_KINDS:
        return _rectifier(voltages, device, key)
    return []


def _switch(voltages: Voltages, device, key) -> list[Finding]:
    title = f"{device.ref} switch voltage rating"
    found = stage_of(voltages.record, device.ref)
    if device.voltage_rating is None or found is None:
        return _not_assessed("STRESS-SWITCH", device.ref, title, _missing(device, found), key)
    rail = _blocking(voltages, *found)
    if rail is None:
        return _not_assessed("STRESS-SWITCH", device.ref, title, f"the stage's topology '{found[1].topology}' or its supply is not known to this calc", ("stages", found[0], "topology"))
    chosen = margin(voltages.record, "switch_voltage")
    return [_rating_finding("STRESS-SWITCH", device.ref, title, device.voltage_rating, rail, chosen, _blocking_label(device), key, (MOHAN_POWER_ELECTRONICS,))]


def _missing(device, found) -> str:
    if device.voltage_rating is None:
        return "the record gives no voltage_rating: add it from the maker's data"
    return f"no stage lists {device.ref}, so the voltage it blocks is unknown"


def _blocking_label(device) -> str:
    return {"mosfet": "peak drain-source voltage", "igbt": "peak collector-emitter voltage"}.get(device.kind, "peak collector-emitter voltage")


def _blocking(voltages: Voltages, index: int, stage) -> Rail | None:
    factor = BLOCKING_FACTOR.get(stage.topology)
    supply = voltages.supply_of(index)
    if factor is None or supply is None:
        return None
    formula = f"V_block = {factor} x V_in ({stage.topology}); {supply.formula}"
    return Rail(factor * supply.voltage, formula, f"{supply.basis}, {stage.topology} stage '{stage.name}'", ("stages", index, "topology"))


def _rectifier(voltages: Voltages, device, key) -> list[Finding]:
    title = f"{device.ref} reverse-voltage rating"
    found = stage_of(voltages.record, device.ref)
    if device.voltage_rating is None or found is None:
        return _not_assessed("STRESS-RECTIFIER", device.ref, title, _missing(device, found), key)
    rail = _inverse(voltages, found[1])
    if rail is None:
        return _not_assessed("STRESS-RECTIFIER", device.ref, title, _inverse_unknown(found[1]), ("stages", found[0]))
    chosen = margin(voltages.record, "rectifier_voltage")
    return [_rating_finding("STRESS-RECTIFIER", device.ref, title, device.voltage_rating, rail, chosen, "peak inverse voltage at high line", key, (ARRL_HANDBOOK,))]


def _inverse(voltages: Voltages, stage) -> Rail | None:
    if stage.side == "mains":
        return voltages.mains_piv()
    if stage.kind == "rectifier":
        return voltages.piv(stage.topology)
    return None


def _inverse_unknown(stage) -> str:
    if stage.kind == "rectifier" and stage.side == "isolated":
        return f"topology '{stage.topology}' is not bridge or centre-tapped, or the secondary's voltage is unknown"
    return f"it sits in the {stage.kind} stage '{stage.name}', not in a rectifier, so its reverse voltage is unknown"


# --- capacitors ---------------------------------------------------------------------------------

def _capacitor(voltages: Voltages, index: int, capacitor) -> list[Finding]:
    findings = _capacitor_voltage(voltages, index, capacitor)
    if capacitor.position in AC_POSITIONS:
        findings += _safety_class(voltages.record, index, capacitor)
    return findings


def _capacitor_voltage(voltages: Voltages, index: int, capacitor) -> list[Finding]:
    key = ("devices", "capacitors", index, "voltage_rating")
    title = f"{capacitor.ref} voltage rating"
    if capacitor.position in AC_POSITIONS:
        return _ac_capacitor(voltages, capacitor, key, title)
    rail = _capacitor_rail(voltages, capacitor)
    if rail is None:
        return _not_assessed("STRESS-CAPACITOR", capacitor.ref, title, f"the voltage at position '{capacitor.position}' is not known to this calc", ("devices", "capacitors", index, "position"))
    chosen = margin(voltages.record, "capacitor_voltage")
    return [_rating_finding("STRESS-CAPACITOR", capacitor.ref, title, capacitor.voltage_rating, rail, chosen, "peak voltage at high line", key, ())]


def _capacitor_rail(voltages: Voltages, capacitor) -> Rail | None:
    found = stage_of(voltages.record, capacitor.ref)
    supply = voltages.supply_of(found[0]) if found else None
    if capacitor.position == "split" and supply is not None:
        return Rail(supply.voltage / 2, f"V_C = V_bus / 2 (split pair); {supply.formula}", supply.basis, supply.key)
    if capacitor.position == "output" and (found is None or found[1].kind not in ("rectifier", "mains-input")):
        return voltages.output_rail()
    return supply if capacitor.position in ("bulk", "output") else None


def _ac_capacitor(voltages: Voltages, capacitor, key, title) -> list[Finding]:
    rail = _ac_rail(voltages, capacitor)
    if rail is None:
        return _not_assessed("STRESS-CAPACITOR", capacitor.ref, title, "the record has no mains section", key)
    verdict = Verdict.PASS if capacitor.voltage_rating >= rail.voltage else Verdict.FAIL
    return [finding(
        code="STRESS-CAPACITOR", subject=capacitor.ref, title=title, verdict=verdict,
        values=(Measure("rated AC voltage", capacitor.voltage_rating),),
        limit=Measure("RMS voltage across it at high line", rail.voltage),
        method=f"V_rated (AC RMS) >= V across it; {rail.formula}",
        explanation=f"A safety capacitor's class carries the allowance for mains impulses, so its rated AC voltage is compared with the {rail.basis} without a further margin.",
        keys=(key, rail.key), sources=(IEC_60384_14,),
    )]


def _ac_rail(voltages: Voltages, capacitor) -> Rail | None:
    line = voltages.line_rms()
    if line is None or capacitor.position != "across-barrier":
        return line
    for barrier in voltages.record.barriers:
        if capacitor.ref in barrier.parts and barrier.working_voltage is not None:
            return Rail(barrier.working_voltage, "V = declared working voltage of the barrier", f"working voltage of barrier '{barrier.name}'", ("barriers", voltages.record.barriers.index(barrier), "working_voltage"))
    return line


def _safety_class(record, index: int, capacitor) -> list[Finding]:
    key = ("devices", "capacitors", index, "safety_class")
    requirement = _requirement(record, capacitor)
    if requirement is None:
        return []
    given = capacitor.safety_class
    verdict = Verdict.PASS if given in requirement.accepted else Verdict.FAIL
    return [finding(
        code="STRESS-SAFETY-CLASS", subject=capacitor.ref, title=f"{capacitor.ref} safety class for its position", verdict=verdict,
        values=(Measure("class", given or "none given"),),
        limit=Measure("accepted classes", ", ".join(requirement.accepted)), relation="in",
        method="class tested for the position's impulse and insulation grade",
        explanation=_class_words(capacitor, requirement, verdict),
        keys=(key,), sources=requirement.sources,
    )]


def _requirement(record, capacitor):
    if record.mains is None:
        return None
    nominal = float(record.mains.nominal.to("V").magnitude)
    if capacitor.position == "across-line":
        return safety_class.across_line(nominal, record.mains.overvoltage_category)
    if capacitor.position == "line-to-earth":
        return safety_class.bridging("basic", nominal)
    grade, how = safety_class.barrier_grade(record, capacitor.ref)
    found = safety_class.bridging(grade, nominal)
    return None if found is None else safety_class.Requirement(found.accepted, f"{found.reason} ({how})", found.sources)


def _class_words(capacitor, requirement, verdict) -> str:
    text = f"Position {capacitor.position}: {requirement.reason}."
    if verdict is Verdict.FAIL:
        text += " Fit a capacitor of an accepted class and give its class in the record; an unclassed capacitor here can fail short and make the mains reachable."
    return text


CALC = Calc(
    name=NAME,
    title="Voltage stress",
    run=run,
    summary=(
        "Works out the highest voltage each power part sees at high line (the mains at the top of its tolerance): "
        "the DC bus, what each switch blocks in its topology, the peak inverse voltage of each rectifier (bridge or "
        "centre-tapped) and what each capacitor holds. Each is judged against the part's rating with a margin for "
        "switching spikes (common practice unless the record sets its own), and each X or Y capacitor against the "
        "class its position needs (IEC 60384-14)."
    ),
    codes={
        "STRESS-BUS": "the DC bus voltage at high line (information for the other checks)",
        "STRESS-SWITCH": "a switch's collector-emitter or drain-source rating against what it blocks",
        "STRESS-RECTIFIER": "a rectifier's reverse-voltage rating against its peak inverse voltage",
        "STRESS-CAPACITOR": "a capacitor's rated voltage against the voltage it sees",
        "STRESS-SAFETY-CLASS": "an X or Y capacitor's class against the class its position needs",
    },
    order=40,
)
