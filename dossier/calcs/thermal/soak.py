"""Soak-test readings (temperatures measured after a run at full load) against the thermal estimate."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.thermal import path, words
from dossier.calcs.thermal.air import air_during
from dossier.calcs.shared.finding_kit import maker, not_assessed
from dossier.calcs.shared.margins import margin
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.units import Q_, fmt

NAME = "thermal"
finding = maker(NAME)
# How far the measured rise may exceed the estimated rise before the estimate is called optimistic.
RISE_TOLERANCE = 0.2
SETTLING = Q_(1, "h")
SOAK_PRACTICE = common_practice(
    "a thermal estimate from datasheet resistances is trusted to about 20 % of the temperature rise; a soak run "
    "lasts about an hour or until readings stop rising, and a rise scales with ambient one to one (from memory)")


@dataclass(frozen=True)
class Projection:
    """What a reading means at the record's highest ambient, against the limit that applies there."""

    label: str
    temperature: object
    limit: object
    limit_label: str


def soak_findings(record) -> list[Finding]:
    return [finding for index, reading in enumerate(record.devices.soak) for finding in _reading(record, index, reading)]


def _reading(record, index: int, reading) -> list[Finding]:
    key = ("devices", "soak", index)
    device = _device(record, reading.ref)
    heatsink = path.heatsink_named(record, reading.ref)
    estimate = _estimate(record, device, heatsink, air_during(record, reading.ambient, heatsink or _sink_of(record, device)))
    title = f"{reading.ref} soak reading against the estimate"
    if estimate is None:
        return [not_assessed(NAME, "THERM-SOAK", reading.ref, title, words.SOAK_NO_ESTIMATE, (key,), (SOAK_PRACTICE,))]
    allowed = _allowed(estimate, reading.ambient)
    projection = _projection(record, device, heatsink, reading)
    verdict = _verdict(reading.temperature, allowed, projection)
    return [finding(
        code="THERM-SOAK", subject=reading.ref, title=title, verdict=verdict,
        values=(Measure(f"measured after {fmt(reading.duration)} at {fmt(reading.ambient)}", reading.temperature), Measure("estimate at that ambient", estimate)),
        limit=Measure(f"estimate plus {RISE_TOLERANCE:.0%} of its rise", allowed), relation="<=",
        method=("rise = T_measured - T_ambient, against the estimated rise (estimated in the room air of the run plus the "
                "enclosure's rise for a part inside); projected = T_measured + (T_a,max - T_ambient)"),
        explanation=words.soak(reading, estimate, projection, verdict, reading.duration.to("h") < SETTLING),
        keys=(key, ("environment", "max_ambient")),
        sources=(SOAK_PRACTICE,),
        extra=_projection_measures(projection) + (Measure("ambient during the run", reading.ambient), Measure("run", reading.duration),
                                                  Measure("rise tolerance", Q_(RISE_TOLERANCE * 100, "percent"))),
    )]


def _sink_of(record, device):
    return path.heatsink_named(record, device.heatsink) if device is not None else None


def _device(record, ref: str):
    return next((device for device in record.devices.semiconductors if device.ref == ref), None)


def _estimate(record, device, heatsink, ambient):
    if device is not None:
        return path.case_temperature(record, device, ambient)
    losses = path.sink_losses(record, heatsink)
    if any(loss is None for _, _, loss in losses):
        return None
    return path.sink_temperature(ambient, heatsink, losses)


def _allowed(estimate, ambient):
    rise = estimate.to("K") - ambient.to("K")
    return (ambient.to("K") + rise * (1 + RISE_TOLERANCE)).to("degC")


def _projection(record, device, heatsink, reading) -> Projection | None:
    """The reading carried to the highest ambient: a device's junction, or a touchable heatsink's surface."""
    raised = (reading.temperature.to("K") + record.environment.max_ambient.to("K") - reading.ambient.to("K")).to("degC")
    if device is not None:
        return _junction_projection(device, raised)
    if heatsink.touchable:
        touch = margin(record, "touch_temperature").value
        return Projection(f"heatsink at {fmt(record.environment.max_ambient)}", raised, touch, "touch limit")
    return None


def _junction_projection(device, case) -> Projection | None:
    loss = path.loss_of(device)
    if loss is None or device.rth_jc is None or device.max_junction is None:
        return None
    junction = path.temperature_at(case, loss.total, device.rth_jc)
    return Projection("junction from the reading at the highest ambient", junction, device.max_junction, "max junction")


def _verdict(measured, allowed, projection: Projection | None) -> Verdict:
    if projection is not None and projection.temperature.to("K") > projection.limit.to("K"):
        return Verdict.FAIL
    return Verdict.MARGINAL if measured.to("K") > allowed.to("K") else Verdict.PASS


def _projection_measures(projection: Projection | None) -> tuple[Measure, ...]:
    if projection is None:
        return ()
    return (Measure(projection.label, projection.temperature), Measure(projection.limit_label, projection.limit))
