"""Findings about the windings: current density, resistance, skin depth, window fill and temperature rise."""

from __future__ import annotations

import math
from dataclasses import replace

from dossier.calcs.magnetics import words
from dossier.calcs.magnetics.context import CURRENT_DENSITY, SKIN, TEMPERATURE_RISE, make
from dossier.calcs.magnetics.density import (
    FORCED_AIR_LIMIT, HARSHEST_CLASS, UNSIZED_LIMIT, class_temperature, core_size_limit,
)
from dossier.calcs.shared.winding_fill import HAND_FILL_LIMIT, wound_surface
from dossier.calcs.magnetics.losses import copper_losses, core_loss, proximity, winding_loss, winding_resistance
from dossier.calcs.magnetics.formulas import current_density, temperature_rise
from dossier.calcs.magnetics.saturation import family_of
from dossier.citations import ASTM_B258, DOWELL, IEC_60028, IEC_60085, IEC_60317
from dossier.findings import Measure, Verdict, common_practice, judge
from dossier.standards.copper import skin_depth
from dossier.standards.wire import copper_area
from dossier.units import Q_, fmt

FORCED_AIR_PRACTICE = common_practice("up to about 8 A/mm^2 with forced air (from memory)")
UNSIZED_PRACTICE = common_practice("2-5 A/mm^2 for small naturally cooled transformers")
HOT_SPOT_ALLOWANCE_K = 10.0  # the hot spot inside a winding runs hotter than its surface mean (common practice; from memory)
SKIN_LIMIT = Q_(2.0)
SKIN_PRACTICE = common_practice("wire diameter at most two skin depths at the operating frequency")
FILL_PRACTICE = common_practice("hand winding: insulated wire and tape filling at most 0.40 of a toroid's hole, 0.55 of a bobbin's window")


def density_findings(ctx):
    return [_density(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings) if ctx.currents[i] is not None]


def _density(ctx, position, winding):
    current, area = ctx.currents[position], copper_area(winding.wire, winding.strands)
    density = current_density(current.value, area)
    limit, basis, source, extra, sized = _density_limit(ctx)
    verdict = judge(density, limit, "<=", 0.1)
    if not sized and verdict is Verdict.PASS:
        verdict = Verdict.MARGINAL
    hint = words.density_hint(math.ceil(winding.strands * (density / limit).to("").magnitude)) if density > limit else ""
    if not sized:
        hint = " ".join(part for part in (hint, words.UNSIZED_CORE) if part)
    return make("MAG-CURRENT-DENSITY", ctx.subject(winding), words.density_title(ctx.subject(winding)), verdict,
                values=(Measure("current density", density),), limit=Measure(f"{ctx.magnetic.cooling} cooling", limit), relation="<=",
                extra=(Measure("RMS current", current.value), Measure("copper area", area), Measure("strands", Q_(winding.strands))) + extra,
                method=words.density_method(current.basis, basis), explanation=hint,
                keys=(ctx.winding_key(position, "wire"), ctx.winding_key(position, "current"), ctx.key("core")), sources=(source,))


def _density_limit(ctx):
    """(limit, words, source, extra measures, whether the core's size set it)."""
    if ctx.magnetic.cooling == "forced-air":
        return FORCED_AIR_LIMIT, "forced air, flat figure", FORCED_AIR_PRACTICE, (), True
    family, _ = family_of(ctx.magnetic.core.material, ctx.frequency)
    found = core_size_limit(ctx.magnetic.core, ctx.core, family, allowed_rise(ctx))
    if found is None:
        return UNSIZED_LIMIT, "upper end of the usual band (core size not known)", UNSIZED_PRACTICE, (), False
    extra = (Measure("area product A_p", found.area_product), Measure("K_j", Q_(found.kj)), Measure("exponent x", Q_(found.exponent)))
    basis = words.kj_basis(found.configuration, found.how, found.rise, found.kj, found.exponent, found.area_product)
    return found.limit, basis, CURRENT_DENSITY, extra, True


def insulation_class(ctx) -> tuple[str, bool]:
    """(class letter, whether declared): the declared class, else the lowest in use (harsher)."""
    declared = ctx.magnetic.insulation_class
    return (declared, True) if declared is not None else (HARSHEST_CLASS, False)


def allowed_rise(ctx):
    """Rise the winding may take: the class temperature (or the core's limit, if lower) less the highest ambient."""
    letter, _ = insulation_class(ctx)
    ceiling = class_temperature(letter)
    material_limit = ctx.magnetic.core.material.max_temperature
    if material_limit is not None and material_limit.to("degC") < ceiling:
        ceiling = material_limit.to("degC")
    return Q_(ceiling.magnitude - ctx.record.environment.max_ambient.to("degC").magnitude, "K")


def resistance_findings(ctx):
    return [_resistance(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings) if winding_resistance(ctx, i) is not None]


def _resistance(ctx, position, winding):
    cold, hot = winding_resistance(ctx, position), winding_resistance(ctx, position, ctx.hot)
    extra = [Measure(f"resistance at {fmt(ctx.hot)}", hot), Measure("mean turn length", ctx.fill.layouts[position].mean_turn_length)]
    loss = winding_loss(ctx, position)
    if loss is not None:
        extra.append(Measure(f"copper loss at {fmt(ctx.hot)}", loss))
    return make("MAG-RESISTANCE", ctx.subject(winding), words.resistance_title(ctx.subject(winding)), Verdict.INFO,
                values=(Measure("resistance at 20 degC", cold),), extra=tuple(extra), explanation=words.listing(extra),
                method=words.resistance_method(ctx.hot_basis), keys=(ctx.winding_key(position, "wire"),), sources=(IEC_60028, ASTM_B258))


def skin_findings(ctx):
    if ctx.frequency is None or ctx.magnetic.role == "choke":
        return []
    return [_skin(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings)]


def _skin(ctx, position, winding):
    depth = skin_depth(ctx.frequency, ctx.hot)
    ratio = (winding.wire / depth).to("")
    verdict = Verdict.PASS if ratio <= SKIN_LIMIT else Verdict.MARGINAL
    return make("MAG-SKIN", ctx.subject(winding), words.skin_title(ctx.subject(winding)), verdict,
                values=(Measure("wire diameter / skin depth", ratio),), limit=Measure("two skin depths", SKIN_LIMIT), relation="<=",
                extra=(Measure(f"skin depth at {fmt(ctx.frequency)}, {fmt(ctx.hot)}", depth), Measure("wire diameter", winding.wire.to("mm"))),
                method=words.SKIN_METHOD, explanation=_strand_hint(winding, depth) if verdict is not Verdict.PASS else "",
                keys=(ctx.winding_key(position, "wire"),), sources=(SKIN, SKIN_PRACTICE))


def _strand_hint(winding, depth) -> str:
    thinner = math.floor((2 * depth).to("mm").magnitude * 20) / 20
    if thinner <= 0:
        return words.litz_hint()
    return words.strand_hint(math.ceil(winding.strands * (winding.wire.to("mm").magnitude / thinner) ** 2), thinner)


def proximity_findings(ctx):
    found = [(i, w, proximity(ctx, i)) for i, w in enumerate(ctx.magnetic.windings)]
    return [_proximity(ctx, i, w, p) for i, w, p in found if p is not None]


def _proximity(ctx, position, winding, found):
    subject = ctx.subject(winding)
    keys = (ctx.winding_key(position, "layers"), ctx.winding_key(position, "wire"))
    extra = (Measure("Delta (round wire, porosity)", Q_(found.delta)), Measure(f"skin depth at {fmt(ctx.frequency)}, {fmt(ctx.hot)}", found.depth))
    if found.factor is None:
        return make("MAG-PROXIMITY", subject, words.proximity_title(subject), Verdict.NOT_ASSESSED, extra=extra,
                    method=words.PROXIMITY_METHOD, explanation=words.PROXIMITY_NO_LAYERS, keys=keys, sources=(DOWELL,))
    return make("MAG-PROXIMITY", subject, words.proximity_title(subject), Verdict.INFO,
                values=(Measure("AC resistance factor F_R", Q_(found.factor)),), extra=extra + (Measure("layers", Q_(found.layers)),),
                method=words.PROXIMITY_METHOD, explanation=words.proximity_text(found), keys=keys, sources=(DOWELL,))


def proximity_unknown(ctx) -> bool:
    """Some winding's proximity factor cannot be worked out, so its copper loss is low by an unknown amount."""
    return any(p is not None and p.factor is None for p in (proximity(ctx, i) for i in range(len(ctx.magnetic.windings))))


def fill_findings(ctx):
    fill = ctx.fill
    if fill is None:
        return []
    limit = Q_(HAND_FILL_LIMIT[ctx.magnetic.core.shape])
    verdict = judge(fill.factor, limit, "<=", 0.25)
    if fill.hole_left is not None and fill.hole_left.magnitude <= 0:
        verdict = Verdict.FAIL
    extra = [Measure("window area", fill.window_area), Measure("area taken by wire and tape", fill.occupied)]
    if fill.hole_left is not None:
        extra.append(Measure("hole left after winding", fill.hole_left))
    return [make("MAG-FILL", ctx.ref, words.fill_title(ctx.ref), verdict, values=(Measure("fill factor", fill.factor),),
                 limit=Measure("can be wound by hand", limit), relation="<=", extra=tuple(extra),
                 method=_fill_method(fill), explanation=_overflow(ctx, limit) if verdict is Verdict.FAIL else "",
                 keys=(ctx.key("windings"),), sources=(IEC_60317, ASTM_B258, FILL_PRACTICE))]


def _fill_method(fill) -> str:
    return words.fill_method(sorted({layout.overall_basis for layout in fill.layouts}))


def _overflow(ctx, limit) -> str:
    fill = ctx.fill
    over = (fill.occupied - limit * fill.window_area).to("mm**2")
    running, first = Q_(0, "mm**2"), fill.layouts[-1].name
    for layout in fill.layouts:
        running = running + layout.window_share
        if running > limit * fill.window_area:
            first = layout.name
            break
    closed = fill.hole_left is not None and fill.hole_left.magnitude <= 0
    return words.overflow_text(over, first, -fill.hole_left if closed else None)


def temperature_findings(ctx):
    losses = [loss for loss in copper_losses(ctx).values() if loss is not None]
    found = core_loss(ctx)
    if found is not None:
        losses.append(found.loss)
    surface = wound_surface(ctx.magnetic.core, ctx.fill)
    if not losses or surface is None:
        return []
    total = sum(losses, Q_(0, "W"))
    rise = temperature_rise(total, surface)
    judged = [_temperature(ctx, total, surface, rise, found is not None), _winding_temperature(ctx, rise)]
    return [_without_proximity(f) for f in judged] if proximity_unknown(ctx) else judged


def _without_proximity(finding):
    """A pass that leaves out an unknown proximity loss is held at marginal, and says why."""
    verdict = Verdict.MARGINAL if finding.verdict is Verdict.PASS else finding.verdict
    return replace(finding, verdict=verdict, explanation=f"{finding.explanation} {words.PROXIMITY_LEFT_OUT}".strip())


def _temperature(ctx, total, surface, rise, with_core):
    material, ambient = ctx.magnetic.core.material, ctx.record.environment.max_ambient.to("degC")
    extra = (Measure("total loss", total), Measure("outside surface", surface), Measure("loss density", (total / surface).to("mW/cm**2")),
             Measure("highest ambient", ambient))
    common = dict(values=(Measure("temperature rise", rise),), extra=extra, keys=(ctx.key("core", "material", "max_temperature"),),
                  method=words.rise_method(with_core), sources=(TEMPERATURE_RISE,))
    title = words.rise_title(ctx.ref)
    if material.max_temperature is None:
        return make("MAG-TEMP-RISE", ctx.ref, title, Verdict.INFO, explanation=f"{words.listing(extra)} {words.RISE_HINT}", **common)
    allowed = Q_(material.max_temperature.to("degC").magnitude - ambient.magnitude, "K")
    return make("MAG-TEMP-RISE", ctx.ref, title, judge(rise, allowed, "<=", 0.15), relation="<=",
                limit=Measure(words.rise_limit_label(material.max_temperature.to("degC")), allowed), **common)


def _winding_temperature(ctx, rise):
    """Highest ambient plus the rise against the insulation class; marginal within the hot-spot allowance."""
    letter, declared = insulation_class(ctx)
    ambient = ctx.record.environment.max_ambient.to("degC")
    temperature = Q_(ambient.magnitude + rise.to("K").magnitude, "degC")
    limit = class_temperature(letter)
    verdict = _class_verdict(temperature.magnitude, limit.magnitude)
    return make("MAG-WINDING-TEMP", ctx.ref, words.winding_temperature_title(ctx.ref), verdict,
                values=(Measure("winding temperature", temperature),), limit=Measure(words.class_label(letter, limit), limit), relation="<=",
                extra=(Measure("highest ambient", ambient), Measure("temperature rise", rise)),
                method=words.winding_temperature_method(declared, letter), explanation="" if declared else words.CLASS_HINT,
                keys=(ctx.key("insulation_class"), ("environment", "max_ambient")), sources=(IEC_60085, TEMPERATURE_RISE))


def _class_verdict(temperature: float, limit: float) -> Verdict:
    if temperature > limit:
        return Verdict.FAIL
    return Verdict.MARGINAL if temperature > limit - HOT_SPOT_ALLOWANCE_K else Verdict.PASS
