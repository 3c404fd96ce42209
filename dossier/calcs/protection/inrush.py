"""Switch-on surge: charging the bulk capacitance at the crest of high line, and what it does to the fuse."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.shared.mains_lines import high_line_peak
from dossier.calcs.protection.common import (
    FUSEOLOGY_PULSE_CYCLES, FUSEOLOGY_WAVESHAPES, RC_CHARGE, add_text, finding, lowered, measure, percent,
)
from dossier.calcs.protection.input import CAPACITOR_INPUT, input_topology
from dossier.findings import Verdict, common_practice, judge
from dossier.standards.fuses import exponential_i2t, pulse_fraction, pulses_in_chart
from dossier.units import Q_, fmt

DEFAULT_SWITCH_ONS = 10_000
SWITCH_ON_GUESS = common_practice("about 10 000 switch-ons in a unit's life: a few a day for ten years (assumed when not declared)")
NO_LIMITER = common_practice("a capacitor-input unit on the mains has an inrush limiter (NTC thermistor, or a resistor bypassed by a relay)")


@dataclass(frozen=True)
class Pulse:
    """The exponential charging pulse i(t) = I_pk e^(-t / tau) at switch-on."""

    peak: object
    time_constant: object
    i2t: object
    resistance: object
    line_peak: object
    assumed: tuple[str, ...]


def _path_resistance(protection, limiter_resistance) -> tuple[object, tuple[str, ...]]:
    parts = {"protection.source_resistance": protection.source_resistance, "protection.bulk_esr": protection.bulk_esr}
    assumed = tuple(key for key, value in parts.items() if value is None)
    total = sum((value for value in parts.values() if value is not None), limiter_resistance)
    return total.to("ohm"), assumed


def charging_pulse(record, limiter_resistance) -> Pulse | None:
    """The pulse through a given limiter resistance; None without mains, capacitance or any resistance."""
    capacitance = record.protection.bulk_capacitance
    if record.mains is None or capacitance is None:
        return None
    resistance, assumed = _path_resistance(record.protection, limiter_resistance)
    if resistance.magnitude <= 0:
        return None
    crest = high_line_peak(record.mains)
    peak = (crest / resistance).to("A")
    tau = (resistance * capacitance).to("ms")
    return Pulse(peak, tau, exponential_i2t(peak, tau), resistance, crest, assumed)


def cold_pulse(record) -> Pulse | None:
    limiter = record.protection.inrush_limiter
    return charging_pulse(record, limiter.cold_resistance if limiter else Q_(0, "ohm"))


def switch_ons(record) -> int:
    return record.protection.switch_on_cycles or DEFAULT_SWITCH_ONS


def minimum_melting_i2t(record):
    """Smallest fuse melting I^2 t that survives the switch-on pulse for the unit's life; None if not computable."""
    pulse = cold_pulse(record)
    if pulse is None:
        return None
    return (pulse.i2t / pulse_fraction(switch_ons(record))).to("A**2*s")


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
    if record.protection.bulk_capacitance is None and input_topology(record) != CAPACITOR_INPUT:
        text = ("No capacitance charged straight from the mains is declared, so no capacitor inrush is computed. "
                "A mains transformer's switch-on surge depends on core remanence and the switch-on angle and is not computed here; "
                "a time-lag fuse is the usual answer.")
        return finding(code="PROT-INRUSH", subject="switch-on", title="No capacitor inrush to compute", verdict=Verdict.INFO,
                       explanation=text, keys=(("protection",),), sources=(RC_CHARGE,))
    missing = ["protection.bulk_capacitance"] if record.protection.bulk_capacitance is None else ["protection.source_resistance", "protection.bulk_esr"]
    return finding(code="PROT-INRUSH", subject="switch-on", title="Inrush not computed", verdict=Verdict.INFO,
                   explanation="The switch-on surge cannot be computed from what is declared." + add_text(missing),
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
        text = f"{limiter.ref} ({fmt(limiter.cold_resistance)} cold) limits the switch-on peak to {fmt(pulse.peak)} at the crest of high line."
        verdict = Verdict.INFO
    else:
        text = _unlimited_text(pulse)
        verdict = Verdict.MARGINAL
    return finding(code="PROT-INRUSH-PEAK", subject=limiter.ref if limiter else "switch-on", title="Switch-on peak current",
                   verdict=lowered(verdict, list(pulse.assumed)), values=(measure("peak current at high line", pulse.peak), measure("time constant", pulse.time_constant)),
                   method="I_pk = sqrt(2) V_high / (R_limiter + R_source + ESR); tau = R C",
                   explanation=text + add_text(list(pulse.assumed)),
                   keys=(("protection", "inrush_limiter", "cold_resistance") if limiter else ("protection", "bulk_capacitance"),),
                   sources=(RC_CHARGE,) if limiter else (RC_CHARGE, NO_LIMITER))


def _unlimited_text(pulse: Pulse) -> str:
    return (f"No inrush limiter is declared: at the crest of high line ({fmt(pulse.line_peak)}) the empty capacitors draw "
            f"{fmt(pulse.peak)}, limited only by the mains wiring and the capacitors' ESR ({fmt(pulse.resistance)} together). "
            "A pulse like that can melt or weaken the fuse, exceed the bridge rectifier's surge rating (I_FSM), "
            "pit the switch contacts and trip the breaker upstream. Fit an NTC thermistor, or a resistor bypassed by a relay.")


def _fuse_finding(record, pulse: Pulse, fuse):
    if fuse.melting_i2t is None:
        return _fuse_unknown(record, pulse, fuse)
    pulses = switch_ons(record)
    share = pulse_fraction(pulses)
    allowed = (fuse.melting_i2t * share).to("A**2*s")
    verdict = lowered(judge(pulse.i2t, allowed, "<="), list(pulse.assumed))
    return finding(code="PROT-INRUSH", subject=fuse.ref, title="Switch-on pulse against the fuse's melting I^2 t", verdict=verdict,
                   values=_pulse_values(pulse) + (measure("fuse melting I^2 t", fuse.melting_i2t),),
                   limit=measure(f"{percent(share)} % of {fuse.ref}'s melting I^2 t, for {pulses} switch-ons", allowed), relation="<=",
                   method="I^2 t = I_pk^2 tau / 2 (exponential pulse); allowed = pulse-cycle share x melting I^2 t",
                   explanation=_fuse_text(record, pulse, fuse, pulses) + add_text(list(pulse.assumed)),
                   keys=(("protection", "fuse", "melting_i2t"), ("protection", "bulk_capacitance")),
                   sources=_fuse_sources(record))


def _fuse_sources(record) -> tuple:
    extra = () if record.protection.switch_on_cycles else (SWITCH_ON_GUESS,)
    return (FUSEOLOGY_WAVESHAPES, FUSEOLOGY_PULSE_CYCLES, RC_CHARGE) + extra


def _fuse_text(record, pulse: Pulse, fuse, pulses: int) -> str:
    ratio = percent((pulse.i2t / fuse.melting_i2t).to(""))
    text = f"The switch-on pulse is {ratio} % of {fuse.ref}'s melting I^2 t."
    if pulse.i2t >= fuse.melting_i2t:
        text += f" It is more than the fuse needs to melt: {fuse.ref} blows at every switch-on."
    elif pulse.i2t > fuse.melting_i2t * pulse_fraction(pulses):
        text += f" The fuse survives a single switch-on but fatigues and opens after far fewer than {pulses} of them."
    if not pulses_in_chart(pulses):
        text += " The makers' pulse-cycle chart ends at 100 000 pulses; its last figure is used."
    if record.protection.inrush_limiter is None:
        text += " There is no inrush limiter."
    return text


def _fuse_unknown(record, pulse: Pulse, fuse):
    needed = minimum_melting_i2t(record)
    return finding(code="PROT-INRUSH", subject=fuse.ref, title="Switch-on pulse against the fuse (melting I^2 t not declared)", verdict=Verdict.INFO,
                   values=(measure("melting I^2 t the fuse needs at least", needed),) + _pulse_values(pulse),
                   method="I^2 t = I_pk^2 tau / 2 (exponential pulse); needed = pulse I^2 t / pulse-cycle share",
                   explanation=f"Look up {fuse.ref}'s nominal melting I^2 t in its maker's data." + add_text(["protection.fuse.melting_i2t"] + list(pulse.assumed)),
                   keys=(("protection", "fuse"),), sources=_fuse_sources(record))
