"""Every sentence the thermal calc says, made from its numbers (the logic stays in the calc's other modules)."""

from __future__ import annotations

from dossier.calcs.thermal.path import ASSUMED_RDS_RISE
from dossier.findings import Verdict
from dossier.units import fmt

# --- junctions -------------------------------------------------------------------------------------

JUNCTION_MISSING = {
    "loss": "give loss, or forward_voltage and current, to estimate its loss",
    "mosfet-loss": "give rds_on (or rds_on_hot) and current_rms: a MOSFET's conduction loss is I_rms^2 x R_DS(on), not V_F x I_avg",
    "max_junction": "give max_junction from the maker's data",
    "rth_jc": "give rth_jc from the maker's data",
    "rth_ja": "give a heatsink, or rth_ja for a device in free air",
}


def junction(device, junction, verdict) -> str:
    text = f"{device.ref} dissipates {fmt(junction.loss.total)} through {fmt(junction.path)} in all from junction to air."
    if junction.loss.rds_assumed:
        text += f" {rds_on_assumed(ASSUMED_RDS_RISE)}"
    if junction.case_to_sink is not None and junction.case_to_sink.assumed:
        text += f" Case to sink: {junction.case_to_sink.words}."
    if verdict is Verdict.FAIL:
        text += " The junction would exceed its maximum: a larger heatsink, a better pad or a lower loss is needed."
    elif verdict is Verdict.MARGINAL:
        text += " It stays under its maximum but inside the allowance for estimate error and life."
    return text


def rds_on_assumed(rise) -> str:
    return (f"The record gives no hot on-resistance: x{fmt(rise)} on the 25 degC value is assumed, the top of the usual "
            "rise of silicon MOSFETs at their maximum junction temperature; give rds_on_hot or rds_on_rise from the "
            "maker's curve to make it exact.")


# --- the air a part sits in -----------------------------------------------------------------------

def air_label(air) -> str:
    return "enclosure air" if air.inside else "room air"


def air(air) -> str:
    if not air.inside:
        return f"Worked out in the room's air at {fmt(air.temperature)}: the heatsink is declared outside the enclosure."
    text = f"Worked out in the enclosure's air at {fmt(air.temperature)}"
    if air.assumed:
        text += (", taken as the room's highest plus 20 K (the harsher reading; from memory): declare "
                 "protection.internal_ambient to make it exact")
    else:
        text += " (protection.internal_ambient)"
    return text + "; a heatsink that stands outside in the room's air can be declared with outside: true."


# --- heatsinks -------------------------------------------------------------------------------------

def sink(heatsink, losses) -> str:
    named = ", ".join(f"{device.ref} {fmt(loss.total)}" if loss else f"{device.ref} (loss unknown)" for _, device, loss in losses)
    text = f"Devices on {heatsink.ref}: {named or 'none listed'}."
    if any(loss is None for _, _, loss in losses):
        text += " A device with no loss figure is left out, so the sink runs hotter than shown."
    return text


UNTOUCHABLE = " It cannot be touched from outside, so no touch limit applies."


def touch(verdict, from_record: bool, standard_words: str = "") -> str:
    text = " It can be touched and runs hotter than the touch limit: guard it, or use a larger sink." if verdict is Verdict.FAIL \
        else " It can be touched and stays under the touch limit."
    if standard_words:
        return text + f" {standard_words[:1].upper()}{standard_words[1:]}; the estimate is at the highest ambient, the harsher reading."
    if not from_record:
        text += (" The limit is that of IEC 62368-1 Table 38 for bare metal touched briefly (the figure from memory:"
                 " check the standard and your product standard); the standard measures at 25 degC, this estimate is"
                 " at the highest ambient, the harsher reading.")
    return text


# --- live tabs -------------------------------------------------------------------------------------

TAB_NEED = {
    "floating": "{sink} is neither touchable nor earthed, so it is live itself",
    "earthed-out-of-reach": "{sink} is earthed and out of reach: basic insulation keeps the mains off earth",
    "protectively-earthed": "{sink} is touchable and protectively earthed in a class I unit: basic insulation is enough, the earth is the second safeguard",
    "touchable-unearthed": "{sink} can be touched and is not earthed: only double or reinforced insulation may stand between it and the mains",
    "class-ii-earthed": "{sink} is marked earthed, but the unit is class II, so no protective earth backs it: it needs double or reinforced insulation",
    "class-unknown": "{sink} is marked earthed, but the record does not say the unit is class I (protection.earth.protective_class), so its earth is not credited: double or reinforced insulation is assumed needed (the harsher reading)",
}

TAB_OUTCOME = {
    "live-sink": "Keep it out of reach and count it as mains in the clearances.",
    "no-pad": "No insulating pad is fitted: the sink is live, or the mains is shorted to earth.",
    "basic-enough": "The pad and bush give basic insulation; the pad's thermal resistance is counted in the heat path.",
    "basic-only": ("A pad and bush are at most basic insulation. To pass: bond the sink to protective earth in a class I unit; "
                   "or make the insulation double or reinforced (two independent layers, or one rated for reinforced "
                   "insulation, with an insulating bush and enough creepage round the pad and screw), set insulation: "
                   "reinforced and list {device} in a reinforced barrier so its creepage and clearance are checked; "
                   "or keep the sink out of reach."),
    "no-barrier": ("The insulation is declared {grade}, but no double or reinforced barrier lists {device} or {sink}, so the "
                   "creepage and clearance round the pad and screw are not assessed; on a mains barrier that blocks power-up. "
                   "Add a barrier of that grade with {device} in its parts."),
    "doubled": "The {grade} insulation is checked for creepage and clearance as barrier '{barrier}'.",
}


def tab(device, heatsink, need, grade, outcome, barrier) -> str:
    names = dict(sink=heatsink.ref, device=device.ref, grade=grade or "none", barrier=barrier.name if barrier else "")
    return f"{device.ref}'s tab is at mains potential. {TAB_NEED[need.why].format(**names)}. {TAB_OUTCOME[outcome].format(**names)}"


# --- soak readings ---------------------------------------------------------------------------------

SOAK_NO_ESTIMATE = "the record lacks the data for an estimate at this point (the losses and thermal resistances of what is measured)"


def soak(reading, estimate, projection, verdict, short_run: bool) -> str:
    text = f"The estimate at {fmt(reading.ambient)} is {fmt(estimate)}."
    if projection is not None:
        text += f" Carried to the highest ambient: {projection.label} {fmt(projection.temperature)} against {projection.limit_label} {fmt(projection.limit)}."
    if verdict is Verdict.MARGINAL:
        text += " The unit runs hotter than estimated: trust the measurement and check the resistances and losses in the record."
    if short_run:
        text += f" A run of {fmt(reading.duration)} may not have reached steady temperature."
    return text
