"""The highest voltage a declared rail reaches: no load, at the top of the mains tolerance.

V_worst = V_no-load x V_high / V_nominal, where V_no-load is the declared no-load voltage, or the loaded voltage
raised by the declared regulation, or by an assumed 25 % (the harsher reading). A rail delivered by a regulator
stage holds its voltage: its worst case is its declared voltage.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from dossier.findings import Source, common_practice
from dossier.units import Q_

# A small mains transformer's secondary at no load over its rated (full-load) voltage: regulation of about 5 % for
# large toroids to 25 % for small EI parts, the smaller the worse; the top is assumed (common practice, from memory).
NO_LOAD_RISE = Q_(0.25)
NO_LOAD_PRACTICE = common_practice(
    "a small mains transformer's no-load secondary voltage is about 5-25 % above its rated full-load voltage, the "
    "smaller the transformer the higher; 25 % is assumed when the record gives only the loaded voltage (from memory)")
REGULATED_TOPOLOGIES = ("series-pass", "shunt", "switching")


@dataclass(frozen=True)
class RailVoltage:
    """One rail's voltages: as declared (loaded, nominal line), at no load (nominal line) and at the worst case.

    how    'declared', 'regulation', 'assumed' or 'regulated': where the no-load figure came from
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

    @property
    def rise(self):
        return (self.no_load / self.loaded).to("") - 1


def rail_voltage(record, index: int) -> RailVoltage:
    rail = record.rails[index]
    key = ("rails", index)
    if _regulated(record, rail):
        return RailVoltage(rail.name, index, rail.kind, rail.voltage, rail.voltage, rail.voltage,
                           "V_worst = V (held by its regulator)", "regulated", (key + ("voltage",), key + ("stage",)))
    no_load, formula, how, keys, sources = _no_load(rail, key)
    worst, formula = _at_high_line(record, no_load, formula)
    return RailVoltage(rail.name, index, rail.kind, rail.voltage, no_load, worst, formula, how, keys, sources)


def _regulated(record, rail) -> bool:
    found = record.stage_by_id(rail.stage)
    return found is not None and found[1].kind == "regulator" and found[1].topology_name in REGULATED_TOPOLOGIES


def _no_load(rail, key):
    if rail.no_load_voltage is not None:
        return rail.no_load_voltage, "V_no-load declared", "declared", (key + ("no_load_voltage",),), ()
    if rail.regulation is not None:
        rise = rail.regulation.to("").magnitude
        return rail.voltage * (1 + rise), "V_no-load = V x (1 + regulation)", "regulation", (key + ("regulation",),), ()
    return (rail.voltage * (1 + NO_LOAD_RISE.magnitude), "V_no-load = V x (1 + 25 %, assumed)", "assumed",
            (key + ("no_load_voltage",), key + ("regulation",)), (NO_LOAD_PRACTICE,))


def _at_high_line(record, voltage, formula: str):
    mains = record.mains
    if mains is None:
        return voltage, formula
    return voltage * (mains.high / mains.nominal).to("").magnitude, f"V_worst = V_no-load x V_high / V_nominal; {formula}"


def rail_voltages(record) -> list[RailVoltage]:
    return [rail_voltage(record, index) for index in range(len(record.rails))]
