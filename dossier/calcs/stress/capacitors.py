"""Capacitors: the voltage each holds at the worst case (high line, no load), its share of a series string,
and, for X and Y capacitors, the nominal supply against their rated voltage and the class their position needs.

Series string of n equal capacitors with a resistor R across each: the worst share falls on the one that leaks
nothing while the others leak I_leak each, V_max = V/n + (n-1)/n x R x I_leak (Kirchhoff's laws; the balancing
section of makers' aluminium electrolytic application guides). With no leakage figure the makers' usual limit
0.01 x C x V_R (at 20 degC) is taken. With no resistors the share is set by leakage alone, so the harsher reading
puts the whole string on one capacitor; a half-bridge's split pair, held at its midpoint by the converter, at best
marginal. A capacitor in a stage that delivers a declared rail holds that rail at its worst case (shared.rail_voltage).
"""

from __future__ import annotations

from dataclasses import replace

from dossier.calcs.shared import safety_class
from dossier.calcs.shared.finding_kit import not_assessed
from dossier.calcs.shared.margins import margin
from dossier.calcs.shared.rail_voltage import rail_voltage
from dossier.calcs.shared.stage_graph import rectifier_of
from dossier.calcs.stress import words
from dossier.calcs.stress.judging import finding, rating_finding
from dossier.calcs.shared.stage_graph import stage_of
from dossier.calcs.stress.voltages import Rail, Voltages
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.citations import ARRL_FILTERS, IEC_60384_14, MOHAN_POWER_ELECTRONICS
from dossier.units import Q_

AC_POSITIONS = ("across-line", "line-to-earth", "across-barrier")
LEAKAGE_PER_CV = Q_(0.01, "1/s")  # I_leak <= 0.01 C V_R (0.01 uA per uF and volt), or 3 uA, whichever is greater
LEAKAGE_FLOOR = Q_(3, "uA")
SERIES_PRACTICE = common_practice(
    "series capacitors share by leakage unless each has a balancing resistor; worst share V/n + (n-1)/n R I_leak; "
    "aluminium electrolytic leakage at most 0.01 C V_R or 3 uA at 20 degC (makers' application guides, e.g. "
    "Cornell Dubilier, Aluminum Electrolytic Capacitor Application Guide; from memory)")
# A doubler capacitor's share of the doubler's no-load output (The ARRL Handbook, power supplies chapter: voltage
# multipliers); not given: the whole output, the harsher reading.
DOUBLER_SHARE = {"full-wave": 0.5, "half-wave-input": 0.5, "half-wave-output": 1.0}
DOUBLER_FORMULA = {"full-wave": "V_out / 2 (full-wave doubler: each at V_pk)", "half-wave-input": "V_out / 2 (half-wave doubler's input capacitor: V_pk)",
                   "half-wave-output": "V_out (half-wave doubler's output capacitor: 2 V_pk)", None: "V_out (position in the doubler not given: the harsher reading)"}
RATED_VOLTAGE_SOURCE = replace(IEC_60384_14, edition="edition 4.0, 2013, with amendment 1, 2016", clause=(
    "rated voltage: the r.m.s. voltage of the supply, at its nominal value, the capacitor may be connected to "
    "(definition clause; the clause number and wording from memory)"))


def capacitor_findings(voltages: Voltages, index: int, capacitor) -> list[Finding]:
    if capacitor.position in AC_POSITIONS:
        return _ac_capacitor(voltages, index, capacitor) + _safety_class(voltages.record, index, capacitor)
    return _dc_capacitor(voltages, index, capacitor)


# --- DC capacitors ---------------------------------------------------------------------------------

def _dc_capacitor(voltages: Voltages, index: int, capacitor) -> list[Finding]:
    key = ("devices", "capacitors", index, "voltage_rating")
    title = f"{capacitor.ref} voltage rating"
    found = stage_of(voltages.record, capacitor.ref)
    if capacitor.doubler is not None or (found is not None and _doubles(found[1])):
        return _doubler_capacitor(voltages, index, capacitor, found, key, title)
    string = _string_rail(voltages, index, capacitor)
    if string is None:
        return [_not_assessed(capacitor.ref, title, words.unknown_position(capacitor.position), ("devices", "capacitors", index, "position"))]
    count = 2 if capacitor.position == "split" else capacitor.in_series
    share, doubts, extra = _share(capacitor, string, count)
    chosen = margin(voltages.record, "capacitor_voltage")
    sources = (MOHAN_POWER_ELECTRONICS, SERIES_PRACTICE) if count > 1 else ()
    keys = (("devices", "capacitors", index),) if count > 1 else ()
    return [rating_finding("STRESS-CAPACITOR", capacitor.ref, title, capacitor.voltage_rating, share, chosen,
                           "peak voltage at high line, no load", key, sources, doubts=doubts, extra=extra, keys=keys)]


# --- voltage doublers ------------------------------------------------------------------------------

def _doubles(stage) -> bool:
    return stage.kind in ("rectifier", "mains-input") and stage.topology_name == "doubler"


def _doubler_capacitor(voltages: Voltages, index: int, capacitor, found, key, title) -> list[Finding]:
    """A doubler's capacitor holds its share of the output, set by the circuit (each is charged through its own
    diode), not by leakage: full-wave each V_out / 2; half-wave the input V_out / 2 and the output V_out."""
    output = _doubler_output(voltages, found)
    if output is None:
        return [_not_assessed(capacitor.ref, title, words.NO_DOUBLER_OUTPUT, ("rails",))]
    share = DOUBLER_SHARE.get(capacitor.doubler, 1.0)
    rail = replace(output, voltage=output.voltage * share,
                   formula=f"V_C = {DOUBLER_FORMULA[capacitor.doubler]}; {output.formula}",
                   basis=f"{output.basis}; {words.doubler_share(capacitor.doubler)}")
    doubler_key = ("devices", "capacitors", index, "doubler")
    return [rating_finding("STRESS-CAPACITOR", capacitor.ref, title, capacitor.voltage_rating, rail, margin(voltages.record, "capacitor_voltage"),
                           "peak voltage at high line, no load", key, (ARRL_FILTERS,), keys=(doubler_key,),
                           extra=(Measure("doubler output, no load, high line", output.voltage), Measure("doubler position", capacitor.doubler or "not given: the whole output")))]


def _doubler_output(voltages: Voltages, found) -> Rail | None:
    """The doubler's output at no load and high line: its declared rail's worst case, else twice the winding's peak
    (twice the mains crest for a doubler on the mains)."""
    if found is None:
        return None
    rail = _declared_rail(voltages.record, found[1])
    if rail is not None:
        return rail
    if found[1].side == "mains":
        peak = voltages.line_peak()
        return None if peak is None else replace(peak, voltage=2 * peak.voltage, formula=f"V_out = 2 x V_pk (doubler); {peak.formula}")
    return voltages.rectified("doubler")


def _string_rail(voltages: Voltages, index: int, capacitor) -> Rail | None:
    """The voltage across the whole string this capacitor is part of, at high line and no load."""
    if capacitor.no_load_voltage is not None and voltages.record.mains is not None:
        mains = voltages.record.mains
        high = capacitor.no_load_voltage * (mains.high / mains.nominal).to("").magnitude
        return Rail(high, "V = declared no-load voltage x V_high / V_nominal", "declared no-load voltage carried to high line",
                    ("devices", "capacitors", index, "no_load_voltage"))
    found = stage_of(voltages.record, capacitor.ref)
    rail = _declared_rail(voltages.record, found[1]) if found and capacitor.position in ("bulk", "output") else None
    if rail is not None:
        return rail
    supply = voltages.supply_of(found[0]) if found else None
    if capacitor.position == "split":
        return supply
    if capacitor.position == "output" and (found is None or found[1].kind not in ("rectifier", "mains-input")):
        return voltages.output_rail()
    return supply if capacitor.position in ("bulk", "output") else None


def _declared_rail(record, stage) -> Rail | None:
    """The highest DC rail the capacitor's stage delivers, at its worst case (shared.rail_voltage)."""
    delivered = [found for found in (rail_voltage(record, index) for index, rail in enumerate(record.rails) if rail.kind == "dc" and _holds(record, rail, stage))
                 if found.how != "regulated" or record.rails[found.index].stage == stage.id]
    if not delivered:
        return None
    worst = max(delivered, key=lambda found: found.worst)
    return Rail(worst.worst, worst.formula, f"rail '{worst.name}' at no load and high line", worst.keys[0],
                notes=("rail-rise",) if worst.how in ("assumed", "choke-peak", "windings") else (), sources=worst.sources)


def _holds(record, rail, stage) -> bool:
    """The rail is delivered by the stage, or by a stage fed from it through no other rectifier."""
    source = rectifier_of(record, rail.stage)
    return rail.stage == stage.id or (source is not None and source[1].id == stage.id)


def _share(capacitor, string: Rail, count: int):
    """(this capacitor's rail, sentences that hold a pass at marginal, measures) for a string of count."""
    if count == 1:
        return string, (), ()
    ideal = string.voltage / count
    measures = (Measure("voltage across the string", string.voltage), Measure("capacitors in series", count),
                Measure("equal share", ideal))
    formula = f"V_C = V / {count} + ({count}-1)/{count} x R x I_leak"
    if capacitor.balancing_resistor is None and capacitor.position == "split":
        return replace(string, voltage=ideal, formula=f"V_C = V / {count} (no balancing: unbounded); {string.formula}"), (words.series_unbalanced(count),), measures
    if capacitor.balancing_resistor is None:
        basis = f"{string.basis}; {words.series_whole(count)}"
        return replace(string, formula=f"V_C = V (no balancing: the whole string on one); {string.formula}", basis=basis), (), measures
    leakage = _leakage(capacitor)
    if leakage is None:
        return replace(string, voltage=ideal, formula=f"{formula}; {string.formula}"), (words.series_no_leakage(count),), measures
    worst = ideal + (count - 1) / count * (capacitor.balancing_resistor * leakage).to("V")
    measures += (Measure("balancing resistor", capacitor.balancing_resistor), Measure("leakage", leakage))
    note = words.series_share(count, capacitor.balancing_resistor, leakage, capacitor.leakage is None)
    return replace(string, voltage=worst, formula=f"{formula}; {string.formula}", basis=f"{string.basis}; {note}"), (), measures


def _leakage(capacitor):
    if capacitor.leakage is not None:
        return capacitor.leakage
    if capacitor.capacitance is None:
        return None
    return max((LEAKAGE_PER_CV * capacitor.capacitance * capacitor.voltage_rating).to("uA"), LEAKAGE_FLOOR)


def _not_assessed(subject, title, why, key) -> Finding:
    return not_assessed("stress", "STRESS-CAPACITOR", subject, title, why, (key,), (IEC_60384_14,))


# --- X and Y capacitors ----------------------------------------------------------------------------

def _ac_capacitor(voltages: Voltages, index: int, capacitor) -> list[Finding]:
    key = ("devices", "capacitors", index, "voltage_rating")
    title = f"{capacitor.ref} voltage rating"
    rail = _nominal_rail(voltages, capacitor)
    if rail is None:
        return [_not_assessed(capacitor.ref, title, words.NO_MAINS, key)]
    verdict = Verdict.PASS if capacitor.voltage_rating >= rail.voltage else Verdict.FAIL
    return [finding(
        code="STRESS-CAPACITOR", subject=capacitor.ref, title=title, verdict=verdict,
        values=(Measure("rated AC voltage", capacitor.voltage_rating),),
        limit=Measure(rail.basis, rail.voltage),
        method=f"V_R (AC RMS) >= {rail.formula}",
        explanation=words.ac_capacitor(rail),
        keys=(key, rail.key), sources=(RATED_VOLTAGE_SOURCE,),
    )]


def _nominal_rail(voltages: Voltages, capacitor) -> Rail | None:
    record = voltages.record
    if capacitor.position == "across-barrier":
        for number, barrier in enumerate(record.barriers):
            if capacitor.ref in barrier.parts and barrier.working_voltage is not None:
                return Rail(barrier.working_voltage, "V = declared working voltage of the barrier", f"working voltage of barrier '{barrier.name}'", ("barriers", number, "working_voltage"))
    if record.mains is None:
        return None
    return Rail(record.mains.nominal, "V = nominal mains RMS", "nominal mains RMS", ("mains", "nominal"))


def _safety_class(record, index: int, capacitor) -> list[Finding]:
    key = ("devices", "capacitors", index, "safety_class")
    requirement = _requirement(record, capacitor)
    if requirement is None:
        return []
    given = capacitor.safety_class
    verdict = Verdict.PASS if given in requirement.accepted else Verdict.FAIL
    return [finding(
        code="STRESS-SAFETY-CLASS", subject=capacitor.ref, title=f"{capacitor.ref} safety class for its position", verdict=verdict,
        values=(Measure("class", given or "none given"),),
        limit=Measure("accepted classes", ", ".join(requirement.accepted)), relation="in",
        method="class tested for the position's impulse and insulation grade",
        explanation=words.safety_class(capacitor, requirement, verdict),
        keys=(key,), sources=requirement.sources,
    )]


def _requirement(record, capacitor):
    if record.mains is None:
        return None
    nominal = float(record.mains.nominal.to("V").magnitude)
    if capacitor.position == "across-line":
        return safety_class.across_line(nominal, record.mains.overvoltage_category)
    if capacitor.position == "line-to-earth":
        return safety_class.bridging("basic", nominal)
    grade, how = safety_class.barrier_grade(record, capacitor.ref)
    found = safety_class.bridging(grade, nominal)
    return None if found is None else safety_class.Requirement(found.accepted, f"{found.reason} ({how})", found.sources)
