"""The inrush limiter itself: switch-on energy, running dissipation, and restarting while it is hot."""

from __future__ import annotations

from dossier.calcs.protection import words
from dossier.calcs.protection.common import NTC_GUIDES, RC_CHARGE, finding, measure, percent
from dossier.calcs.shared.mains_lines import high_line_peak
from dossier.calcs.protection.inrush import MELTING_CURVE, charging_pulse, fuse_melting, referred_capacitance
from dossier.findings import Source
from dossier.calcs.shared.input_current import input_current
from dossier.findings import Verdict, common_practice, judge
from dossier.units import Q_

ENERGY_MARGIN = 0.2
CURRENT_MARGIN = 0.2
MARGIN_PRACTICE = common_practice("keep 20 % headroom below a limiter's rated energy and current")
COOL_DOWN = common_practice("an NTC limiter needs tens of seconds to minutes to cool after switch-off (from memory; see the maker's data)")
RESISTOR_POWER = common_practice("a resistor that stays in circuit is rated for at least twice its dissipation")
CAPACITANCE_SCALING = Source(
    title="The size of the NTC thermistor with filter capacitor", publisher="Shenzhen Linxiang Electronic (NTC maker), application note",
    clause="the capacitance an NTC allows varies inversely as the square of the rated voltage (E = 1/2 C V^2)", kind="application-note",
)


def limiter_findings(record) -> list:
    limiter = record.protection.inrush_limiter
    if limiter is None or record.mains is None:
        return []
    found = [_energy_finding(record, limiter)] if limiter.kind != "relay-bypassed-resistor" else []
    found += _dissipation_findings(record, limiter)
    if limiter.kind == "ntc":
        found.append(_cool_down_finding(record, limiter))
    return found


def switch_on_energy(capacitance, crest_voltage):
    """Energy the limiter must absorb charging C to the crest: 1/2 C V_pk^2."""
    return (capacitance * crest_voltage**2 / 2).to("J")


def _energy_finding(record, limiter):
    capacitance = referred_capacitance(record)
    if capacitance is None:
        return _energy_info(limiter, None, ["protection.bulk_capacitance"])
    energy = switch_on_energy(capacitance, high_line_peak(record.mains))
    if limiter.max_energy is not None:
        rated = measure(f"{limiter.ref} rated energy", limiter.max_energy)
        return _energy_against(limiter, measure("switch-on energy at high line", energy), rated, energy)
    if limiter.max_capacitance is not None:
        return _capacitance_against(record, limiter, capacitance, energy)
    return _energy_info(limiter, energy, [f"protection.inrush_limiter.max_energy (or max_capacitance) for {limiter.ref}"])


def _energy_against(limiter, value, limit, energy):
    verdict = judge(value.quantity, limit.quantity, "<=", ENERGY_MARGIN)
    return finding(code="PROT-NTC-ENERGY", subject=limiter.ref, title="Inrush limiter switch-on energy", verdict=verdict,
                   values=_unique((value, measure("switch-on energy at high line", energy))), limit=limit, relation="<=",
                   method="E = 1/2 C V_pk^2 at the crest of high line", explanation=_energy_text(limiter, verdict, energy),
                   extra=(_headroom(),),
                   keys=(("protection", "inrush_limiter"), ("protection", "bulk_capacitance")), sources=(NTC_GUIDES, MARGIN_PRACTICE))


def scaled_capacitance(limiter, quoted_at, used_at):
    """The maker's maximum capacitance moved to another voltage at the same energy: C_used = C_quoted (V_quoted / V_used)^2."""
    return (limiter.max_capacitance * (quoted_at / used_at).to("") ** 2).to("uF")


def _capacitance_against(record, limiter, capacitance, energy):
    quoted_at = limiter.max_capacitance_voltage or record.mains.nominal
    used_at = record.mains.high
    allowed = scaled_capacitance(limiter, quoted_at, used_at)
    verdict = judge(capacitance, allowed, "<=", ENERGY_MARGIN)
    text = words.capacitance_scaled_text(limiter.ref, limiter.max_capacitance, quoted_at, used_at, allowed, limiter.max_capacitance_voltage is None)
    values = (measure("bulk capacitance", capacitance), measure("switch-on energy at high line", energy),
              measure(f"{limiter.ref} maximum capacitance as quoted", limiter.max_capacitance), measure("voltage it is quoted at", quoted_at),
              measure("high line", used_at))
    return finding(code="PROT-NTC-ENERGY", subject=limiter.ref, title="Inrush limiter switch-on energy", verdict=verdict,
                   values=values, limit=measure(f"{limiter.ref} maximum capacitance at high line", allowed), relation="<=",
                   method="C_allowed = C_max (V_quoted / V_high)^2 (equal energy 1/2 C V^2)",
                   explanation=(text + " " + _energy_text(limiter, verdict, energy)).strip(), extra=(_headroom(),),
                   keys=(("protection", "inrush_limiter", "max_capacitance"), ("protection", "inrush_limiter", "max_capacitance_voltage"),
                         ("protection", "bulk_capacitance")),
                   sources=(NTC_GUIDES, CAPACITANCE_SCALING, MARGIN_PRACTICE))


def _unique(measures: tuple) -> tuple:
    return tuple({m.label: m for m in measures}.values())


def _headroom():
    return measure("headroom kept below the rating", Q_(percent(ENERGY_MARGIN), "percent"))


def _energy_text(limiter, verdict: Verdict, energy) -> str:
    if verdict is Verdict.FAIL:
        return words.energy_too_high_text(energy, limiter.ref)
    if verdict is Verdict.MARGINAL:
        return words.energy_near_rating_text(limiter.ref, percent(ENERGY_MARGIN))
    return ""


def _energy_info(limiter, energy, missing: list[str]):
    values = (measure("switch-on energy at high line", energy),) if energy is not None else ()
    return finding(code="PROT-NTC-ENERGY", subject=limiter.ref, title="Inrush limiter switch-on energy", verdict=Verdict.INFO,
                   values=values, method="E = 1/2 C V_pk^2 at the crest of high line",
                   explanation=words.ENERGY_NOT_COMPARED + words.add_text(missing),
                   keys=(("protection", "inrush_limiter"),), sources=(NTC_GUIDES,))


def _dissipation_findings(record, limiter) -> list:
    if limiter.kind == "relay-bypassed-resistor":
        return []
    running = input_current(record)
    if running is None:
        return [_dissipation_info(limiter, (), ["output (voltage, current, efficiency, power_factor)"])]
    resistance = limiter.cold_resistance if limiter.kind == "resistor" else limiter.hot_resistance
    if resistance is None:
        return [_dissipation_info(limiter, (measure("running current at low line", running.rms),), ["protection.inrush_limiter.hot_resistance"])]
    power = (running.rms**2 * resistance).to("W")
    if limiter.kind == "resistor":
        return [_resistor_power(limiter, power)]
    return [_ntc_current(limiter, running.rms, power, running.assumed)]


def _ntc_current(limiter, current, power, assumed):
    values = (measure("running current at low line", current), measure("dissipation at running current", power))
    if limiter.max_current is None:
        return _dissipation_info(limiter, values, ["protection.inrush_limiter.max_current"])
    verdict = Verdict.INFO if assumed else judge(current, limiter.max_current, "<=", CURRENT_MARGIN)
    text = words.ntc_dissipation_text(limiter.ref, power)
    return finding(code="PROT-NTC-DISSIPATION", subject=limiter.ref, title="Inrush limiter running current and dissipation", verdict=verdict,
                   values=values, limit=measure(f"{limiter.ref} maximum current", limiter.max_current), relation="<=",
                   method="P = I_rms^2 R_hot at low line", explanation=text + words.add_text(list(assumed)),
                   keys=(("protection", "inrush_limiter", "max_current"),), sources=(NTC_GUIDES, MARGIN_PRACTICE))


def _resistor_power(limiter, power):
    text = words.resistor_power_text(limiter.ref, power, power * 2)
    return finding(code="PROT-NTC-DISSIPATION", subject=limiter.ref, title="Inrush resistor running dissipation", verdict=Verdict.INFO,
                   values=(measure("dissipation at running current", power),), extra=(measure("power rating it needs at least", power * 2),), method="P = I_rms^2 R at low line",
                   explanation=text, keys=(("protection", "inrush_limiter"),), sources=(RESISTOR_POWER,))


def _dissipation_info(limiter, values, missing: list[str]):
    return finding(code="PROT-NTC-DISSIPATION", subject=limiter.ref, title="Inrush limiter running current and dissipation", verdict=Verdict.INFO,
                   values=values, method="P = I_rms^2 R_hot at low line",
                   explanation=words.DISSIPATION_NOT_CHECKED + words.add_text(missing),
                   keys=(("protection", "inrush_limiter"),), sources=(NTC_GUIDES,))


def _cool_down_finding(record, limiter):
    """A hot restart that needs the whole melting I^2 t blows the fuse: marginal, never info. No hot resistance is taken as zero."""
    hot = limiter.hot_resistance if limiter.hot_resistance is not None else Q_(0, "ohm")
    pulse = charging_pulse(record, hot)
    fuse = record.protection.fuse
    melting = fuse_melting(fuse, pulse.time_constant) if pulse is not None and fuse is not None else None
    share = percent((pulse.i2t / melting.i2t).to("")) if melting is not None else None
    values = (measure("hot-restart I^2 t", pulse.i2t), measure("peak current on a hot restart", pulse.peak)) if pulse else ()
    if melting is not None:
        values += (measure("fuse melting I^2 t at the pulse's duration", melting.i2t), measure("share of the melting I^2 t", Q_(share, "percent")))
    verdict = Verdict.MARGINAL if share is not None and share >= 100 else Verdict.INFO
    return finding(code="PROT-NTC-COOLDOWN", subject=limiter.ref, title="Switching on again while the limiter is hot", verdict=verdict,
                   values=values, limit=measure("fuse melting I^2 t at the pulse's duration", melting.i2t) if melting is not None else None,
                   relation="<=", method="I_pk = sqrt(2) V_high / (R_hot + R_source + ESR); I^2 t = I_pk^2 tau / 2 against the melting I^2 t",
                   explanation=words.hot_restart_text(limiter.ref, fuse.ref if fuse else None, share, limiter.hot_resistance is None),
                   keys=(("protection", "inrush_limiter", "hot_resistance"), ("protection", "fuse")), sources=(COOL_DOWN, RC_CHARGE, MELTING_CURVE))
