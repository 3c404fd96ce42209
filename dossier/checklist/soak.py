"""The temperature soak: how long to run at full load, where to measure, and how much rise each point may show.

Limits come from the thermal and magnetics findings: a touchable heatsink's touch limit (THERM-HEATSINK), the
hottest a heatsink may run with its devices' junctions under their limits (THERM-JUNCTION), and a wound part's
temperature limit (MAG-TEMP-RISE). A rise is independent of the room, so each is stated as a rise above it.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.magnetics import TEMP_RISE
from dossier.calcs.thermal import HEATSINK, JUNCTION
from dossier.checklist.items import Item, Origin, Phase, at_least, at_most, slug
from dossier.checklist.windings import winding_by_resistance
from dossier.findings import common_practice
from dossier.units import Q_, fmt

SOAK_TIME = Q_(60, "minute")
SETTLED = "until two readings 10 minutes apart differ by less than 1 K"


@dataclass(frozen=True)
class RiseLimit:
    rise: object
    why: str
    sources: tuple = ()


def soak_items(record, findings, hazardous_rails: bool = False) -> list[Item]:
    """hazardous_rails: the unit makes voltages beyond the mains, so every wound part may sit at one."""
    if record.output is None and not record.rails:
        return []
    by_code = _index(findings)
    places = [_heatsink(sink, record, by_code) for sink in record.devices.heatsinks]
    for part in record.magnetics:
        if hazardous_rails:
            places += winding_by_resistance(part, _magnetic_limit(part, by_code))
        else:
            places.append(_magnetic(part, by_code))
    return [_run(record), _room()] + places


def _index(findings) -> dict:
    return {(f.code, f.subject): f for f in findings}


def _run(record) -> Item:
    output = record.output
    load = f"{fmt(output.current)} at {fmt(output.voltage)}" if output is not None else "every rail at its rated current"
    return Item(
        key="soak-run", phase=Phase.SOAK, origin=Origin.BUILD,
        title=f"Run at full load, {load}",
        steps=(
            f"With the covers in place as in use, run the unit at {load} into a load for at least "
            f"{fmt(SOAK_TIME)} and {SETTLED}. Enter how long it ran."
        ),
        unit="minute",
        expected=at_least(SOAK_TIME),
        sources=(common_practice(f"a soak at full load {SETTLED}"),),
    )


def _room() -> Item:
    return Item(
        key="soak-room", phase=Phase.SOAK, origin=Origin.BUILD,
        title="Room temperature during the soak",
        steps="Measure the air temperature about half a metre from the unit, away from its exhaust.",
        unit="degC",
    )


def _rise_item(ref: str, what: str, estimate, limit: RiseLimit | None) -> Item:
    guess = f" The estimate at full load is a rise of about {fmt(estimate)}." if estimate is not None else ""
    return Item(
        key=f"soak-{slug(ref)}", phase=Phase.SOAK, origin=Origin.BUILD,
        title=f"Temperature rise of {what} {ref}",
        steps=(
            f"At the end of the soak, measure {what} {ref} with a thermocouple held to its hottest reachable point; "
            f"enter the reading less the room temperature, in kelvin.{guess}"
        ),
        unit="K",
        expected=at_most(limit.rise) if limit is not None else None,
        sources=limit.sources if limit is not None else (),
        note=limit.why if limit is not None else f"No limit for {ref} could be worked out from the record; note the reading.",
    )


def _magnetic(part, by_code) -> Item:
    finding = by_code.get((TEMP_RISE, part.ref))
    estimate = finding.value.quantity if finding is not None and finding.value is not None else None
    return _rise_item(part.ref, "the winding of", estimate, _magnetic_limit(part, by_code))


def _magnetic_limit(part, by_code) -> RiseLimit | None:
    finding = by_code.get((TEMP_RISE, part.ref))
    if finding is None or finding.limit is None:
        return None
    return RiseLimit(finding.limit.quantity.to("K"), f"Range: {finding.limit.label}.", finding.sources)


def _heatsink(sink, record, by_code) -> Item:
    finding = by_code.get((HEATSINK, sink.ref))
    ambient = record.environment.max_ambient
    estimate = _rise(finding.value.quantity, ambient) if finding is not None and finding.value is not None else None
    limits = [_touch_limit(finding, ambient)] + [_junction_limit(device, finding, ambient, by_code) for device in _devices_on(record, sink)]
    limits = [limit for limit in limits if limit is not None]
    tightest = min(limits, key=lambda limit: limit.rise.to("K").magnitude) if limits else None
    return _rise_item(sink.ref, "heatsink", estimate, tightest)


def _rise(temperature, ambient):
    return Q_(temperature.to("degC").magnitude - ambient.to("degC").magnitude, "K")


def _devices_on(record, sink) -> list:
    return [device for device in record.devices.semiconductors if device.heatsink == sink.ref]


def _touch_limit(finding, ambient) -> RiseLimit | None:
    if finding is None or finding.limit is None:
        return None
    why = f"Range: the {finding.limit.label} {fmt(finding.limit.quantity)}, less the highest ambient in the record, {fmt(ambient)}."
    return RiseLimit(_rise(finding.limit.quantity, ambient), why, finding.sources)


def _junction_limit(device, sink_finding, ambient, by_code) -> RiseLimit | None:
    """The sink temperature at which the device's junction reaches its limit, from the thermal estimate's drop."""
    junction = by_code.get((JUNCTION, device.ref))
    if junction is None or junction.limit is None or junction.value is None or sink_finding is None or sink_finding.value is None:
        return None
    drop = junction.value.quantity.to("degC").magnitude - sink_finding.value.quantity.to("degC").magnitude
    hottest = Q_(junction.limit.quantity.to("degC").magnitude - drop, "degC")
    why = (f"Range: the sink at {fmt(hottest)} brings {device.ref}'s junction to its limit "
           f"({junction.limit.label}), less the highest ambient in the record, {fmt(ambient)}.")
    return RiseLimit(_rise(hottest, ambient), why, junction.sources)
