"""Isolation calc: what the chosen standard asks beyond IEC 60664-1 -- its clearance and creepage tables, the
electric-strength test of each barrier, its protective-earth limit -- and the functional board spacing."""

from __future__ import annotations

from dataclasses import replace

from dossier.calcs.isolation import words
from dossier.calcs.isolation.inputs import Inputs, Site
from dossier.calcs.isolation.judging import finding, not_assessed, standard_source, verdict
from dossier.calcs.isolation.needs import ClearanceNeed, bridged_slots, clearance_need, creepage_need, impulse_voltages
from dossier.calcs.isolation.product import product_clearance, product_creepage
from dossier.calcs.isolation.standard import STANDARD_LABEL, Chosen
from dossier.citations import IEC_60664_1, IPC_2221
from dossier.findings import Finding, Measure, Verdict, judge
from dossier.standards import ipc2221
from dossier.standards.iec60664 import OutsideTable
from dossier.standards.product import TableNotHeld, TestVoltage
from dossier.units import Q_

BASIC_HIPOT_SOURCE = replace(IEC_60664_1, clause=words.BASIC_HIPOT_TABLE + " (from memory)")
BASIC_TEMPORARY_OVERVOLTAGE_V = 1200
BASIC_HIPOT_SECONDS = 5


def standard_measure(chosen: Chosen) -> Measure:
    return Measure(STANDARD_LABEL, chosen.name)


def standard_finding(record, chosen: Chosen) -> Finding:
    confirmed, from_memory = _provenance_lists(chosen)
    basic = replace(IEC_60664_1, clause="the basic standard: Tables F.1, F.2, F.3, F.5, F.8 and A.2")
    sources = (basic,) if chosen.standard is None else (standard_source(chosen.standard, "the tables named in the finding"), basic)
    return finding(code="ISO-STANDARD", subject="product standard", title=words.STANDARD_TITLE, verdict=Verdict.INFO,
                   values=(standard_measure(chosen),),
                   explanation=words.standard_text(chosen, from_memory, confirmed, MISSING.get(_key(chosen), [])),
                   keys=chosen.keys or ((("mains",),) if record.mains is not None else (("barriers",),)), sources=sources)


def _key(chosen: Chosen) -> str:
    return chosen.standard.key if chosen.standard is not None else ""


PROVENANCE = {  # standard key -> (confirmed in public material, from memory)
    "iec-62368-1": (["Table 14 at 2 500 V peak, pollution degree 2 (1.5 mm basic, 3.0 mm reinforced)",
                     "Table 17 at 250 V, pollution degree 2", "reinforced insulation tested at 4 000 V d.c. on a 240 V mains"],
                    ["the other rows of Tables 14 and 17", "Tables 25 and 27 (test voltages)", "the 60 s test duration",
                     "clause 5.6.6.2 (earth)", "Table 38 (touch temperatures of metal parts)"]),
    "iec-60335-1": ([], ["Tables 16 and 17 (clearance, creepage)", "clause 29.1.4 (reinforced: next impulse step)",
                         "Table 7 (test voltages)", "clause 27.5 (earth)", "Table 3 (temperature rises of handles)"]),
    "iec-61558-1": (["Tables 20 and 21 (clearance, creepage) and Table 14 (test voltages), in one public transcription "
                     "that agrees with IEC 60664-1 where checked"],
                    ["the 60 s test duration", "the protective-earth rule"]),
    "iec-61010-1": ([], ["Table 5 (test voltages, category II up to 300 V)", "clause 6.5.2.4 (protective bonding)",
                         "Table 19 (surface temperatures)"]),
}
MISSING = {"iec-61010-1": ["Table 4 and Annex K (clearance and creepage of mains circuits): not found in public material, "
                           "so clearance and creepage are not assessed under this standard"]}


def _provenance_lists(chosen: Chosen) -> tuple[list[str], list[str]]:
    if chosen.standard is None:
        return (["Tables F.1, F.2, F.3, F.5, F.8 and A.2"], [words.BASIC_HIPOT_TABLE])
    confirmed, from_memory = PROVENANCE[chosen.standard.key]
    return confirmed, from_memory


# --- clearance and creepage by the product standard ------------------------------------------------


def product_clearance_finding(site: Site, inputs: Inputs, chosen: Chosen) -> Finding:
    standard = chosen.standard
    keys = (site.key("clearance"), *inputs.voltage_keys, *inputs.supply_keys, *chosen.keys)
    try:
        need = clearance_need(inputs, site.grade)
        clearance = product_clearance(standard, inputs, site, need)
    except TableNotHeld as problem:
        return _table_not_held(site, "ISO-CLEARANCE", "Clearance", problem, keys, chosen, Q_(need.required_mm, "mm"))
    except OutsideTable as problem:
        return not_assessed(site, "ISO-CLEARANCE", "Clearance", str(problem), keys, standard_source(standard, "clearance table"))
    declared, required = site.barrier.clearance, Q_(clearance.required_mm, "mm")
    source = standard_source(standard, f"{clearance.table.table} ({clearance.table.provenance})")
    return finding(code="ISO-CLEARANCE", subject=site.barrier.name, title=words.clearance_title(site.grade),
                   verdict=verdict(site, declared, required), values=(Measure("declared clearance", declared),),
                   limit=Measure("required clearance", required), method=words.PRODUCT_CLEARANCE_METHOD,
                   explanation=words.product_clearance_text(site, inputs, standard, need, clearance), keys=keys,
                   sources=(source, IEC_60664_1), extra=_clearance_extra(chosen, need, clearance))


def _clearance_extra(chosen: Chosen, need: ClearanceNeed, clearance) -> tuple[Measure, ...]:
    return (standard_measure(chosen), Measure("table and row", clearance.table.table),
            Measure("table figure", Q_(clearance.table.value, "mm")), Measure("table figure provenance", clearance.table.provenance),
            Measure("rated impulse voltage", Q_(need.basic_impulse, "V")), Measure("IEC 60664-1 Table F.8 clearance", Q_(need.steady_mm, "mm")),
            Measure("altitude factor", Q_(clearance.factor)), Measure("IEC 60664-1 alone", Q_(clearance.basic_standard_mm, "mm")))


def product_creepage_finding(site: Site, inputs: Inputs, chosen: Chosen, group: str, clearance_mm: float | None, keys: tuple) -> Finding:
    """The product standard's creepage, never less than the required clearance (None: the clearance is not known)."""
    standard = chosen.standard
    keys = (*keys, *chosen.keys)
    try:
        basic_mm = creepage_need(inputs, site, group, clearance_mm if clearance_mm is not None else 0.0).required_mm
    except OutsideTable:
        basic_mm = None
    try:
        creepage = product_creepage(standard, inputs, site, group, clearance_mm, basic_mm)
    except TableNotHeld as problem:
        basic = Q_(basic_mm, "mm") if basic_mm is not None else None
        return _table_not_held(site, "ISO-CREEPAGE", "Creepage", problem, keys, chosen, basic)
    except OutsideTable as problem:
        return not_assessed(site, "ISO-CREEPAGE", "Creepage", str(problem), keys, standard_source(standard, "creepage table"))
    if clearance_mm is None:
        return not_assessed(site, "ISO-CREEPAGE", "Creepage", words.NO_CLEARANCE_FLOOR, (*keys, site.key("clearance")),
                            standard_source(standard, "creepage table"))
    declared, required = site.barrier.creepage, Q_(creepage.required_mm, "mm")
    bridged = bridged_slots(site, inputs)
    outcome = verdict(site, declared, required)
    if bridged and outcome is not Verdict.INFO:
        outcome = Verdict.FAIL
    source = standard_source(standard, f"{creepage.table.table} ({creepage.table.provenance})")
    extra = (standard_measure(chosen), Measure("table and row", creepage.table.table), Measure("table figure", Q_(creepage.table.value, "mm")),
             Measure("table figure provenance", creepage.table.provenance), Measure("required clearance (floor)", Q_(clearance_mm, "mm")))
    if basic_mm is not None:
        extra += (Measure("IEC 60664-1 alone", Q_(basic_mm, "mm")),)
    return finding(code="ISO-CREEPAGE", subject=site.barrier.name, title=words.creepage_title(site.grade, bool(bridged)),
                   verdict=outcome, values=(Measure("declared creepage", declared),), limit=Measure("required creepage", required),
                   method=words.PRODUCT_CREEPAGE_METHOD, explanation=words.product_creepage_text(site, inputs, standard, creepage)
                   + words.bridged_text(site, bridged), keys=keys, sources=(source,), extra=extra)


def _table_not_held(site: Site, code: str, what: str, problem: TableNotHeld, keys: tuple, chosen: Chosen, basic_figure) -> Finding:
    """The standard's table is not held: not assessed (blocking on a safety barrier), with IEC 60664-1's figure as guidance."""
    made = not_assessed(site, code, what, str(problem), keys, standard_source(chosen.standard, f"{what.lower()} table (not held)"))
    extra = (standard_measure(chosen), Measure("table not held", str(problem)))
    if basic_figure is not None:
        extra += (Measure("IEC 60664-1 alone (guidance, not this standard's figure)", basic_figure),)
    return replace(made, explanation=words.table_not_held_text(str(problem), site, chosen.name, basic_figure), extra=extra)


# --- electric strength ---------------------------------------------------------------------------


def hipot_finding(record, site: Site, inputs: Inputs, chosen: Chosen) -> Finding | None:
    """The test voltage for a safety barrier, for the qualified person's checklist; None for functional insulation."""
    if site.guidance_only:
        return None
    keys = (*inputs.voltage_keys, ("mains", "nominal"), *chosen.keys)
    try:
        test, source, provenance = _test_voltage(record, site, inputs, chosen)
    except OutsideTable as problem:
        return finding(code="ISO-HIPOT", subject=site.barrier.name, title=words.hipot_title(site.grade), verdict=Verdict.INFO,
                       explanation=f"No test voltage found: {problem}. {words.HIPOT_CAUTION}.", keys=keys, sources=(IEC_60664_1,),
                       extra=(standard_measure(chosen),))
    return finding(code="ISO-HIPOT", subject=site.barrier.name, title=words.hipot_title(site.grade), verdict=Verdict.INFO,
                   values=(Measure("test voltage", Q_(test.volts, "V")),),
                   explanation=words.hipot_text(site, chosen.name, test, provenance), keys=keys, sources=(source,),
                   extra=(standard_measure(chosen), Measure("waveform", test.waveform), Measure("duration", Q_(test.seconds, "s")),
                          Measure("table and row", test.table), Measure("pass criterion", "no breakdown")))


def _test_voltage(record, site: Site, inputs: Inputs, chosen: Chosen):
    mains = record.mains.nominal.to("V").magnitude if record.mains is not None and site.touches_mains else None
    working = inputs.creepage_voltage.to("V").magnitude
    if chosen.standard is None:
        return _basic_test_voltage(site, mains if mains is not None else working), BASIC_HIPOT_SOURCE, "from memory"
    basic_impulse, _ = impulse_voltages(inputs, "basic")
    test = chosen.standard.test_voltage(site.grade, mains, working, basic_impulse, category=inputs.category)
    provenance = "confirmed in public material" if test.confirmed else "from memory"
    return test, standard_source(chosen.standard, f"{test.table} ({provenance})"), provenance


def _basic_test_voltage(site: Site, nominal_v: float):
    volts = nominal_v + BASIC_TEMPORARY_OVERVOLTAGE_V
    doubled = site.doubled
    return TestVoltage(volts * (2 if doubled else 1), "a.c. r.m.s.", BASIC_HIPOT_SECONDS,
                       f"{words.BASIC_HIPOT_TABLE}: U_n {nominal_v:g} V + 1 200 V" + (", doubled" if doubled else ""), False)


# --- protective earth ----------------------------------------------------------------------------


def earth_limit_finding(record, chosen: Chosen) -> Finding | None:
    """The chosen product standard's protective-earth continuity limit, for a class I unit on the mains."""
    earth = record.protection.earth
    if chosen.standard is None or record.mains is None or (earth is not None and earth.protective_class != "I"):
        return None
    rule = chosen.standard.earth
    return finding(code="ISO-PE-LIMIT", subject="protective earth", title=words.EARTH_TITLE, verdict=Verdict.INFO,
                   values=(Measure("earth continuity limit", Q_(rule.limit_ohm, "ohm")),),
                   explanation=words.earth_text(chosen.name, rule), keys=(("protection", "earth"), *chosen.keys),
                   sources=(standard_source(chosen.standard, rule.clause),), extra=(standard_measure(chosen), Measure("test", rule.test)))


# --- functional board spacing ------------------------------------------------------------------


def board_spacing_findings(record) -> list[Finding]:
    altitude = record.environment.altitude.to("m").magnitude
    return [_board_spacing(index, spacing, altitude) for index, spacing in enumerate(record.board_spacings)]


def _board_spacing(index: int, spacing, altitude_m: float) -> Finding:
    keys = (("board_spacings", index, "spacing"), ("board_spacings", index, "voltage"), ("board_spacings", index, "condition"))
    volts = abs(spacing.voltage.to("V").magnitude)
    try:
        column = ipc2221.column_for(spacing.condition, altitude_m)
    except OutsideTable as problem:
        return finding(code="ISO-BOARD-SPACING", subject=spacing.name, title=words.BOARD_TITLE, verdict=Verdict.INFO,
                       explanation=words.board_not_assessed(spacing, problem), keys=(*keys, ("environment", "altitude")), sources=(IPC_2221,))
    minimum_mm, row = ipc2221.spacing_mm(volts, column)
    minimum = Q_(minimum_mm, "mm")
    return finding(code="ISO-BOARD-SPACING", subject=spacing.name, title=words.BOARD_TITLE,
                   verdict=judge(spacing.spacing.to("mm"), minimum), values=(Measure("declared spacing", spacing.spacing),),
                   limit=Measure("minimum functional spacing", minimum), method=words.BOARD_METHOD,
                   explanation=words.board_text(spacing, column, row), keys=keys, sources=(IPC_2221,),
                   extra=(Measure("Table 6-1 column", column), Measure("Table 6-1 row", row)))
