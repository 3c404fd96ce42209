"""Items for the rails beyond the mains: the staged first power-up a unit with hazardous DC rails or valves needs,
each rail's expected reading with the no-load rise allowed for, and the discharge check before hands go in."""

from __future__ import annotations

from dossier.calcs.rails import DISCHARGE, HAZARDS, VOLTAGES
from dossier.calcs.rails.discharge import SAFE_VOLTAGE
from dossier.calcs.rails.hazards import NAME as RAILS
from dossier.checklist.items import Expected, Item, Origin, Phase, at_most, slug
from dossier.citations import IEC_60204_1_RESIDUAL
from dossier.findings import common_practice
from dossier.units import fmt

VALVE_TOPOLOGIES = ("valve-centre-tapped", "valve-half-wave")
STAGED_PRACTICE = common_practice(
    "a first switch-on of a valve or high-voltage unit with the current limited (series lamp or variac), the valves "
    "and load out first, then in stages; output valves only once their bias is set")
READING_PRACTICE = common_practice("a rail measured with no load reads between its loaded value at low line and its no-load value at high line")


def has_valves(record) -> bool:
    parts = (part for stage in record.stages for part in stage.parts)
    return any(part.kind.lower() in ("valve", "tube") for part in parts) or any(s.topology in VALVE_TOPOLOGIES for s in record.stages)


def rail_items(record, review) -> list[Item]:
    hazards = review.product(RAILS, HAZARDS) or ()
    dc_hazards = [hazard for hazard in hazards if hazard.kind == "dc"]
    items = _staged(record, dc_hazards) if dc_hazards or has_valves(record) else []
    items += [_reading(found) for found in review.product(RAILS, VOLTAGES) or ()]
    times = {f.subject: f for f in review.findings if f.code == DISCHARGE}
    items += [_discharge_check(hazard, times.get(hazard.name)) for hazard in dc_hazards]
    return items


def _staged(record, hazards) -> list[Item]:
    rails = ", ".join(f"{hazard.name} ({fmt(hazard.worst)})" for hazard in hazards) or "its high-voltage rails"
    items = [Item(
        key="staged-power-up", phase=Phase.POWER_UP, origin=Origin.BUILD, title="Staged first power-up",
        steps=(
            "Take the load off, and pull the valves (the rectifier valve last, if there is one) or leave the high-voltage "
            "stages unplugged. Switch on through a series lamp or a variac turned right down; bring the mains up slowly "
            f"while watching the input current. Check the heater and bias rails first, then fit the rectifier and watch "
            f"{rails} rise; only then fit the remaining valves or connect the load, one stage at a time."
        ),
        sources=(STAGED_PRACTICE,),
    )]
    negative = [rail for rail in record.rails if rail.polarity == "negative" and rail.kind == "dc"]
    if negative and has_valves(record):
        names = ", ".join(rail.name for rail in negative)
        items.append(Item(
            key="bias-before-output-valves", phase=Phase.POWER_UP, origin=Origin.BUILD, title="Bias set before the output valves go in",
            steps=(
                f"With the output valves out, switch on and set the bias ({names}) to the most negative end of its range "
                "at each output valve's grid socket; only then fit the output valves, and set their idle current."
            ),
            sources=(STAGED_PRACTICE,),
        ))
    return items


def _reading(found) -> Item:
    expected = Expected(low=found.loaded * _low_line(found), high=found.worst)
    return Item(
        key=f"rail-{slug(found.name)}", phase=Phase.POWER_UP, origin=Origin.BUILD,
        title=f"Rail {found.name} with no load",
        steps=(
            f"With no load on it, measure rail {found.name} ({'DC' if found.kind == 'dc' else 'AC RMS'}) with a meter rated "
            f"for it, clipped on before switch-on. It reads above its loaded {fmt(found.loaded)}: with no load it rises to about "
            f"{fmt(found.no_load)} at nominal mains."
        ),
        unit="V", expected=expected, sources=(READING_PRACTICE,) + found.sources,
        note="Range: the loaded voltage at low line up to the no-load voltage at high line.",
    )


def _low_line(found) -> float:
    """The loaded voltage falls with the mains; a regulated rail does not."""
    return 1.0 if found.how == "regulated" else 0.9


def _discharge_check(hazard, finding) -> Item:
    seconds = finding.value.quantity if finding is not None and finding.value is not None and hasattr(finding.value.quantity, "units") else None
    wait = (f"wait at least {fmt(seconds)} (its bleeder's time from {fmt(hazard.worst)} to {fmt(SAFE_VOLTAGE)})" if seconds is not None
            else "its bleeder's time is not known (no bleeder, or no capacitance declared): discharge it through a resistor of a few kilohms rated for the voltage")
    return Item(
        key=f"discharge-{slug(hazard.name)}", phase=Phase.POWER_UP, origin=Origin.BUILD,
        title=f"Rail {hazard.name} discharged before hands go in",
        steps=(
            f"After every switch-off, unplug, {wait}, then measure rail {hazard.name} across its capacitors with a meter "
            f"rated for {fmt(hazard.worst)}. Enter the reading; touch nothing until it is below {fmt(SAFE_VOLTAGE)}."
        ),
        unit="V", expected=at_most(SAFE_VOLTAGE), sources=(IEC_60204_1_RESIDUAL,),
    )
