"""Items for the parts of a test station and a soft-start: RCD, series lamp, variac, isolated output and its sockets."""

from __future__ import annotations

from dossier.calcs.protection.bench import HSE_TEST_BENCH, LAMP_COLD, RCD_TRIP_TIMES, SEPARATION
from dossier.calcs.shared.variac import fed_voltage
from dossier.calcs.protection.surge import ESP_SOFT_START
from dossier.checklist.general import INSULATION_MINIMUM, INSULATION_TEST_VOLTAGE
from dossier.checklist.items import Item, Origin, Phase, at_least, at_most
from dossier.citations import DIN_EN_50678
from dossier.findings import common_practice
from dossier.units import Q_, fmt

RCD_TRIP_LIMIT = Q_(300, "ms")
RCD_FAST_LIMIT = Q_(40, "ms")


def station_items(record) -> list[Item]:
    if record.mains is None:
        return []
    protection = record.protection
    items = []
    if protection.rcd is not None:
        items += _rcd(protection.rcd)
    if protection.isolating_output is not None:
        items += _isolated(protection.isolating_output)
    if protection.variac is not None:
        items.append(_variac(record, protection.variac))
    if protection.series_lamp is not None:
        items.append(_lamp(protection.series_lamp))
    limiter = protection.inrush_limiter
    if limiter is not None and limiter.kind == "relay-bypassed-resistor":
        items.append(_softstart(limiter))
    return items


def _rcd(rcd) -> list[Item]:
    return [
        Item(key="rcd-test-button", phase=Phase.POWER_UP, origin=Origin.BUILD, title=f"{rcd.ref}: test button",
             steps=f"With the station on its mains supply, press {rcd.ref}'s test button: it must trip at once. Reset it.",
             sources=(RCD_TRIP_TIMES,)),
        Item(key="rcd-trip-time", phase=Phase.POWER_UP, origin=Origin.BUILD, title=f"{rcd.ref}: trip time",
             steps=(f"Plug an RCD tester into an outlet fed through {rcd.ref}, on an earthed supply (the tester's test current returns"
                    f" through the protective earth; behind an isolating transformer it cannot). Test at {fmt(rcd.residual_current.to('mA'))}"
                    f" on both half-cycles and enter the longer time; at five times the rated current it must trip within {fmt(RCD_FAST_LIMIT)}."),
             unit="ms", expected=at_most(RCD_TRIP_LIMIT), sources=(RCD_TRIP_TIMES,),
             note=f"General-type limits: {fmt(RCD_TRIP_LIMIT)} at the rated residual current, {fmt(RCD_FAST_LIMIT)} at five times it."),
    ]


def _isolated(output) -> list[Item]:
    sockets = ", ".join(s.ref for s in output.sockets) or "each output socket"
    return [
        Item(key="isolated-socket-earth", phase=Phase.UNPOWERED, origin=Origin.BUILD, title="Isolated sockets: where the earth contacts go",
             steps=(f"Unplugged, open the station and follow the wire from the earth contact of {sockets}: it must not reach the case,"
                    " the mains earth or the inlet's earth pin; it is either unconnected or bonded only to the other isolated sockets."
                    " Confirm with an ohmmeter from each earth contact to the case: open circuit."),
             sources=(SEPARATION, HSE_TEST_BENCH)),
        Item(key="isolated-output-insulation", phase=Phase.UNPOWERED, origin=Origin.BUILD, title="Insulation resistance, isolated output to earth",
             steps=(f"Unplugged, switches on. Join the isolated output's two poles (and the sockets' earth contacts) and apply"
                    f" {fmt(INSULATION_TEST_VOLTAGE)} DC from them to the mains inlet's earth pin and the case; read once it settles."),
             unit="megaohm", expected=at_least(INSULATION_MINIMUM["I"]), sources=(DIN_EN_50678,),
             note=f"The class I figure at {fmt(INSULATION_TEST_VOLTAGE)} DC, applied to the separated circuit."),
        Item(key="isolated-output-float", phase=Phase.POWER_UP, origin=Origin.BUILD, title="Isolated output floats",
             steps=("Powered, nothing plugged in: measure AC volts from each output pole to earth with a meter loaded by about"
                    " 2 kohm across its leads. A few volts is the transformer's coupling; a reading near the output voltage means"
                    " the output is tied to earth somewhere: switch off and find it before any use."),
             sources=(common_practice("checking that an isolated output floats with a loaded voltmeter to earth (from memory)"), SEPARATION)),
    ]


def _variac(record, variac) -> Item:
    nominal, _ = fed_voltage(record)
    return Item(key="variac-top-of-scale", phase=Phase.POWER_UP, origin=Origin.BUILD, title=f"{variac.ref}: voltage at the top of the scale",
                steps=(f"With nothing plugged in, turn {variac.ref} to the top of its scale and measure its output. The record declares"
                       f" {fmt(nominal)}; everything it feeds must be rated for what you read. Turn it back to zero before plugging anything in."),
                unit="V", expected=at_most(nominal * 1.05), sources=(common_practice("measuring a variac's output at the top of its scale"),),
                note="Within 5 % of the declared top of scale (common practice).")


def _lamp(lamp) -> Item:
    bypass = " Its bypass switch must be open (the lamp in circuit) for every first switch-on of a unit under test." if lamp.bypass else ""
    return Item(key="series-lamp-station", phase=Phase.POWER_UP, origin=Origin.BUILD, title=f"Series lamp {lamp.ref} in circuit",
                steps=(f"Fit a {fmt(lamp.power)} incandescent lamp rated {fmt(lamp.voltage)} in {lamp.ref}.{bypass} At switch-on it flashes"
                       " and dims; staying bright means the unit under test draws too much: switch off."),
                sources=(LAMP_COLD,))


def _softstart(limiter) -> Item:
    cutoff = limiter.thermal_cutoff
    check = (f" Check that the thermal cut-off ({fmt(cutoff.temperature)}) is in series with {limiter.ref} and clamped to its body."
             if cutoff is not None else f" The record declares no thermal cut-off on {limiter.ref}.")
    delay = f" about {fmt(limiter.bypass_delay.to('ms'))}" if limiter.bypass_delay is not None else ""
    return Item(key="soft-start", phase=Phase.POWER_UP, origin=Origin.BUILD, title=f"Soft-start {limiter.ref}: the relay closes",
                steps=(f"Unplugged first:{check} Then at switch-on listen for the relay closing across {limiter.ref}{delay} later;"
                       f" after a minute's running, switched off and unplugged, {limiter.ref} must be no more than warm."),
                sources=(ESP_SOFT_START,))
