"""Every sentence the protection calc writes; the checks pass numbers in and keep to rules."""

from __future__ import annotations

from dossier.findings import Verdict
from dossier.units import fmt


def add_text(missing) -> str:
    """' Add protection.bulk_esr and protection.source_resistance.' or ''."""
    if not missing:
        return ""
    return " Add " + " and ".join(missing) + "."


def assumed_text(keys, harsher: str) -> str:
    """Says that the record was silent, which reading was taken, and which keys make it exact."""
    if not keys:
        return ""
    return f" The record does not give {' or '.join(keys)}: the plausible value that {harsher} was taken (the harsher reading). Declare {' and '.join(keys)} to make it exact."


# Input current and the fuse rating

INPUT_NOT_COMPUTED = "The input current comes from the output power."
MORE_CURRENT = "gives the most input current"
LESS_CURRENT = "gives the least input current"


def input_text(topology_words: str, input_power, line: str = "low") -> str:
    return f"Input: {topology_words}; at {line} line the unit draws {fmt(input_power)}."


def no_fuse_text(fit_marking: str | None) -> str:
    fit = f" Fit a {fit_marking} fuse in the line conductor." if fit_marking else ""
    return ("No mains fuse is declared. Without one, a short inside the unit is cleared only by the building's breaker, "
            "which is sized for the wiring, not for this unit: parts can burn before it trips." + fit)


def rating_text(ref: str, load_percent: float, ambient_in_range: bool) -> str:
    text = f"{ref} runs at {load_percent} % of its rating at low line."
    if load_percent > 75:
        text += " Above 75 % a fuse runs hot, ages and opens in normal use."
    if not ambient_in_range:
        text += " The ambient is beyond the re-rating line's range (100 degC): use the maker's curve."
    return text


def rating_limit_label(rerating_percent: float, ambient) -> str:
    return f"running current / (75 % x {rerating_percent} % re-rating at {fmt(ambient)})"


RUNNING_UNKNOWN = "The running current is unknown."
NO_MINIATURE_RATING = "The running current needs more than 10 A, the top of the IEC 60127 series: use a larger fuse type."


def fuse_ambient_text(ambient, assumed: bool) -> str:
    if not assumed:
        return ""
    return (f" The fuse sits inside the enclosure: its air is taken at {fmt(ambient)}, the room's highest plus 20 K."
            " Declare protection.internal_ambient (or protection.fuse.ambient) to make it exact.")


def recommendation_text(rating, speed: str, melting_i2t, unlimited: bool) -> str:
    text = f"The smallest preferred rating that carries the running current is {fmt(rating)} ({speed})."
    if melting_i2t is not None:
        text += f" Choose a type whose melting I^2 t is at least {fmt(melting_i2t)}, so the switch-on surge does not wear it out"
        text += " (or fit an inrush limiter, which shrinks the surge)." if unlimited else "."
    return text


def declared_fits_text(ref: str, declared_marking: str, fits: bool) -> str:
    if fits:
        return f" The declared {ref} ({declared_marking}) also passes these checks."
    return f" The declared {ref} ({declared_marking}) does not pass all of them: see the other findings for {ref}."


# An oversized fuse

def oversize_wiring_text(ref: str, part: str) -> str:
    return (f"{ref} is rated above the {part} it protects: a fault current the {part} cannot carry for long "
            f"can flow without blowing {ref}. Fit a smaller fuse, or a {part} rated for the fuse.")


def oversize_running_text(ref: str, multiple: float, wiring_declared: bool) -> str:
    text = (f"{ref} is more than {multiple:g} times the smallest rating that carries the running current: an overload or "
            "a partial fault inside the unit (a shorted turn, a failing rectifier) can run hot for long without blowing it.")
    if not wiring_declared:
        text += (" The record does not give the ratings of the inlet, cord, switch or internal wiring the fuse protects,"
                 " so nothing shows that they can carry what the fuse lets through (the harsher reading)."
                 " Declare protection.wiring (inlet, cord, switch, internal).")
    return text


OVERSIZE_NOT_ASSESSED = ("Not assessed: neither the running current nor the ratings of what the fuse protects are known."
                         " Add output (voltage, current) or protection.wiring (inlet, cord, switch, internal).")


# Speed, voltage, breaking capacity

def speed_text(ref: str, speed: str, too_fast: bool) -> str:
    if too_fast:
        return (f"{ref} is fast-acting, but the unit draws a surge at every switch-on; a time-lag fuse carries the surge "
                "and still opens on a lasting fault.")
    return f"{ref} is {speed}."


FUSE_VOLTAGE_LOW = "A fuse rated below the circuit voltage may not quench the arc when it opens."
BREAKING_UNKNOWN = "The breaking capacity is marked on the fuse (H for high, L for low) and given in its data."


def breaking_text(ref: str, glass: bool) -> str:
    body = "glass " if glass else ""
    return (f"{ref} is a low-breaking {body}fuse. A short across the mains can drive more current than it can interrupt; "
            "it may arc or shatter instead of clearing. Common practice on a mains primary is a ceramic, sand-filled, high-breaking type.")


# The switch-on pulse against the fuse

def melting_basis_text(basis: str, time, derating: float | None) -> str:
    if basis == "curve":
        return f" The fuse's melting I^2 t is read from its declared I^2 t-t curve at the pulse's time constant, {fmt(time)}."
    return (f" Only one melting I^2 t is declared; makers usually measure it at about ten times the rated current, where a time-lag fuse"
            f" takes tens of milliseconds to melt. A pulse of {fmt(time)} melts it at less: the figure is taken at {derating * 100:g} %"
            " (the harsher reading, from memory). Declare protection.fuse.melting_curve (time and I^2 t points from the maker's curve) to make it exact.")


def pulse_against_fuse_text(ref: str, ratio_percent: float, blows: bool, fatigues: bool, pulses: int) -> str:
    text = f"The switch-on pulse is {ratio_percent} % of {ref}'s melting I^2 t at the pulse's duration."
    if blows:
        text += f" It is more than the fuse needs to melt: {ref} blows at every switch-on."
    elif fatigues:
        text += f" The fuse survives a single switch-on but fatigues and opens after far fewer than {pulses} of them."
    return text


CHART_END = " The makers' pulse-cycle chart ends at 100 000 pulses; its last figure is used."
NO_LIMITER = " There is no inrush limiter."


def ntc_cold_text(ref: str, cold, at, internal_assumed: bool, b_assumed: bool) -> str:
    text = f" {ref} starts from the enclosure's air at {fmt(at)}, where its resistance is {fmt(cold)} (not its 25 degC figure)."
    if internal_assumed:
        text += " That air is taken as the room's highest plus 20 K; declare protection.internal_ambient to make it exact."
    if b_assumed:
        text += " Its B constant is taken as 4000 K (the harsher reading); declare protection.inrush_limiter.b_value."
    return text


# The limiter

def capacitance_scaled_text(ref: str, quoted, at_voltage, used_at, allowed, assumed: bool) -> str:
    text = (f"{ref}'s maximum capacitance, {fmt(quoted)}, is quoted at {fmt(at_voltage)}; the energy 1/2 C V^2 it can absorb"
            f" is fixed, so at {fmt(used_at)} (high line) it allows {fmt(allowed)}.")
    if assumed:
        text += (" The record does not say at which voltage the maker quotes it: the nominal mains voltage was taken."
                 " Declare protection.inrush_limiter.max_capacitance_voltage to make it exact.")
    return text


def hot_restart_text(ref: str, fuse_ref: str | None, share_percent: float | None, hot_assumed: bool) -> str:
    text = (f"A warm NTC has only its residual resistance: switched off and on again before {ref} has cooled "
            "(tens of seconds to minutes), the unit draws nearly the unlimited surge.")
    if hot_assumed:
        text += " With no hot resistance declared it is taken as zero (the harsher reading)."
    if share_percent is None:
        return text
    text += f" That pulse is {share_percent} % of {fuse_ref}'s melting I^2 t"
    if share_percent >= 100:
        return text + (": a quick power cycle blows the fuse. Fit a limiter bypassed by a relay, a larger melting I^2 t,"
                       " or label the unit to wait before switching on again.")
    return text + "."


# Earth

EARTH_NOT_DECLARED = "The record does not say whether the unit is class I or class II, nor how touchable metal is earthed."
EARTH_TERMINAL_UNBONDED = ("The mains inlet has a protective-earth terminal, but the record does not say what it is bonded to. "
                           "An earth pin that goes nowhere protects nothing.")


def bond_claimed_text(bonding: str) -> str:
    return (f"The record says the bond is: \"{bonding}\". That is a claim, not a measurement: it is verified only by the "
            "checklist's protective-earth continuity test, made with the test current the checklist states "
            "(a multimeter's few milliamperes cannot prove a bond).")


def class_i_unbonded_text(where: str, said_none: bool) -> str:
    said = "says there is no bond to" if said_none else "does not say how protective earth is bonded to"
    return (f"The unit is class I but the record {said} {where}. "
            "If that bond is missing or loose, a fault from the mains to the case leaves the case live and nothing trips: "
            "whoever touches it takes the fault current. Say how the earth lead is fixed (stud, star washer, locknut, crimped "
            "ring terminal) and have it checked by a qualified person.")


CLASS_II_METAL = ("The unit is class II in a metal enclosure, and the record does not say how the case is kept from live parts. "
                  "State the double or reinforced insulation that does it, or bond the case to earth and declare class I.")


# Battery lead

def lead_fuse_glass_text(ref: str) -> str:
    return (f"{ref} is a glass fuse. Glass miniature fuses are rated for AC mains at a low breaking capacity; a battery's DC "
            "fault current can hold an arc across the melted link and shatter the glass. Use a fuse rated for DC at the "
            "battery voltage with a breaking capacity above the battery's short-circuit current (e.g. an automotive or "
            "ceramic DC-rated type).")


def lead_fuse_dc_unknown_text(missing) -> str:
    return ("Not assessed: a fuse in a battery lead must be rated for DC at the battery's voltage and must break the "
            "battery's short-circuit current; the record does not show either." + add_text(missing))


def lead_fuse_dc_text(ref: str, voltage_ok: bool, breaking_ok: bool, prospective_assumed: bool) -> str:
    parts = []
    if not voltage_ok:
        parts.append(f"{ref}'s DC voltage rating is below the battery's highest voltage: it may not quench the DC arc")
    if not breaking_ok:
        parts.append(f"{ref} cannot break the battery's short-circuit current: it may arc or burst instead of clearing")
    text = ("; ".join(parts) + ".") if parts else ""
    if prospective_assumed:
        text += (" The battery's short-circuit current is taken as 30 A per Ah of capacity (the harsher reading, from memory);"
                 " declare protection.output_fuse.prospective_current from the battery maker's data.")
    return text.strip()


# The input, as words

TOPOLOGY_WORDS = {
    "capacitor-input": "capacitor-input rectifier on the mains",
    "transformer-capacitor-input": "mains transformer feeding a capacitor-input rectifier",
    "no-bulk-capacitor": "input with no bulk capacitor",
}


# The switch-on surge

NO_CAPACITOR_INRUSH = ("No capacitance charged at switch-on is declared (protection.bulk_capacitance, or secondary_banks behind a"
                       " transformer), so no capacitor inrush is computed. A mains transformer's own switch-on surge is bounded in"
                       " its own finding.")
INRUSH_NOT_COMPUTED = "The switch-on surge cannot be computed from what is declared."


def limited_peak_text(ref: str, resistance, air, peak) -> str:
    return f"{ref} ({fmt(resistance)} at {fmt(air)}) limits the switch-on peak to {fmt(peak)} at the crest of high line."


def unlimited_peak_text(line_peak, peak, resistance) -> str:
    return (f"No inrush limiter is declared: at the crest of high line ({fmt(line_peak)}) the empty capacitors draw "
            f"{fmt(peak)}, limited only by the mains wiring and the capacitors' ESR ({fmt(resistance)} together). "
            "A pulse like that can melt or weaken the fuse, exceed the bridge rectifier's surge rating (I_FSM), "
            "pit the switch contacts and trip the breaker upstream. Fit an NTC thermistor, or a resistor bypassed by a relay.")


def pulse_limit_label(share_percent: float, ref: str, time, pulses: int) -> str:
    return f"{share_percent} % of {ref}'s melting I^2 t at {fmt(time)}, for {pulses} switch-ons"


def melting_unknown_text(ref: str) -> str:
    return f"Look up {ref}'s nominal melting I^2 t in its maker's data."


# The limiter's energy and dissipation

def energy_too_high_text(energy, ref: str) -> str:
    return f"Charging the bulk capacitance puts {fmt(energy)} into {ref}, more than it is rated for; it can crack at switch-on."


def energy_near_rating_text(ref: str, margin_percent: float) -> str:
    return f"{ref} is within {margin_percent} % of its rating at every switch-on at high line."


ENERGY_NOT_COMPARED = "The limiter's energy rating is not compared."


def ntc_dissipation_text(ref: str, power) -> str:
    return (f"{ref} dissipates about {fmt(power)} while running, from its residual resistance "
            f"(the maker quotes it at full current; at lower current it runs cooler and its resistance is higher).")


def resistor_power_text(ref: str, power, rating) -> str:
    return f"{ref} stays in circuit and dissipates {fmt(power)}; rate it for at least {fmt(rating)}."


DISSIPATION_NOT_CHECKED = "The running dissipation is not checked."


# Earth, where the bond goes

def unbonded_where(metal_enclosure: bool) -> str:
    return "the metal enclosure" if metal_enclosure else "touchable metal parts"


# Battery side

def no_lead_fuse_text(charger_current) -> str:
    return (f"No fuse is declared in the battery lead. A charged battery can deliver hundreds of amperes into a short in the lead "
            f"or inside the charger; the charger's own {fmt(charger_current)} limit does not stop that current, it comes from the battery. "
            "Without a fuse near the battery the lead itself becomes the fuse: it overheats, its insulation melts and it can start a fire. "
            "Fit a fuse in the positive lead close to the battery.")


def lead_fuse_rating_text(ref: str) -> str:
    return f"{ref} must carry the full charge current without ageing, and blow on a fault from the battery."


def lead_survives_text(ref: str) -> str:
    return f"The lead must survive any current that {ref} lets through for long."


def lead_too_thin_text(ref: str) -> str:
    return f"{ref} is larger than the lead can carry: a fault could overheat the lead without blowing the fuse. Use a thicker lead or a smaller fuse."


LEAD_NOT_COMPARED = "The lead's rating is not compared."
UNFUSED_LEAD = "Unfused lead between the battery and the fuse is unprotected."
MOVE_FUSE_NEARER = "The lead between the battery and the fuse is unprotected; move the fuse nearer the battery."
NO_REVERSE_POLARITY = ("No reverse-polarity protection is declared. Battery leads get swapped; a reversed battery drives its full fault current "
                       "backwards through the output rectifier and capacitors, which can burst or burn. Add a series diode, a fuse with a reverse diode "
                       "across the output, or a relay or MOSFET that only closes with the right polarity.")


# --- touch current through the Y capacitors ------------------------------------------------------

def touch_missing(refs) -> str:
    return (f"the capacitance of {', '.join(refs)} is not declared, so the current it lets flow to accessible parts cannot "
            "be worked out; give devices.capacitors[].capacitance for each Y capacitor")


def touch_behind_variac(refs, variac_ref, volts) -> str:
    return (f"{', '.join(refs)} {'sits' if len(refs) == 1 else 'sit'} behind the variac {variac_ref}, so {'it is' if len(refs) == 1 else 'they are'} "
            f"taken at its top of scale at high line, {fmt(volts)} (the harsher reading; the others at the mains).")


def touch_text(klass, refs, verdict, wanted) -> str:
    text = (f"{', '.join(refs)} from the mains to earth or across the barrier, taken in parallel across the whole high-line "
            "voltage (the harsher reading: a broken earth or an open neutral puts them there).")
    if klass is None:
        text += (" The record does not say the unit is class I, so the class II limit of 0.25 mA applies (the harsher reading); "
                 "declare protection.earth.protective_class to make it exact.")
    if verdict is Verdict.FAIL:
        text += " Too much current would flow through a person touching the output or the case: use less Y capacitance."
    elif verdict is Verdict.MARGINAL and klass == "I":
        text += (f" It is under the appliance limit for a class I portable unit but over the {wanted.magnitude:g} mA of "
                 "IEC 62368-1 (ES1, from memory); check which product standard applies.")
    elif verdict is Verdict.MARGINAL:
        text += " It is within the Y capacitors' usual 20 % tolerance of the limit."
    return text


# A mains transformer's switch-on surge

SURGE_METHOD = ("bound: I_pk <= sqrt 2 V_high / (R_primary + R_source + R_series); refined: sqrt 2 V_high / sqrt((omega L_air)^2 + R^2) "
                "x (2 B_n + B_r - B_s) / B_n, L_air = mu_0 N^2 A_e / l_e; I^2 t = I_pk^2 / (4 f) x 1 / (1 - e^(-2 / (f tau)))")
SURGE_NOT_ASSESSED = ("the primary's resistance cannot be worked out: declare magnetics[].windings[].resistance (measured), or the core's "
                      "mean_turn_length for a declared core")


def surge_text(ref: str, peak, series_ref: str | None, remanence_assumed: bool) -> str:
    text = (f"Switched on at a zero crossing of high line with the core's remanence the same way, {ref}'s core saturates and draws up to "
            f"{fmt(peak)}. This is an upper bound, not an estimate: most switch-ons draw far less.")
    text += f" {series_ref} limits it at switch-on." if series_ref else " Nothing but the windings and the supply limits it."
    if remanence_assumed:
        text += (" The core's remanence is taken as its saturation flux density (the bound);"
                 " declare core.material.remanence from the maker's data to refine it.")
    return text


def surge_against_fuse(ref: str, ratio_percent: float, melts: bool, over_share: bool) -> str:
    text = f" The bound's I^2 t is {ratio_percent} % of {ref}'s melting I^2 t at a half-cycle."
    if melts:
        return text + (f" A worst-case switch-on melts {ref}: fit a soft-start (a resistor bypassed by a relay, or an NTC) "
                       "or a fuse with a larger melting I^2 t that still protects the transformer.")
    if over_share:
        return text + f" {ref} survives one worst-case switch-on but is worn by repeated ones."
    return text


def surge_no_melting(ref: str | None) -> str:
    if ref is None:
        return ""
    return f" {ref}'s melting I^2 t is not declared, so the surge is not compared with it. Add protection.fuse.melting_curve or melting_i2t."


# A soft-start resistor bypassed by a relay

def softstart_missing(missing) -> str:
    return "the record does not give " + " and ".join(missing) + "; declare them"


def softstart_energy_text(ref: str, verdict) -> str:
    if verdict.value == "fail":
        return (f"Every switch-on puts more energy into {ref} than its pulse rating: it can crack or go open, and a soft-start"
                " that goes open leaves the unit dead or, with the relay closed, unprotected at the next switch-on.")
    if verdict.value == "marginal":
        return f"{ref} takes within 20 % of its pulse rating at every switch-on at high line."
    return ""


def stuck_within_text(ref: str) -> str:
    return f"If the relay never closes, {ref} carries the running current and stays within its power rating."


def stuck_unprotected_text(ref: str) -> str:
    return (f"If the relay never closes (a failed coil, a dead timer, welded-open contacts), {ref} carries the running current and"
            " dissipates far more than it is rated for; the mains fuse does not blow, because the current is at most the running"
            f" current. {ref} overheats and can set fire to what is near it. Fit a thermal cut-off clamped to it, in series,"
            " and declare it as protection.inrush_limiter.thermal_cutoff.")


def cutoff_too_small_text(ref: str) -> str:
    return f"The thermal cut-off on {ref} is rated below the running current it carries: it can open in normal use or fail to break it."


def stuck_cutoff_text(ref: str, temperature, rating_missing: bool) -> str:
    text = (f"If the relay never closes, {ref} overheats, and the thermal cut-off clamped to it opens at {fmt(temperature)}."
            " The checklist has an item to verify it is in series and in thermal contact.")
    if rating_missing:
        text += " Its current rating is not declared: declare protection.inrush_limiter.thermal_cutoff.current_rating."
    return text


def delay_text(ref: str, short: bool) -> str:
    if short:
        return (f"The relay closes across {ref} before the surge has settled: the rest of it flows through the relay contacts"
                " and the fuse. Lengthen the delay.")
    return ""


# What the mains fuse must also protect and clear

def primary_unknown(refs) -> str:
    return (f"the rated primary current of {', '.join(refs)} is not known, so nothing shows the fuse protects it;"
            " declare magnetics[].rated_power (VA) or the primary winding's current")


def primary_text(ref: str, too_big: bool, bases) -> str:
    text = ""
    if too_big:
        text = (f"{ref} is more than twice the transformer's rated primary current: a transformer overloaded or with shorted turns"
                " can run hot for hours without blowing it. Fit a smaller fuse with a soft-start to carry the switch-on surge,"
                " or declare a thermal fuse in the transformer.")
    if "primary current" in bases:
        text += " The rated primary current is taken from the primary winding's declared current; declare rated_power (VA) to make it exact."
    return text.strip()


def short_unknown(refs) -> str:
    return f"the winding resistances of {', '.join(refs)} are not known; declare magnetics[].windings[].resistance"


def short_text(ref: str, transformer: str, winding: str, multiple: float, thermal: str | None) -> str:
    text = f"A short across {transformer}'s {winding} draws about {multiple:.3g} times {ref}'s rating from the mains."
    if multiple >= 10:
        return text + f" {ref} clears it within a fraction of a second."
    if thermal is not None:
        return text + f" That is too little to blow {ref} quickly; {thermal} opens on the transformer's heat instead."
    if multiple >= 4:
        return text + f" {ref} takes up to seconds to clear it while the winding heats; a thermal fuse in the transformer is the usual answer."
    return (text + f" {ref} may not clear it at all: the winding cooks until its insulation fails. Fit a smaller mains fuse,"
            " a fuse on the secondary, or a thermal fuse in the transformer (declare protection.thermal_fuse).")


BRIDGE_UNKNOWN = "The rectifier's surge rating is not declared, so the charging pulse is not compared with it."


def bridge_banks(banks: tuple) -> str:
    if banks:
        return f" It carries the pulse of the banks it charges ({', '.join(banks)}), each bank's share of the primary pulse referred to its winding."
    return (" No secondary bank is tied to it through a rail (secondary_banks[].name the name of a rail this bridge "
            "feeds), so the whole primary pulse is taken through it at the lowest bank's voltage (the harsher reading).")


def bridge_text(ref: str, verdict, over_peak: bool, derived: bool) -> str:
    text = ""
    if verdict.value == "fail":
        text = f"The switch-on charging pulse exceeds {ref}'s I^2 t rating: it can fail short at switch-on, and then the fuse must clear it."
    elif over_peak:
        text = f"The charging pulse's peak exceeds {ref}'s I_FSM, though its I^2 t is within the rating; a soft-start or more resistance in the path lowers it."
    if derived:
        text += f" {ref}'s I^2 t is worked out from its I_FSM as one half-sine; declare surge_i2t (rating for fusing) from its data sheet."
    return text.strip()


# A test station's parts

RCD_TOO_LARGE = "Its rated residual current is above 30 mA: it protects the wiring from earth faults but not a person touching a live part."
RCD_NO_BUTTON = "The record does not declare a test button (read as none): the device cannot be checked before use."
RCD_BEHIND_ISOLATION = ("It sits behind the isolating transformer: a person touching one pole of the isolated output and earth makes no"
                        " return path through it, so it does not trip; it protects only the supply side if moved there.")
RCD_CHECKLIST = " The checklist has the test-button item and a trip-time test with an RCD tester on an earthed supply."


def lamp_text(ref: str, first_peak, steady, bypass: bool, ratio_assumed: bool) -> str:
    text = (f"{ref} limits the unit under test to about {fmt(steady)} once its filament is hot; at the first instant the cold filament"
            f" lets through up to {fmt(first_peak)} at the crest.")
    if ratio_assumed:
        text += " The cold resistance is taken as a fifteenth of the hot (the harsher reading); declare protection.series_lamp.cold_ratio."
    if bypass:
        text += f" {ref} has a bypass: the checklist asks that it be open (the lamp in circuit) at every first switch-on of a unit under test."
    return text


def lamp_overrun(ref: str) -> str:
    return f" {ref} is rated below the voltage it is fed at high line (the variac's top of scale): it runs overvolted and fails open sooner."


def variac_text(ref: str, top, mains, below) -> str:
    text = (f"{ref} gives {fmt(top)} at the top of its scale from {fmt(mains)} mains: more than it takes in. That top-of-scale voltage is"
            " the nominal for everything it feeds, and its high line is that plus the mains tolerance.")
    if below:
        text += f" Rated below it: {', '.join(below)}. Fit parts rated for the top of scale, or a stop on the variac."
    return text + " The checklist asks for the top-of-scale voltage to be measured."


SOCKET_EARTH_UNKNOWN = ("the record does not say where the socket's earth contact goes; declare "
                        "protection.isolating_output.sockets[].earth_contact (unconnected, protective-earth or equipotential-bond)")


def socket_earth_text(ref: str, contact: str) -> str:
    if contact == "protective-earth":
        return (f"{ref}'s earth contact is wired to the case or protective earth behind the isolating transformer. A unit under test"
                " with a fault from one pole to its case then ties the isolated output to earth: the isolation is gone, and a person"
                " touching the other pole and anything earthed takes the full voltage with nothing to trip. Leave the earth contact"
                " unconnected, or bond the sockets' earth contacts only to each other (equipotential bonding, not earthed).")
    if contact == "equipotential-bond":
        return (f"{ref}'s earth contact is bonded only to the other isolated sockets' (not to earth): two faulty units under test"
                " cannot put the two poles on touchable metal at once. The checklist verifies it is not earthed.")
    return f"{ref}'s earth contact is unconnected: the isolated output stays floating. The checklist verifies it."


NO_ISOLATED_FUSE = ("The isolated output has no fuse of its own: a short in a unit under test is cleared only by the station's mains fuse,"
                    " sized for the whole station, while the isolating transformer, the variac and the sockets' wiring overheat."
                    " Fit a fuse on the output, rated for the smallest of them.")


def isolated_fuse_text(ref: str, too_big, low_voltage: bool, voltage) -> str:
    parts = []
    if too_big:
        parts.append(f"{ref} is rated above the {', '.join(too_big)}: it does not protect them")
    if low_voltage:
        parts.append(f"{ref} is rated below the {fmt(voltage)} it may break")
    return ("; ".join(parts) + ".") if parts else ""


LOAD_WORDS = {
    "regulated": "a regulated load draws constant power, so the most current at low line",
    "unregulated-linear": "an unregulated linear load (e.g. a class-AB amplifier on unregulated rails) draws power as the square of the mains, so current in proportion to it",
    "resistive": "a resistive load draws current in proportion to the mains, a sine (not the half-sine pulses of a capacitor input)",
}


def load_text(kind: str, line: str, assumed: bool) -> str:
    text = f" Load model: {LOAD_WORDS[kind]}; worked out at {line} line."
    if assumed:
        text += (" The record does not give protection.load_kind: constant power and power as V^2 were both worked out and the one"
                 " that makes each check harsher was taken. Declare protection.load_kind to make it exact.")
    return text
