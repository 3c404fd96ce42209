"""A rectifier valve's maker ratings against what its stage puts on it.

  peak inverse voltage   PIV = k x V_out at the worst case (k by topology, as for the rectifier finding)
  peak anode current     I_pk = V_pk (1 - cos theta) / R_s at high line, the capacitor-input model of shared/regulation.py with the
                         winding's source resistance (the valve's own resistance left out: the harsher reading)
  reservoir              the capacitance straight after the valve against the largest the maker allows: the bulk
                         capacitors declared in the rectifier stage or before the first choke of a capacitor-input
                         or CLC filter straight after it, else the rail's whole capacitance (harsher)
"""

from __future__ import annotations

import math

from dossier.calcs.rails import words
from dossier.calcs.rails.hazards import NAME, finding
from dossier.calcs.shared.finding_kit import not_assessed
from dossier.calcs.shared.rail_rise import ANGLE_LABEL, SOURCE_LABEL
from dossier.calcs.shared.stage_graph import between
from dossier.citations import SCHADE_RECTIFIER, VALVE_RECTIFIER_RATINGS
from dossier.findings import Measure, Verdict, judge
from dossier.units import Q_

VALVE_PARTS = ("valve", "tube")
CHOKE_PARTS = ("choke", "inductor")
CLOSE = 0.1  # within 10 % of a maximum rating: marginal (common practice)


def valves_in(record, stage):
    """(index, valve) of each rectifier valve with ratings declared whose designator is a part of the stage."""
    refs = {part.ref for part in stage.parts if part.kind.lower() in VALVE_PARTS}
    return [(index, valve) for index, valve in enumerate(record.devices.valves) if valve.ref in refs]


def valve_findings(record, stage_index: int, stage, rail, piv) -> list:
    out = []
    for index, valve in valves_in(record, stage):
        key = ("devices", "valves", index)
        out += _piv(valve, key, piv, rail) + _reservoir(record, stage, valve, key, rail) + _peak_current(valve, key, rail)
    return out


def _rated(valve, what: str, value, rating, method: str, keys: tuple, sources: tuple, extra=(), note: str = ""):
    title = f"{valve.ref} {what}"
    return finding(code="RAILS-VALVE", subject=title, title=title, verdict=judge(value, rating, "<=", CLOSE),
                   values=(Measure(what, value),), limit=Measure(f"maker's maximum {what}", rating), relation="<=", method=method,
                   explanation=f"{words.valve_rating(valve.ref, what, value, rating)} {note}".strip(), keys=keys, sources=sources, extra=tuple(extra))


def _piv(valve, key, piv, rail) -> list:
    if valve.peak_inverse_voltage is None:
        return []
    return [_rated(valve, "peak inverse voltage", piv, valve.peak_inverse_voltage, "PIV = k x V_out (worst case)",
                   (key + ("peak_inverse_voltage",),) + rail.keys, (VALVE_RECTIFIER_RATINGS,) + rail.sources)]


def _reservoir(record, stage, valve, key, rail) -> list:
    if valve.max_reservoir is None:
        return []
    refs = _reservoir_refs(record, stage, rail)
    bulk = [(i, c) for i, c in enumerate(record.devices.capacitors) if c.ref in refs and c.position == "bulk" and c.capacitance is not None]
    if bulk:
        capacitance = sum((c.capacitance / c.in_series for _, c in bulk), Q_(0, "uF"))
        keys = tuple(("devices", "capacitors", i, "capacitance") for i, _ in bulk)
        basis = words.RESERVOIR_DECLARED
    elif record.rails[rail.index].capacitance is not None:
        capacitance, keys, basis = record.rails[rail.index].capacitance, (("rails", rail.index, "capacitance"),), words.RESERVOIR_RAIL
    else:
        return [not_assessed(NAME, "RAILS-VALVE", f"{valve.ref} reservoir", f"{valve.ref} reservoir", words.NO_RESERVOIR,
                             (("rails", rail.index, "capacitance"),), (VALVE_RECTIFIER_RATINGS,))]
    return [_rated(valve, "reservoir capacitance", capacitance.to("uF"), valve.max_reservoir, "C_reservoir <= C_max",
                   (key + ("max_reservoir",),) + keys, (VALVE_RECTIFIER_RATINGS,), note=basis)]


def _reservoir_refs(record, stage, rail) -> set:
    """The parts that can be the reservoir: the rectifier stage's, and a capacitor-input or CLC filter's straight after
    it up to its first choke."""
    refs = {part.ref for part in stage.parts}
    path = between(record, record.rails[rail.index].stage, stage.id)
    if path and path[-1][1].kind == "filter" and path[-1][1].topology_name in ("capacitor-input", "clc"):
        for part in path[-1][1].parts:
            if part.kind.lower() in CHOKE_PARTS:
                break
            refs.add(part.ref)
    return refs


def _peak_current(valve, key, rail) -> list:
    if valve.peak_current is None:
        return []
    measures = {m.label: m.quantity for m in rail.measures}
    if SOURCE_LABEL not in measures or ANGLE_LABEL not in measures:
        return [not_assessed(NAME, "RAILS-VALVE", f"{valve.ref} peak current", f"{valve.ref} peak current", words.NO_PEAK_CURRENT,
                             (("rails", rail.index, "winding"), ("rails", rail.index, "current")), (VALVE_RECTIFIER_RATINGS, SCHADE_RECTIFIER))]
    theta = math.radians(measures[ANGLE_LABEL].to("degree").magnitude)
    current = (rail.worst * (1 - math.cos(theta)) / measures[SOURCE_LABEL]).to("mA")
    return [_rated(valve, "peak current", current, valve.peak_current, "I_pk = V_pk (1 - cos theta) / R_s",
                   (key + ("peak_current",),) + rail.keys, (VALVE_RECTIFIER_RATINGS, SCHADE_RECTIFIER),
                   extra=(Measure(SOURCE_LABEL, measures[SOURCE_LABEL]), Measure(ANGLE_LABEL, measures[ANGLE_LABEL])))]
