"""Findings about the windings: current density, resistance, skin depth, window fill and temperature rise."""

from __future__ import annotations

import math

from dossier.calcs.magnetics.context import SKIN, TEMPERATURE_RISE, listing, make
from dossier.calcs.magnetics.fill import HAND_FILL_LIMIT, wound_surface
from dossier.calcs.magnetics.losses import copper_losses, core_loss, winding_loss, winding_resistance
from dossier.calcs.magnetics.formulas import current_density, temperature_rise
from dossier.citations import IEC_60028, IEC_60317
from dossier.findings import Measure, Verdict, common_practice, judge
from dossier.standards.copper import skin_depth
from dossier.units import Q_, fmt

DENSITY_LIMIT = {
    "natural": (Q_(5, "A/mm**2"), common_practice("2-5 A/mm^2 for small naturally cooled transformers")),
    "forced-air": (Q_(8, "A/mm**2"), common_practice("up to about 8 A/mm^2 with forced air (from memory)")),
}
SKIN_LIMIT = Q_(2.0)
SKIN_PRACTICE = common_practice("wire diameter at most two skin depths at the operating frequency")
FILL_PRACTICE = common_practice("hand winding: insulated wire and tape filling at most 0.40 of a toroid's hole, 0.55 of a bobbin's window")


def density_findings(ctx):
    return [_density(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings) if ctx.currents[i] is not None]


def _density(ctx, position, winding):
    current, layout = ctx.currents[position], ctx.fill.layouts[position]
    density = current_density(current.value, layout.copper_area)
    limit, source = DENSITY_LIMIT[ctx.magnetic.cooling]
    return make("MAG-CURRENT-DENSITY", ctx.subject(winding), f"Current density in {ctx.subject(winding)}", judge(density, limit, "<=", 0.1),
                values=(Measure("current density", density),), limit=Measure(f"{ctx.magnetic.cooling} cooling", limit), relation="<=",
                extra=(Measure("RMS current", current.value), Measure("copper area", layout.copper_area), Measure("strands", Q_(winding.strands))),
                method=f"J = I / A_copper; current: {current.basis}", explanation=_density_hint(density, limit, winding),
                keys=(ctx.winding_key(position, "wire"), ctx.winding_key(position, "current")), sources=(source,))


def _density_hint(density, limit, winding) -> str:
    if density <= limit:
        return ""
    strands = math.ceil(winding.strands * (density / limit).to("").magnitude)
    return f"Thicker wire or more strands in parallel: {strands} strands of this wire would bring it within the limit."


def resistance_findings(ctx):
    return [_resistance(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings) if winding_resistance(ctx, i) is not None]


def _resistance(ctx, position, winding):
    cold, hot = winding_resistance(ctx, position), winding_resistance(ctx, position, ctx.hot)
    extra = [Measure(f"resistance at {fmt(ctx.hot)}", hot), Measure("mean turn length", ctx.fill.layouts[position].mean_turn_length)]
    loss = winding_loss(ctx, position)
    if loss is not None:
        extra.append(Measure(f"copper loss at {fmt(ctx.hot)}", loss))
    return make("MAG-RESISTANCE", ctx.subject(winding), f"DC resistance of {ctx.subject(winding)}", Verdict.INFO,
                values=(Measure("resistance at 20 degC", cold),), extra=tuple(extra), explanation=listing(extra),
                method=f"R = rho N l_turn / A, rho = 1/58 ohm mm^2/m at 20 degC rising 0.393 %/K; hot: {ctx.hot_basis}",
                keys=(ctx.winding_key(position, "wire"),), sources=(IEC_60028,))


def skin_findings(ctx):
    if ctx.frequency is None or ctx.magnetic.role == "choke":
        return []
    return [_skin(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings)]


def _skin(ctx, position, winding):
    depth = skin_depth(ctx.frequency, ctx.hot)
    ratio = (winding.wire / depth).to("")
    verdict = Verdict.PASS if ratio <= SKIN_LIMIT else Verdict.MARGINAL
    return make("MAG-SKIN", ctx.subject(winding), f"Skin depth against the wire of {ctx.subject(winding)}", verdict,
                values=(Measure("wire diameter / skin depth", ratio),), limit=Measure("two skin depths", SKIN_LIMIT), relation="<=",
                extra=(Measure(f"skin depth at {fmt(ctx.frequency)}, {fmt(ctx.hot)}", depth), Measure("wire diameter", winding.wire.to("mm"))),
                method="delta = sqrt(rho / (pi f mu_0))", explanation=_strand_hint(winding, depth) if verdict is not Verdict.PASS else "",
                keys=(ctx.winding_key(position, "wire"),), sources=(SKIN, SKIN_PRACTICE))


def _strand_hint(winding, depth) -> str:
    thinner = math.floor((2 * depth).to("mm").magnitude * 20) / 20
    if thinner <= 0:
        return "Use litz wire: even very thin strands are thicker than two skin depths."
    count = math.ceil(winding.strands * (winding.wire.to("mm").magnitude / thinner) ** 2)
    return f"Use more, thinner strands: for example {count} strands of {thinner:.2f} mm keep at least the copper area."


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
    return [make("MAG-FILL", ctx.ref, f"Window fill of {ctx.ref}", verdict, values=(Measure("fill factor", fill.factor),),
                 limit=Measure("can be wound by hand", limit), relation="<=", extra=tuple(extra),
                 method=_fill_method(fill), explanation=_overflow(ctx, limit) if verdict is Verdict.FAIL else "",
                 keys=(ctx.key("windings"),), sources=(IEC_60317, FILL_PRACTICE))]


def _fill_method(fill) -> str:
    bases = sorted({layout.overall_basis for layout in fill.layouts})
    return "insulated wire (overall diameter) and tape over the window area; overall diameters: " + "; ".join(bases)


def _overflow(ctx, limit) -> str:
    fill = ctx.fill
    over = (fill.occupied - limit * fill.window_area).to("mm**2")
    running, first = Q_(0, "mm**2"), fill.layouts[-1].name
    for layout in fill.layouts:
        running = running + layout.window_share
        if running > limit * fill.window_area:
            first = layout.name
            break
    text = f"Does not fit: {fmt(over)} more than can be wound by hand; the window is full from winding '{first}' on."
    if fill.hole_left is not None and fill.hole_left.magnitude <= 0:
        text += f" The windings close the hole: they need {fmt(-fill.hole_left)} more diameter than it has."
    return text


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
    return [_temperature(ctx, total, surface, rise, found is not None)]


def _temperature(ctx, total, surface, rise, with_core):
    material, ambient = ctx.magnetic.core.material, ctx.record.environment.max_ambient.to("degC")
    extra = (Measure("total loss", total), Measure("outside surface", surface), Measure("highest ambient", ambient))
    common = dict(values=(Measure("temperature rise", rise),), extra=extra, keys=(ctx.key("core", "material", "max_temperature"),),
                  method="copper loss at the hot temperature" + (" plus core loss" if with_core else ", no core loss known") + "; T_r = 450 (P / A)^0.826",
                  sources=(TEMPERATURE_RISE,))
    title = f"Temperature rise of {ctx.ref}"
    if material.max_temperature is None:
        return make("MAG-TEMP-RISE", ctx.ref, title, Verdict.INFO, explanation=f"{listing(extra)} Declare core.material.max_temperature to judge the rise.", **common)
    allowed = Q_(material.max_temperature.to("degC").magnitude - ambient.magnitude, "K")
    return make("MAG-TEMP-RISE", ctx.ref, title, judge(rise, allowed, "<=", 0.15), relation="<=",
                limit=Measure(f"{fmt(material.max_temperature.to('degC'))} less the ambient", allowed), **common)
