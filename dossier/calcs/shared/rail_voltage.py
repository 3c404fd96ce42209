"""The highest voltage a declared rail reaches: no load, at the top of the mains tolerance.

V_worst = V_no-load x V_high / V_nominal, where V_no-load is the declared no-load voltage, or the loaded voltage
raised by the declared regulation, or worked out from the resistances of the transformer winding that feeds it
(shared/rail_rise.py), or raised by an assumed 25 % (the harsher reading; a choke-input filter's rise to the peak,
pi / 2 - 1, where that is higher). A rail delivered by a regulator stage holds its voltage: its worst case is its
declared voltage.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import math

from dossier.calcs.shared.winding_figures import winding_figures
from dossier.calcs.shared.rail_rise import winding_rise
from dossier.calcs.shared.stage_graph import between, rectifier_of
from dossier.citations import ARRL_FILTERS
from dossier.findings import Source, common_practice
from dossier.units import Q_

# A small mains transformer's secondary at no load over its rated (full-load) voltage: regulation of about 5 % for
# large toroids to 25 % for small EI parts, the smaller the worse; the top is assumed (common practice, from memory).
NO_LOAD_RISE = Q_(0.25)
NO_LOAD_PRACTICE = common_practice(
    "a small mains transformer's no-load secondary voltage is about 5-25 % above its rated full-load voltage, the "
    "smaller the transformer the higher; 25 % is assumed when the record gives only the loaded voltage (from memory)")
REGULATED_TOPOLOGIES = ("series-pass", "shunt", "switching")
CHOKE_INPUT_PEAK = math.pi / 2  # V_pk over a choke-input filter's loaded 2 V_pk / pi


@dataclass(frozen=True)
class RailVoltage:
    """One rail's voltages: as declared (loaded, nominal line), at no load (nominal line) and at the worst case.

    how    'declared', 'regulation', 'windings', 'assumed', 'choke-peak' or 'regulated': where the no-load figure came from
    measures  the figures a computed rise was worked out from (source resistance, load current, ...)
    keys   the record keys the figures came from
    """

    name: str
    index: int
    kind: str
    loaded: object
    no_load: object
    worst: object
    formula: str
    how: str
    keys: tuple
    sources: tuple[Source, ...] = field(default=())
    basis: str = ""
    measures: tuple = field(default=())

    @property
    def rise(self):
        return (self.no_load / self.loaded).to("") - 1


def rail_voltage(record, index: int, figures=None) -> RailVoltage:
    rail = record.rails[index]
    key = ("rails", index)
    if _regulated(record, rail):
        return RailVoltage(rail.name, index, rail.kind, rail.voltage, rail.voltage, rail.voltage,
                           "V_worst = V (held by its regulator)", "regulated", (key + ("voltage",), key + ("stage",)))
    declared = _declared(rail, key)
    if declared is not None:
        no_load, formula, how, keys, sources = declared
        basis, measures = "", ()
    else:
        no_load, formula, how, keys, sources, basis, measures = _worked_out(record, index, key, figures)
    worst, formula = _at_high_line(record, no_load, formula)
    return RailVoltage(rail.name, index, rail.kind, rail.voltage, no_load, worst, formula, how, keys, sources, basis, measures)


def _regulated(record, rail) -> bool:
    found = record.stage_by_id(rail.stage)
    return found is not None and found[1].kind == "regulator" and found[1].topology_name in REGULATED_TOPOLOGIES


def _declared(rail, key):
    if rail.no_load_voltage is not None:
        return rail.no_load_voltage, "V_no-load declared", "declared", (key + ("no_load_voltage",),), ()
    if rail.regulation is not None:
        rise = rail.regulation.to("").magnitude
        return rail.voltage * (1 + rise), "V_no-load = V x (1 + regulation)", "regulation", (key + ("regulation",),), ()
    return None


def _worked_out(record, index, key, figures):
    """From the winding's resistances; else the assumed rise (a choke-input filter's rise to the peak if higher)."""
    found = winding_rise(record, index, figures)
    if found is not None:
        return found.no_load, found.formula, "windings", found.keys, found.sources, found.basis, found.measures
    rail = record.rails[index]
    keys = (key + ("no_load_voltage",), key + ("regulation",), key + ("winding",))
    if _choke_input(record, rail):
        return (rail.voltage * CHOKE_INPUT_PEAK, "V_no-load = V x pi / 2 (a choke-input filter rises to the peak with no load)", "choke-peak",
                keys, (ARRL_FILTERS,), "", ())
    return (rail.voltage * (1 + NO_LOAD_RISE.magnitude), "V_no-load = V x (1 + 25 %, assumed)", "assumed",
            keys, (NO_LOAD_PRACTICE,), "", ())


def _choke_input(record, rail) -> bool:
    source = rectifier_of(record, rail.stage)
    if rail.kind != "dc" or source is None:
        return False
    return any(stage.kind == "filter" and stage.topology_name == "choke-input" for _, stage in between(record, rail.stage, source[1].id))


def _at_high_line(record, voltage, formula: str):
    mains = record.mains
    if mains is None:
        return voltage, formula
    return voltage * (mains.high / mains.nominal).to("").magnitude, f"V_worst = V_no-load x V_high / V_nominal; {formula}"


def rail_voltages(record) -> list[RailVoltage]:
    figures = winding_figures(record) if record.magnetics else ()
    return [rail_voltage(record, index, figures) for index in range(len(record.rails))]
