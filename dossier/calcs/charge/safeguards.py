"""A charger's safeguards: the absorption timer, and the high-temperature cut-off with where its sensor sits.

A failed (shorted) cell never lets the voltage reach the absorption setpoint's taper, so without a timer the
charger holds the rest of the battery in absorption for ever. A valve-regulated battery (AGM, gel) charged hot
draws more current, which heats it further: thermal runaway. Only a sensor on the battery itself, with a
cut-off in the charger, stops it; a sensor inside the charger reads the charger's air, not the battery.
"""

from __future__ import annotations

from dataclasses import replace

from dossier.calcs.charge import words
from dossier.citations import BU_403, GEL_VRLA_HANDBOOK, YUASA_NP_MANUAL
from dossier.findings import Finding, Measure, Verdict, common_practice

BATTERY = ("output", "battery")
TIMER_SOURCES = (
    replace(YUASA_NP_MANUAL, clause="charging for cyclic use: limit the charging time, or end the charge on current taper (from memory)"),
    common_practice("a charge timer ends absorption when a failed cell keeps the current from tapering (makers' charging guides; from memory)"),
)
RUNAWAY_SOURCES = (
    replace(BU_403, clause=("page 'BU-403: Charging Lead Acid' as published on batteryuniversity.com (page date not confirmed): "
                            "temperature compensation, and sealed lead-acid charged hot running away thermally (the latter from memory)")),
    replace(YUASA_NP_MANUAL, clause="charging: temperature compensation and thermal runaway of valve-regulated batteries (from memory)"),
    replace(GEL_VRLA_HANDBOOK, clause="charging: battery temperature and thermal runaway (from memory)"),
)


def timer_finding(charger) -> Finding:
    timer = charger.battery.absorption_timer
    common = dict(code="CHG-TIMER", calc="charge", subject="battery", title=words.TIMER_TITLE,
                  keys=(BATTERY + ("absorption_timer",),), sources=TIMER_SOURCES, method=words.TIMER_METHOD)
    if timer is None:
        return Finding(verdict=Verdict.MARGINAL, values=(Measure("absorption timer", "none declared"),),
                       explanation=words.NO_TIMER, **common)
    return Finding(verdict=Verdict.PASS, values=(Measure("absorption timer", timer.to("h")),),
                   explanation=words.timer_set(timer), **common)


def cutoff_finding(charger) -> Finding:
    battery, chemistry = charger.battery, charger.chemistry
    cutoff, sensor = battery.high_temperature_cutoff, battery.temperature_sensor
    charging = chemistry.charge_temperature
    ceiling = charging.high.to("degC") if charging is not None else None
    problems = _problems(cutoff, sensor, ceiling)
    verdict = Verdict.PASS if not problems else (Verdict.FAIL if chemistry.valve_regulated else Verdict.MARGINAL)
    values = (Measure("high-temperature cut-off", cutoff if cutoff is not None else "none declared"),
              Measure("temperature sensor", sensor or "not declared"))
    return Finding(
        code="CHG-HOT-CUTOFF", calc="charge", subject="battery", title=words.cutoff_title(chemistry.label),
        verdict=verdict, values=values,
        limit=Measure("charging range high", ceiling) if ceiling is not None else None, relation="<=",
        method=words.CUTOFF_METHOD, explanation=words.cutoff_text(problems, chemistry.valve_regulated, ceiling),
        keys=(BATTERY + ("high_temperature_cutoff",), BATTERY + ("temperature_sensor",)),
        sources=RUNAWAY_SOURCES + (charging.sources if charging is not None else ()),
        guards_hazard=chemistry.valve_regulated,
    )


def _problems(cutoff, sensor, ceiling) -> tuple[str, ...]:
    """Keys into words.CUTOFF_PROBLEMS for what is missing or wrong."""
    found = []
    if cutoff is None:
        found.append("no-cutoff")
    elif ceiling is not None and cutoff.to("degC").magnitude > ceiling.magnitude:
        found.append("cutoff-too-high")
    if sensor is None:
        found.append("sensor-not-declared")
    elif sensor != "battery":
        found.append(f"sensor-{sensor}")
    return tuple(found)
