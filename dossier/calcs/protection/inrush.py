"""Switch-on surge: charging the bulk capacitance at the crest of high line, and what it does to the fuse."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.shared.mains_lines import high_line_peak
import math

from dossier.calcs.protection import words
from dossier.calcs.shared.enclosure_air import INTERNAL_RISE, internal_ambient
from dossier.calcs.protection.common import (
    FUSEOLOGY_PULSE_CYCLES, FUSEOLOGY_WAVESHAPES, RC_CHARGE, finding, lowered, measure,
    percent,
)
from dossier.calcs.shared.input_current import CAPACITOR_INPUT, input_topology
from dossier.calcs.protection.transformer import mains_transformers, referred
from dossier.findings import Verdict, common_practice, judge
from dossier.standards.fuses import (
    exponential_i2t, melting_i2t_at, pulse_fraction, pulses_in_chart, single_figure_share,
)
from dossier.units import Q_

DEFAULT_SWITCH_ONS = 10_000
SWITCH_ON_GUESS = common_practice("about 10 000 switch-ons in a unit's life: a few a day for ten years (assumed when not declared)")
NO_LIMITER = common_practice("a capacitor-input unit on the mains has an inrush limiter (NTC thermistor, or a resistor bypassed by a relay)")
NTC_B_EQUATION = common_practice(
    "NTC resistance R(T) = R25 exp(B (1/T - 1/298.15 K)), the B-constant equation of NTC makers' data sheets; "
    "B of inrush-limiting NTCs about 2700 to 4000 K, 4000 K taken when not declared (from memory)"
)
MELTING_CURVE = common_practice(
    "compare a pulse with the fuse's melting I^2 t at the pulse's duration, read from the maker's I^2 t-t curve; "
    "the nominal single figure is measured at about 10 x I_n, and shorter pulses melt the link at less (from memory)"
)
DEFAULT_B = 4000.0
REFERENCE_K = 298.15


@dataclass(frozen=True)
class Melting:
    """The fuse's melting I^2 t to set against a pulse of a given duration, and how it was found."""

    i2t: object
    basis: str
    time: object
    share: float | None


@dataclass(frozen=True)
class Pulse:
    """The exponential charging pulse i(t) = I_pk e^(-t / tau) at switch-on."""

    peak: object
    time_constant: object
    i2t: object
    resistance: object
    line_peak: object
    assumed: tuple[str, ...]


def _path_resistance(record, limiter_resistance) -> tuple[object, tuple[str, ...]]:
    protection = record.protection
    parts = {"protection.source_resistance": protection.source_resistance}
    if protection.bulk_capacitance is not None:
        parts["protection.bulk_esr"] = protection.bulk_esr
    assumed = tuple(key for key, value in parts.items() if value is None)
    total = sum((value for value in parts.values() if value is not None), limiter_resistance)
    return (total + windings_resistance(record)).to("ohm"), assumed


def windings_resistance(record):
    """Behind a mains transformer the banks charge through its primary and (referred) the lowest secondary, cold.

    Nothing is added when no bank is declared behind it or the windings' resistances are not known (the harsher reading).
    """
    if not record.protection.secondary_banks:
        return Q_(0, "ohm")
    transformers = mains_transformers(record)
    if not transformers or transformers[0].primary.resistance is None:
        return Q_(0, "ohm")
    first = transformers[0]
    secondaries = [r for r in (referred(w, first.primary) for w in first.secondaries) if r is not None]
    return (first.primary.resistance + (min(secondaries, key=lambda r: r.magnitude) if secondaries else Q_(0, "ohm"))).to("ohm")


def referred_capacitance(record):
    """Capacitance the mains charges at switch-on: protection.bulk_capacitance plus each secondary bank referred
    to the primary at equal energy, C (V_bank / (sqrt 2 V_nominal))^2; None when neither is declared."""
    protection = record.protection
    if protection.bulk_capacitance is None and not protection.secondary_banks:
        return None
    primary_peak = record.mains.nominal * math.sqrt(2)
    banks = sum((bank.capacitance * (bank.voltage / primary_peak).to("") ** 2 for bank in protection.secondary_banks), Q_(0, "uF"))
    return (banks + (protection.bulk_capacitance if protection.bulk_capacitance is not None else Q_(0, "uF"))).to("uF")


def charging_pulse(record, limiter_resistance) -> Pulse | None:
    """The pulse through a given limiter resistance; None without mains, capacitance or any resistance."""
    if record.mains is None:
        return None
    capacitance = referred_capacitance(record)
    if capacitance is None:
        return None
    resistance, assumed = _path_resistance(record, limiter_resistance)
    if resistance.magnitude <= 0:
        return None
    crest = high_line_peak(record.mains)
    peak = (crest / resistance).to("A")
    tau = (resistance * capacitance).to("ms")
    return Pulse(peak, tau, exponential_i2t(peak, tau), resistance, crest, assumed)


def cold_pulse(record) -> Pulse | None:
    limiter = record.protection.inrush_limiter
    return charging_pulse(record, ntc_start_resistance(record)[0] if limiter else Q_(0, "ohm"))


def ntc_start_resistance(record):
    """(resistance at switch-on, air temperature it starts from): an NTC at the enclosure's inside air, not at 25 degC."""
    limiter = record.protection.inrush_limiter
    air, _ = internal_ambient(record)
    if limiter.kind != "ntc":
        return limiter.cold_resistance, air
    b = limiter.b_value.to("K").magnitude if limiter.b_value is not None else DEFAULT_B
    kelvin = air.to("K").magnitude
    return (limiter.cold_resistance * math.exp(b * (1 / kelvin - 1 / REFERENCE_K))).to("ohm"), air


def fuse_melting(fuse, pulse_time) -> Melting | None:
    """The melting I^2 t at the pulse's duration: from the declared curve, else the single figure derated for short pulses."""
    if fuse.melting_curve:
        points = [(point.time, point.i2t) for point in fuse.melting_curve]
        return Melting(melting_i2t_at(points, pulse_time), "curve", pulse_time, None)
    if fuse.melting_i2t is None:
        return None
    share = single_figure_share(pulse_time)
    return Melting((fuse.melting_i2t * share).to("A**2*s"), "single", pulse_time, share)


def pulse_fits(record) -> bool | None:
    """Whether the declared fuse survives the switch-on pulse for the unit's life; None when not computable."""
    pulse, fuse = cold_pulse(record), record.protection.fuse
    if pulse is None:
        return None
    melting = fuse_melting(fuse, pulse.time_constant) if fuse is not None else None
    return melting is not None and pulse.i2t <= melting.i2t * pulse_fraction(switch_ons(record))


def switch_ons(record) -> int:
    return record.protection.switch_on_cycles or DEFAULT_SWITCH_ONS


def minimum_melting_i2t(record):
    """Smallest fuse melting I^2 t that survives the switch-on pulse for the unit's life; None if not computable."""
    pulse = cold_pulse(record)
    if pulse is None:
        return None
    return (pulse.i2t / pulse_fraction(switch_ons(record)) / single_figure_share(pulse.time_constant)).to("A**2*s")


def inrush_findings(record) -> list:
    if record.mains is None:
        return []
    pulse = cold_pulse(record)
    if pulse is None:
        return [_not_computed(record)]
    found = [_peak_finding(record, pulse)]
    if record.protection.fuse is not None:
        found.append(_fuse_finding(record, pulse, record.protection.fuse))
    return found


def _not_computed(record):
    if referred_capacitance(record) is None and input_topology(record) != CAPACITOR_INPUT:
        return finding(code="PROT-INRUSH", subject="switch-on", title="No capacitor inrush to compute", verdict=Verdict.INFO,
                       explanation=words.NO_CAPACITOR_INRUSH, keys=(("protection",),), sources=(RC_CHARGE,))
    missing = ["protection.bulk_capacitance"] if referred_capacitance(record) is None else ["protection.source_resistance", "protection.bulk_esr"]
    return finding(code="PROT-INRUSH", subject="switch-on", title="Inrush not computed", verdict=Verdict.INFO,
                   explanation=words.INRUSH_NOT_COMPUTED + words.add_text(missing),
                   keys=(("protection",),), sources=(RC_CHARGE,))


def _pulse_values(pulse: Pulse) -> tuple:
    return (
        measure("switch-on I^2 t", pulse.i2t),
        measure("peak current at high line", pulse.peak),
        measure("time constant", pulse.time_constant),
        measure("charging-path resistance", pulse.resistance),
    )


def _peak_finding(record, pulse: Pulse):
    limiter = record.protection.inrush_limiter
    if limiter is not None:
        resistance, air = ntc_start_resistance(record)
        text = words.limited_peak_text(limiter.ref, resistance, air, pulse.peak)
        verdict = Verdict.INFO
        extra = (measure("limiter resistance at switch-on", resistance), measure("air at the limiter", air))
    else:
        text = words.unlimited_peak_text(pulse.line_peak, pulse.peak, pulse.resistance)
        verdict = Verdict.MARGINAL
        extra = (measure("crest of high line", pulse.line_peak), measure("charging-path resistance", pulse.resistance))
    return finding(code="PROT-INRUSH-PEAK", subject=limiter.ref if limiter else "switch-on", title="Switch-on peak current",
                   verdict=lowered(verdict, list(pulse.assumed)), values=(measure("peak current at high line", pulse.peak), measure("time constant", pulse.time_constant)),
                   method="I_pk = sqrt(2) V_high / (R_limiter + R_source + ESR); tau = R C",
                   explanation=text + words.add_text(list(pulse.assumed)), extra=extra,
                   keys=(("protection", "inrush_limiter", "cold_resistance") if limiter else ("protection", "bulk_capacitance"),),
                   sources=(RC_CHARGE,) if limiter else (RC_CHARGE, NO_LIMITER))


def _fuse_finding(record, pulse: Pulse, fuse):
    melting = fuse_melting(fuse, pulse.time_constant)
    if melting is None:
        return _fuse_unknown(record, pulse, fuse)
    pulses = switch_ons(record)
    share = pulse_fraction(pulses)
    allowed = (melting.i2t * share).to("A**2*s")
    verdict = lowered(judge(pulse.i2t, allowed, "<="), list(pulse.assumed))
    return finding(code="PROT-INRUSH", subject=fuse.ref, title="Switch-on pulse against the fuse's melting I^2 t", verdict=verdict,
                   values=_pulse_values(pulse) + _melting_values(fuse, melting, share) + _ntc_values(record),
                   limit=measure(words.pulse_limit_label(percent(share), fuse.ref, pulse.time_constant, pulses), allowed),
                   relation="<=",
                   method="I^2 t = I_pk^2 tau / 2 (exponential pulse); allowed = pulse-cycle share x melting I^2 t at t = tau",
                   explanation=_fuse_text(record, pulse, fuse, pulses, melting) + words.add_text(list(pulse.assumed)),
                   extra=(measure("switch-on pulse share of the melting I^2 t", Q_(percent((pulse.i2t / melting.i2t).to("")), "percent")),
                          measure("switch-ons", Q_(pulses))),
                   keys=(("protection", "fuse", "melting_curve" if melting.basis == "curve" else "melting_i2t"), ("protection", "bulk_capacitance")),
                   sources=_fuse_sources(record))


def _melting_values(fuse, melting: Melting, share: float) -> tuple:
    values = (measure("fuse melting I^2 t at the pulse's duration", melting.i2t), measure("pulse duration (time constant)", melting.time),
              measure("pulse-cycle share", Q_(share * 100, "percent")), measure("melting I^2 t basis", melting.basis))
    if melting.basis == "single":
        values += (measure("declared single melting I^2 t (at about 10 x I_n)", fuse.melting_i2t),
                   measure("share of the single figure relied on", Q_(melting.share * 100, "percent")))
    return values


def _ntc_values(record) -> tuple:
    limiter = record.protection.inrush_limiter
    if limiter is None or limiter.kind != "ntc":
        return ()
    resistance, air = ntc_start_resistance(record)
    return (measure("NTC resistance at switch-on", resistance), measure("air at the NTC", air))


def _fuse_sources(record) -> tuple:
    extra = () if record.protection.switch_on_cycles else (SWITCH_ON_GUESS,)
    limiter = record.protection.inrush_limiter
    if limiter is not None and limiter.kind == "ntc":
        extra += (NTC_B_EQUATION,) + ((INTERNAL_RISE,) if record.protection.internal_ambient is None else ())
    return (FUSEOLOGY_WAVESHAPES, FUSEOLOGY_PULSE_CYCLES, RC_CHARGE, MELTING_CURVE) + extra


def _fuse_text(record, pulse: Pulse, fuse, pulses: int, melting: Melting) -> str:
    ratio = percent((pulse.i2t / melting.i2t).to(""))
    blows = pulse.i2t >= melting.i2t
    text = words.pulse_against_fuse_text(fuse.ref, ratio, blows, not blows and pulse.i2t > melting.i2t * pulse_fraction(pulses), pulses)
    text += words.melting_basis_text(melting.basis, melting.time, melting.share)
    if not pulses_in_chart(pulses):
        text += words.CHART_END
    limiter = record.protection.inrush_limiter
    if limiter is None:
        return text + words.NO_LIMITER
    if limiter.kind == "ntc":
        resistance, air = ntc_start_resistance(record)
        text += words.ntc_cold_text(limiter.ref, resistance, air, record.protection.internal_ambient is None, limiter.b_value is None)
    return text


def _fuse_unknown(record, pulse: Pulse, fuse):
    needed = minimum_melting_i2t(record)
    return finding(code="PROT-INRUSH", subject=fuse.ref, title="Switch-on pulse against the fuse (melting I^2 t not declared)", verdict=Verdict.INFO,
                   values=(measure("melting I^2 t the fuse needs at least", needed),) + _pulse_values(pulse),
                   method="I^2 t = I_pk^2 tau / 2 (exponential pulse); needed = pulse I^2 t / pulse-cycle share",
                   explanation=words.melting_unknown_text(fuse.ref) + words.add_text(["protection.fuse.melting_i2t"] + list(pulse.assumed)),
                   keys=(("protection", "fuse"),), sources=_fuse_sources(record))
