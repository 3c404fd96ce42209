"""Thermal: device losses, junction temperatures through the heat path, heatsinks, insulating pads, soak tests."""

from __future__ import annotations

from dossier.calcs.thermal import path
from dossier.calcs.shared.finding_kit import banded, maker, not_assessed
from dossier.calcs.shared.margins import margin
from dossier.calcs.thermal.soak import soak_findings
from dossier.citations import IEC_61140, MOHAN_POWER_ELECTRONICS
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.plugins import Calc
from dossier.units import fmt

JUNCTION = "THERM-JUNCTION"
HEATSINK = "THERM-HEATSINK"

NAME = "thermal"
PAD_RANGES = common_practice("insulating pads about 1-4 K/W, greased bare mount about 0.1-0.5 K/W (makers' pad listings)")
finding = maker(NAME)


def run(record):
    findings = []
    for index, device in enumerate(record.devices.semiconductors):
        findings += _junction(record, index, device)
        findings += _pad(record, index, device)
    for index, heatsink in enumerate(record.devices.heatsinks):
        findings += _heatsink(record, index, heatsink)
    return findings + soak_findings(record)


# --- junctions ----------------------------------------------------------------------------------

def _junction(record, index: int, device) -> list[Finding]:
    key = ("devices", "semiconductors", index)
    title = f"{device.ref} junction temperature"
    ambient = record.environment.max_ambient
    junction = path.junction_of(record, device, ambient)
    if junction is None or device.max_junction is None:
        return [not_assessed(NAME, "THERM-JUNCTION", device.ref, title, _junction_missing(device), (key,), (MOHAN_POWER_ELECTRONICS,))]
    allowance = margin(record, "junction")
    limit = (device.max_junction.to("K") - allowance.value.to("K")).to("degC")
    # fail above the maximum junction temperature; marginal inside the allowance below it
    verdict = banded(junction.temperature, limit, device.max_junction, "<=")
    return [finding(
        code="THERM-JUNCTION", subject=device.ref, title=title, verdict=verdict,
        values=(Measure(f"junction at {fmt(ambient)} ambient", junction.temperature),),
        limit=Measure(f"max junction {fmt(device.max_junction)} less {fmt(allowance.value)}", limit), relation="<=",
        method=f"{junction.formula}; {junction.loss.formula}",
        explanation=_junction_words(device, junction, verdict),
        keys=(key, ("environment", "max_ambient")),
        sources=_junction_sources(junction, allowance.source),
        extra=_loss_measures(junction),
    )]


def _junction_missing(device) -> str:
    if path.loss_of(device) is None:
        return "give loss, or forward_voltage and current, to estimate its loss"
    if device.max_junction is None:
        return "give max_junction from the maker's data"
    if device.heatsink:
        return "give rth_jc from the maker's data"
    return "give a heatsink, or rth_ja for a device in free air"


def _junction_words(device, junction, verdict) -> str:
    text = f"{device.ref} dissipates {fmt(junction.loss.total)} through {fmt(junction.path)} in all from junction to air."
    if junction.case_to_sink is not None and junction.case_to_sink.assumed:
        text += f" Case to sink: {junction.case_to_sink.words}."
    if verdict is Verdict.FAIL:
        text += " The junction would exceed its maximum: a larger heatsink, a better pad or a lower loss is needed."
    elif verdict is Verdict.MARGINAL:
        text += " It stays under its maximum but inside the allowance for estimate error and life."
    return text


def _junction_sources(junction, allowance_source):
    assumed = junction.case_to_sink is not None and junction.case_to_sink.assumed
    return (MOHAN_POWER_ELECTRONICS, allowance_source) + ((PAD_RANGES,) if assumed else ())


def _loss_measures(junction) -> tuple[Measure, ...]:
    parts = [("conduction loss", junction.loss.conduction), ("switching loss", junction.loss.switching)]
    measures = [Measure(label, value) for label, value in parts if value is not None]
    return tuple(measures) + (Measure("loss", junction.loss.total), Measure("junction-to-air resistance", junction.path))


# --- heatsinks ----------------------------------------------------------------------------------

def _heatsink(record, index: int, heatsink) -> list[Finding]:
    losses = path.sink_losses(record, heatsink)
    temperature = path.sink_temperature(record.environment.max_ambient, heatsink, losses)
    common = dict(
        code="THERM-HEATSINK", subject=heatsink.ref, title=f"{heatsink.ref} temperature",
        values=(Measure(f"heatsink at {fmt(record.environment.max_ambient)} ambient", temperature),),
        method="T_sink = T_a + R_sa x sum(P of the devices on it)",
        keys=(("devices", "heatsinks", index, "rth_sa"), ("environment", "max_ambient")),
        extra=(Measure("total loss", path.total_loss(losses)),),
    )
    words = _sink_words(heatsink, losses)
    if not heatsink.touchable:
        return [finding(**common, verdict=Verdict.INFO, explanation=words + " It cannot be touched from outside, so no touch limit applies.", sources=(MOHAN_POWER_ELECTRONICS,))]
    touch = margin(record, "touch_temperature")
    verdict = Verdict.FAIL if temperature.to("K") > touch.value.to("K") else Verdict.PASS
    return [finding(**common, verdict=verdict, limit=Measure("touch limit", touch.value), relation="<=",
                    explanation=words + _touch_words(verdict), sources=(MOHAN_POWER_ELECTRONICS, touch.source))]


def _sink_words(heatsink, losses) -> str:
    named = ", ".join(f"{device.ref} {fmt(loss.total)}" if loss else f"{device.ref} (loss unknown)" for _, device, loss in losses)
    text = f"Devices on {heatsink.ref}: {named or 'none listed'}."
    if any(loss is None for _, _, loss in losses):
        text += " A device with no loss figure is left out, so the sink runs hotter than shown."
    return text


def _touch_words(verdict) -> str:
    if verdict is Verdict.FAIL:
        return " It can be touched and runs hotter than the touch limit: guard it, or use a larger sink."
    return " It can be touched and stays under the touch limit."


# --- insulating pads ----------------------------------------------------------------------------

def _pad(record, index: int, device) -> list[Finding]:
    heatsink = path.heatsink_named(record, device.heatsink)
    if not device.tab_live or heatsink is None:
        return []
    reachable = heatsink.touchable or heatsink.earthed
    verdict = _pad_verdict(device, reachable)
    return [finding(
        code="THERM-PAD", subject=device.ref, title=f"{device.ref} live tab on {heatsink.ref}", verdict=verdict,
        values=(Measure("insulating pad", "fitted" if device.insulated else "none"),),
        method="a tab at mains potential on a touchable or earthed heatsink needs insulation between them",
        explanation=_pad_words(device, heatsink, verdict),
        keys=(("devices", "semiconductors", index, "insulated"), ("devices", "heatsinks", record.devices.heatsinks.index(heatsink))),
        sources=(IEC_61140,),
    )]


def _pad_verdict(device, reachable: bool) -> Verdict:
    if not reachable:
        return Verdict.INFO
    return Verdict.PASS if device.insulated else Verdict.FAIL


def _pad_words(device, heatsink, verdict) -> str:
    where = " and ".join(word for word, flag in (("touchable", heatsink.touchable), ("earthed", heatsink.earthed)) if flag)
    if verdict is Verdict.INFO:
        return f"{heatsink.ref} is neither touchable nor earthed, so it is live itself: keep it out of reach and count it as mains in the clearances."
    if verdict is Verdict.FAIL:
        return f"{device.ref}'s tab is at mains potential and {heatsink.ref} is {where}: without an insulating pad and bush the sink is live or the mains is shorted to earth."
    return f"{device.ref}'s tab is at mains potential and {heatsink.ref} is {where}; the insulating pad separates them and its thermal resistance is counted in the heat path."


CALC = Calc(
    name=NAME,
    title="Thermal",
    run=run,
    summary=(
        "Estimates each power device's loss (conduction from its current and forward or saturation voltage, plus "
        "switching where the record gives the data) and its junction temperature through junction-to-case, "
        "case-to-sink and sink-to-air resistances at the record's highest ambient, with devices sharing a heatsink. "
        "Judges the margin to the maximum junction temperature, touchable heatsinks against a touch limit, live "
        "tabs on touchable or earthed heatsinks for an insulating pad, and compares soak-test readings with the estimate."
    ),
    codes={
        "THERM-JUNCTION": "a device's estimated junction temperature against its maximum, less an allowance",
        "THERM-HEATSINK": "a heatsink's temperature with all its devices; touchable ones against a touch limit",
        "THERM-PAD": "a live tab on a touchable or earthed heatsink needs an insulating pad",
        "THERM-SOAK": "a temperature measured after a run, against the estimate and the device's limits",
    },
    order=50,
)
