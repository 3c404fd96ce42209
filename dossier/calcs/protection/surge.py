"""A mains transformer's magnetising surge at switch-on: an upper bound on its peak and I^2 t, against the fuse.

The worst switch-on is at a zero crossing of the mains with the core's remanence the same way as the flux the
first half-cycle drives: the flux then heads for twice its normal peak plus the remanence, the core saturates and
only the winding's resistance, the supply's and any series soft-start resistance hold the current back.

    bound:    I_pk <= sqrt 2 V_high / (R_primary + R_source + R_series)          (the core taken as air)
    refined:  I_pk = sqrt 2 V_high / sqrt((2 pi f L_air)^2 + R^2) x (2 B_n + B_r - B_s) / B_n, never above the bound
    I^2 t:    one half-sine of a half-cycle, I_pk^2 / (4 f), times 1 / (1 - e^(-2 / (f tau))) for the peaks that
              follow once a cycle, decaying with tau = L_air / R (only when L_air is known)
"""

from __future__ import annotations

import dataclasses
import math
from dataclasses import dataclass

from dossier.calcs.protection import words
from dossier.calcs.protection.common import CALC_NAME, FUSEOLOGY_PULSE_CYCLES, FUSEOLOGY_WAVESHAPES, finding, measure, percent
from dossier.calcs.protection.inrush import MELTING_CURVE, fuse_melting, ntc_start_resistance, switch_ons
from dossier.calcs.protection.transformer import (
    COLD, Transformer, air_core_inductance, mains_transformers, normal_peak_flux,
)
from dossier.calcs.shared.finding_kit import not_assessed
from dossier.citations import ESP_PROJECT_39
from dossier.findings import Verdict, common_practice
from dossier.standards.fuses import half_sine_i2t, pulse_fraction, single_figure_share
from dossier.units import Q_

ESP_SOFT_START = dataclasses.replace(
    ESP_PROJECT_39, clause="the transformer's switch-on surge is worst when power is applied as the mains passes through zero and is limited then "
           "only by the wiring and winding resistance; a series resistor sized for about 200 % of full-load current, bypassed after "
           "about 100 ms (500 VA at 240 V: 2 A, 4 A, 60 ohm), dissipates V^2 / R if the bypass fails (confirmed in a public copy)",
)
HOLCOMB = common_practice(
    "transformer switch-on peak with the core saturated: I_pk = sqrt 2 V / sqrt((omega L_air)^2 + R^2) x (2 B_n + B_r - B_s) / B_n, "
    "L_air the winding's air-core inductance (J. F. Holcomb, 'Distribution transformer magnetizing inrush current', AIEE "
    "Transactions, 1961; reference and form from memory)"
)
REMANENCE_BOUND = common_practice("a core's remanence is below its saturation flux density: B_r = B_s is the bound taken when not declared")


@dataclass(frozen=True)
class Surge:
    transformer: Transformer
    peak: object
    bound: object
    refined: object | None
    i2t: object
    half_cycle: object
    resistance: object
    series: object
    series_ref: str | None
    inductance: object | None
    decay_factor: float
    remanence_assumed: bool
    assumed: tuple[str, ...]


def series_resistance(record):
    """(resistance in series with the primary at switch-on, its designator): the inrush limiter cold, else none."""
    limiter = record.protection.inrush_limiter
    if limiter is None:
        return Q_(0, "ohm"), None
    return ntc_start_resistance(record)[0], limiter.ref


def magnetising_surge(record, transformer: Transformer, series=None) -> Surge | None:
    """The surge bound of one transformer; None when its primary resistance cannot be worked out."""
    primary = transformer.primary.resistance
    if record.mains is None or primary is None:
        return None
    added, ref = series_resistance(record) if series is None else (series, None)
    source = record.protection.source_resistance
    assumed = ("protection.source_resistance",) if source is None else ()
    total = (primary + added + (source if source is not None else Q_(0, "ohm"))).to("ohm")
    crest = (record.mains.high * math.sqrt(2)).to("V")
    bound = (crest / total).to("A")
    refined, inductance, remanence_assumed = _refined(record, transformer, crest, total)
    peak = min(bound, refined) if refined is not None else bound
    frequency = record.mains.frequency
    half_cycle = (1 / (2 * frequency)).to("ms")
    decay = _decay_factor(inductance, total, frequency) if inductance is not None else 1.0
    i2t = (half_sine_i2t(peak, half_cycle) * decay).to("A**2*s")
    return Surge(transformer, peak, bound, refined, i2t, half_cycle, total, added, ref, inductance, decay, remanence_assumed, assumed)


def _refined(record, transformer: Transformer, crest, total):
    """(refined peak, air-core inductance, remanence assumed?) from the core; (None, None, False) without it."""
    material = transformer.magnetic.core.material
    if transformer.core_area is None or transformer.path_length is None:
        return None, None, False
    inductance = air_core_inductance(transformer)
    frequency = record.mains.frequency
    normal = normal_peak_flux(transformer, record.mains.high, frequency)
    saturation = material.saturation_flux.to("T")
    remanence = material.remanence.to("T") if material.remanence is not None else saturation
    factor = float(((2 * normal + remanence - saturation) / normal).to("").magnitude)
    reactance = (2 * math.pi * frequency * inductance).to("ohm")
    impedance = ((reactance**2 + total**2) ** 0.5).to("ohm")
    refined = (crest / impedance * max(factor, 0.0)).to("A")
    return refined, inductance, material.remanence is None


def _decay_factor(inductance, total, frequency) -> float:
    tau = (inductance / total).to("s").magnitude
    if tau <= 0:
        return 1.0
    return 1.0 / (1.0 - math.exp(-2.0 / (frequency.to("Hz").magnitude * tau)))


def surge_findings(record) -> list:
    if record.mains is None:
        return []
    return [_finding(record, transformer) for transformer in mains_transformers(record, COLD)]


def _finding(record, transformer: Transformer):
    surge = magnetising_surge(record, transformer)
    if surge is None:
        return not_assessed(CALC_NAME, "PROT-SURGE-TRANSFORMER", transformer.ref, "Transformer switch-on surge: not assessed",
                            words.SURGE_NOT_ASSESSED, (transformer.key("windings"),), (ESP_SOFT_START,))
    fuse = record.protection.fuse
    melting = fuse_melting(fuse, surge.half_cycle) if fuse is not None else None
    values = _values(surge)
    base = dict(code="PROT-SURGE-TRANSFORMER", subject=transformer.ref, method=words.SURGE_METHOD, keys=_keys(transformer),
                sources=_sources(surge) + ((FUSEOLOGY_WAVESHAPES, FUSEOLOGY_PULSE_CYCLES, MELTING_CURVE) if melting else ()))
    if melting is None:
        text = words.surge_text(transformer.ref, surge.peak, surge.series_ref, surge.remanence_assumed) + words.surge_no_melting(fuse.ref if fuse else None)
        return finding(title="Transformer switch-on surge (upper bound)", verdict=Verdict.INFO, values=values,
                       explanation=text + words.add_text(list(surge.assumed)), **base)
    share = pulse_fraction(switch_ons(record))
    allowed = (melting.i2t * share).to("A**2*s")
    ratio = percent((surge.i2t / melting.i2t).to(""))
    verdict = Verdict.PASS if surge.i2t <= allowed else Verdict.MARGINAL
    text = (words.surge_text(transformer.ref, surge.peak, surge.series_ref, surge.remanence_assumed)
            + words.surge_against_fuse(fuse.ref, ratio, surge.i2t >= melting.i2t, verdict is Verdict.MARGINAL)
            + words.melting_basis_text(melting.basis, melting.time, melting.share) + words.add_text(list(surge.assumed)))
    return finding(title="Transformer switch-on surge against the fuse (upper bound)", verdict=verdict,
                   values=values + (measure("fuse melting I^2 t at a half-cycle", melting.i2t), measure("pulse-cycle share", Q_(share * 100, "percent"))),
                   limit=measure(words.pulse_limit_label(percent(share), fuse.ref, surge.half_cycle, switch_ons(record)), allowed), relation="<=",
                   explanation=text, extra=(measure("surge share of the melting I^2 t", Q_(ratio, "percent")),), **base)


def _values(surge: Surge) -> tuple:
    values = (measure("switch-on surge I^2 t (upper bound)", surge.i2t), measure("peak current (upper bound)", surge.peak),
              measure("peak with the core taken as air", surge.bound), measure("resistance in the path", surge.resistance),
              measure("primary resistance (cold)", surge.transformer.primary.resistance), measure("series soft-start resistance", surge.series),
              measure("half-cycle", surge.half_cycle))
    if surge.refined is not None:
        values += (measure("peak refined from the core", surge.refined), measure("air-core inductance of the primary", surge.inductance),
                   measure("later peaks' share (decay factor)", Q_(surge.decay_factor)))
    return values


def _keys(transformer: Transformer) -> tuple:
    return (transformer.key("windings", transformer.primary.position), transformer.key("core", "material", "remanence"),
            ("protection", "source_resistance"), ("protection", "inrush_limiter"), ("protection", "fuse", "melting_curve"))


def _sources(surge: Surge) -> tuple:
    sources = (ESP_SOFT_START, HOLCOMB) if surge.refined is not None else (ESP_SOFT_START,)
    return sources + ((REMANENCE_BOUND,) if surge.remanence_assumed else ())


def needed_melting_i2t(record):
    """Smallest melting I^2 t that survives every transformer's surge bound for the unit's life; None without one."""
    needed = [s.i2t / pulse_fraction(switch_ons(record)) / single_figure_share(s.half_cycle)
              for s in (magnetising_surge(record, t) for t in mains_transformers(record, COLD)) if s is not None]
    return max(needed, key=lambda q: q.magnitude).to("A**2*s") if needed else None


def surge_fits(record) -> bool | None:
    """Whether the declared fuse survives every surge bound for the unit's life; None when not computable."""
    fuse = record.protection.fuse
    surges = [s for s in (magnetising_surge(record, t) for t in mains_transformers(record, COLD)) if s is not None]
    if not surges:
        return None
    for surge in surges:
        melting = fuse_melting(fuse, surge.half_cycle) if fuse is not None else None
        if melting is None or surge.i2t > melting.i2t * pulse_fraction(switch_ons(record)):
            return False
    return True

