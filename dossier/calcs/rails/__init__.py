"""Rails calc: the hazards a unit holds beyond the mains. Each rail's worst case and whether it is hazardous, the
energy its capacitors keep and how fast its bleeder removes it, the X capacitors at the plug, ripple and ripple
current, regulator dissipation, each rectifier's output and peak inverse voltage, and a word on every stage kind."""

from __future__ import annotations

from dataclasses import replace
from functools import partial

from dossier.calcs.rails import discharge, supply
from dossier.calcs.rails.hazards import NAME, energy_classes, hazard_finding, hazardous, rail_hazard, voltage_finding
from dossier.calcs.shared.standard_choice import chosen_product_standard
from dossier.calcs.shared.rail_voltage import rail_voltages
from dossier.plugins import Calc, CalcResult

HAZARDS = "hazards"
VOLTAGES = "voltages"
DISCHARGE = "RAILS-DISCHARGE"
HAZARD = "RAILS-HAZARD"


def run(record, default_standard=None):
    voltages = {found.name: found for found in rail_voltages(record)}
    classes = energy_classes(*chosen_product_standard(record, default_standard))
    findings = []
    for found in voltages.values():
        findings.append(voltage_finding(found, classes))
        if hazardous(found):
            findings.append(hazard_finding(record, found, classes))
        findings += discharge.rail_findings(record, found)
        findings += supply.ripple_findings(record, found)
    findings += discharge.x_capacitor_findings(record)
    findings += supply.regulator_findings(record, voltages)
    findings += supply.stage_findings(record, voltages)
    hazards = tuple(rail_hazard(record, found) for found in voltages.values() if hazardous(found))
    return CalcResult(findings, {HAZARDS: hazards, VOLTAGES: tuple(voltages.values())})


def configured(settings):
    """This calc with the archive's default product standard, which names the energy-source class under IEC 62368-1."""
    return CALC if settings.standard is None else replace(CALC, run=partial(run, default_standard=settings.standard))


CALC = Calc(
    name=NAME,
    title="Rails and stored energy",
    run=run,
    summary=(
        "Works out each declared rail's worst case (no load, high line; the no-load voltage declared, or from the "
        "declared regulation, or an assumed 25 % rise) and names every rail above the extra-low-voltage limits (60 V DC, "
        "30 V RMS AC; IEC 62368-1 ES1) as a hazard beyond the mains. For each hazardous DC rail: the energy its "
        "capacitors hold (1/2 C V^2), the time its bleeder takes to bring it to 60 V (t = R C ln(V0 / V_safe), at most 5 s, "
        "IEC 60204-1 6.2.4), and the bleeder's dissipation and voltage against its ratings. The X capacitors across the "
        "line against 34 V one second after unplugging (IEC 60335-1 22.5). Ripple (I / (f_r C)) and the reservoir's ripple "
        "current against its rating; a series-pass regulator's dissipation at high line; each rectifier's output and peak "
        "inverse voltage by its topology, and a rectifier valve's against its maker's ratings; and a word on each filter, switch, input and regulator topology it does not compute."
    ),
    codes={
        "RAILS-VOLTAGE": "a rail's worst-case voltage: no load, high line (information for the other checks)",
        HAZARD: "a rail above the extra-low-voltage limit: a hazard beyond the mains (fails when it is brought out to a touchable terminal)",
        "RAILS-ENERGY": "the energy a hazardous rail's capacitors hold at the worst case",
        DISCHARGE: "the time a hazardous rail's bleeder takes to bring it to a safe voltage, against the limit",
        "RAILS-BLEEDER": "a bleeder's dissipation and voltage against its ratings",
        "RAILS-X-DISCHARGE": "the X capacitors across the line: the voltage at the plug pins one second after unplugging",
        "RAILS-RIPPLE": "a rectified rail's peak-to-peak ripple (information)",
        "RAILS-RIPPLE-CURRENT": "a reservoir capacitor's ripple current against its rating",
        "RAILS-REGULATOR": "a linear regulator's dissipation: a series-pass device at high line, a shunt at no load",
        "RAILS-RECTIFIER": "a rectifier stage's output and peak inverse voltage from its topology and its rail",
        "RAILS-VALVE": "a rectifier valve's peak inverse voltage, peak anode current and reservoir against its maker's ratings",
        "RAILS-STAGE": "what dossier checks, and does not compute, for a stage's kind and topology",
    },
    products={
        HAZARDS: "the rails above the extra-low-voltage limits (name, stage, worst case, limit, accessible), for the pages, drawings and checklist",
        VOLTAGES: "every rail's loaded, no-load and worst-case voltage, for the checklist's expected readings",
    },
    order=35,
)
