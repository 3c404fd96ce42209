"""Every sentence the charge calc's temperature findings write; the logic stays numbers and rules."""

from __future__ import annotations

import math

from dossier.units import fmt


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
