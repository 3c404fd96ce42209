"""Stored energy and discharge: the energy of each rail's capacitors at the worst case, the time its bleeder takes
to bring it to a safe voltage, the bleeder's own dissipation and voltage, and the X capacitors at the plug.

  E = 1/2 C V^2                          energy in a capacitor charged to V
  t = R C ln(V0 / V_safe)                an RC discharge from V0 to V_safe
  P = V^2 / R                            the bleeder's dissipation at V
Limits: 60 V within 5 s for a bank above 60 V, unless it stores no more than 60 uC (IEC 60204-1, 6.2.4); the plug pins
at most 34 V one second after the plug is pulled, X capacitance up to 0.1 uF exempt (IEC 60335-1, 22.5); a resistor
at no more than half its power rating (common practice).
"""

from __future__ import annotations

import math

from dossier.calcs.rails import words
from dossier.calcs.rails.hazards import NAME, finding, hazardous
from dossier.calcs.shared import variac
from dossier.calcs.shared.finding_kit import banded, not_assessed
from dossier.calcs.shared.mains_lines import high_line_peak
from dossier.calcs.shared.rail_voltage import RailVoltage
from dossier.citations import ARRL_FILTERS, IEC_60204_1_RESIDUAL, IEC_60335_1_PLUG_DISCHARGE
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.units import Q_

SAFE_VOLTAGE = Q_(60, "V")
DISCHARGE_LIMIT = Q_(5, "s")
EXEMPT_CHARGE = Q_(60, "uC")
PLUG_SAFE_VOLTAGE = Q_(34, "V")
PLUG_LIMIT = Q_(1, "s")
EXEMPT_X_CAPACITANCE = Q_(0.1, "uF")
BLEEDER_DERATING = 0.5
RESISTOR_PRACTICE = common_practice(
    "a resistor run at no more than half its rated power, and within its limiting element voltage (the maker's "
    "figure; small film resistors are often 200-350 V), so it stays cool and does not arc over (from memory)")
X_POSITION = "across-line"


def energy(capacitance, voltage):
    return (0.5 * capacitance * voltage ** 2).to("J")


def discharge_time(resistance, capacitance, start, safe):
    """t = R C ln(V0 / V_safe); zero when it starts at or below the safe voltage."""
    if start <= safe:
        return Q_(0, "s")
    return (resistance * capacitance * math.log((start / safe).to("").magnitude)).to("s")


def rail_findings(record, found: RailVoltage) -> list[Finding]:
    rail = record.rails[found.index]
    if rail.kind != "dc" or not hazardous(found):
        return []
    key = ("rails", found.index)
    if rail.capacitance is None:
        return [not_assessed(NAME, "RAILS-DISCHARGE", found.name, f"Rail {found.name}: discharge after switch-off",
                             words.NO_CAPACITANCE, (key + ("capacitance",),), (IEC_60204_1_RESIDUAL,), guards_hazard=True)]
    return [_energy(found, rail), _discharge(found, rail)] + _bleeder(found, rail)


def _energy(found: RailVoltage, rail) -> Finding:
    joules = energy(rail.capacitance, found.worst)
    return finding(
        code="RAILS-ENERGY", subject=found.name, title=f"Rail {found.name}: stored energy", verdict=Verdict.INFO,
        values=(Measure("stored energy", joules),), extra=(Measure("capacitance", rail.capacitance), Measure("voltage", found.worst)),
        method="E = 1/2 C V^2 at the worst case", explanation=words.energy(found.name, joules),
        keys=(("rails", found.index, "capacitance"),) + found.keys, sources=(ARRL_FILTERS,),
    )


def _discharge(found: RailVoltage, rail) -> Finding:
    key = ("rails", found.index)
    title = f"Rail {found.name}: discharge after switch-off"
    charge = (rail.capacitance * found.worst).to("uC")
    common = dict(code="RAILS-DISCHARGE", subject=found.name, title=title, sources=(IEC_60204_1_RESIDUAL, ARRL_FILTERS), guards_hazard=True)
    if charge <= EXEMPT_CHARGE:
        return finding(**common, verdict=Verdict.PASS, values=(Measure("stored charge", charge),),
                       limit=Measure("exempt up to", EXEMPT_CHARGE), relation="<=", method="Q = C V",
                       explanation=words.exempt_charge(found.name, charge, EXEMPT_CHARGE), keys=(key + ("capacitance",),))
    if rail.bleeder is None:
        return finding(**common, verdict=Verdict.FAIL, values=(Measure("bleeder", "none declared"),),
                       limit=Measure(f"time to {SAFE_VOLTAGE:~P}", DISCHARGE_LIMIT), relation="<=",
                       method="t = R C ln(V0 / V_safe)", explanation=words.discharge(found.name, None, DISCHARGE_LIMIT, False),
                       keys=(key + ("bleeder",), key + ("capacitance",)))
    seconds = discharge_time(rail.bleeder, rail.capacitance, found.worst, SAFE_VOLTAGE)
    verdict = Verdict.PASS if seconds <= DISCHARGE_LIMIT else Verdict.FAIL
    return finding(**common, verdict=verdict, values=(Measure(f"time to {SAFE_VOLTAGE:~P}", seconds),),
                   limit=Measure("allowed", DISCHARGE_LIMIT), relation="<=", method="t = R C ln(V0 / V_safe), V0 the worst case",
                   explanation=words.discharge(found.name, seconds, DISCHARGE_LIMIT, True),
                   keys=(key + ("bleeder",), key + ("capacitance",)) + found.keys,
                   extra=(Measure("bleeder", rail.bleeder), Measure("capacitance", rail.capacitance), Measure("from", found.worst),
                          Measure("time constant", (rail.bleeder * rail.capacitance).to("s"))))


def _bleeder(found: RailVoltage, rail) -> list[Finding]:
    if rail.bleeder is None:
        return []
    key = ("rails", found.index)
    power = (found.worst ** 2 / rail.bleeder).to("W")
    rating = rail.bleeder_power_rating
    power_verdict = Verdict.NOT_ASSESSED if rating is None else banded(power, rating * BLEEDER_DERATING, rating, "<=")
    volts_rating = rail.bleeder_voltage_rating
    volts_verdict = Verdict.NOT_ASSESSED if volts_rating is None else (Verdict.PASS if found.worst <= volts_rating else Verdict.FAIL)
    return [
        finding(code="RAILS-BLEEDER", subject=f"{found.name} bleeder power", title=f"Rail {found.name}: bleeder dissipation",
                verdict=power_verdict, values=(Measure("dissipation", power),),
                limit=Measure("half the rating", rating * BLEEDER_DERATING) if rating is not None else None, relation="<=",
                method="P = V^2 / R at the worst case", explanation=words.bleeder_power(found.name, power, rating),
                keys=(key + ("bleeder_power_rating",), key + ("bleeder",)), sources=(RESISTOR_PRACTICE,), guards_hazard=True),
        finding(code="RAILS-BLEEDER", subject=f"{found.name} bleeder voltage", title=f"Rail {found.name}: bleeder voltage",
                verdict=volts_verdict, values=(Measure("voltage across it", found.worst),),
                limit=Measure("limiting element voltage", volts_rating) if volts_rating is not None else None, relation="<=",
                method="V_worst <= limiting element voltage", explanation=words.bleeder_voltage(found.name, found.worst, volts_rating),
                keys=(key + ("bleeder_voltage_rating",),), sources=(RESISTOR_PRACTICE,), guards_hazard=True),
    ]


# --- X capacitors at the plug ---------------------------------------------------------------------------

def x_capacitor_findings(record) -> list[Finding]:
    across = [(index, c) for index, c in enumerate(record.devices.capacitors) if c.position == X_POSITION]
    if record.mains is None or not across:
        return []
    keys = tuple(("devices", "capacitors", index, "capacitance") for index, _ in across)
    common = dict(code="RAILS-X-DISCHARGE", subject="X capacitors", title="X capacitors: discharge after unplugging",
                  sources=(IEC_60335_1_PLUG_DISCHARGE,), guards_hazard=True)
    if any(c.capacitance is None for _, c in across):
        why = "an X capacitor across the line gives no capacitance, so its charge at the plug pins is unknown: give devices.capacitors[].capacitance"
        # a charge left at the plug pins after unplugging, not a mains barrier or the mains protection: not blocking
        return [not_assessed(NAME, common["code"], common["subject"], common["title"], why, keys, common["sources"])]
    total = sum((c.capacitance for _, c in across), Q_(0, "uF")).to("uF")
    if total <= EXEMPT_X_CAPACITANCE:
        return [finding(**common, verdict=Verdict.PASS, values=(Measure("X capacitance", total),), limit=Measure("exempt up to", EXEMPT_X_CAPACITANCE),
                        relation="<=", method="sum of the capacitance across the line", explanation=words.x_exempt(total, EXEMPT_X_CAPACITANCE), keys=keys)]
    resistors = [c.discharge_resistor for _, c in across if c.discharge_resistor is not None]
    resistor_keys = tuple(("devices", "capacitors", index, "discharge_resistor") for index, _ in across)
    if not resistors:
        return [finding(**common, verdict=Verdict.FAIL, values=(Measure("X capacitance", total), Measure("discharge resistor", "none declared")),
                        limit=Measure(f"time to {PLUG_SAFE_VOLTAGE:~P}", PLUG_LIMIT), relation="<=", method="t = R C ln(V_peak / 34 V)",
                        explanation=words.x_discharge(total, None, None, PLUG_LIMIT), keys=resistor_keys + keys)]
    resistor = _parallel(resistors)
    raised = [c.ref for _, c in across if variac.part_high_line(record, c.ref)[1]]
    peak = (variac.fed_voltage(record)[1] * math.sqrt(2)).to("V") if raised else high_line_peak(record.mains)
    seconds = discharge_time(resistor, total, peak, PLUG_SAFE_VOLTAGE)
    verdict = Verdict.PASS if seconds <= PLUG_LIMIT else Verdict.FAIL
    explanation = words.x_discharge(total, seconds, resistor, PLUG_LIMIT)
    if raised:
        explanation += " " + words.x_behind_variac(raised, record.protection.variac.ref, peak)
        common["sources"] += (variac.VARIAC_PRACTICE,)
    return [finding(**common, verdict=verdict, values=(Measure(f"time to {PLUG_SAFE_VOLTAGE:~P}", seconds),), limit=Measure("allowed", PLUG_LIMIT),
                    relation="<=", method="t = R C ln(V_peak,high / 34 V), the plug pulled at the crest of the highest mains (a variac's top of scale behind it)",
                    explanation=explanation, keys=resistor_keys + keys + ((variac.VARIAC_KEY,) if raised else ()),
                    extra=(Measure("X capacitance", total), Measure("discharge resistance", resistor), Measure("from", peak)))]


def _parallel(resistors):
    """Resistors declared on several X capacitors all sit across the same line: in parallel."""
    return 1 / sum(1 / r for r in resistors)
