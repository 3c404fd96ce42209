"""Every sentence the stress calc says, made from its numbers (the logic stays in the calc's other modules)."""

from __future__ import annotations

from dossier.findings import Verdict
from dossier.units import fmt


def bus(rail) -> str:
    return f"The {rail.basis}; switches and capacitors on the mains side are judged against it."


def rating(verdict, subject, rating_value, rail, stressed: str, chosen, notes=()) -> str:
    text = f"{subject} sees {fmt(rail.voltage)} ({stressed}; {rail.basis})."
    if verdict is Verdict.FAIL:
        text += f" Its rating is below even that: it will break down. Fit a part rated for at least x{fmt(chosen.value)} the stress."
    elif verdict is Verdict.MARGINAL and not notes:
        text += f" Its rating covers the steady peak but not the x{fmt(chosen.value)} allowance for switching spikes and ringing."
    return " ".join((text,) + tuple(notes))


# --- why a part could not be judged ---------------------------------------------------------------

NO_RATING = "the record gives no voltage_rating: add it from the maker's data"


def no_stage(ref: str) -> str:
    return f"no stage lists {ref}, so the voltage it blocks is unknown"


def unknown_topology(topology: str) -> str:
    return f"the stage's topology '{topology}' or its supply is not known to this calc"


def no_inverse(stage) -> str:
    return f"the voltage feeding the {stage.kind} stage '{stage.name}' is unknown, so its reverse voltage cannot be found"


def unknown_position(position: str) -> str:
    return f"the voltage at position '{position}' is not known to this calc"


NO_MAINS = "the record has no mains section"


# --- switches: which rating the record gives ------------------------------------------------------

RATING_KIND_NOTES = {
    "unstated": ("The record does not say which rating voltage_rating is; it is read as V_CEO, the rating that holds "
                 "whatever the base does, but if it is V_CES or V_CBO the part's V_CEO is lower, so a pass is held at "
                 "marginal: set voltage_rating_kind."),
    "ces-base-open": ("V_CES holds only while the base is shorted or reverse-biased to the emitter; the record does not "
                      "say so (base_held_off), so V_CEO applies and is not given: a pass is held at marginal."),
    "cbo": ("V_CBO is a collector-base rating: it says nothing of what collector to emitter withstands (V_CEO is often "
            "about half), so a pass is held at marginal: give V_CEO, or V_CES with base_held_off."),
}


def blocking_label(kind: str) -> str:
    return {"mosfet": "peak drain-source voltage"}.get(kind, "peak collector-emitter voltage")


# --- diodes: the role that sets what they block ---------------------------------------------------

ROLE_WORDS = {
    "mains-bridge": "a bridge on the mains blocks the line peak",
    "bridge": "a bridge's diodes each block the peak of the winding",
    "centre-tapped": "a centre-tapped full-wave rectifier's diodes block twice the peak of one half",
    "half-wave": "a half-wave rectifier with a reservoir capacitor blocks the capacitor's charge plus the opposite peak: twice the peak",
    "doubler": "a voltage doubler's diodes each block twice the peak",
    "reset": "a forward converter's reset diode blocks the input plus the reset winding's reflection: twice the input with a 1:1 reset winding (assumed)",
    "clamp": "a clamp diode blocks what the switch it clamps blocks",
    "freewheel": "a freewheeling diode blocks the stage's input",
}


def role_basis(role: str, how: str) -> str:
    return f"role '{role}' ({how}): {ROLE_WORDS[role]}"


HIGHEST_WINDING = ("The stage above this one holds several transformers or secondaries and no rail names the one it rectifies, so the "
                   "highest of them is taken (the harsher reading). Name it in rails[].winding (e.g. 'T1 HT') to make it exact.")
SERIES_ASSUMED = ("The transformer above this stage has secondaries of equal turns and no rail names the ones it rectifies, "
                  "so they are taken in series across the rectifier, as a split-rail pair is wired (the harsher reading). "
                  "Name them in rails[].winding to make it exact.")
SPLIT_UNKNOWN = ("The bridge sits across a centre-tapped winding (or a pair in series), but no plus and minus rails are "
                 "declared from it, so its centre is not known to be the 0 V: each capacitor is taken at the whole "
                 "winding's peak (the harsher reading). Declare both rails (rails[] with their stage and polarity) to "
                 "judge each at the peak of one half.")
VARIAC_TOP = ("A variac feeds this stage: it is taken at the variac's top of scale (protection.variac.top_voltage) in "
              "place of the mains nominal, at high line, since its output can exceed its input.")
ROLE_ASSUMED = ("The record gives no role for this diode (devices.semiconductors[].role, or a role on its stage part), so "
                "the harshest of the roles its stage allows is taken: twice the peak, as a reset, clamp, half-wave or "
                "doubler diode would block. Set role to make it exact.")

# --- capacitors ----------------------------------------------------------------------------------

RAIL_RISE = ("The rail's no-load voltage is not declared: it is taken as the rails calc works it out (its RAILS-VOLTAGE "
             "finding says how). Declare rails[].no_load_voltage, measured, to make it exact.")
NO_LOAD_RISE = ("The winding's declared excitation is taken as its rated, loaded voltage: raised by the assumed no-load "
                "rise of a small mains transformer. Declare no_load_voltage on the capacitor, or the excitation across "
                "the primary (the turns then give the no-load voltage), to make it exact.")


def series_unbalanced(count: int) -> str:
    return (f"{count} capacitors in series with no balancing resistors: their leakage currents, not their ratings, "
            f"share the voltage, so one can take far more than 1/{count}. Held at marginal at best: fit a resistor "
            "across each and give balancing_resistor and leakage.")


def series_whole(count: int) -> str:
    return (f"{count} capacitors in series with no balancing resistors: their leakage currents, not their ratings, share "
            "the voltage, so the harsher reading puts the whole string on the one that leaks least. Fit a resistor across "
            "each and give balancing_resistor and leakage to judge each on its share")


def series_share(count: int, resistor, leakage, assumed_leakage: bool) -> str:
    text = (f"{count} in series with {fmt(resistor)} across each: the worst share, when this one leaks nothing and the "
            f"others {fmt(leakage)} each, is V/n + (n-1)/n x R x I_leak.")
    if assumed_leakage:
        text += " The leakage is the makers' usual limit 0.01 x C x V_R (at 20 degC; hot leakage is higher): give leakage from the maker's data to make it exact."
    return text


def series_no_leakage(count: int) -> str:
    return (f"{count} in series with balancing resistors, but neither leakage nor capacitance is given, so the share "
            "cannot be bounded: held at marginal at best. Give leakage (or capacitance).")


def ac_capacitor(rail) -> str:
    return (f"An X or Y capacitor's rated voltage is the RMS of the supply it is made for: it is compared with the "
            f"{rail.basis}, not the high line; the class's endurance and impulse tests carry the tolerance and the spikes.")


def safety_class(capacitor, requirement, verdict) -> str:
    text = f"Position {capacitor.position}: {requirement.reason}."
    if verdict is Verdict.FAIL:
        text += " Fit a capacitor of an accepted class and give its class in the record; an unclassed capacitor here can fail short and make the mains reachable."
    return text


NO_DOUBLER_OUTPUT = ("the doubler's output is not known: declare the rail it delivers (rails[] with its stage) or the "
                     "transformer under magnetics")
DOUBLER_SHARES = {
    "full-wave": "a full-wave doubler's capacitor: each of the pair is charged to the winding's peak by its own diode, half the output",
    "half-wave-input": "a half-wave doubler's input (series) capacitor: charged to the winding's peak, half the output",
    "half-wave-output": "a half-wave doubler's output capacitor: the whole output, twice the winding's peak",
    None: ("a capacitor in a doubler stage whose place in it is not given: taken at the doubler's whole output (the harsher "
           "reading); declare devices.capacitors[].doubler (full-wave, half-wave-input or half-wave-output) to judge it at its share"),
}


def doubler_share(position) -> str:
    return DOUBLER_SHARES[position]
