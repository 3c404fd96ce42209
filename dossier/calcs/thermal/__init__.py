"""Thermal: device losses, junction temperatures through the heat path, heatsinks, insulating pads, soak tests."""

from __future__ import annotations

from dataclasses import replace
from functools import partial

from dossier.calcs.thermal import path, tab, words
from dossier.calcs.thermal.air import air_of
from dossier.calcs.shared.finding_kit import banded, maker, not_assessed
from dossier.calcs.shared.margins import margin
from dossier.calcs.thermal.soak import soak_findings
from dossier.calcs.thermal.touch import touch_limit
from dossier.calcs.shared.standard_choice import chosen_product_standard
from dossier.citations import IEC_61140, IEC_62368_1, MOHAN_POWER_ELECTRONICS
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.plugins import Calc
from dossier.units import fmt

JUNCTION = "THERM-JUNCTION"
HEATSINK = "THERM-HEATSINK"

NAME = "thermal"
PAD_RANGES = common_practice("insulating pads about 1-4 K/W, greased bare mount about 0.1-0.5 K/W (makers' pad listings)")
RDS_RISE_PRACTICE = common_practice(
    "a silicon MOSFET's on-resistance rises about 1.5-2.5 x from 25 degC to 150 degC, high-voltage parts at the top; "
    "the top is assumed when the record gives no curve (from memory; the maker's normalised R_DS(on) curve makes it exact)")
TAB_SOURCES = (
    replace(IEC_61140, edition="edition 4.0, 2016", clause="class I (basic insulation plus protective earth) and class II (double or reinforced insulation) equipment (from memory)"),
    replace(IEC_62368_1, edition="edition 3.0, 2018", clause="clause 5.4: a pad and bush as basic insulation; double or reinforced insulation to accessible parts (from memory)"),
)
finding = maker(NAME)


def run(record, default_standard=None):
    findings = []
    for index, device in enumerate(record.devices.semiconductors):
        findings += _junction(record, index, device)
        findings += _pad(record, index, device)
    standard = chosen_product_standard(record, default_standard)
    for index, heatsink in enumerate(record.devices.heatsinks):
        findings += _heatsink(record, index, heatsink, standard)
    return findings + soak_findings(record)


def configured(settings):
    """This calc with the archive's default product standard (archive.yaml standard), for its touch limits."""
    return CALC if settings.standard is None else replace(CALC, run=partial(run, default_standard=settings.standard))


# --- junctions ----------------------------------------------------------------------------------

def _junction(record, index: int, device) -> list[Finding]:
    key = ("devices", "semiconductors", index)
    title = f"{device.ref} junction temperature"
    heatsink = path.heatsink_named(record, device.heatsink)
    air = air_of(record, heatsink, _sink_index(record, heatsink))
    ambient = air.temperature
    junction = path.junction_of(record, device, ambient)
    if junction is None or device.max_junction is None:
        why = words.JUNCTION_MISSING[_junction_missing(device)]
        return [not_assessed(NAME, "THERM-JUNCTION", device.ref, title, why, (key,), (MOHAN_POWER_ELECTRONICS,))]
    allowance = margin(record, "junction")
    limit = (device.max_junction.to("K") - allowance.value.to("K")).to("degC")
    # fail above the maximum junction temperature; marginal inside the allowance below it
    verdict = banded(junction.temperature, limit, device.max_junction, "<=")
    return [finding(
        code="THERM-JUNCTION", subject=device.ref, title=title, verdict=verdict,
        values=(Measure(f"junction at {fmt(ambient)} {words.air_label(air)}", junction.temperature),),
        limit=Measure(f"max junction {fmt(device.max_junction)} less {fmt(allowance.value)}", limit), relation="<=",
        method=f"{junction.formula}; {junction.loss.formula}",
        explanation=f"{words.junction(device, junction, verdict)} {words.air(air)}",
        keys=(key, *air.keys),
        sources=_junction_sources(junction, allowance.source) + air.sources,
        extra=_loss_measures(junction) + (Measure(words.air_label(air), ambient), Measure("max junction", device.max_junction),
                                          Measure("junction allowance", allowance.value)),
    )]


def _junction_missing(device) -> str:
    """The key into words.JUNCTION_MISSING naming what the record lacks."""
    if path.loss_of(device) is None:
        return "mosfet-loss" if device.kind == "mosfet" else "loss"
    if device.max_junction is None:
        return "max_junction"
    return "rth_jc" if device.heatsink else "rth_ja"


def _junction_sources(junction, allowance_source):
    assumed = junction.case_to_sink is not None and junction.case_to_sink.assumed
    rds = (RDS_RISE_PRACTICE,) if junction.loss.rds_assumed else ()
    return (MOHAN_POWER_ELECTRONICS, allowance_source) + ((PAD_RANGES,) if assumed else ()) + rds


def _loss_measures(junction) -> tuple[Measure, ...]:
    loss = junction.loss
    parts = [("conduction loss", loss.conduction), ("switching loss", loss.switching), ("hot on-resistance", loss.on_resistance)]
    measures = [Measure(label, value) for label, value in parts if value is not None]
    if junction.case_to_sink is not None:
        measures.append(Measure("case-to-sink resistance", junction.case_to_sink.resistance))
    return tuple(measures) + (Measure("loss", loss.total), Measure("junction-to-air resistance", junction.path))


# --- heatsinks ----------------------------------------------------------------------------------

def _heatsink(record, index: int, heatsink, standard=(None, "default")) -> list[Finding]:
    losses = path.sink_losses(record, heatsink)
    air = air_of(record, heatsink, index)
    ambient = air.temperature
    temperature = path.sink_temperature(ambient, heatsink, losses)
    common = dict(
        code="THERM-HEATSINK", subject=heatsink.ref, title=f"{heatsink.ref} temperature",
        values=(Measure(f"heatsink at {fmt(ambient)} {words.air_label(air)}", temperature),),
        method="T_sink = T_a + R_sa x sum(P of the devices on it)",
        keys=(("devices", "heatsinks", index, "rth_sa"), *air.keys),
        extra=(Measure("total loss", path.total_loss(losses)), Measure("sink-to-air resistance", heatsink.rth_sa),
               Measure(words.air_label(air), ambient)),
    )
    text = words.sink(heatsink, losses)
    if not heatsink.touchable:
        return [finding(**common, verdict=Verdict.INFO, explanation=f"{text}{words.UNTOUCHABLE} {words.air(air)}",
                        sources=(MOHAN_POWER_ELECTRONICS,) + air.sources)]
    touch = touch_limit(record, heatsink, index, *standard)
    verdict = Verdict.FAIL if temperature.to("K") > touch.limit.to("K") else Verdict.PASS
    common["keys"] = common["keys"] + touch.keys
    return [finding(**common, verdict=verdict, limit=Measure("touch limit", touch.limit), relation="<=",
                    explanation=f"{text}{words.touch(verdict, touch.from_record, touch.standard_words)} {words.air(air)}",
                    sources=(MOHAN_POWER_ELECTRONICS, touch.source) + air.sources)]


def _sink_index(record, heatsink) -> int | None:
    return record.devices.heatsinks.index(heatsink) if heatsink is not None else None


# --- live tabs and their insulation -------------------------------------------------------------

def _pad(record, index: int, device) -> list[Finding]:
    heatsink = path.heatsink_named(record, device.heatsink)
    if not device.tab_live or heatsink is None:
        return []
    sink_index = record.devices.heatsinks.index(heatsink)
    need = tab.need_of(record, sink_index, heatsink)
    grade = tab.grade_of(device)
    found = tab.barrier_round(record, device, heatsink)
    verdict, outcome = tab.verdict_of(need, grade, found)
    barrier = found[1] if found else None
    keys = (("devices", "semiconductors", index, "insulation"),) + need.keys + ((("barriers", found[0]),) if found else ())
    return [finding(
        code="THERM-PAD", subject=device.ref, title=f"{device.ref} live tab on {heatsink.ref}", verdict=verdict,
        values=(Measure("insulation between tab and sink", grade or "none"),),
        limit=Measure("insulation needed", need.grade) if need.grade else None, relation=">=",
        method="a tab at mains potential: basic insulation to an earthed or protectively earthed sink; double or reinforced to a touchable sink without protective earth",
        explanation=words.tab(device, heatsink, need, grade, outcome, barrier),
        keys=keys, sources=TAB_SOURCES,
    )]


CALC = Calc(
    name=NAME,
    title="Thermal",
    run=run,
    summary=(
        "Estimates each power device's loss (conduction from its current and forward or saturation voltage, a MOSFET's from I_rms^2 x its hot R_DS(on), plus "
        "switching where the record gives the data) and its junction temperature through junction-to-case, "
        "case-to-sink and sink-to-air resistances in the air the part sits in (the enclosure's, declared or the room's highest "
        "plus 20 K; the room's for a heatsink declared outside), with devices sharing a heatsink. "
        "Judges the margin to the maximum junction temperature, touchable heatsinks against a touch limit, live "
        "tabs on heatsinks for the grade of insulation the sink needs, and compares soak-test readings with the estimate."
    ),
    codes={
        "THERM-JUNCTION": "a device's estimated junction temperature against its maximum, less an allowance",
        "THERM-HEATSINK": "a heatsink's temperature with all its devices; touchable ones against a touch limit",
        "THERM-PAD": "a live tab on a heatsink: basic insulation to an earthed sink, double or reinforced to a touchable sink without protective earth",
        "THERM-SOAK": "a temperature measured after a run, against the estimate and the device's limits",
    },
    order=50,
)
