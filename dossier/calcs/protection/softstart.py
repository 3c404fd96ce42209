"""A soft-start resistor bypassed by a relay: its pulse energy, what it dissipates if the relay never closes, and the delay.

    pulse energy  E = 1/2 C V_pk^2 (charging the capacitors through it) + I_pk^2 R T/4 x decay (the transformer's
                  surge through it) + I_run^2 R t_delay (the load's current until the relay closes)
    bypass stuck  P = I^2 R with I = min(I_run, V_high / R), against the power rating; over it, only a thermal
                  cut-off on the resistor keeps it from burning
    delay         t_delay >= max(3 tau, 5 mains cycles), tau = R_path C
"""

from __future__ import annotations

from dossier.calcs.protection import words
from dossier.calcs.protection.common import CALC_NAME, RC_CHARGE, finding, measure
from dossier.calcs.protection.inrush import charging_pulse, referred_capacitance
from dossier.calcs.shared.input_current import input_current
from dossier.calcs.protection.surge import ESP_SOFT_START, magnetising_surge
from dossier.calcs.protection.transformer import COLD, mains_transformers
from dossier.calcs.shared.finding_kit import not_assessed
from dossier.calcs.shared.mains_lines import high_line_peak
from dossier.findings import Verdict, common_practice, judge
from dossier.units import Q_

RELAY_BYPASSED = "relay-bypassed-resistor"
CHARGE_ENERGY = common_practice("charging a capacitor to V through a resistance dissipates 1/2 C V^2 in it, whatever the resistance (circuit theory)")
STUCK_BYPASS = common_practice("a soft-start resistor rated only for the switch-on pulse is protected by a thermal cut-off against a relay that never closes")
CHARGED_TIME_CONSTANTS = 3.0  # 95 % charged: the relay then closes on a small step
SETTLE_CYCLES = 5.0  # about 100 ms at 50 Hz (Elliott Sound Products, Project 39)
KEYS = (("protection", "inrush_limiter"),)


def softstart_findings(record) -> list:
    limiter = record.protection.inrush_limiter
    if record.mains is None or limiter is None or limiter.kind != RELAY_BYPASSED:
        return []
    return [_energy(record, limiter), _stuck_bypass(record, limiter), _delay(record, limiter)]


def running_through(record, limiter):
    """(current the resistor carries while in circuit, running current): the running current, at most V_high / R."""
    running = input_current(record)
    if running is None:
        return None, None
    return min(running.rms, (record.mains.high / limiter.cold_resistance).to("A"), key=lambda q: q.magnitude), running.rms


def _energy(record, limiter):
    title = "Soft-start resistor pulse energy at switch-on"
    missing = [f"protection.inrush_limiter.{key}" for key in ("max_energy", "bypass_delay") if getattr(limiter, key) is None]
    current, _ = running_through(record, limiter)
    if current is None:
        missing.append("output (voltage, current)")
    if missing:
        return not_assessed(CALC_NAME, "PROT-SOFTSTART-ENERGY", limiter.ref, title, words.softstart_missing(missing), KEYS, (CHARGE_ENERGY,))
    charge, surge, running = _energy_parts(record, limiter, current)
    total = (charge + surge + running).to("J")
    verdict = judge(total, limiter.max_energy, "<=", 0.2)
    return finding(code="PROT-SOFTSTART-ENERGY", subject=limiter.ref, title=title, verdict=verdict,
                   values=(measure("pulse energy at switch-on", total), measure("charging the capacitors", charge),
                           measure("transformer surge through it", surge), measure("load current until the relay closes", running),
                           measure("bypass delay", limiter.bypass_delay)),
                   limit=measure(f"{limiter.ref} rated pulse energy", limiter.max_energy), relation="<=",
                   method="E = 1/2 C V_pk^2 + I_pk^2 R T/4 x decay + I_run^2 R t_delay",
                   explanation=words.softstart_energy_text(limiter.ref, verdict),
                   keys=KEYS + (("protection", "secondary_banks"),), sources=(CHARGE_ENERGY, ESP_SOFT_START))


def _energy_parts(record, limiter, current):
    capacitance = referred_capacitance(record)
    charge = (capacitance * high_line_peak(record.mains) ** 2 / 2).to("J") if capacitance is not None else Q_(0, "J")
    surge = Q_(0, "J")
    for transformer in mains_transformers(record, COLD):
        found = magnetising_surge(record, transformer)
        if found is not None:
            surge += (found.i2t * limiter.cold_resistance).to("J")
    running = (current**2 * limiter.cold_resistance * limiter.bypass_delay).to("J")
    return charge, surge, running


def _stuck_bypass(record, limiter):
    title = "Soft-start resistor if the relay never closes"
    current, running = running_through(record, limiter)
    missing = ([] if limiter.power_rating is not None else ["protection.inrush_limiter.power_rating"]) + ([] if current is not None else ["output (voltage, current)"])
    if missing:
        return not_assessed(CALC_NAME, "PROT-SOFTSTART-BYPASS", limiter.ref, title, words.softstart_missing(missing), KEYS,
                            (STUCK_BYPASS, ESP_SOFT_START), guards_hazard=True)
    power = (current**2 * limiter.cold_resistance).to("W")
    worst = (record.mains.high**2 / limiter.cold_resistance).to("W")
    cutoff = limiter.thermal_cutoff
    within = power <= limiter.power_rating
    verdict, text = _stuck_verdict(limiter, within, cutoff, running)
    values = (measure("dissipation with the relay open", power), measure("current through it", current),
              measure("dissipation if the load shorts (V_high^2 / R)", worst))
    rating = measure(f"{limiter.ref} power rating", limiter.power_rating)
    if cutoff is not None:
        values += (measure("thermal cut-off opens at", cutoff.temperature), rating)
    return finding(code="PROT-SOFTSTART-BYPASS", subject=limiter.ref, title=title, verdict=verdict, values=values,
                   limit=rating if within or cutoff is None else None, relation="<=",
                   method="P = I^2 R, I = min(I_run, V_high / R); over the rating only a thermal cut-off protects it",
                   explanation=text, guards_hazard=True,
                   keys=KEYS + (("protection", "inrush_limiter", "power_rating"), ("protection", "inrush_limiter", "thermal_cutoff")),
                   sources=(STUCK_BYPASS, ESP_SOFT_START))


def _stuck_verdict(limiter, within: bool, cutoff, running):
    if within:
        return Verdict.PASS, words.stuck_within_text(limiter.ref)
    if cutoff is None:
        return Verdict.FAIL, words.stuck_unprotected_text(limiter.ref)
    if cutoff.current_rating is not None and cutoff.current_rating < running:
        return Verdict.FAIL, words.cutoff_too_small_text(limiter.ref)
    return Verdict.PASS, words.stuck_cutoff_text(limiter.ref, cutoff.temperature, cutoff.current_rating is None)


def _delay(record, limiter):
    title = "Soft-start delay against the charge time"
    if limiter.bypass_delay is None:
        return not_assessed(CALC_NAME, "PROT-SOFTSTART-DELAY", limiter.ref, title,
                            words.softstart_missing(["protection.inrush_limiter.bypass_delay"]), KEYS, (ESP_SOFT_START,))
    pulse = charging_pulse(record, limiter.cold_resistance)
    settle = (SETTLE_CYCLES / record.mains.frequency).to("ms")
    charged = (CHARGED_TIME_CONSTANTS * pulse.time_constant).to("ms") if pulse is not None else Q_(0, "ms")
    needed = max(settle, charged, key=lambda q: q.magnitude)
    verdict = Verdict.PASS if limiter.bypass_delay >= needed else Verdict.MARGINAL
    values = (measure("bypass delay", limiter.bypass_delay.to("ms")), measure("five mains cycles", settle))
    if pulse is not None:
        values += (measure("charging time constant through it", pulse.time_constant), measure("three time constants", charged))
    return finding(code="PROT-SOFTSTART-DELAY", subject=limiter.ref, title=title, verdict=verdict, values=values,
                   limit=measure("time for the surge to settle", needed), relation=">=",
                   method="t_delay >= max(3 R C, 5 / f)", explanation=words.delay_text(limiter.ref, verdict is Verdict.MARGINAL),
                   keys=(("protection", "inrush_limiter", "bypass_delay"),), sources=(RC_CHARGE, ESP_SOFT_START))
