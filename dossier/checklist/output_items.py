"""Items for this build's output: minimum load, the settings to verify, and a charger's battery leads."""

from __future__ import annotations

import math

from dossier.checklist.items import Item, Origin, Phase, at_least, at_most, within
from dossier.findings import common_practice
from dossier.units import Q_, fmt

E12 = (1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2)
RESISTOR_WATTS = (0.25, 0.5, 1, 2, 3, 5, 10, 25, 50, 100)
NO_TOLERANCE = "The record gives no output tolerance, so there is no range to check against; note the reading."


def e12_at_most(ohms: float) -> float:
    """The largest E12 value not above ohms, so the load draws at least the current asked for."""
    decade = 10 ** math.floor(math.log10(ohms))
    candidates = [step * decade * scale for scale in (0.1, 1) for step in E12]
    return max(value for value in candidates if value <= ohms * (1 + 1e-9))


def resistor_rating(watts: float) -> float:
    """A power rating of at least twice the dissipation (common practice), from the usual series."""
    return next((rating for rating in RESISTOR_WATTS if rating >= 2 * watts), RESISTOR_WATTS[-1])


def minimum_load(record) -> list[Item]:
    output = record.output
    if output is None or output.minimum_load is None:
        return []
    ohms = e12_at_most((output.voltage / output.minimum_load).to("ohm").magnitude)
    watts = (output.voltage**2 / Q_(ohms, "ohm")).to("W").magnitude
    return [Item(
        key="minimum-load",
        phase=Phase.POWER_UP,
        origin=Origin.BUILD,
        title="Minimum load fitted",
        steps=(
            f"The record says the converter needs at least {fmt(output.minimum_load)} to start and regulate. "
            f"Before switching on, fit a load across the output: for example {fmt(Q_(ohms, 'ohm'))} rated "
            f"{fmt(Q_(resistor_rating(watts), 'W'))} (it dissipates {fmt(Q_(watts, 'W'))} at {fmt(output.voltage)}). "
            "Measure the current it draws once running."
        ),
        unit="A",
        expected=at_least(output.minimum_load),
        sources=(common_practice("a load resistor rated for twice its dissipation"),),
    )]


def _tolerance(output) -> float | None:
    return output.tolerance.to("").magnitude if output.tolerance is not None else None


def _range(nominal, output):
    fraction = _tolerance(output)
    return within(nominal, fraction) if fraction is not None else None


def _tolerance_note(output) -> str:
    if _tolerance(output) is None:
        return NO_TOLERANCE
    return f"Range: the record's setting plus or minus its output tolerance of {fmt(output.tolerance)}."


def setting_items(record) -> list[Item]:
    output = record.output
    if output is None:
        return []
    items = [_voltage(output)]
    if output.battery is not None and output.battery.float_voltage is not None:
        items.append(_float_voltage(output))
    items.append(_current_limit(output) if output.battery is not None else _full_load(output))
    return items


def _voltage(output) -> Item:
    load = "the minimum load" if output.minimum_load is not None else "no load"
    battery = output.battery
    setting = battery.absorption_voltage if battery is not None else output.voltage
    name = "Absorption (constant-voltage) setting" if battery is not None else "Output voltage setting"
    return Item(
        key="output-voltage",
        phase=Phase.SETTINGS,
        origin=Origin.BUILD,
        title=f"{name}, {fmt(setting)}",
        steps=f"With {load} and no battery connected, measure the voltage at the output terminals.{_compensation_text(battery)}",
        unit="V",
        expected=_range(setting, output),
        note=_tolerance_note(output),
    )


def _compensation_text(battery) -> str:
    if battery is None or battery.compensation is None:
        return ""
    return (f" The setting follows temperature by {fmt(battery.compensation)} around 25 °C: take the reading at 25 °C, "
            "or correct it by that much per kelvin before comparing.")


def _float_voltage(output) -> Item:
    battery = output.battery
    at = f" (setting for {fmt(battery.temperature)})" if battery.temperature is not None else ""
    return Item(
        key="float-voltage",
        phase=Phase.SETTINGS,
        origin=Origin.BUILD,
        title=f"Float voltage setting, {fmt(battery.float_voltage)}",
        steps=f"Once the charger has switched to float, measure the voltage at the battery terminals{at}.{_compensation_text(battery)}",
        unit="V",
        expected=_range(battery.float_voltage, output),
        note=_tolerance_note(output),
    )


def _current_limit(output) -> Item:
    limit = output.battery.charge_current if output.battery.charge_current is not None else output.current
    return Item(
        key="output-current",
        phase=Phase.SETTINGS,
        origin=Origin.BUILD,
        title=f"Charge current limit, {fmt(limit)}",
        steps=(
            "Connect a discharged battery through an ammeter, or an electronic load set to hold the output below "
            "the voltage setting, and measure the current the charger regulates to."
        ),
        unit="A",
        expected=_range(limit, output),
        note=_tolerance_note(output),
    )


def _full_load(output) -> Item:
    ohms = (output.voltage / output.current).to("ohm")
    return Item(
        key="output-full-load",
        phase=Phase.SETTINGS,
        origin=Origin.BUILD,
        title=f"Output voltage at the rated current, {fmt(output.current)}",
        steps=(
            f"Load the output with {fmt(output.current)} (an electronic load, or about {fmt(ohms)} rated for "
            f"{fmt((output.voltage * output.current).to('W'))} or more) and measure the voltage at the terminals."
        ),
        unit="V",
        expected=_range(output.voltage, output),
        note=_tolerance_note(output),
    )


def battery_lead_items(record) -> list[Item]:
    """A charger's battery leads: the fuse in the positive lead and the polarity."""
    if record.output is None or record.output.battery is None:
        return []
    return [_lead_fuse(record.protection.output_fuse), _polarity(record.protection.reverse_polarity)]


def _lead_fuse(fuse) -> Item:
    if fuse is None:
        return Item(
            key="output-lead-fuse",
            phase=Phase.SETTINGS,
            origin=Origin.BUILD,
            title="Battery-lead fuse: none recorded",
            steps="The record has no fuse in the battery lead. Fit one in the positive lead, close to the battery, before connecting a battery.",
            sources=(common_practice("a fuse in the positive battery lead, close to the battery"),),
        )
    return Item(
        key="output-lead-fuse",
        phase=Phase.SETTINGS,
        origin=Origin.BUILD,
        title=f"Battery-lead fuse {fuse.ref}, {fmt(fuse.rating)}",
        steps=(
            f"Check that {fuse.ref} ({fmt(fuse.rating)}) is fitted in the positive battery lead"
            + (f", a {fmt(fuse.lead_wire)} wire" if fuse.lead_wire is not None else "")
            + ". Measure the length of lead from the fuse holder to the battery clamp."
        ),
        unit="mm" if fuse.distance_to_battery is not None else "",
        expected=at_most(fuse.distance_to_battery) if fuse.distance_to_battery is not None else None,
        sources=(common_practice("a fuse in the positive battery lead, close to the battery"),),
        note="Range: the distance declared in the record." if fuse.distance_to_battery is not None else "",
    )


def _polarity(protection: str) -> Item:
    guard = f" The record's reverse-polarity protection: {protection}." if protection else " The record names no reverse-polarity protection."
    return Item(
        key="output-polarity",
        phase=Phase.SETTINGS,
        origin=Origin.BUILD,
        title="Battery-lead polarity",
        steps=(
            "Before a battery is connected, check with a meter that the red lead reads positive against the "
            f"black, and that the clamps are marked + and -.{guard}"
        ),
        sources=(common_practice("checking lead polarity before connecting a battery"),),
    )
