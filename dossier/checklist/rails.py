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
    voltages = review.product(RAILS, VOLTAGES) or ()
    staged = dc_hazards or has_valves(record) or (hazards and variac_input(record) is not None)
    items = _staged(record, dc_hazards or list(hazards), voltages) if staged else []
    items += [_reading(found) for found in voltages]
    times = {f.subject: f for f in review.findings if f.code == DISCHARGE}
    items += [_discharge_check(hazard, times.get(hazard.name)) for hazard in dc_hazards]
    return items


def _staged(record, hazards, voltages=()) -> list[Item]:
    rails = ", ".join(f"{hazard.name} ({fmt(hazard.worst)})" for hazard in hazards) or "its high-voltage rails"
    items = _variac_steps(record, rails, voltages) if variac_input(record) is not None else [_series_lamp(record, rails)]
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


OUT_FIRST = ("Take the load off, and pull the valves (the rectifier valve last, if there is one) or leave the high-voltage "
             "stages unplugged.")
STEPS = (0.25, 0.5, 0.75, 1.0)
INPUT_TOPOLOGIES = ("variac", "isolating-transformer")
LAMP_PRACTICE = common_practice(
    "a first switch-on through an incandescent lamp in series with the live lead (about 60 W for a unit drawing under "
    "100 W, 100 W above): it glows and dims as the capacitors charge; a lamp that stays bright is a fault (from memory)")
VARIAC_PRACTICE = common_practice(
    "a first switch-on from a variac brought up in steps (a quarter, a half, three quarters, then the full mains), "
    "the rails read at each step: with no load each follows the mains in proportion; a step that reads high, low or "
    "draws current that keeps rising is a fault")


def variac_input(record):
    """The record's variac mains-input stage, else its isolating-transformer one, or None."""
    inputs = [stage for stage in record.stages if stage.kind == "mains-input" and stage.topology_name in INPUT_TOPOLOGIES]
    return next((stage for stage in inputs if stage.topology_name == "variac"), inputs[0] if inputs else None)


def _out_first(record) -> str:
    return OUT_FIRST if has_valves(record) or any(rail.kind == "dc" for rail in record.rails) else "Take the load off."


def _series_lamp(record, rails: str) -> Item:
    return Item(
        key="staged-power-up", phase=Phase.POWER_UP, origin=Origin.BUILD, title="Staged first power-up through a series lamp",
        steps=(
            f"{_out_first(record)} Switch on through an incandescent lamp in series with the live lead (about 60 W for a unit drawing "
            "under 100 W, 100 W above): it glows, then dims as the capacitors charge. If it stays bright, switch off: there is "
            f"a fault. {_then(record, rails)} Take the lamp out last."
        ),
        sources=(STAGED_PRACTICE, LAMP_PRACTICE),
    )


def _then(record, rails: str) -> str:
    if has_valves(record) or any(rail.kind == "dc" for rail in record.rails):
        return (f"Check the heater and bias rails first, then fit the rectifier and watch {rails} rise; only then fit the "
                "remaining valves or connect the load, one stage at a time.")
    return f"Watch {rails} rise with nothing connected; only then connect the load."


def _variac_steps(record, rails: str, voltages) -> list[Item]:
    stage = variac_input(record)
    device = "its variac" if stage.topology_name == "variac" else "a variac ahead of its isolating transformer"
    first = Item(
        key="staged-power-up", phase=Phase.POWER_UP, origin=Origin.BUILD, title=f"Staged first power-up from {device}",
        steps=(
            f"{_out_first(record)} Turn {device} right down and switch on. Bring the mains up in steps of a quarter, reading the input "
            f"current and each rail at every step (the readings below); stop and switch off at any step that reads high or low, "
            f"or where the current keeps rising. {_then(record, rails)}"
        ),
        sources=(STAGED_PRACTICE, VARIAC_PRACTICE),
    )
    direct = [found for found in voltages if found.kind == "dc"] or list(voltages)
    main = max(direct, key=lambda found: found.no_load, default=None)
    if main is None or record.mains is None:
        return [first]
    return [first] + [_step(record, main, voltages, share) for share in STEPS]


def _step(record, main, voltages, share: float) -> Item:
    mains = record.mains.nominal * share
    others = "; ".join(f"{found.name} about {fmt(found.no_load * _follows(found, share))}" for found in voltages if found is not main)
    return Item(
        key=f"variac-step-{round(share * 100)}", phase=Phase.POWER_UP, origin=Origin.BUILD,
        title=f"Variac at {round(share * 100)} % ({fmt(mains)}): rail {main.name}",
        steps=(
            f"With the mains at {fmt(mains)} and no load, read rail {main.name}: with no load it follows the mains, so about "
            f"{fmt(main.no_load * share)}." + (f" The other rails: {others}." if others else "")
        ),
        unit="V", expected=Expected(low=main.loaded * share, high=main.no_load * share),
        sources=(VARIAC_PRACTICE,),
        note="Range: the loaded voltage up to the no-load voltage, each scaled by the share of the mains.",
    )


def _follows(found, share: float) -> float:
    """A regulated rail holds its voltage once its regulator has headroom; shown at its own value."""
    return 1.0 if found.how == "regulated" else share


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
