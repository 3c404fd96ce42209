"""The mains fuse: running current, the recommended rating, speed, voltage rating and breaking capacity."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.protection.common import (
    FUSEOLOGY_VOLTAGE, HALF_SINE_PULSES, IEC_60127_SERIES, POWER_FACTOR, RUNNING_SOURCES, TYPICAL_EFFICIENCY,
    TYPICAL_POWER_FACTORS, add_text, finding, lowered, measure, percent,
)
from dossier.calcs.protection.inrush import minimum_melting_i2t
from dossier.calcs.protection.input import TOPOLOGY_WORDS, has_inrush, input_current
from dossier.findings import Verdict, common_practice, judge
from dossier.standards.fuses import (
    HIGH_BREAKING_CAPACITY_A, ambient_factor, ambient_in_range, marking, minimum_rating, next_preferred,
)
from dossier.units import Q_, fmt

TIME_LAG_PRACTICE = common_practice("a unit that draws a surge at switch-on (capacitor input or mains transformer) takes a time-lag fuse")
BREAKING_PRACTICE = common_practice(
    "a mains primary fuse is of high breaking capacity (1500 A, ceramic sand-filled, IEC 60127-2 'H' types); "
    "low-breaking glass types (35 A or ten times the rating) can shatter on a hard short (figures from memory)"
)
OUTPUT_KEYS = (("output",),)


@dataclass(frozen=True)
class FuseChoice:
    """The smallest preferred rating that carries the running current, with the speed and melting I^2 t it needs.

    declared_fits tells whether the record's own fuse passes the same tests (rating, speed, voltage, switch-on pulse).
    """

    rating: object | None
    speed: str
    minimum: object
    ambient: object
    minimum_melting_i2t: object | None
    declared_fits: bool = False

    @property
    def marking(self) -> str:
        return marking(self.rating, self.speed) if self.rating is not None else ""


def fuse_ambient(record):
    fuse = record.protection.fuse
    if fuse is not None and fuse.ambient is not None:
        return fuse.ambient
    return record.environment.max_ambient


def recommended_fuse(record) -> FuseChoice | None:
    """The mains fuse to fit, from the running current at low line; None without mains or a declared output."""
    running = input_current(record)
    if running is None:
        return None
    ambient = fuse_ambient(record)
    minimum = minimum_rating(running.rms, ambient)
    speed = "time-lag" if has_inrush(record) else "fast-acting"
    needed_i2t = minimum_melting_i2t(record)
    fits = _declared_fits(record, minimum, speed, needed_i2t)
    return FuseChoice(next_preferred(minimum), speed, minimum, ambient, needed_i2t, fits)


def _declared_fits(record, minimum, speed: str, needed_i2t) -> bool:
    """Whether the declared fuse also does the job: rating, speed, voltage and (where known) switch-on pulse."""
    fuse = record.protection.fuse
    if fuse is None or fuse.rating < minimum or fuse.speed != speed or fuse.voltage_rating < record.mains.nominal:
        return False
    if needed_i2t is None:
        return True
    return fuse.melting_i2t is not None and fuse.melting_i2t >= needed_i2t


def fuse_findings(record) -> list:
    if record.mains is None:
        return []
    found = [_input_current_finding(record), *_rating_findings(record)]
    fuse = record.protection.fuse
    if fuse is not None:
        found += [_speed_finding(record, fuse), _voltage_finding(record, fuse), _breaking_finding(fuse)]
    return found


def _input_current_finding(record):
    running = input_current(record)
    if running is None:
        return finding(code="PROT-INPUT-CURRENT", subject="mains input", title="Mains input current not computed", verdict=Verdict.INFO,
                       explanation="The input current comes from the output power." + add_text(["output (voltage, current, efficiency, power_factor)"]),
                       keys=OUTPUT_KEYS, sources=(POWER_FACTOR,))
    values = (
        measure("RMS input current at low line", running.rms),
        measure("peak input current at low line", running.peak),
        measure("input power", running.input_power),
        measure("low line", running.low_line),
        measure("power factor", Q_(running.power_factor)),
        measure("efficiency", Q_(running.efficiency * 100, "percent")),
    )
    return finding(code="PROT-INPUT-CURRENT", subject="mains input", title="Mains input current at low line", verdict=Verdict.INFO,
                   values=values, method="I_rms = P_out / (efficiency x power factor x V_low); I_pk = I_rms sqrt(2 pi / conduction angle)",
                   explanation=_input_text(running), keys=OUTPUT_KEYS, sources=_input_sources(running))


def _input_text(running) -> str:
    text = f"Input: {TOPOLOGY_WORDS[running.topology]}; at low line the unit draws {fmt(running.input_power)}."
    if running.assumed:
        text += " Typical values were used for what is not declared." + add_text(list(running.assumed))
    return text


def _input_sources(running) -> tuple:
    sources = [POWER_FACTOR, HALF_SINE_PULSES]
    if any("power_factor" in key for key in running.assumed):
        sources.append(TYPICAL_POWER_FACTORS)
    if any("efficiency" in key for key in running.assumed):
        sources.append(TYPICAL_EFFICIENCY)
    return tuple(sources)


def _rating_findings(record) -> list:
    fuse = record.protection.fuse
    choice = recommended_fuse(record)
    if fuse is None:
        return [_no_fuse(choice)] + ([_recommendation_finding(record, choice)] if choice else [])
    if choice is None:
        return [finding(code="PROT-FUSE-RATING", subject=fuse.ref, title="Mains fuse rating not checked", verdict=Verdict.INFO,
                        values=(measure("declared rating", fuse.rating),), explanation="The running current is unknown." + add_text(["output (voltage, current)"]),
                        keys=(("protection", "fuse", "rating"),), sources=RUNNING_SOURCES)]
    return [_rating_finding(record, fuse, choice), _recommendation_finding(record, choice)]


def _no_fuse(choice):
    fit = f" Fit a {choice.marking} fuse in the line conductor." if choice and choice.rating is not None else ""
    text = ("No mains fuse is declared. Without one, a short inside the unit is cleared only by the building's breaker, "
            "which is sized for the wiring, not for this unit: parts can burn before it trips." + fit)
    return finding(code="PROT-FUSE-RATING", subject="mains input", title="No mains fuse", verdict=Verdict.FAIL,
                   explanation=text + add_text(["protection.fuse"]), keys=(("protection",),), sources=RUNNING_SOURCES)


def _rating_finding(record, fuse, choice: FuseChoice):
    running = input_current(record)
    verdict = lowered(judge(fuse.rating, choice.minimum, ">="), list(running.assumed))
    return finding(code="PROT-FUSE-RATING", subject=fuse.ref, title="Mains fuse rating against the running current", verdict=verdict,
                   values=_rating_values(fuse, running, choice),
                   limit=measure(f"running current / (75 % x {percent(ambient_factor(choice.ambient))} % re-rating at {fmt(choice.ambient)})", choice.minimum),
                   method="I_rating >= I_rms / (0.75 x re-rating(ambient)); re-rating = 1 - 0.005/K (T - 25 degC)",
                   explanation=_rating_text(fuse, running, choice) + add_text(list(running.assumed)),
                   keys=(("protection", "fuse", "rating"),), sources=RUNNING_SOURCES)


def _rating_values(fuse, running, choice: FuseChoice) -> tuple:
    values = (measure("declared rating", fuse.rating.to("A")), measure("running current at low line", running.rms))
    return values + ((measure("recommended rating", choice.rating),) if choice.rating is not None else ())


def _rating_text(fuse, running, choice: FuseChoice) -> str:
    load = percent((running.rms / fuse.rating).to(""))
    text = f"{fuse.ref} runs at {load} % of its rating at low line."
    if load > 75:
        text += " Above 75 % a fuse runs hot, ages and opens in normal use."
    if not ambient_in_range(choice.ambient):
        text += " The ambient is beyond the re-rating line's range (100 degC): use the maker's curve."
    return text


def _recommendation_finding(record, choice: FuseChoice):
    if choice.rating is None:
        return finding(code="PROT-FUSE-RECOMMENDED", subject="mains fuse", title="No miniature fuse rating is large enough", verdict=Verdict.INFO,
                       values=(measure("smallest rating for the running current", choice.minimum),),
                       explanation="The running current needs more than 10 A, the top of the IEC 60127 series: use a larger fuse type.",
                       sources=(IEC_60127_SERIES,) + RUNNING_SOURCES)
    values = (measure("recommended rating", choice.rating), measure("marking", choice.marking), measure("speed", choice.speed))
    if choice.minimum_melting_i2t is not None:
        values += (measure("melting I^2 t at least", choice.minimum_melting_i2t),)
    return finding(code="PROT-FUSE-RECOMMENDED", subject="mains fuse", title=f"Fit {choice.marking}", verdict=Verdict.INFO, values=values,
                   method="smallest IEC 60127 preferred rating >= I_rms / (0.75 x re-rating); melting I^2 t >= pulse I^2 t / pulse-cycle share",
                   explanation=_recommendation_text(choice, record.protection.inrush_limiter is None) + _declared_text(record, choice),
                   keys=(("protection", "fuse"),),
                   sources=(IEC_60127_SERIES,) + RUNNING_SOURCES + (TIME_LAG_PRACTICE,))


def _recommendation_text(choice: FuseChoice, unlimited: bool) -> str:
    text = f"The smallest preferred rating that carries the running current is {fmt(choice.rating)} ({choice.speed})."
    if choice.minimum_melting_i2t is not None:
        text += f" Choose a type whose melting I^2 t is at least {fmt(choice.minimum_melting_i2t)}, so the switch-on surge does not wear it out"
        text += " (or fit an inrush limiter, which shrinks the surge)." if unlimited else "."
    return text


def _declared_text(record, choice: FuseChoice) -> str:
    fuse = record.protection.fuse
    if fuse is None:
        return ""
    declared = marking(fuse.rating, fuse.speed)
    if choice.declared_fits:
        return f" The declared {fuse.ref} ({declared}) also passes these checks."
    return f" The declared {fuse.ref} ({declared}) does not pass all of them: see the other findings for {fuse.ref}."


def _speed_finding(record, fuse):
    wanted = "time-lag" if has_inrush(record) else fuse.speed
    verdict = Verdict.MARGINAL if fuse.speed != wanted else Verdict.PASS
    text = (f"{fuse.ref} is fast-acting, but the unit draws a surge at every switch-on; a time-lag fuse carries the surge "
            "and still opens on a lasting fault." if verdict is Verdict.MARGINAL else f"{fuse.ref} is {fuse.speed}.")
    return finding(code="PROT-FUSE-SPEED", subject=fuse.ref, title="Mains fuse speed", verdict=verdict,
                   values=(measure("declared speed", fuse.speed),), explanation=text,
                   keys=(("protection", "fuse", "speed"),), sources=(TIME_LAG_PRACTICE,))


def _voltage_finding(record, fuse):
    verdict = judge(fuse.voltage_rating, record.mains.nominal, ">=")
    text = "A fuse rated below the circuit voltage may not quench the arc when it opens."
    return finding(code="PROT-FUSE-VOLTAGE", subject=fuse.ref, title="Mains fuse voltage rating", verdict=verdict,
                   values=(measure("fuse voltage rating", fuse.voltage_rating),), limit=measure("nominal mains voltage", record.mains.nominal),
                   method="V_rating >= V_mains (nominal RMS)", explanation=text if verdict is Verdict.FAIL else "",
                   keys=(("protection", "fuse", "voltage_rating"),), sources=(FUSEOLOGY_VOLTAGE,))


def _breaking_finding(fuse):
    if fuse.breaking_capacity is None:
        return finding(code="PROT-FUSE-BREAKING", subject=fuse.ref, title="Mains fuse breaking capacity", verdict=Verdict.INFO,
                       explanation="The breaking capacity is marked on the fuse (H for high, L for low) and given in its data." + add_text(["protection.fuse.breaking_capacity"]),
                       keys=(("protection", "fuse"),), sources=(BREAKING_PRACTICE,))
    high = Q_(HIGH_BREAKING_CAPACITY_A, "A").to("kA")
    verdict = Verdict.PASS if fuse.breaking_capacity >= high else Verdict.MARGINAL
    return finding(code="PROT-FUSE-BREAKING", subject=fuse.ref, title="Mains fuse breaking capacity", verdict=verdict,
                   values=(measure("breaking capacity", fuse.breaking_capacity.to("kA")),), limit=measure("high breaking capacity", high),
                   method="breaking capacity >= 1500 A on a mains primary", explanation=_breaking_text(fuse, verdict),
                   keys=(("protection", "fuse", "breaking_capacity"),), sources=(BREAKING_PRACTICE,))


def _breaking_text(fuse, verdict: Verdict) -> str:
    if verdict is Verdict.PASS:
        return ""
    body = "glass " if fuse.body == "glass" else ""
    return (f"{fuse.ref} is a low-breaking {body}fuse. A short across the mains can drive more current than it can interrupt; "
            "it may arc or shatter instead of clearing. Common practice on a mains primary is a ceramic, sand-filled, high-breaking type.")
