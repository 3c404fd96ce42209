"""Every sentence the charge calc writes; the logic stays numbers and rules."""

from __future__ import annotations

import math

from dossier.units import Q_, fmt


def band_text(coldest: float, warmest: float) -> str:
    if math.isinf(coldest) and math.isinf(warmest):
        return "at any battery temperature"
    if math.isinf(coldest):
        return f"for battery temperatures up to {warmest:.0f} °C"
    if math.isinf(warmest):
        return f"for battery temperatures from {coldest:.0f} °C up"
    return f"for battery temperatures from {coldest:.0f} to {warmest:.0f} °C"


def span_text(span: tuple[float, float]) -> str:
    if span[0] == span[1]:
        return f"{span[0]:g} °C"
    return f"{span[0]:g} to {span[1]:g} °C"


def inside_band(label: str, band: str) -> str:
    return f"The setpoints stay inside the {label} windows {band}. "


NO_COMMON_TEMPERATURE = "No battery temperature puts every setpoint inside its window at once."


def outside_band(span) -> str:
    return f"Part of the expected range, {span_text(span)}, is outside that."


def tight_side(colder: bool, span, room: float, room_text: str) -> str:
    side, effect = ("below", "undercharged") if colder else ("above", "overcharged")
    if room < 0.05:
        return f"There is no room {side} the expected {span_text(span)}: a battery any {'colder' if colder else 'warmer'} is {effect}."
    return f"That leaves only {room_text} {side} the expected {span_text(span)} before the battery is {effect}."


def rising_coefficient(per_cell) -> str:
    return (f"The coefficient {fmt(per_cell)} per cell raises the setpoints as the battery warms; it must be negative, "
            "or a warm battery is driven harder and can run away thermally.")


def without_compensation(text: str, typical) -> str:
    return (text + " A fixed setpoint suits a battery kept near one temperature; otherwise fit compensation "
            f"(about {fmt(typical)} for this battery, a sensor on the battery) "
            "or declare lowest_temperature and highest_temperature so the range is checked.")


def not_wanted(title: str) -> str:
    return f"The {title} window takes no temperature compensation; check the maker's charging guide."


# --- charging temperature range -------------------------------------------------------------------------------

def range_title(label: str) -> str:
    return f"Battery temperature while charging against the {label} charging range"


def range_method(highest_basis: str) -> str:
    return ("the coldest and warmest battery temperature while charging against the chemistry's charging range; "
            f"warmest: {highest_basis}")


HIGHEST_DECLARED = "output.battery.highest_temperature as declared"


def highest_assumed(ambient) -> str:
    return (f"not declared: the warmer of the expected battery temperature and the highest ambient ({fmt(ambient)}) "
            "taken (harsher reading; declare output.battery.highest_temperature to make it exact)")


def too_hot(warmest: float, high, valve_regulated: bool) -> str:
    text = f"A battery at {warmest:g} °C is above the {fmt(high)} it may be charged at"
    if valve_regulated:
        return text + (": a valve-regulated battery charged hot draws more float current, which heats it further and can run "
                       "away thermally. Stop charging above the range (a temperature sensor on the battery, a cut-off in the charger).")
    return text + ": it gasses, loses water and ages fast. Stop charging above the range."


def too_cold(coldest: float, low) -> str:
    return (f"A battery at {coldest:g} °C is below the {fmt(low)} it may be charged at: charge is not accepted and a "
            "discharged battery can freeze. Stop charging below the range.")


def inside_range(span, low, high) -> str:
    return f"The expected battery temperatures, {span_text(span)}, are inside the charging range {fmt(low)} to {fmt(high)}."


def compensated_label(stage: str, temperature: float) -> str:
    return f"{stage} setpoint compensated to {temperature:g} °C"


def compensation_title(compensation, label: str) -> str:
    return f"Temperature compensation of {fmt(compensation)} against {label}"


def no_compensation_title(label: str) -> str:
    return f"No temperature compensation declared for the {label} battery"


def compensation_not_wanted_title(label: str) -> str:
    return f"Temperature compensation declared for {label}"


# --- setpoints against their windows ------------------------------------------------------------------------

NO_TEMPERATURE = " No battery temperature is given; 25 °C is assumed."


def temperature_note(declared: bool) -> str:
    return "" if declared else NO_TEMPERATURE


def window_text(window) -> str:
    return f"{fmt(window.low)} to {fmt(window.high)}"


def setpoint_where(temperature) -> str:
    return f"at {fmt(temperature)}"


def setpoint_title(stage: str, cells: int, label: str, where: str) -> str:
    return f"{stage.capitalize()} setpoint for a {cells}-cell {label} battery {where}"


def setpoint_label(stage: str, where: str) -> str:
    return f"{stage} setpoint {where}"


def below_window(value, span: str) -> str:
    return f"{fmt(value)} is below the window ({span}): the battery is left undercharged and sulphates over time."


def above_window(value, span: str) -> str:
    return (f"{fmt(value)} is above the window ({span}): the battery gasses and loses water "
            "(a sealed one dries out for good) and runs hot.")


def band_past_edge(value, band, span: str, advice: str) -> str:
    return (f"{fmt(value)} is inside the window, but with the output tolerance it may sit anywhere from "
            f"{fmt(band[0])} to {fmt(band[1])}, past an edge ({span}). {advice}")


def window_span(stage: str, window) -> str:
    return f"the {stage} window is {window_text(window)}"


def inside_window(span: str) -> str:
    return f"Inside the window ({span})."


BAND_WIDER_THAN_WINDOW = "The tolerance band is wider than the window itself: tighten the tolerance (or trim the setting on the bench)."


def set_nearer(middle) -> str:
    return f"Set it nearer {fmt(middle)} or tighten the tolerance."


def no_float_title(label: str) -> str:
    return f"No float stage declared for the {label} battery"


def no_float_stage(label: str, window) -> str:
    return (f"A {label} battery left on at its absorption voltage overcharges. Without a float "
            f"stage ({window_text(window)} here), the charger must end the charge once the current has "
            "tapered, or the battery must be taken off when full.")


def float_not_wanted_title(label: str) -> str:
    return f"Float stage declared for {label}"


def float_not_wanted(title: str) -> str:
    return f"The {title} windows take no float stage; the charge should end when full."


# --- charge current and the charger's rating ----------------------------------------------------------------

def current_title(current, capacity, label: str, rate: float) -> str:
    return f"Charge current {fmt(current)} for a {fmt(capacity)} {label} battery ({rate:.2g} C)"


def current_span(window, low_rate: float, high_rate: float) -> str:
    return f"{window_text(window)}, i.e. {low_rate:g} C to {high_rate:g} C"


def current_too_high(current, span: str) -> str:
    return f"{fmt(current)} is more than the battery should take ({span}): it heats and gasses, and its life shortens."


def current_too_low(current, span: str) -> str:
    return (f"{fmt(current)} is below the usual range ({span}): charging is slow, and a flooded battery's "
            "electrolyte may stratify without the stirring a stronger charge gives.")


def current_inside(span: str) -> str:
    return f"Inside the usual range ({span})."


def rating_title(limit_set) -> str:
    return f"Charge-current limit {fmt(limit_set)} against the charger's rating"


RATING_EXCEEDED = "The charger cannot deliver the limit set for the battery; lower it or uprate the charger."


# --- time to full --------------------------------------------------------------------------------------------

def time_title(start_percent: float) -> str:
    return f"Estimated time to full from {start_percent:g} % charge"


def _hours(value: float) -> str:
    return fmt(Q_(round(value, 2), "h"))


def taper_text(cv_hours: float, setpoint_v: float, termination_a: float) -> str:
    return f"then {_hours(cv_hours)} at {setpoint_v:.3g} V while the current tapers to {termination_a:.3g} A"


NO_TAPER = "the limit is below the termination current, so there is no taper"


def time_text(cc_hours: float, current_a: float, cv_onset_percent: float, taper: str, efficiency_percent: float) -> str:
    return (f"About {_hours(cc_hours)} at a constant {current_a:.3g} A to {cv_onset_percent:g} % charge, {taper}; "
            f"charge efficiency taken as {efficiency_percent:g} %. An estimate from a simple model, not a measurement: "
            "an old, cold or sulphated battery takes longer.")


# --- safeguards: absorption timer, high-temperature cut-off ------------------------------------------

TIMER_TITLE = "Absorption timer"
TIMER_METHOD = "a declared absorption timer passes; none is marginal"
NO_TIMER = ("The record declares no absorption timer (output.battery.absorption_timer). A failed cell keeps the current "
            "from tapering, so the charger holds the battery in absorption indefinitely, gassing and drying the good cells "
            "and heating the battery. Fit a timer that ends absorption (to float or off), and declare it.")


def timer_set(timer) -> str:
    return f"Absorption ends after at most {fmt(timer.to('h'))}, so a failed cell cannot hold the charger in absorption."


def cutoff_title(label: str) -> str:
    return f"High-temperature cut-off for the {label} battery"


CUTOFF_METHOD = ("a cut-off at or below the top of the chemistry's charging range, read by a sensor on the battery; for a "
                 "valve-regulated battery anything less fails, for others it is marginal")
CUTOFF_PROBLEMS = {
    "no-cutoff": "the record declares no high-temperature cut-off (output.battery.high_temperature_cutoff)",
    "cutoff-too-high": "the cut-off is above the top of the charging range",
    "sensor-not-declared": "the record does not say where the temperature sensor sits (output.battery.temperature_sensor), so it is taken as not on the battery (the harsher reading)",
    "sensor-charger": "the temperature sensor sits in the charger, where it reads the charger's air, not the battery",
    "sensor-none": "the charger has no temperature sensor",
}


def cutoff_text(problems, valve_regulated: bool, ceiling) -> str:
    if not problems:
        return "Charging stops when the battery, read by a sensor on the battery, passes the cut-off."
    listed = "; ".join(CUTOFF_PROBLEMS[p] for p in problems)
    text = listed[0].upper() + listed[1:] + "."
    top = f" (the charging range ends at {fmt(ceiling)})" if ceiling is not None else ""
    if valve_regulated:
        return text + (" A valve-regulated battery charged hot draws more current, which heats it further: thermal runaway, "
                       f"with swelling, venting and fire. Put a sensor on the battery and stop charging above the range{top}.")
    return text + f" A battery charged hot gasses, loses water and ages fast: stop charging above the range{top}."
