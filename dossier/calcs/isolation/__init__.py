"""Isolation: clearance and creepage across each declared barrier, per IEC 60664-1 edition 3 (2020)."""

from __future__ import annotations

import math
from dataclasses import replace

from dossier.calcs.shared.finding_kit import maker, not_assessed as not_assessed_finding
from dossier.calcs.isolation.inputs import Inputs, Site, derive_inputs, material_group_of, material_key
from dossier.calcs.isolation.needs import (
    DOUBLED_GRADES, ClearanceNeed, CreepageNeed, bridged_slots, clearance_need, creepage_need, impulse_voltages,
    judged_slot_index, minimum_groove,
)
from dossier.citations import IEC_60664_1, IEC_62368_1
from dossier.findings import Finding, Measure, Verdict, judge
from dossier.plugins import Calc
from dossier.standards import iec60664 as std
from dossier.units import Q_, fmt

NAME = "isolation"
finding = maker(NAME)
MARGINAL_WITHIN = 0.10  # dossier's own band: within 10 % of the requirement is marginal
INTERPOLATION_NOTE = "interpolated linearly between rows (from memory, to verify against the standard's note)"

CLEARANCE_SOURCE = replace(IEC_60664_1, clause=(
    "Table F.1 (rated impulse voltage); Table F.2, case A (clearance); Table A.2 (altitude); "
    "reinforced clearance for 160 % of the basic impulse voltage"))
CREEPAGE_SOURCE = replace(IEC_60664_1, clause=(
    "Table F.3 (rationalised voltage); Table F.5 (creepage for basic insulation); "
    "reinforced creepage twice basic, never less than the clearance"))
PRODUCT_CREEPAGE_SOURCE = replace(IEC_62368_1, clause="Table 17 (creepage; no printed-board column, from memory)")
GROOVE_SOURCE = replace(IEC_60664_1, clause="clause 6.8 (grooves across a creepage path)")
INPUTS_SOURCE = replace(IEC_60664_1, clause=(
    "Table F.1 (rated impulse voltage); Table F.3 (rationalised voltage); material groups by comparative tracking index"))

CLEARANCE = "ISO-CLEARANCE"
CREEPAGE = "ISO-CREEPAGE"

CODES = {
    "ISO-INPUTS": "what the barrier's requirements were derived from: working voltage, impulse voltage, material group",
    "ISO-CLEARANCE": "declared clearance against the clearance IEC 60664-1 requires",
    "ISO-CREEPAGE": "declared creepage against the creepage IEC 60664-1 requires",
    "ISO-SLOT": "a slot or groove in the creepage path is at least as wide as clause 6.8 asks, or counts as bridged",
    "ISO-NO-VOLTAGE": "the barrier cannot be assessed: no mains record and no working voltage declared",
}


def run(record):
    findings = []
    for index, barrier in enumerate(record.barriers):
        findings.extend(barrier_findings(record, Site(index, barrier)))
    return findings


def barrier_findings(record, site: Site) -> list[Finding]:
    if record.mains is None and site.barrier.working_voltage is None:
        return [no_voltage_finding(site)]
    inputs = derive_inputs(record, site)
    clearance = clearance_finding(site, inputs)
    findings = [inputs_finding(site, inputs), clearance]
    findings.append(creepage_finding(site, inputs, _required(clearance)))
    if site.barrier.slots:
        findings.append(slot_finding(site, inputs))
    return findings


def _required(clearance: Finding):
    """The required clearance in mm, or None when it could not be assessed."""
    return clearance.limit.quantity.to("mm").magnitude if clearance.limit else None


# --- inputs -----------------------------------------------------------------------------------


def inputs_finding(site: Site, inputs: Inputs) -> Finding:
    values = [Measure("working voltage RMS", inputs.working_rms), Measure("peak working voltage", inputs.working_peak),
              Measure("Table F.5 voltage", inputs.creepage_voltage)]
    notes = list(inputs.notes)
    values += _impulse_measures(site, inputs, notes)
    values += _group_measures(site.barrier, notes)
    return finding(code="ISO-INPUTS", subject=site.barrier.name, title=f"Derived inputs for {site.grade} insulation",
                   verdict=Verdict.INFO, values=tuple(values), explanation=_capitalised("; ".join(notes)) + ".",
                   keys=(inputs.rms_key, *inputs.supply_keys, material_key(site)), sources=(INPUTS_SOURCE,))


def _impulse_measures(site: Site, inputs: Inputs, notes: list) -> list[Measure]:
    try:
        basic, impulse = impulse_voltages(inputs, site.grade)
    except std.OutsideTable as problem:
        notes.append(f"impulse voltage not found: {problem}")
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
    keys = (site.key("clearance"), *inputs.supply_keys)
    try:
        need = clearance_need(inputs, site.grade)
    except std.OutsideTable as problem:
        return not_assessed(site, "ISO-CLEARANCE", "Clearance", str(problem), keys, CLEARANCE_SOURCE)
    declared, required = site.barrier.clearance, Q_(need.required_mm, "mm")
    return finding(code="ISO-CLEARANCE", subject=site.barrier.name, title=f"Clearance for {site.grade} insulation",
                   verdict=verdict(site, declared, required), values=(Measure("declared clearance", declared),),
                   limit=Measure("required clearance", required), method=CLEARANCE_METHOD,
                   explanation=clearance_text(site, inputs, need), keys=keys, sources=(CLEARANCE_SOURCE,),
                   extra=_clearance_extra(need))


CLEARANCE_METHOD = ("required = Table F.2 case A (impulse voltage, pollution degree) x Table A.2 altitude factor; "
                    "impulse voltage from Table F.1, x 1.6 for reinforced and double insulation")


def _clearance_extra(need: ClearanceNeed) -> tuple[Measure, ...]:
    extra = [Measure("rated impulse voltage", Q_(need.basic_impulse, "V")), Measure("Table F.2 clearance", Q_(need.table_mm, "mm")),
             Measure("altitude factor", Q_(need.factor))]
    if need.edition2_mm is not None:
        extra.append(Measure("edition 2 clearance (next impulse step)", Q_(need.edition2_mm, "mm")))
    return tuple(extra)


def clearance_text(site: Site, inputs: Inputs, need: ClearanceNeed) -> str:
    parts = [f"Rated impulse voltage {need.basic_impulse:g} V (Table F.1, {inputs.supply_note})"]
    if site.grade in DOUBLED_GRADES:
        parts.append(f"{site.grade} insulation is dimensioned for 160 % of it, {need.impulse:g} V (edition 3, 2020)")
    parts.append(_table_f2_text(inputs, need))
    parts.append(_altitude_text(inputs, need))
    if site.grade in DOUBLED_GRADES:
        parts.append(_edition2_text(need))
    parts.append(grade_note(site))
    return sentences(parts)


def _table_f2_text(inputs: Inputs, need: ClearanceNeed) -> str:
    rows = {volts for volts, _ in std.CLEARANCE_F2}
    how = "" if need.impulse in rows else f", {INTERPOLATION_NOTE}"
    return f"Table F.2, case A, pollution degree {inputs.pollution_degree}: {need.table_mm:.3g} mm{how}"


def _altitude_text(inputs: Inputs, need: ClearanceNeed) -> str:
    altitude = fmt(inputs.altitude.to("m"))
    if need.factor == 1:
        return f"Altitude {altitude}: no correction up to 2000 m (Table A.2)"
    rows = {metres for metres, _ in std.ALTITUDE_A2}
    how = "" if inputs.altitude.to("m").magnitude in rows else ", interpolated between its rows"
    return f"Altitude {altitude}: factor {need.factor:.3g} (Table A.2{how}), so {need.required_mm:.3g} mm"


def _edition2_text(need: ClearanceNeed) -> str:
    if need.edition2_mm is None:
        return "Edition 2 (2007) took the next step of the impulse series instead; that step lies beyond the table here"
    same = "the same" if math.isclose(need.edition2_mm, need.required_mm) else "a different result"
    return (f"Edition 2 (2007) took the next step of the impulse series instead, giving {need.edition2_mm:.3g} mm here "
            f"({same}; the editions differ at overvoltage category III)")


def grade_note(site: Site) -> str:
    return GRADE_NOTES.get(site.grade, "")


GRADE_NOTES = {
    "functional": "Functional insulation is no safety barrier: the basic-insulation values are shown as guidance, without a verdict",
    "supplementary": "Supplementary insulation is dimensioned as basic insulation",
    "double": ("Double insulation is judged here as one reinforced gap; each of its basic and supplementary layers "
               "must also meet the basic values on its own, which one declared pair cannot show"),
}


# --- creepage ---------------------------------------------------------------------------------


def creepage_finding(site: Site, inputs: Inputs, clearance_mm: float | None) -> Finding:
    keys = (site.key("creepage"), material_key(site), site.key("printed_board"), inputs.rms_key, ("environment", "pollution_degree"))
    try:
        group, _ = material_group_of(site.barrier)
    except std.OutsideTable as problem:
        return unsuitable_material(site, str(problem), keys)
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
    text = creepage_text(site, inputs, need) + bridged_text(site, bridged)
    sources = (CREEPAGE_SOURCE,) if need.off_board_mm is None else (CREEPAGE_SOURCE, PRODUCT_CREEPAGE_SOURCE)
    title = f"Creepage for {site.grade} insulation" + (": not credited, a slot counts as bridged" if bridged else "")
    return finding(code="ISO-CREEPAGE", subject=site.barrier.name, title=title,
                   verdict=outcome, values=(Measure("declared creepage", declared),), limit=Measure("required creepage", required),
                   method=CREEPAGE_METHOD, explanation=text, keys=keys, sources=sources, extra=_creepage_extra(need))


def _creepage_extra(need: CreepageNeed) -> tuple[Measure, ...]:
    extra = [Measure("Table F.5 creepage (basic)", Q_(need.basic_mm, "mm")), Measure("material group", need.group)]
    if need.off_board_required_mm is not None:
        extra.append(Measure("required without the printed-board column", Q_(need.off_board_required_mm, "mm")))
    return tuple(extra)


CREEPAGE_METHOD = "required = max(Table F.5 value x 2 for reinforced and double insulation, required clearance)"


def creepage_text(site: Site, inputs: Inputs, need: CreepageNeed) -> str:
    parts = [inputs.creepage_note, _table_f5_text(inputs, need)]
    if site.grade in DOUBLED_GRADES:
        parts.append(f"{site.grade} insulation needs twice that, {need.graded_mm:.3g} mm")
    if need.clearance_mm is not None and need.clearance_mm > need.graded_mm:
        parts.append(f"raised to the required clearance, {need.clearance_mm:.3g} mm: creepage is never less than the clearance")
    parts.append(_board_note(site, inputs, need))
    parts.append(_off_board_note(need))
    parts.append(grade_note(site))
    return sentences(parts)


def sentences(parts) -> str:
    return ". ".join(_capitalised(part) for part in parts if part) + "."


def _capitalised(text: str) -> str:
    return text[:1].upper() + text[1:]


def _table_f5_text(inputs: Inputs, need: CreepageNeed) -> str:
    volts = inputs.creepage_voltage.to("V").magnitude
    how = "" if volts in std.CREEPAGE_ROWS or volts <= std.CREEPAGE_ROWS[0] else f", {INTERPOLATION_NOTE}"
    return f"Table F.5 at {volts:g} V, {column_text(need.column)}, material group {need.group}: {need.basic_mm:.3g} mm for basic insulation{how}"


def column_text(column: str) -> str:
    if column.startswith("board-"):
        return f"printed-board column for pollution degree {column[-1]}"
    pd, _, family = column.partition("-")
    return f"pollution degree {pd[-1]} column" + (f" for material group {family}" if family else "")


def _board_note(site: Site, inputs: Inputs, need: CreepageNeed) -> str:
    pd = inputs.pollution_degree
    if not site.barrier.printed_board or need.column.startswith("board-"):
        return ""
    if pd in std.BOARD_COLUMNS:
        return f"the printed-board column does not apply to material group {need.group} at pollution degree {pd}"
    return f"Table F.5 has no printed-board column at pollution degree {pd}"


def _off_board_note(need: CreepageNeed) -> str:
    if need.off_board_required_mm is None:
        return ""
    return (f"without the printed-board column it would be {need.off_board_required_mm:.3g} mm: product standards "
            f"such as IEC 62368-1 (Table 17) give no printed-board column (from memory), so check which standard the unit "
            f"must meet")


def unsuitable_material(site: Site, reason: str, keys: tuple) -> Finding:
    return finding(code="ISO-CREEPAGE", subject=site.barrier.name, title="Creepage: insulating material unsuitable",
                   verdict=Verdict.FAIL, values=(Measure("CTI", site.barrier.cti),),
                   explanation=f"{reason}. Use a material of CTI 100 or more and declare its group or CTI.",
                   keys=keys, sources=(CREEPAGE_SOURCE,))


# --- slots ------------------------------------------------------------------------------------


def bridged_text(site: Site, bridged: list[int]) -> str:
    if not bridged:
        return ""
    named = ", ".join(f"{fmt(site.barrier.slots[j].width)}" for j in bridged)
    return (f" A slot the declared creepage counts on ({named}) is too narrow and counts as bridged (clause 6.8), so the "
            f"declared {fmt(site.barrier.creepage)} cannot be credited. Measure the creepage straight across the slot and "
            f"declare that value with 'credited: false' on the slot, or widen the slot.")


def slot_finding(site: Site, inputs: Inputs) -> Finding:
    j = judged_slot_index(site)
    slot = site.barrier.slots[j]
    keys = (site.key("slots", j, "width"), site.key("clearance"), ("environment", "pollution_degree"))
    try:
        minimum = minimum_groove(site, inputs)
    except std.OutsideTable as problem:
        return not_assessed(site, "ISO-SLOT", "Slot width", str(problem), keys, GROOVE_SOURCE)
    outcome = Verdict.INFO if not slot.credited else verdict(site, slot.width, minimum)
    return finding(code="ISO-SLOT", subject=site.barrier.name, title=slot_title(slot, minimum),
                   verdict=outcome, values=(Measure("slot width", slot.width),), limit=Measure("minimum groove width", minimum),
                   method=SLOT_METHOD, explanation=slot_text(site, inputs, slot, minimum), keys=keys, sources=(GROOVE_SOURCE,))


SLOT_METHOD = ("minimum width by pollution degree (1: 0.25 mm, 2: 1.0 mm, 3: 1.5 mm); "
               "one third of the declared clearance where that is below 3 mm, if smaller")


def slot_title(slot, minimum) -> str:
    if slot.width < minimum:
        return "Slot too narrow: counts as bridged"
    return "Slot wide enough to interrupt the creepage path"


def slot_text(site: Site, inputs: Inputs, slot, minimum) -> str:
    clearance = site.barrier.clearance.to("mm")
    reduced = "; as the declared clearance is below 3 mm, one third of it is enough" if clearance.magnitude < std.GROOVE_REDUCTION_BELOW_MM else ""
    base = fmt(Q_(std.GROOVE_MINIMUM_MM[inputs.pollution_degree], "mm"))
    text = f"Clause 6.8: at pollution degree {inputs.pollution_degree} a groove interrupts a creepage path only if it is at least {base} wide{reduced}."
    if slot.width < minimum:
        text += " A narrower one is measured straight across, as if bridged by dirt and moisture."
    if not slot.credited:
        text += " The declared creepage does not count on this slot ('credited: false'), so its width is for information."
    return text + ("" if not site.guidance_only else " " + grade_note(site) + ".")


# --- shared -----------------------------------------------------------------------------------


def verdict(site: Site, declared, required) -> Verdict:
    if site.guidance_only:
        return Verdict.INFO
    return judge(declared.to("mm"), required.to("mm"), ">=", MARGINAL_WITHIN)


def not_assessed(site: Site, code: str, what: str, reason: str, keys: tuple, source) -> Finding:
    why = f"{reason}; check this barrier against IEC 60664-1 directly"
    return not_assessed_finding(NAME, code, site.barrier.name, f"{what} not assessed", why, keys, (source,))


def no_voltage_finding(site: Site) -> Finding:
    return finding(code="ISO-NO-VOLTAGE", subject=site.barrier.name, title="Barrier not assessed: no working voltage",
                   verdict=Verdict.INFO, keys=(site.key("working_voltage"), ("mains",)), sources=(INPUTS_SOURCE,),
                   explanation=("The record has no mains section and the barrier declares no working_voltage. Add a mains section "
                                "(nominal, frequency, overvoltage_category) or give working_voltage on this barrier."))


CALC = Calc(
    name=NAME,
    title="Isolation",
    run=run,
    summary=("Checks the clearance and creepage declared across each isolation barrier against IEC 60664-1 edition 3 "
             "(2020): rated impulse voltage (Table F.1), clearance (Table F.2, case A) with the altitude factor "
             "(Table A.2), creepage (Tables F.3 and F.5) by pollution degree and material group, reinforced and "
             "double insulation, and slots that are too narrow to count (clause 6.8)."),
    codes=CODES,
    order=10,
)
