"""Isolation: clearance and creepage across each declared barrier, per IEC 60664-1 edition 3 (2020)."""

from __future__ import annotations

from dataclasses import replace
from functools import partial

from dossier.calcs.isolation import words
from dossier.calcs.isolation.by_standard import (
    board_spacing_findings, earth_limit_finding, standard_measure, hipot_finding, product_clearance_finding, product_creepage_finding,
    standard_finding,
)
from dossier.calcs.isolation.inputs import (
    NEXT_ROW_UP, Inputs, Reading, Site, derive_inputs, material_group_of, material_keys, working_of,
)
from dossier.calcs.isolation.needs import (
    ClearanceNeed, CreepageNeed, bridged_slots, clearance_need, creepage_need, impulse_voltages,
    judged_slot_index, minimum_groove,
)
from dossier.calcs.isolation.standard import Chosen, chosen_standard
from dossier.calcs.isolation.judging import NAME, finding, not_assessed, unassessed_verdict, verdict
from dossier.citations import IEC_60664_1, IEC_62368_1
from dossier.findings import Finding, Measure, Verdict
from dossier.plugins import Calc
from dossier.standards import iec60664 as std
from dossier.units import Q_


CLEARANCE_SOURCE = replace(IEC_60664_1, clause=(
    "Table F.1 (rated impulse voltage); Table F.2, case A (clearance for transients); Table F.8, case A (clearance "
    "for steady-state and recurring peak voltages); Table A.2 (altitude); reinforced insulation at 160 % of the "
    "voltages for basic insulation (clause 5.1.6, clause number from memory)"))
CREEPAGE_SOURCE = replace(IEC_60664_1, clause=(
    "Table F.3 (rationalised voltage); Table F.5 (creepage for basic insulation); reinforced creepage twice basic, "
    "never less than the clearance (clause 5.2, clause number from memory)"))
PRODUCT_CREEPAGE_SOURCE = replace(IEC_62368_1, edition="edition 3.0, 2018 (from memory)",
                                  clause="Table 17 (creepage; no printed-board column, from memory)")
GROOVE_SOURCE = replace(IEC_60664_1, clause="clause 6.8 (grooves across a creepage path)")
INPUTS_SOURCE = replace(IEC_60664_1, clause=(
    "Table F.1 (rated impulse voltage); Table F.3 (rationalised voltage); material groups by comparative tracking "
    "index (clause 4.8.1.3, clause number from memory)"))

CLEARANCE = "ISO-CLEARANCE"
CREEPAGE = "ISO-CREEPAGE"
HIPOT = "ISO-HIPOT"
STANDARD = "ISO-STANDARD"

CODES = {
    "ISO-INPUTS": "what the barrier's requirements were derived from: working voltage, impulse voltage, material group",
    "ISO-CLEARANCE": "declared clearance against the clearance IEC 60664-1 or the chosen product standard requires",
    "ISO-CREEPAGE": "declared creepage against the creepage IEC 60664-1 or the chosen product standard requires",
    "ISO-SLOT": "a slot or groove in the creepage path is at least as wide as clause 6.8 asks, or counts as bridged",
    "ISO-NO-VOLTAGE": "the barrier cannot be assessed: no working voltage declared and none to default to",
    "ISO-STANDARD": "which standard the barriers are judged against (the record's, the archive's default, or IEC 60664-1) and which of its tables are confirmed",
    "ISO-HIPOT": "the electric-strength (hi-pot) test voltage, waveform and duration for a safety barrier, from the chosen standard",
    "ISO-PE-LIMIT": "the protective-earth continuity limit and test of the chosen product standard, for a class I unit",
    "ISO-BOARD-SPACING": "functional conductor spacing on the low-voltage side of a board against IPC-2221B Table 6-1; no safety figure",
}


def run(record, reading: Reading = NEXT_ROW_UP, default_standard=None):
    chosen = chosen_standard(record, default_standard)
    findings = [standard_finding(record, chosen)] if record.barriers or record.mains is not None else []
    for index, barrier in enumerate(record.barriers):
        findings.extend(barrier_findings(record, Site(index, barrier), reading, chosen))
    findings.extend(f for f in [earth_limit_finding(record, chosen)] if f is not None)
    return findings + board_spacing_findings(record)


def reading_from(settings) -> Reading:
    """The archive's table_interpolation setting as a Reading."""
    chosen = settings.table_interpolation
    return Reading(True, chosen.clause.strip()) if chosen.allowed else NEXT_ROW_UP


def configured(settings) -> Calc:
    """This calc as an archive's settings ask for it: interpolation between table rows on a named clause, and the
    product standard for records that name none."""
    reading = reading_from(settings)
    if reading == NEXT_ROW_UP and settings.standard is None:
        return CALC
    return replace(CALC, run=partial(run, reading=reading, default_standard=settings.standard))


def barrier_findings(record, site: Site, reading: Reading = NEXT_ROW_UP, chosen: Chosen = Chosen(None, "default")) -> list[Finding]:
    working = working_of(record, site)
    if working is None:
        return [no_voltage_finding(record, site)]
    inputs = derive_inputs(record, site, working, reading)
    clearance = clearance_finding(site, inputs) if chosen.standard is None else product_clearance_finding(site, inputs, chosen)
    judged = [clearance, creepage_finding(site, inputs, _required(clearance), chosen)]
    if site.barrier.slots:
        judged.append(slot_finding(site, inputs))
    hipot = hipot_finding(record, site, inputs, chosen)
    return [inputs_finding(site, inputs), *(_guarding(site, f) for f in judged), *([hipot] if hipot else [])]


def _guarding(site: Site, finding: Finding) -> Finding:
    """Clearance, creepage and slot of a safety barrier guard a hazard, whatever their verdict."""
    return replace(finding, guards_hazard=not site.guidance_only)


def _required(clearance: Finding):
    """The required clearance in mm, or None when it could not be assessed."""
    return clearance.limit.quantity.to("mm").magnitude if clearance.limit else None


# --- inputs -----------------------------------------------------------------------------------


def inputs_finding(site: Site, inputs: Inputs) -> Finding:
    values = [Measure("working voltage, r.m.s. or d.c.", inputs.creepage_voltage), Measure("peak working voltage", inputs.working_peak)]
    notes = list(inputs.notes)
    values += _impulse_measures(site, inputs, notes)
    values += _group_measures(site.barrier, notes)
    return finding(code="ISO-INPUTS", subject=site.barrier.name, title=words.inputs_title(site.grade),
                   verdict=Verdict.INFO, values=tuple(values), explanation=words.sentences(notes),
                   keys=(*inputs.voltage_keys, *inputs.supply_keys, *material_keys(site)), sources=(INPUTS_SOURCE,))


def _impulse_measures(site: Site, inputs: Inputs, notes: list) -> list[Measure]:
    try:
        basic, impulse = impulse_voltages(inputs, site.grade)
    except std.OutsideTable as problem:
        notes.append(words.impulse_not_found(problem))
        return []
    measures = [Measure("rated impulse voltage", Q_(basic, "V"))]
    if impulse != basic:
        measures.append(Measure(f"impulse voltage for {site.grade} clearance", Q_(impulse, "V")))
    return measures


def _group_measures(barrier, notes: list) -> list[Measure]:
    try:
        group, note = material_group_of(barrier)
    except std.OutsideTable as problem:
        notes.append(str(problem))
        return []
    notes.append(note)
    return [Measure("material group", group)]


# --- clearance --------------------------------------------------------------------------------


def clearance_finding(site: Site, inputs: Inputs) -> Finding:
    keys = (site.key("clearance"), *inputs.voltage_keys, *inputs.supply_keys)
    try:
        need = clearance_need(inputs, site.grade)
    except std.OutsideTable as problem:
        return not_assessed(site, "ISO-CLEARANCE", "Clearance", str(problem), keys, CLEARANCE_SOURCE)
    declared, required = site.barrier.clearance, Q_(need.required_mm, "mm")
    return finding(code="ISO-CLEARANCE", subject=site.barrier.name, title=words.clearance_title(site.grade),
                   verdict=verdict(site, declared, required), values=(Measure("declared clearance", declared),),
                   limit=Measure("required clearance", required), method=words.CLEARANCE_METHOD,
                   explanation=words.clearance_text(site, inputs, need), keys=keys, sources=(CLEARANCE_SOURCE,),
                   extra=(*_clearance_extra(need, inputs.reading), standard_measure(Chosen(None, "default"))))


def _clearance_extra(need: ClearanceNeed, reading: Reading) -> tuple[Measure, ...]:
    extra = [Measure("rated impulse voltage", Q_(need.basic_impulse, "V")),
             Measure("impulse voltage for the clearance", Q_(need.impulse, "V")),
             Measure("Table F.2 clearance", Q_(need.transient_mm, "mm")),
             Measure("Table F.2 reading", need.transient_reading),
             Measure("peak voltage for Table F.8", Q_(need.steady_peak, "V")),
             Measure("Table F.8 clearance", Q_(need.steady_mm, "mm")),
             Measure("Table F.8 reading", need.steady_reading),
             Measure("altitude factor", Q_(need.factor)),
             Measure("Table A.2 reading", need.altitude_reading)]
    if need.edition2_mm is not None:
        extra.append(Measure("edition 2 clearance (next impulse step)", Q_(need.edition2_mm, "mm")))
    return tuple(extra) + _clause_measure(reading)


def _clause_measure(reading: Reading) -> tuple[Measure, ...]:
    return (Measure("interpolation relies on", reading.clause),) if reading.interpolated else ()


# --- creepage ---------------------------------------------------------------------------------


def creepage_finding(site: Site, inputs: Inputs, clearance_mm: float | None, chosen: Chosen = Chosen(None, "default")) -> Finding:
    keys = (site.key("creepage"), *material_keys(site), site.key("printed_board"), *inputs.voltage_keys, ("environment", "pollution_degree"))
    try:
        group, _ = material_group_of(site.barrier)
    except std.OutsideTable as problem:
        return unsuitable_material(site, str(problem), keys)
    if chosen.standard is not None:
        return product_creepage_finding(site, inputs, chosen, group, clearance_mm, keys)
    if clearance_mm is None:
        return not_assessed(site, "ISO-CREEPAGE", "Creepage", words.NO_CLEARANCE_FLOOR, (*keys, site.key("clearance")), CREEPAGE_SOURCE)
    try:
        need = creepage_need(inputs, site, group, clearance_mm)
    except std.OutsideTable as problem:
        return not_assessed(site, "ISO-CREEPAGE", "Creepage", str(problem), keys, CREEPAGE_SOURCE)
    return judged_creepage(site, inputs, need, keys)


def judged_creepage(site: Site, inputs: Inputs, need: CreepageNeed, keys: tuple) -> Finding:
    declared, required = site.barrier.creepage, Q_(need.required_mm, "mm")
    bridged = bridged_slots(site, inputs)
    outcome = verdict(site, declared, required)
    if bridged and outcome is not Verdict.INFO:
        outcome = Verdict.FAIL
    text = words.creepage_text(site, inputs, need) + words.bridged_text(site, bridged)
    sources = (CREEPAGE_SOURCE,) if need.off_board_mm is None else (CREEPAGE_SOURCE, PRODUCT_CREEPAGE_SOURCE)
    return finding(code="ISO-CREEPAGE", subject=site.barrier.name, title=words.creepage_title(site.grade, bool(bridged)),
                   verdict=outcome, values=(Measure("declared creepage", declared),), limit=Measure("required creepage", required),
                   method=words.CREEPAGE_METHOD, explanation=text, keys=keys, sources=sources,
                   extra=(*_creepage_extra(need, inputs), standard_measure(Chosen(None, "default"))))


def _creepage_extra(need: CreepageNeed, inputs: Inputs) -> tuple[Measure, ...]:
    extra = [Measure("Table F.5 voltage", inputs.creepage_voltage), Measure("Table F.5 creepage (basic)", Q_(need.basic_mm, "mm")),
             Measure("Table F.5 reading", need.reading), Measure("material group", need.group),
             Measure("graded creepage", Q_(need.graded_mm, "mm")), Measure("required clearance (floor)", Q_(need.clearance_mm, "mm"))]
    if need.off_board_required_mm is not None:
        extra.append(Measure("required without the printed-board column", Q_(need.off_board_required_mm, "mm")))
    return tuple(extra) + _clause_measure(inputs.reading)


def unsuitable_material(site: Site, reason: str, keys: tuple) -> Finding:
    return finding(code="ISO-CREEPAGE", subject=site.barrier.name, title=words.UNSUITABLE_TITLE,
                   verdict=Verdict.FAIL, values=(Measure("CTI", site.barrier.cti),),
                   explanation=words.unsuitable_text(reason), keys=keys, sources=(CREEPAGE_SOURCE,))


# --- slots ------------------------------------------------------------------------------------


def slot_finding(site: Site, inputs: Inputs) -> Finding:
    j = judged_slot_index(site)
    slot = site.barrier.slots[j]
    keys = (site.key("slots", j, "width"), site.key("clearance"), ("environment", "pollution_degree"))
    try:
        minimum = minimum_groove(site, inputs)
    except std.OutsideTable as problem:
        return not_assessed(site, "ISO-SLOT", "Slot width", str(problem), keys, GROOVE_SOURCE)
    outcome = Verdict.INFO if not slot.credited else verdict(site, slot.width, minimum)
    return finding(code="ISO-SLOT", subject=site.barrier.name, title=words.slot_title(slot, minimum),
                   verdict=outcome, values=(Measure("slot width", slot.width),), limit=Measure("minimum groove width", minimum),
                   method=words.SLOT_METHOD, explanation=words.slot_text(site, inputs, slot, minimum), keys=keys,
                   sources=(GROOVE_SOURCE,), extra=(Measure("clause 6.8 width", Q_(std.GROOVE_MINIMUM_MM[inputs.pollution_degree], "mm")),))


# --- shared -----------------------------------------------------------------------------------


def no_voltage_finding(record, site: Site) -> Finding:
    keys = (site.key("working_voltage"), site.key("working_dc"), site.key("between"), ("mains",))
    return finding(code="ISO-NO-VOLTAGE", subject=site.barrier.name, title=words.not_assessed_title("Barrier", site),
                   verdict=unassessed_verdict(site), keys=keys, sources=(INPUTS_SOURCE,), guards_hazard=not site.guidance_only,
                   explanation=words.no_voltage_text(site, record.mains is not None))


CALC = Calc(
    name=NAME,
    title="Isolation",
    run=run,
    summary=("Checks the clearance and creepage declared across each isolation barrier against IEC 60664-1 edition 3 "
             "(2020): rated impulse voltage (Table F.1), clearance for transients (Table F.2, case A) and for "
             "steady-state and recurring peak voltages (Table F.8, case A), the larger, with the altitude factor "
             "(Table A.2), creepage (Tables F.3 and F.5) by pollution degree and material group, reinforced and "
             "double insulation, and slots that are too narrow to count (clause 6.8). Between table rows the next "
             "row up is taken unless the archive allows interpolation and names the clause it relies on."),
    codes=CODES,
    order=10,
)
