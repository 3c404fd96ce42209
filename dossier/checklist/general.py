"""Items the trade uses before any first power-up, worded for this record's mains and protective class."""

from __future__ import annotations

import dataclasses
import math

from dossier.calcs.protection.touch import LEAKAGE_LIMITS, LIMITS
from dossier.checklist.items import Item, Origin, Phase, at_least, at_most
from dossier.citations import DIN_EN_50678, EN_50106, IEC_60335_1, IET_INSERVICE_COP
from dossier.findings import common_practice
from dossier.units import Q_, fmt

IEC_60335_1_EARTH = dataclasses.replace(
    IEC_60335_1, edition="edition 5.0, 2010",
    clause="27.5, resistance of the earthing connection: 1.5 times the rated current or 25 A, whichever is higher, from a source of no more "
           "than 12 V; at most 0.1 ohm, the supply cord excluded (from memory)",
)
IN_SERVICE_EARTH = dataclasses.replace(
    IET_INSERVICE_COP, edition="5th edition, 2020 (from memory)",
    clause="protective-conductor continuity: at most 0.1 ohm plus the resistance of the cord's protective conductor",
)
INSULATION_TEST_VOLTAGE = Q_(500, "V")
EARTH_LIMIT = Q_(0.1, "ohm")
# EN 50106:2008 Annex A.1 (routine test): at least 10 A from no more than 12 V. A multimeter's milliamperes cannot prove a bond.
EARTH_TEST_CURRENT = Q_(10, "A")
EARTH_TEST_VOLTAGE = Q_(12, "V")
# Minimum insulation resistance at 500 V DC, DIN EN 50678:2021 (earlier DIN VDE 0701-0702:2008).
INSULATION_MINIMUM = {"I": Q_(1.0, "megaohm"), "II": Q_(2.0, "megaohm")}
LAMP_WATTS = (25, 40, 60, 75, 100, 150, 200)
BULK_POSITIONS = ("bulk", "split")
STRONG_GRADES = ("reinforced", "double")


def protective_class(record) -> str:
    earth = record.protection.earth
    return earth.protective_class if earth else "I"


def visual_inspection(record) -> Item:
    return Item(
        key="visual-inspection",
        phase=Phase.UNPOWERED,
        origin=Origin.GENERAL,
        title="Visual inspection",
        steps=(
            "With the mains lead unplugged, look over the whole unit in good light: no loose strands, solder "
            "splashes, stray screws or swarf; every mains connection mechanically secure; the mains cord clamped "
            "against pulling; exposed mains terminals sleeved; the rating label fitted."
        ),
        sources=(common_practice("a visual inspection before any electrical test"),),
    )


def earth_continuity(record) -> list[Item]:
    """Class I only: a class II unit has no protective earth to measure."""
    if protective_class(record) != "I":
        return []
    return [Item(
        key="pe-continuity",
        phase=Phase.UNPOWERED,
        origin=Origin.GENERAL,
        title="Protective-earth continuity",
        steps=(
            f"Use an earth-bond tester that drives at least {fmt(EARTH_TEST_CURRENT)} from no more than {fmt(EARTH_TEST_VOLTAGE)}: "
            "a multimeter's few milliamperes read low through a single strand or a loose screw and cannot prove a bond. "
            "Null the test leads, or note their resistance and subtract it. Measure from the earth pin of the "
            f"mains inlet to every touchable metal part: {_metal_parts(record)}. Enter the highest reading. "
            "With a cord fitted for good, measure from the plug's earth pin and add the resistance of the "
            "cord's earth conductor to the limit; flex the cord along its length while measuring."
        ),
        unit="ohm",
        expected=at_most(EARTH_LIMIT),
        sources=(IN_SERVICE_EARTH, EN_50106, IEC_60335_1_EARTH),
        note=f"Test current at least {fmt(EARTH_TEST_CURRENT)} (EN 50106:2008 Annex A.1); limit {fmt(EARTH_LIMIT)} plus the cord's earth conductor.",
    )]


def protective_conductor_current(record) -> list[Item]:
    """Class I only: the current in the protective conductor, measured live by a qualified person."""
    if record.mains is None or protective_class(record) != "I":
        return []
    limit = LIMITS["I"]
    return [Item(
        key="pe-current",
        phase=Phase.POWER_UP,
        origin=Origin.GENERAL,
        title="Protective-conductor current (qualified person)",
        steps=(
            "CAUTION: this test is made with the unit live. It is for a qualified person with a leakage-current tester "
            "made for it (the differential or direct method), never improvised. Never lift or break the earth to "
            "measure: the current then flows through whoever touches the case or the output. With the unit running at "
            "full load from its normal supply, read the current in the protective conductor with the mains switch on, "
            "then with line and neutral reversed; enter the higher."
        ),
        unit="mA",
        expected=at_most(limit),
        sources=(LEAKAGE_LIMITS, DIN_EN_50678),
        note=f"Limit {fmt(limit)} for a class I portable unit (IEC 60335-1 clause 16.2); your product standard may set another.",
    )]


def _metal_parts(record) -> str:
    parts = ["the enclosure"] if record.protection.earth and record.protection.earth.enclosure == "metal" else []
    parts += [f"heatsink {sink.ref}" for sink in record.devices.heatsinks if sink.earthed]
    bonding = record.protection.earth.bonding if record.protection.earth else ""
    text = ", ".join(parts) if parts else "each exposed metal part"
    return f"{text} (the record describes the bond as: {bonding}; this test is what verifies it)" if bonding else text


def insulation_to_metal(record) -> Item:
    klass = protective_class(record)
    return Item(
        key="insulation-mains-metal",
        phase=Phase.UNPOWERED,
        origin=Origin.GENERAL,
        title="Insulation resistance, mains to touchable metal",
        steps=(
            f"Unplugged, mains switch on. Join line and neutral at the inlet and apply {fmt(INSULATION_TEST_VOLTAGE)} DC "
            f"from them to {'the earth pin and ' if klass == 'I' else ''}each touchable metal part; read once the "
            "value settles. Take out any surge suppressor wired to earth for the test and refit it after. "
            "Discharge the unit when done."
        ),
        unit="megaohm",
        expected=at_least(INSULATION_MINIMUM[klass]),
        sources=(DIN_EN_50678,),
        note=f"Figure for a protective class {klass} unit, tested at {fmt(INSULATION_TEST_VOLTAGE)} DC.",
    )


def insulation_to_output(record) -> Item:
    klass, figure_note = _output_class(record)
    return Item(
        key="insulation-mains-output",
        phase=Phase.UNPOWERED,
        origin=Origin.GENERAL,
        title="Insulation resistance, mains to output",
        steps=(
            "Unplugged, mains switch on. Join line and neutral at the inlet, join the output terminals together, "
            f"and apply {fmt(INSULATION_TEST_VOLTAGE)} DC between the two; read once the value settles. "
            "Discharge both sides when done."
        ),
        unit="megaohm",
        expected=at_least(INSULATION_MINIMUM[klass]),
        sources=(DIN_EN_50678,),
        note=figure_note,
    )


def _output_class(record) -> tuple[str, str]:
    """Output behind double or reinforced insulation takes the class II figure (from memory of the standard's rule)."""
    grades = {b.grade for b in record.barriers if "mains" in b.between and "output" in b.between}
    if grades & set(STRONG_GRADES) or protective_class(record) == "II":
        return "II", ("Figure for parts behind double or reinforced insulation (the class II value), "
                      "applied to the output; from memory of the standard's rule, check it.")
    return "I", "Figure for basic insulation (the class I value)."


def one_hand() -> Item:
    return Item(
        key="one-hand",
        phase=Phase.POWER_UP,
        origin=Origin.GENERAL,
        title="One hand in the pocket",
        steps=(
            "While the unit is live, keep one hand away from it (in a pocket or behind your back), wear no rings "
            "or watch, and stand on a dry floor. Clip probes on while the unit is unpowered where you can. The "
            "witness stands at the switch that cuts the supply."
        ),
        sources=(common_practice("one hand away from live work"),),
    )


def series_lamp(record) -> Item:
    return Item(
        key="series-lamp",
        phase=Phase.POWER_UP,
        origin=Origin.GENERAL,
        title="First power-up through a series lamp",
        steps=(
            f"Connect the unit through an incandescent lamp in series with the line, rated for the "
            f"{_mains_text(record)} mains, {_lamp_text(record)}. At switch-on the lamp may flash, then it should "
            "dim or go dark. If it stays bright, switch off: something draws too much current."
        ),
        sources=(common_practice("a current-limiting series lamp for a first power-up"),),
    )


def _mains_text(record) -> str:
    return f"{fmt(record.mains.nominal)} {fmt(record.mains.frequency)}" if record.mains else "local"


def _lamp_text(record) -> str:
    watts = input_power(record)
    if watts is None:
        return "of roughly the unit's input power"
    lamp = min(LAMP_WATTS, key=lambda w: abs(w - watts.to("W").magnitude))
    return f"about {lamp} W (roughly the unit's input power of {fmt(watts)}; a smaller lamp limits harder)"


def input_power(record):
    """Input power at full load: output power over efficiency, when the record gives both."""
    output = record.output
    if output is None:
        return None
    power = output.power if output.power is not None else (output.voltage * output.current).to("W")
    return (power / output.efficiency.to("").magnitude).to("W") if output.efficiency is not None else power


def isolated_supply() -> Item:
    return Item(
        key="isolating-supply",
        phase=Phase.POWER_UP,
        origin=Origin.GENERAL,
        title="Isolating transformer or residual-current device",
        steps=(
            "Feed the lamp and the unit from an isolating transformer, or through a residual-current device that "
            "trips at 30 mA or less. The transformer takes away the path to earth through you from one touched "
            "point; the device trips on current leaking to earth. Neither protects you when you touch two points "
            "of the live circuit."
        ),
        sources=(common_practice("an isolating transformer or a 30 mA residual-current device on the bench"),),
    )


def bleed_capacitors(record) -> Item:
    return Item(
        key="bleed-capacitors",
        phase=Phase.POWER_UP,
        origin=Origin.GENERAL,
        title="Bleed the capacitors before touching",
        steps=(
            f"After every switch-off, unplug, then discharge {_capacitor_text(record)} through a resistor of a few "
            "kilohms rated for the voltage (never a screwdriver across the terminals), and check with a meter "
            f"across each that it reads near zero before you touch anything. {_peak_text(record)}"
        ).strip(),
        sources=(common_practice("discharging and measuring capacitors before touching"),),
    )


def _capacitor_text(record) -> str:
    refs = [c.ref for c in record.devices.capacitors if c.position in BULK_POSITIONS]
    if not refs:
        return "the bulk capacitors"
    return f"the bulk capacitor{'s' if len(refs) > 1 else ''} " + ", ".join(refs)


def _mains_side_refs(record) -> set[str]:
    return {part.ref for stage in record.stages if stage.side == "mains" for part in stage.parts}


def _peak_text(record) -> str:
    """Only capacitors on the mains side charge to the mains peak."""
    mains_side = _mains_side_refs(record)
    charged = [c.ref for c in record.devices.capacitors if c.position in BULK_POSITIONS and c.ref in mains_side]
    if record.mains is None or not charged:
        return ""
    peak = record.mains.high * math.sqrt(2)
    return f"On the mains side, {', '.join(charged)} hold{'s' if len(charged) == 1 else ''} up to {fmt(peak.to('V'))}, the peak of the highest mains."
