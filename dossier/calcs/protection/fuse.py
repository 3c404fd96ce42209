"""The mains fuse: running current, the recommended rating, speed, voltage rating and breaking capacity."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.protection import words
from dossier.calcs.shared.enclosure_air import INTERNAL_RISE, internal_ambient
from dossier.calcs.protection.common import (
    CAPACITOR_INPUT_POWER_FACTOR, FUSEOLOGY_VOLTAGE, HALF_SINE_PULSES, IEC_60127_SERIES, OTHER_POWER_FACTORS,
    PLAUSIBLE_EFFICIENCY, POWER_FACTOR, RUNNING_SOURCES, finding, measure, percent,
)
from dossier.calcs.protection.inrush import minimum_melting_i2t, pulse_fits
from dossier.calcs.shared.input_current import LEAST, LOAD_MODELS, has_inrush, input_current
from dossier.calcs.protection.surge import needed_melting_i2t, surge_fits
from dossier.findings import Verdict, common_practice, judge
from dossier.standards.fuses import (
    HIGH_BREAKING_CAPACITY_A, ambient_factor, ambient_in_range, marking, minimum_rating, next_preferred,
)
from dossier.units import Q_

TIME_LAG_PRACTICE = common_practice("a unit that draws a surge at switch-on (capacitor input or mains transformer) takes a time-lag fuse")
BREAKING_PRACTICE = common_practice(
    "a mains primary fuse is of high breaking capacity (1500 A, ceramic sand-filled, IEC 60127-2 'H' types); "
    "low-breaking glass types (35 A or ten times the rating) can shatter on a hard short (figures from memory)"
)
OUTPUT_KEYS = (("output",),)
OVERSIZE_MULTIPLE = 3.0
OVERSIZE_WIRING = common_practice(
    "the mains fuse protects the inlet, cord, switch and wiring behind it, so it is rated no higher than the smallest of them (from memory)"
)
OVERSIZE_RUNNING = common_practice(
    "a mains fuse no more than about 3 times the smallest rating that carries the running current, so an overload inside the unit "
    "still blows it (from memory)"
)


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
    surge_blows_declared: bool = False  # the declared fuse does not survive a mains transformer's switch-on surge bound
    transformer_i2t: object | None = None  # the melting I^2 t a mains transformer's switch-on surge bound alone needs

    @property
    def marking(self) -> str:
        return marking(self.rating, self.speed) if self.rating is not None else ""


def fuse_ambient(record):
    """(air temperature at the fuse, assumed?): the fuse's own, else the enclosure's inside air."""
    fuse = record.protection.fuse
    if fuse is not None and fuse.ambient is not None:
        return fuse.ambient, False
    return internal_ambient(record)


def recommended_fuse(record) -> FuseChoice | None:
    """The mains fuse to fit, from the running current at low line; None without mains or a declared output."""
    running = input_current(record)
    if running is None:
        return None
    ambient, _ = fuse_ambient(record)
    minimum = minimum_rating(running.rms, ambient)
    speed = "time-lag" if has_inrush(record) else "fast-acting"
    transformer = needed_melting_i2t(record)
    needed_i2t = combined_i2t(minimum_melting_i2t(record), transformer)
    fits = _declared_fits(record, minimum, speed)
    return FuseChoice(next_preferred(minimum), speed, minimum, ambient, needed_i2t, fits, surge_fits(record) is False, transformer)


def combined_i2t(capacitor, transformer):
    """The melting I^2 t two surges at the same switch-on need together: at most (sqrt a + sqrt b)^2 (Minkowski's inequality)."""
    found = [q.to("A**2*s").magnitude for q in (capacitor, transformer) if q is not None]
    if not found:
        return None
    return Q_(sum(value**0.5 for value in found) ** 2, "A**2*s")


def _declared_fits(record, minimum, speed: str) -> bool:
    """Whether the declared fuse also does the job: rating, speed, voltage and (where known) switch-on pulse."""
    fuse = record.protection.fuse
    if fuse is None or fuse.rating < minimum or fuse.speed != speed or fuse.voltage_rating < record.mains.nominal:
        return False
    return pulse_fits(record) is not False and surge_fits(record) is not False


def fuse_findings(record, choice: FuseChoice | None) -> list:
    """The mains-fuse findings, given the recommendation worked out once for the whole calc."""
    if record.mains is None:
        return []
    found = [_input_current_finding(record), *_rating_findings(record, choice)]
    fuse = record.protection.fuse
    if fuse is not None:
        found += [_speed_finding(record, fuse), _voltage_finding(record, fuse), _breaking_finding(fuse)]
    return found


def _input_current_finding(record):
    running = input_current(record)
    if running is None:
        return finding(code="PROT-INPUT-CURRENT", subject="mains input", title="Mains input current not computed", verdict=Verdict.INFO,
                       explanation=words.INPUT_NOT_COMPUTED + words.add_text(["output (voltage, current, efficiency, power_factor)"]),
                       keys=OUTPUT_KEYS, sources=(POWER_FACTOR,))
    line = running.line_name
    values = (
        measure(f"RMS input current at {line} line", running.rms),
        measure(f"peak input current at {line} line", running.peak),
        measure("input power", running.input_power),
        measure(f"{line} line", running.low_line),
        measure("load model", running.load_kind),
        measure("power factor", Q_(running.power_factor)),
        measure("efficiency", Q_(running.efficiency * 100, "percent")),
        measure("crest factor", Q_((running.peak / running.rms).to("").magnitude)),
    )
    return finding(code="PROT-INPUT-CURRENT", subject="mains input", title=f"Mains input current at {line} line", verdict=Verdict.INFO,
                   values=values, method=f"P_in = P_out / efficiency; {LOAD_MODELS[running.load_kind]}; "
                                         + ("I_pk = sqrt 2 I_rms" if running.peak_model == "sine" else "I_pk = I_rms sqrt(2 pi / conduction angle)"),
                   explanation=words.input_text(words.TOPOLOGY_WORDS[running.topology], running.input_power, line)
                   + words.load_text(running.load_kind, line, running.load_assumed)
                   + words.assumed_text(running.assumed, words.MORE_CURRENT),
                   keys=OUTPUT_KEYS, sources=_input_sources(running))


def _input_sources(running) -> tuple:
    sources = [POWER_FACTOR, HALF_SINE_PULSES]
    if any("power_factor" in key for key in running.assumed):
        sources += [CAPACITOR_INPUT_POWER_FACTOR, OTHER_POWER_FACTORS]
    if any("efficiency" in key for key in running.assumed):
        sources.append(PLAUSIBLE_EFFICIENCY)
    return tuple(sources)


def _rating_findings(record, choice: FuseChoice | None) -> list:
    fuse = record.protection.fuse
    if fuse is None:
        return [_no_fuse(choice)] + ([_recommendation_finding(record, choice)] if choice else [])
    oversize = _oversize_finding(record, fuse)
    if choice is None:
        return [finding(code="PROT-FUSE-RATING", subject=fuse.ref, title="Mains fuse rating not checked", verdict=Verdict.INFO,
                        values=(measure("declared rating", fuse.rating),), explanation=words.RUNNING_UNKNOWN + words.add_text(["output (voltage, current)"]),
                        keys=(("protection", "fuse", "rating"),), sources=RUNNING_SOURCES), oversize]
    return [_rating_finding(record, fuse, choice), oversize, _recommendation_finding(record, choice)]


def _no_fuse(choice):
    fit = choice.marking if choice and choice.rating is not None else None
    return finding(code="PROT-FUSE-RATING", subject="mains input", title="No mains fuse", verdict=Verdict.FAIL,
                   explanation=words.no_fuse_text(fit) + words.add_text(["protection.fuse"]), keys=(("protection",),), sources=RUNNING_SOURCES)


def _rating_finding(record, fuse, choice: FuseChoice):
    """Judged at the plausible reading that gives the most current when the record is silent: never lowered to info."""
    running = input_current(record)
    _, ambient_assumed = fuse_ambient(record)
    explanation = (words.rating_text(fuse.ref, percent((running.rms / fuse.rating).to("")), ambient_in_range(choice.ambient))
                   + words.assumed_text(running.assumed, words.MORE_CURRENT) + words.fuse_ambient_text(choice.ambient, ambient_assumed))
    return finding(code="PROT-FUSE-RATING", subject=fuse.ref, title="Mains fuse rating against the running current",
                   verdict=judge(fuse.rating, choice.minimum, ">="), values=_rating_values(fuse, running, choice),
                   limit=measure(words.rating_limit_label(percent(ambient_factor(choice.ambient)), choice.ambient), choice.minimum),
                   method="I_rating >= I_rms / (0.75 x re-rating(ambient)); re-rating = 1 - 0.005/K (T - 25 degC)",
                   explanation=explanation, keys=(("protection", "fuse", "rating"), ("output", "power_factor")),
                   sources=RUNNING_SOURCES + _ambient_sources(ambient_assumed))


def _ambient_sources(assumed: bool) -> tuple:
    return (INTERNAL_RISE,) if assumed else ()


def _rating_values(fuse, running, choice: FuseChoice) -> tuple:
    values = (measure("declared rating", fuse.rating.to("A")), measure("running current at low line", running.rms),
              measure("power factor", Q_(running.power_factor)), measure("efficiency", Q_(running.efficiency * 100, "percent")),
              measure("air at the fuse", choice.ambient), measure("ambient re-rating", Q_(ambient_factor(choice.ambient))))
    return values + ((measure("recommended rating", choice.rating),) if choice.rating is not None else ())


def _oversize_finding(record, fuse):
    """The fuse is no larger than what it protects: the declared wiring, else a multiple of the least plausible running current."""
    wiring = declared_wiring(record.protection.wiring)
    least = input_current(record, LEAST)
    if least is None and not wiring:
        return finding(code="PROT-FUSE-OVERSIZE", subject=fuse.ref, title="Mains fuse not too large: not assessed",
                       verdict=Verdict.NOT_ASSESSED, guards_hazard=True,  # mains protection that cannot be judged blocks power-up
                       values=(measure("declared rating", fuse.rating.to("A")),), explanation=words.OVERSIZE_NOT_ASSESSED,
                       keys=(("protection", "fuse", "rating"), ("protection", "wiring"), ("output",)), sources=(OVERSIZE_WIRING,))
    if wiring:
        part, rated = min(wiring.items(), key=lambda item: item[1])
        if fuse.rating > rated:
            return _oversize(fuse, Verdict.FAIL, measure(f"{part} rating", rated), words.oversize_wiring_text(fuse.ref, part),
                             (("protection", "wiring", part),), (OVERSIZE_WIRING,))
    if least is None:
        return _oversize(fuse, Verdict.PASS, measure(f"{part} rating", rated), "", (("protection", "wiring", part),), (OVERSIZE_WIRING,))
    return _oversize_running(record, fuse, least, bool(wiring))


def declared_wiring(wiring) -> dict:
    if wiring is None:
        return {}
    named = {name: getattr(wiring, name) for name in type(wiring).model_fields}
    return {name: value for name, value in named.items() if value is not None}


def _oversize_running(record, fuse, least, wiring_declared: bool):
    ambient, _ = fuse_ambient(record)
    bound = (OVERSIZE_MULTIPLE * minimum_rating(least.rms, ambient)).to("A")
    too_big = fuse.rating > bound
    verdict = (Verdict.MARGINAL if wiring_declared else Verdict.FAIL) if too_big else Verdict.PASS
    text = words.oversize_running_text(fuse.ref, OVERSIZE_MULTIPLE, wiring_declared) if too_big else ""
    text += words.assumed_text(least.assumed, words.LESS_CURRENT)
    values = (measure(f"least plausible running current at {least.line_name} line", least.rms),)
    return _oversize(fuse, verdict, measure(f"{OVERSIZE_MULTIPLE:g} x the smallest rating that carries it", bound), text,
                     (("protection", "wiring"), ("output",)), (OVERSIZE_RUNNING, OVERSIZE_WIRING) + RUNNING_SOURCES, values)


def _oversize(fuse, verdict, limit, text: str, keys: tuple, sources: tuple, values: tuple = ()):
    return finding(code="PROT-FUSE-OVERSIZE", subject=fuse.ref, title="Mains fuse not larger than what it protects", verdict=verdict,
                   values=(measure("declared rating", fuse.rating.to("A")),) + values, limit=limit, relation="<=",
                   method="I_rating <= smallest declared rating of inlet, cord, switch, internal wiring; "
                          "I_rating <= 3 x I_rms,least / (0.75 x re-rating(ambient))",
                   explanation=text.strip(), keys=(("protection", "fuse", "rating"),) + keys, sources=sources)


def _recommendation_finding(record, choice: FuseChoice):
    if choice.rating is None:
        return finding(code="PROT-FUSE-RECOMMENDED", subject="mains fuse", title="No miniature fuse rating is large enough", verdict=Verdict.INFO,
                       values=(measure("smallest rating for the running current", choice.minimum),),
                       explanation=words.NO_MINIATURE_RATING, sources=(IEC_60127_SERIES,) + RUNNING_SOURCES)
    values = (measure("recommended rating", choice.rating), measure("marking", choice.marking), measure("speed", choice.speed),
              measure("smallest rating for the running current", choice.minimum))
    if choice.minimum_melting_i2t is not None:
        values += (measure("melting I^2 t at least", choice.minimum_melting_i2t),)
    return finding(code="PROT-FUSE-RECOMMENDED", subject="mains fuse", title=f"Fit {choice.marking}", verdict=Verdict.INFO, values=values,
                   method="smallest IEC 60127 preferred rating >= I_rms / (0.75 x re-rating); melting I^2 t >= pulse I^2 t / pulse-cycle share",
                   explanation=words.recommendation_text(choice.rating, choice.speed, choice.minimum_melting_i2t, record.protection.inrush_limiter is None)
                   + _declared_text(record, choice),
                   keys=(("protection", "fuse"),),
                   sources=(IEC_60127_SERIES,) + RUNNING_SOURCES + (TIME_LAG_PRACTICE,))


def _declared_text(record, choice: FuseChoice) -> str:
    fuse = record.protection.fuse
    if fuse is None:
        return ""
    return words.declared_fits_text(fuse.ref, marking(fuse.rating, fuse.speed), choice.declared_fits)


def _speed_finding(record, fuse):
    wanted = "time-lag" if has_inrush(record) else fuse.speed
    verdict = Verdict.MARGINAL if fuse.speed != wanted else Verdict.PASS
    return finding(code="PROT-FUSE-SPEED", subject=fuse.ref, title="Mains fuse speed", verdict=verdict,
                   values=(measure("declared speed", fuse.speed),), explanation=words.speed_text(fuse.ref, fuse.speed, verdict is Verdict.MARGINAL),
                   keys=(("protection", "fuse", "speed"),), sources=(TIME_LAG_PRACTICE,))


def _voltage_finding(record, fuse):
    verdict = judge(fuse.voltage_rating, record.mains.nominal, ">=")
    return finding(code="PROT-FUSE-VOLTAGE", subject=fuse.ref, title="Mains fuse voltage rating", verdict=verdict,
                   values=(measure("fuse voltage rating", fuse.voltage_rating),), limit=measure("nominal mains voltage", record.mains.nominal),
                   method="V_rating >= V_mains (nominal RMS)", explanation=words.FUSE_VOLTAGE_LOW if verdict is Verdict.FAIL else "",
                   keys=(("protection", "fuse", "voltage_rating"),), sources=(FUSEOLOGY_VOLTAGE,))


def _breaking_finding(fuse):
    if fuse.breaking_capacity is None:
        return finding(code="PROT-FUSE-BREAKING", subject=fuse.ref, title="Mains fuse breaking capacity", verdict=Verdict.INFO,
                       explanation=words.BREAKING_UNKNOWN + words.add_text(["protection.fuse.breaking_capacity"]),
                       keys=(("protection", "fuse"),), sources=(BREAKING_PRACTICE,))
    high = Q_(HIGH_BREAKING_CAPACITY_A, "A").to("kA")
    verdict = Verdict.PASS if fuse.breaking_capacity >= high else Verdict.MARGINAL
    return finding(code="PROT-FUSE-BREAKING", subject=fuse.ref, title="Mains fuse breaking capacity", verdict=verdict,
                   values=(measure("breaking capacity", fuse.breaking_capacity.to("kA")),), limit=measure("high breaking capacity", high),
                   method="breaking capacity >= 1500 A on a mains primary",
                   explanation="" if verdict is Verdict.PASS else words.breaking_text(fuse.ref, fuse.body == "glass"),
                   keys=(("protection", "fuse", "breaking_capacity"),), sources=(BREAKING_PRACTICE,))
