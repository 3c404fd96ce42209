"""What the mains fuse must also do beyond carrying the running current: protect the transformer's primary, clear a
secondary short; and whether the rectifier survives the capacitor-charging surge.

    primary        I_fuse <= 2 x I_primary,rated            I_primary,rated = VA / V_nominal (or the primary's declared current)
    secondary short I_sc = V_low / (R_source + R_primary + R_secondary (N_p / N_s)^2), windings hot;
                   I_sc >= 10 I_fuse clears within about 0.3 s, >= 4 I_fuse within about 3 s, below that a thermal fuse must
    rectifier      pulse I^2 t k^2 <= I^2 t rating (or I_FSM^2 t_FSM / 2); peak <= I_FSM, k the share of the primary
                   pulse its own banks draw, referred to their winding (bridge_scale)
"""

from __future__ import annotations

import dataclasses
import math

from dossier.calcs.protection import words
from dossier.calcs.protection.common import CALC_NAME, finding, measure
from dossier.calcs.protection.inrush import cold_pulse, referred_capacitance
from dossier.calcs.protection.transformer import HOT, mains_transformers, referred, rated_primary_current
from dossier.calcs.shared.finding_kit import not_assessed
from dossier.calcs.shared.stage_graph import rectifier_of
from dossier.citations import IEC_60127_1
from dossier.findings import Verdict, common_practice, judge
from dossier.standards.fuses import half_sine_i2t
from dossier.units import Q_

PRIMARY_MULTIPLE = 2.0
PRIMARY_PRACTICE = common_practice(
    "a mains transformer's primary fuse no more than about twice its rated primary current, so an overload of the transformer "
    "opens it (transformer makers' guidance; figure from memory). For comparison, NFPA 70 Table 450.3(B) allows 167 % for "
    "primary-only protection of a 2 to 9 A premises transformer (confirmed in a public reproduction)"
)
TIME_LAG_SHEET = dataclasses.replace(
    IEC_60127_1, title="IEC 60127-2, Miniature fuses - Part 2: Cartridge fuse-links",
    edition="edition 3.0, 2014 (edition from memory)",
    clause="standard sheets for time-lag fuse-links: pre-arcing time at most about 0.3 s at 10 I_n and 3 s at 4 I_n (figures from memory)",
)
SHORT_ESTIMATE = common_practice(
    "a secondary short draws V / (R_source + R_primary + R_secondary referred); the leakage reactance, small in a toroid, is left out "
    "(from memory), so the current is a little high: the windings are taken hot and the mains at low line to keep it on the low side"
)
FAST_MULTIPLE, SLOW_MULTIPLE = 10.0, 4.0
JEDEC_SURGE = common_practice(
    "a rectifier's I_FSM is one half-sine of 8.3 ms (JEDEC method); its I^2 t for fusing is I_FSM^2 x 8.3 ms / 2 (e.g. a bridge "
    "data sheet's 50 A I_FSM beside 10 A^2 s); a charging pulse on the secondary is the primary's scaled by the turns ratio"
)
DEFAULT_SURGE_TIME = Q_(8.3, "ms")


def bound_findings(record) -> list:
    if record.mains is None:
        return []
    found = []
    fuse = record.protection.fuse
    transformers = mains_transformers(record, HOT)
    if fuse is not None and transformers:
        found += [_primary(record, fuse, transformers), _secondary_short(record, fuse, transformers)]
    return found + _bridges(record)


def _primary(record, fuse, transformers):
    title = "Mains fuse against the transformer's rated primary current"
    rated = [rated_primary_current(record, t) for t in transformers]
    unknown = [t.ref for t, (current, _) in zip(transformers, rated) if current is None]
    if unknown:
        return not_assessed(CALC_NAME, "PROT-FUSE-PRIMARY", fuse.ref, title, words.primary_unknown(unknown),
                            tuple(t.key("rated_power") for t in transformers), (PRIMARY_PRACTICE,), guards_hazard=True)
    total = sum((current for current, _ in rated), Q_(0, "A")).to("A")
    limit = (PRIMARY_MULTIPLE * total).to("A")
    verdict = judge(fuse.rating, limit, "<=")
    return finding(code="PROT-FUSE-PRIMARY", subject=fuse.ref, title=title, verdict=verdict, guards_hazard=True,
                   values=(measure("declared rating", fuse.rating.to("A")), measure("rated primary current", total)),
                   limit=measure(f"{PRIMARY_MULTIPLE:g} x the rated primary current", limit), relation="<=",
                   method="I_fuse <= 2 x sum(VA / V_nominal) of the mains transformers",
                   explanation=words.primary_text(fuse.ref, verdict is Verdict.FAIL, [basis for _, basis in rated]),
                   keys=(("protection", "fuse", "rating"),) + tuple(t.key("rated_power") for t in transformers), sources=(PRIMARY_PRACTICE,))


def short_current(record, transformer):
    """(current, winding name) of the secondary whose short draws the least, at low line with hot windings; None if unknown."""
    primary = transformer.primary.resistance
    source = record.protection.source_resistance or Q_(0, "ohm")
    found = []
    for winding in transformer.secondaries:
        seen = referred(winding, transformer.primary)
        if primary is None or seen is None:
            return None
        found.append(((record.mains.low / (source + primary + seen)).to("A"), winding.name))
    return min(found, key=lambda item: item[0].magnitude) if found else None


def _secondary_short(record, fuse, transformers):
    title = "Mains fuse clears a secondary short"
    shorts = [(t, short_current(record, t)) for t in transformers]
    unknown = [t.ref for t, short in shorts if short is None]
    if unknown:
        return not_assessed(CALC_NAME, "PROT-FUSE-SHORT", fuse.ref, title, words.short_unknown(unknown),
                            tuple(t.key("windings") for t in transformers), (SHORT_ESTIMATE,), guards_hazard=True)
    transformer, (current, name) = min(shorts, key=lambda item: item[1][0].magnitude)
    multiple = float((current / fuse.rating).to("").magnitude)
    thermal = record.protection.thermal_fuse
    verdict = Verdict.PASS if multiple >= FAST_MULTIPLE else Verdict.MARGINAL if multiple >= SLOW_MULTIPLE else Verdict.FAIL
    if verdict is not Verdict.PASS and thermal is not None:
        verdict = Verdict.PASS
    return finding(code="PROT-FUSE-SHORT", subject=fuse.ref, title=title, verdict=verdict, guards_hazard=True,
                   values=(measure(f"short-circuit current of {transformer.ref} {name}", current), measure("multiple of the fuse rating", Q_(round(multiple, 2))),
                           measure("fuse rating", fuse.rating.to("A"))),
                   limit=measure(f"{FAST_MULTIPLE:g} x the fuse rating (clears within about 0.3 s)", (FAST_MULTIPLE * fuse.rating).to("A")), relation=">=",
                   method="I_sc = V_low / (R_source + R_p + R_s (N_p/N_s)^2), windings at 105 degC; >= 10 I_n pass, >= 4 I_n marginal",
                   explanation=words.short_text(fuse.ref, transformer.ref, name, multiple, thermal.ref if thermal and thermal.ref else ("the thermal fuse" if thermal else None)),
                   keys=(("protection", "fuse", "rating"), ("protection", "thermal_fuse"), transformer.key("windings")),
                   sources=(SHORT_ESTIMATE, TIME_LAG_SHEET))


def secondary_scale(record) -> float:
    """How much larger a charging pulse is on the secondary: the primary's crest over the lowest bank's voltage; 1 with no bank."""
    banks = record.protection.secondary_banks
    if not banks:
        return 1.0
    lowest = min((bank.voltage for bank in banks), key=lambda v: v.magnitude)
    return float((record.mains.nominal * math.sqrt(2) / lowest).to("").magnitude)


def _bridges(record) -> list:
    bridges = [(i, d) for i, d in enumerate(record.devices.semiconductors) if d.kind == "bridge"]
    pulse = cold_pulse(record) if bridges else None
    if pulse is None:
        return []
    out = []
    for index, device in bridges:
        scale, banks = bridge_scale(record, device.ref)
        out.append(_bridge(index, device, (pulse.peak * scale).to("A"), (pulse.i2t * scale**2).to("A**2*s"), scale, banks))
    return out


def bridge_scale(record, ref: str) -> tuple[float, tuple]:
    """(how much of the primary pulse, referred to the secondary, one diode of bridge ref carries; the banks it charges).

    Every bank charges in the same time constant, so bank k draws the share C_k,ref / C_ref of the primary pulse,
    and on its winding that share times V_pri,pk / V_k (C_k,ref = C_k (V_k / V_pri,pk)^2). A bridge feeding a + and
    a - bank from its centre charges each through its own diodes: the worst diode carries the larger polarity's sum.
    Banks are tied to the bridge through their rail (secondary_banks[].name = rails[].name, the rail's stage and the
    rectifier above it); when none is, the whole pulse at the lowest bank's ratio (the harsher reading)."""
    banks = [(bank, polarity) for bank, polarity, bridge in _bank_bridges(record) if ref in bridge]
    total = referred_capacitance(record)
    if not banks or total is None or total.magnitude <= 0:
        return secondary_scale(record), ()
    crest = record.mains.nominal * math.sqrt(2)
    by_polarity: dict[str, float] = {}
    for bank, polarity in banks:
        share = float((bank.capacitance * (bank.voltage / crest) ** 2 / total).to("").magnitude)
        by_polarity[polarity] = by_polarity.get(polarity, 0.0) + share * float((crest / bank.voltage).to("").magnitude)
    return max(by_polarity.values()), tuple(bank.name for bank, _ in banks)


def _bank_bridges(record):
    """(bank, its rail's polarity, refs of the bridges in the rectifier above its rail) for each bank tied to a rail."""
    rails = {rail.name: rail for rail in record.rails}
    for bank in record.protection.secondary_banks:
        rail = rails.get(bank.name)
        found = rectifier_of(record, rail.stage) if rail is not None else None
        if found is not None:
            yield bank, rail.polarity, {part.ref for part in found[1].parts}


def _bridge(index: int, device, peak, i2t, scale: float, banks: tuple):
    title = "Rectifier surge rating against the charging pulse"
    key = ("devices", "semiconductors", index)
    values = (measure("charging-pulse I^2 t through it", i2t), measure("charging-pulse peak through it", peak), measure("turns-ratio scale", Q_(round(scale, 3))))
    banks_measure = (measure("banks it charges", ", ".join(banks) if banks else "not tied to a rail: the whole pulse"),)
    if device.surge_current is None and device.surge_i2t is None:
        return finding(code="PROT-BRIDGE-SURGE", subject=device.ref, title=title, verdict=Verdict.INFO, values=values,
                       explanation=words.BRIDGE_UNKNOWN + words.add_text([f"devices.semiconductors[{index}].surge_current (I_FSM) and surge_i2t"]),
                       keys=(key,), sources=(JEDEC_SURGE,), extra=banks_measure)
    rated, basis = _rated_i2t(device)
    verdict = judge(i2t, rated, "<=")
    over_peak = device.surge_current is not None and peak > device.surge_current
    if verdict is Verdict.PASS and over_peak:
        verdict = Verdict.MARGINAL
    extra = ((measure("I_FSM", device.surge_current),) if device.surge_current is not None else ()) + banks_measure
    return finding(code="PROT-BRIDGE-SURGE", subject=device.ref, title=title, verdict=verdict, values=values, extra=extra,
                   limit=measure(f"{device.ref} I^2 t ({basis})", rated), relation="<=",
                   method="pulse I^2 t x k^2 <= I^2 t rating (or I_FSM^2 t_FSM / 2), k = sum over its banks of one polarity (C_k,ref / C_ref) (V_primary,pk / V_k); peak <= I_FSM",
                   explanation=words.bridge_text(device.ref, verdict, over_peak, basis != "declared") + words.bridge_banks(banks),
                   keys=(key + ("surge_current",), key + ("surge_i2t",), ("protection", "secondary_banks"), ("rails",)), sources=(JEDEC_SURGE,))


def _rated_i2t(device):
    if device.surge_i2t is not None:
        return device.surge_i2t.to("A**2*s"), "declared"
    duration = device.surge_duration or DEFAULT_SURGE_TIME
    return half_sine_i2t(device.surge_current, duration), f"I_FSM^2 x {duration.to('ms').magnitude:g} ms / 2"
