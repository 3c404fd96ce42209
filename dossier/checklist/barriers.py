"""Items for this build's insulation: distances at each barrier and live tabs on heatsinks."""

from __future__ import annotations

from dossier.checklist.general import INSULATION_MINIMUM, INSULATION_TEST_VOLTAGE
from dossier.checklist.items import Item, Origin, Phase, at_least, slug
from dossier.calcs.isolation import CLEARANCE, CREEPAGE, HIPOT
from dossier.calcs.isolation.standard import STANDARD_LABEL
from dossier.standards.product import BASIC_TITLE
from dossier.citations import DIN_EN_50678
from dossier.findings import common_practice
from dossier.units import fmt

DISTANCE_CODES = {"clearance": CLEARANCE, "creepage": CREEPAGE}
HOW_TO_MEASURE = {
    "clearance": "the shortest path through air between the two sides",
    "creepage": "the shortest path along insulating surfaces between the two sides, around slots and over barriers",
}


def distance_items(record, findings) -> list[Item]:
    """Clearance and creepage to measure at each barrier, against the isolation calc's required value."""
    return [_distance(barrier, kind, findings) for barrier in record.barriers for kind in ("clearance", "creepage")]


def _distance(barrier, kind: str, findings) -> Item:
    finding = _finding_for(findings, DISTANCE_CODES[kind], barrier.name)
    declared = getattr(barrier, kind)
    required = finding.limit.quantity if finding is not None and finding.limit is not None else None
    sides = " and ".join(barrier.between)
    return Item(
        key=f"{kind}-{slug(barrier.name)}",
        phase=Phase.UNPOWERED,
        origin=Origin.BUILD,
        title=f"{kind.capitalize()} at '{barrier.name}'",
        steps=(
            f"Measure {HOW_TO_MEASURE[kind]} ({sides}, {barrier.grade} insulation) with calipers or a feeler "
            f"gauge, at the closest point you can find. The record declares {fmt(declared)}."
        ),
        unit="mm",
        expected=at_least(required if required is not None else declared),
        sources=finding.sources if finding is not None else (),
        note="" if required is not None else "No calculated requirement is available; the declared value is the target.",
    )


def hipot_items(record, findings) -> list[Item]:
    """The electric-strength test of each safety barrier, at the product standard's voltage, for a qualified person.
    Only under a product standard: IEC 60664-1 alone sets no test of the finished unit, and its figure is from memory."""
    return [_hipot(barrier, found) for barrier in record.barriers
            if (found := _finding_for(findings, HIPOT, barrier.name)) is not None and found.value is not None
            and not _standard_of(found).startswith(BASIC_TITLE)]


def _standard_of(finding) -> str:
    return next((str(m.quantity) for m in finding.extra if m.label == STANDARD_LABEL), "")


def _hipot(barrier, finding) -> Item:
    extra = {m.label: m.quantity for m in finding.extra}
    sides = " and ".join(barrier.between)
    volts = finding.value.quantity
    return Item(
        key=f"hipot-{slug(barrier.name)}",
        phase=Phase.UNPOWERED,
        origin=Origin.BUILD,
        title=f"Electric-strength (hi-pot) test at '{barrier.name}': qualified person only",
        steps=(
            f"Only a person trained for it, with a proper electric-strength tester, does this. Unplugged, mains switch on: "
            f"join each side's conductors together ({sides}), disconnect what the standard lets you remove for the test "
            f"(such as a surge suppressor to earth), raise the voltage smoothly to "
            f"{fmt(volts)} {extra.get('waveform', '')} and hold it for {fmt(extra['duration'])}. Pass: no breakdown. "
            "Tick only when it passed; discharge both sides afterwards."
        ),
        sources=finding.sources,
        note=(f"{extra.get('product standard', '')}, {extra.get('table and row', '')}. This test can hurt: trained people with proper "
              "equipment only, the area kept clear; defer to local codes and licensed practice."),
    )


def _finding_for(findings, code: str, subject: str):
    return next((f for f in findings if f.code == code and f.subject == subject), None)


def tab_isolation_items(record) -> list[Item]:
    """A live tab on a heatsink: the pad between them is the only insulation, so test it."""
    sinks = {sink.ref: sink for sink in record.devices.heatsinks}
    return [_tab(device, sinks.get(device.heatsink)) for device in record.devices.semiconductors if device.tab_live and device.heatsink]


def _tab(device, sink) -> Item:
    if not device.insulated:
        return _live_sink(device)
    earthed = sink is not None and sink.earthed
    minimum = INSULATION_MINIMUM["I" if earthed else "II"]
    return Item(
        key=f"tab-isolation-{slug(device.ref)}",
        phase=Phase.UNPOWERED,
        origin=Origin.BUILD,
        title=f"{device.ref}'s live tab isolated from heatsink {device.heatsink}",
        steps=(
            f"{device.ref}'s tab is at mains potential and sits on heatsink {device.heatsink} "
            f"({'earthed' if earthed else 'not earthed'}). Check that the insulating pad and bush are fitted "
            f"and unbroken, then apply {fmt(INSULATION_TEST_VOLTAGE)} DC between the tab and the heatsink."
        ),
        unit="megaohm",
        expected=at_least(minimum),
        sources=(DIN_EN_50678,),
        note=(
            "The standard sets this figure for the whole unit; it is applied here to the pad alone, "
            f"{'as basic insulation to earthed metal' if earthed else 'as the figure for double or reinforced insulation'}."
        ),
    )


def _live_sink(device) -> Item:
    """No pad: the heatsink itself carries mains."""
    return Item(
        key=f"tab-isolation-{slug(device.ref)}",
        phase=Phase.UNPOWERED,
        origin=Origin.BUILD,
        title=f"Heatsink {device.heatsink} is live through {device.ref}'s tab",
        steps=(
            f"{device.ref} is mounted on {device.heatsink} with no insulating pad, so the heatsink is at mains potential. "
            "Check that it cannot be touched with the unit closed, that it clears earthed metal and the output side "
            "as mains does, and treat it as live while the unit is open."
        ),
        sources=(common_practice("a heatsink bolted to a live tab is itself live"),),
    )
