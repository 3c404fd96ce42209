"""Every sentence the rails calc says, made from its numbers (the logic stays in the calc's other modules)."""

from __future__ import annotations

from dossier.units import fmt

# --- a rail's worst case ----------------------------------------------------------------------------

HOW_NO_LOAD = {
    "declared": "its declared no-load voltage",
    "regulation": "its loaded voltage raised by its declared regulation",
    "assumed": ("its loaded voltage raised by an assumed 25 % no-load rise (the harsher reading for a small mains "
                "transformer): declare no_load_voltage or regulation to make it exact, or name the transformer winding "
                "that feeds it (rails[].winding, with the transformer under magnetics) to have it worked out"),
    "choke-peak": ("its loaded voltage raised to the peak a choke-input filter reaches with no load (x pi / 2, the harsher "
                   "reading): declare no_load_voltage or regulation, or name the winding that feeds it (rails[].winding), to make it exact"),
    "windings": ("the resistances of the transformer winding that feeds it (worked out, not declared: measure the "
                 "no-load voltage and declare no_load_voltage, or the maker's regulation, to make it exact)"),
    "regulated": "its declared voltage: a regulator holds it whatever the mains does",
}


def worst_case(found) -> str:
    text = f"Rail {found.name} at no load and high line, from {HOW_NO_LOAD[found.how]}"
    text += ("." if found.how == "regulated" else ", carried to the top of the mains tolerance.")
    if found.how == "windings":
        text += f" Regulation: {found.basis}; no-load {fmt(found.no_load)} against {fmt(found.loaded)} loaded, a rise of {found.rise.magnitude:.1%}."
    return text


def hazard(name: str, worst, limit, accessible: bool) -> str:
    text = (f"Rail {name} reaches {fmt(worst)}, above the {fmt(limit)} a person may touch safely: it is a hazardous "
            "voltage beyond the mains. Treat everything on it as live, and it stays charged after switch-off until "
            "its capacitors are discharged.")
    if accessible:
        text += (" The record says it is brought out to a terminal someone can touch: a hazardous voltage must not be "
                 "accessible. Enclose the terminal or guard it so it cannot be touched, and set accessible: false.")
    return text


ENERGY_CLASS_WORDS = {
    "ES1": "ES1, within its limits: no safeguard against shock is needed",
    "ES2": ("ES2: the hazard limit here stays at ES1 (the harsher reading), since the safeguards an ES2 source allows "
            "(one basic safeguard towards ordinary persons) are not checked"),
    "ES3": "ES3: it needs safeguards that keep it from ordinary and instructed persons alike",
}


def energy_class(name: str, named: str) -> str:
    return (f"Under IEC 62368-1 (clause 5.2.2.2, Table 4; class limits from memory: ES1 to 60 V d.c. or 30 V r.m.s., "
            f"ES2 to 120 V d.c. or 50 V r.m.s.) rail {name} is {ENERGY_CLASS_WORDS[named]}.")


# --- stored energy and discharge ----------------------------------------------------------------------

def energy(name: str, joules) -> str:
    return f"Rail {name}'s capacitors hold {fmt(joules)} at the worst case; a charged bank can burn and stop a heart."


NO_CAPACITANCE = ("the record gives no capacitance for this hazardous DC rail, so the charge it keeps after switch-off "
                  "and the time it takes to fall to a safe voltage are unknown: give rails[].capacitance")


def discharge(name: str, seconds, limit, has_bleeder: bool) -> str:
    if not has_bleeder:
        return (f"Rail {name} has no bleeder declared: after switch-off its capacitors keep their charge for minutes "
                f"to hours. Fit a bleeder resistor across the rail that brings it below the safe voltage within "
                f"{fmt(limit)}, and give rails[].bleeder.")
    if seconds > limit:
        return (f"Through its bleeder rail {name} takes {fmt(seconds)} to fall to the safe voltage, more than "
                f"{fmt(limit)}: someone opening the unit soon after switch-off meets a charged bank. Lower the bleeder's "
                "resistance (mind its dissipation) or add a discharge switch.")
    return f"Through its bleeder rail {name} falls to the safe voltage {fmt(seconds)} after switch-off."


def exempt_charge(name: str, charge, limit) -> str:
    return f"Rail {name} stores {fmt(charge)}, no more than the {fmt(limit)} the clause exempts: no discharge time applies."


def bleeder_power(name: str, power, rating) -> str:
    if rating is None:
        return (f"The bleeder across rail {name} dissipates {fmt(power)} at the worst case; the record gives no power "
                "rating, so it cannot be judged: give rails[].bleeder_power_rating.")
    return (f"The bleeder across rail {name} dissipates {fmt(power)} at the worst case, against its {fmt(rating)} rating; "
            "a resistor runs at no more than half its rating to keep cool and last.")


def bleeder_voltage(name: str, volts, rating) -> str:
    if rating is None:
        return (f"The bleeder across rail {name} holds {fmt(volts)}; the record gives no voltage rating (small resistors "
                "are often rated 200-350 V each), so it cannot be judged: give rails[].bleeder_voltage_rating, or use "
                "several resistors in series.")
    return f"The bleeder across rail {name} holds {fmt(volts)}, against its limiting element voltage of {fmt(rating)}."


def x_discharge(capacitance, seconds, resistor, limit) -> str:
    if resistor is None:
        return (f"{fmt(capacitance)} of X capacitance across the line and no discharge resistor declared: after the plug "
                f"is pulled at the crest, its pins can stay charged to the mains peak. Fit a resistor across the line "
                f"that brings them below the safe voltage within {fmt(limit)} and give discharge_resistor on the X capacitor.")
    verdict = "within" if seconds <= limit else "later than"
    return (f"{fmt(capacitance)} of X capacitance discharges through {fmt(resistor)} to the safe voltage {fmt(seconds)} after "
            f"the plug is pulled at the crest, {verdict} the {fmt(limit)} allowed.")


def x_behind_variac(refs, variac_ref, peak) -> str:
    return (f"{', '.join(refs)} {'sits' if len(refs) == 1 else 'sit'} behind the variac {variac_ref}: the charge is taken from the crest "
            f"of its top of scale at high line, {fmt(peak)} (the harsher reading).")


def x_exempt(capacitance, limit) -> str:
    return f"{fmt(capacitance)} of X capacitance across the line, no more than {fmt(limit)}: the clause needs no discharge."


# --- ripple and regulators ------------------------------------------------------------------------------

def ripple(name: str, volts, frequency, capacitance, topology: str) -> str:
    return (f"Rail {name}: {fmt(volts)} peak-to-peak ripple at {fmt(frequency)} ({topology or 'unknown'} rectifier, "
            f"{fmt(capacitance)}), as on the first (reservoir) capacitor if it held all the rail's capacitance; an LC or "
            "CLC filter leaves much less on the rail itself and more on the reservoir.")


def ripple_current(ref: str, current, rating) -> str:
    text = f"{ref} carries about {fmt(current)} RMS ripple current (rectangular charging pulses)"
    if rating is None:
        return text + "; the record gives no ripple current rating for it: give devices.capacitors[].ripple_current."
    return text + f" against its {fmt(rating)} rating."


NO_RIPPLE_INPUTS = "the rail's current, its capacitance or the mains frequency is not given"


def pass_device(name: str, power, v_in, v_out, current) -> str:
    return (f"The series-pass regulator of rail {name} drops {fmt(v_in)} - {fmt(v_out)} at {fmt(current)}: its pass device "
            f"dissipates {fmt(power)} at high line, no allowance for ripple troughs; its heatsink must carry that.")


def understated_loss(ref: str, declared, power) -> str:
    return (f" {ref}'s declared loss, {fmt(declared)}, is below this: the thermal check works from too little heat. "
            "Declare the high-line loss.")


def shunt(name: str, power, current, v_out) -> str:
    return (f"A shunt regulator takes the whole load current when the load is removed: rail {name}'s shunt element "
            f"dissipates up to {fmt(v_out)} x {fmt(current)} = {fmt(power)}, more if its supply rises at high line.")


NO_REGULATOR_INPUT = ("no rail is declared for the stage feeding this regulator, and no rail with current for the regulator "
                      "itself, so its input and dissipation are unknown: declare both rails")

NO_RAILS_REGULATOR = ("A linear regulator: the record declares no rails, so its input and output are taken from the output "
                      "section by the other calcs and its dissipation is not computed here; declare the rails (the one "
                      "feeding it and its own, with current) to have the pass device's dissipation at high line worked out.")

# --- rectifiers and stages -------------------------------------------------------------------------------

RECTIFIER_WORDS = {
    "bridge": "a bridge gives the peak of the whole winding; each diode blocks that peak",
    "centre-tapped": "a centre-tapped full-wave rectifier gives the peak of one half; each diode blocks the whole winding's peak, twice the output",
    "valve-centre-tapped": "a full-wave valve rectifier on a centre-tapped winding gives the peak of one half less the valve's drop; each anode blocks twice the output",
    "half-wave": "a half-wave rectifier with a reservoir gives the winding's peak and blocks twice it; ripple at the mains frequency",
    "valve-half-wave": "a half-wave valve rectifier gives the winding's peak less the valve's drop and blocks twice it; ripple at the mains frequency",
    "doubler": "a doubler gives twice the winding's peak; each diode blocks the output, twice the peak",
}


def rectifier(stage_name: str, topology: str, output, piv, valve: bool, rated: bool = False) -> str:
    text = f"Stage '{stage_name}': {RECTIFIER_WORDS[topology]}. From its rail at the worst case: output {fmt(output)}, peak inverse {fmt(piv)}."
    if valve and rated:
        text += (" The valve's maker ratings are judged in the RAILS-VALVE findings; allow its warm-up (the rail rises to "
                 "no load before the other valves draw current).")
    elif valve:
        text += (" The record gives no maker ratings for the valve, so they are not compared: add it under devices.valves "
                 "(ref, peak_inverse_voltage, peak_current, max_reservoir) from its data sheet, and allow its warm-up (the "
                 "rail rises to no load before the other valves draw current).")
    return text


def valve_rating(ref: str, what: str, value, rating) -> str:
    verdict = "within" if value <= rating else "above"
    return f"{ref}'s {what} here is {fmt(value)}, {verdict} the maker's maximum of {fmt(rating)}."


RESERVOIR_DECLARED = ("The reservoir is the bulk capacitors declared in the rectifier stage or ahead of the first choke of the "
                      "filter after it (a series string at its series value).")
RESERVOIR_RAIL = ("No bulk capacitor with its capacitance is declared in the rectifier stage or ahead of the filter's first choke, so the rail's whole capacitance is "
                  "taken as the reservoir (the harsher reading): declare the reservoir under devices.capacitors to make it exact.")
NO_RESERVOIR = "the reservoir's capacitance is not known: give rails[].capacitance or the reservoir under devices.capacitors"
NO_PEAK_CURRENT = ("the valve's peak current needs the winding's source resistance, which is worked out only when the rail names "
                   "its winding (rails[].winding, with the transformer under magnetics) and gives its current; compare it with "
                   "the maker's figure by hand until then")


def no_rectifier_rail(stage_name: str) -> str:
    return (f"no rail is declared downstream of rectifier stage '{stage_name}', so its output and peak inverse voltage are "
            "worked out only for the diodes listed under devices (the stress calc): declare its rail")


STAGE_NOTES = {
    ("filter", "capacitor-input"): "A capacitor-input filter: its reservoir charges to the peak; ripple, discharge and the capacitors' ratings are checked on its rail.",
    ("filter", "lc"): "An LC filter after a reservoir: the rail's worst case, ripple and discharge are checked on its rail; dossier does not compute the choke's attenuation or resonance (declare the choke under magnetics to check its flux and heat).",
    ("filter", "clc"): "A CLC filter: the reservoir is checked as the rail's first capacitor (ripple, discharge, ratings); dossier does not compute the choke's attenuation or resonance (declare the choke under magnetics to check its flux and heat).",
    ("filter", "choke-input"): "A choke-input filter gives about 0.9 x V_RMS when loaded above its critical current, but rises to the peak with no load: dossier takes the peak (its worst case) for every rating. Keep a bleeder that draws the critical current, and declare the choke under magnetics.",
    ("filter", "series-bank"): "Capacitors in series: each is judged on its share of the rail by the stress calc (balancing resistors, leakage).",
    ("switch", "standby"): "A standby switch holds the high-voltage rail off while the valves warm: dossier does not rate switch contacts for DC; check its DC voltage and current rating against the rail's worst case, and that the rail still discharges with the switch open (a bleeder on the reservoir side).",
    ("switch", "high-voltage"): "A switch in a high-voltage rail: dossier does not rate switch contacts for DC; check its DC voltage and current rating against the rail's worst case, and that the rail still discharges with the switch open.",
    ("mains-input", "isolating-transformer"): "An isolating transformer at the input: it takes away the path to earth through one touched point, not the hazard between two points of the circuit; the checks after it still treat the circuit as hazardous.",
    ("mains-input", "variac"): "A variac is an autotransformer: its output is not isolated from the mains, so everything after it is on the mains; dossier judges it at the mains' high line, the top of its range.",
    ("mains-input", "direct"): "Straight from the mains: the fuse, the earth and the inrush are checked by the protection calc.",
    ("regulator", "switching"): "A switching regulator: dossier checks the voltage on its switches and diodes (stress) and its magnetics, not its control loop or its efficiency.",
}


def stage_note(kind: str, topology: str) -> str:
    return STAGE_NOTES[(kind, topology)]


def empty_topology(kind: str) -> str:
    return (f"The {kind} stage gives no topology, so dossier cannot tell how it behaves and judges the parts around it by "
            "the harsher reading: give topology to make its checks exact.")
