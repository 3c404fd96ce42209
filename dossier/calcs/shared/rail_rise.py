"""A rail's no-load voltage worked out from the transformer winding that feeds it (shared/regulation.py has the
formulas): the winding named by the rail's `winding` key, or the one secondary of the transformer above it.

The no-load voltage is the higher of the regulation model's peak and the winding's own no-load peak from the turns
ratio (the harsher of the two; diode and valve drops are left out, which also reads harsher).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from dossier.calcs.shared.winding_figures import winding_figures
from dossier.calcs.shared.winding_voltages import reference_winding
from dossier.calcs.shared import regulation as r
from dossier.calcs.shared.stage_graph import between, rectifier_of, upstream
from dossier.citations import ARRL_FILTERS, SCHADE_RECTIFIER, TRANSFORMER_REGULATION
from dossier.findings import Measure
from dossier.record.rails import split_winding
from dossier.units import Q_, fmt

POWER_ROLES = ("mains-transformer", "transformer")
SOURCE_LABEL = "source resistance R_s (hot)"
ANGLE_LABEL = "half conduction angle"


@dataclass(frozen=True)
class WindingRise:
    """A rail's no-load voltage from its winding, with how it was found."""

    no_load: object
    formula: str
    basis: str
    keys: tuple
    sources: tuple
    measures: tuple = field(default=())


@dataclass(frozen=True)
class _Feed:
    primary: r.WindingFigures
    secondary: r.WindingFigures
    how: str


def winding_rise(record, index: int, figures=None) -> WindingRise | None:
    """The rail's no-load voltage from its winding's resistances; None when the winding, its resistances or the rail's
    current are not known (the caller then takes the harsher assumed rise)."""
    rail = record.rails[index]
    figures = winding_figures(record) if figures is None else figures
    feed = _feed(record, rail, figures)
    if rail.current is None or feed is None or None in (feed.primary.resistance, feed.secondary.resistance):
        return None
    current = _winding_load(record, feed, figures)
    if current is None:
        return None
    if rail.kind == "ac":
        return _ac(rail, index, feed, current)
    source = rectifier_of(record, rail.stage)
    if source is None or source[1].topology_name not in r.PULSES:
        return None
    return _dc(record, rail, index, feed, current, source, figures)


# --- which winding --------------------------------------------------------------------------------------

def _feed(record, rail, figures) -> _Feed | None:
    if rail.winding is not None:
        ref, name = split_winding(rail.winding)
        secondary = next((f for f in figures if f.ref == ref and f.name == name), None)
        how = f"rails[].winding names {rail.winding}"
    else:
        secondary = _sole_secondary(record, rail, figures)
        how = "the one secondary of the transformer above the rail"
    if secondary is None:
        return None
    magnetic = record.magnetics[secondary.magnetic]
    primary_name = reference_winding(magnetic)
    primary = next((f for f in figures if f.magnetic == secondary.magnetic and f.name == primary_name), None)
    return None if primary is None or primary is secondary else _Feed(primary, secondary, how)


def _sole_secondary(record, rail, figures):
    refs = {part.ref for _, stage in upstream(record, rail.stage) for part in stage.parts}
    transformers = [m for m in record.magnetics if m.ref in refs and m.role in POWER_ROLES]
    if len(transformers) != 1:
        return None
    secondaries = [f for f in figures if f.ref == transformers[0].ref and f.role == "secondary"]
    return secondaries[0] if len(secondaries) == 1 else None


def _winding_load(record, feed: _Feed, figures):
    """The current of every rail the same winding feeds, summed (None when one of them gives none)."""
    total = Q_(0, "A")
    for rail in record.rails:
        found = _feed(record, rail, figures)
        if found is not None and found.secondary == feed.secondary:
            if rail.current is None:
                return None
            total = total + rail.current
    return total.to("A")


# --- the models -----------------------------------------------------------------------------------------

def _ac(rail, index, feed, current) -> WindingRise:
    source = r.referred_resistance(feed.primary, feed.secondary, half=False)
    regulated = rail.voltage + (current * source).to("V")
    turns = feed.secondary.peak / math.sqrt(2) if feed.secondary.peak is not None else None
    no_load, basis = _harsher(regulated, turns, feed, f"I R_s = {fmt(current)} x {fmt(source)}")
    return WindingRise(no_load, "V_no-load = V + I R_s, R_s = R_p (N_s / N_p)^2 + R_s (hot); or the winding's RMS from the turns, the higher",
                       basis, _keys(rail, index, feed), (TRANSFORMER_REGULATION,), _measures(source, current, turns))


def _dc(record, rail, index, feed, current, source_stage, figures) -> WindingRise:
    topology = source_stage[1].topology_name
    half = topology in r.HALF_OF_WINDING
    resistance = r.referred_resistance(feed.primary, feed.secondary, half=half)
    filters = between(record, rail.stage, source_stage[1].id)
    choke = _choke_resistance(record, filters, figures)
    reservoir = rail.voltage + (rail.current * choke).to("V")
    if any(stage.kind == "filter" and stage.topology_name == "choke-input" for _, stage in filters):
        peak = r.choke_input_peak(reservoir, current, resistance)
        model = "choke-input: V_pk = (pi / 2)(V_dc + I R_s), reached with no load (harsher)"
        sources = (TRANSFORMER_REGULATION, ARRL_FILTERS)
        theta = None
    else:
        ripple = _ripple(record, rail, current, topology)
        peak, theta = r.capacitor_input_peak(reservoir, current, resistance, r.PULSES[topology], ripple)
        model = f"capacitor-input ({topology}, n = {r.PULSES[topology]:g}): tan theta - theta = pi R_s / (n R_L), V_pk = (V_dc + V_r / 2) / cos theta"
        sources = (TRANSFORMER_REGULATION, SCHADE_RECTIFIER)
    turns = _turns_peak(feed.secondary, half, topology)
    no_load, basis = _harsher(peak, turns, feed, model)
    measures = _measures(resistance, current, turns) + ((Measure(ANGLE_LABEL, Q_(math.degrees(theta), "degree")),) if theta else ())
    measures += (Measure("choke resistance (hot)", choke),) if choke.magnitude else ()
    return WindingRise(no_load, f"V_no-load = V_pk, {model}; or the winding's no-load peak from the turns, the higher",
                       basis, _keys(rail, index, feed), sources, measures)


def _turns_peak(secondary, half: bool, topology: str):
    if secondary.peak is None:
        return None
    return secondary.peak * (0.5 if half else 1.0) * (2 if topology == "doubler" else 1)


def _ripple(record, rail, current, topology):
    if rail.capacitance is None or record.mains is None:
        return None
    return (current / (max(r.PULSES[topology], 1.0) * record.mains.frequency * rail.capacitance)).to("V")


def _choke_resistance(record, filters, figures):
    """Hot DC resistance of the chokes declared under magnetics whose designators sit in the rail's filters."""
    refs = {part.ref for _, stage in filters for part in stage.parts}
    chokes = [f for f in figures if f.ref in refs and record.magnetics[f.magnetic].role == "choke" and f.position == 0]
    return sum((f.resistance for f in chokes if f.resistance is not None), Q_(0, "ohm"))


def _harsher(modelled, turns, feed, how: str):
    if turns is not None and turns > modelled:
        return turns.to("V"), f"the winding's no-load peak from the turns ({fmt(turns)}) is above the regulation model's ({fmt(modelled)}, {how}); {feed.how}"
    return modelled.to("V"), f"{how}; {feed.how}"


def _measures(source, current, turns) -> tuple:
    found = (Measure(SOURCE_LABEL, source), Measure("winding load current", current))
    return found + ((Measure("no-load from the turns", turns),) if turns is not None else ())


def _keys(rail, index, feed) -> tuple:
    return (("rails", index, "winding"), ("rails", index, "current"), feed.secondary.key + ("wire",), feed.primary.key + ("wire",),
            ("rails", index, "no_load_voltage"), ("rails", index, "regulation"))
