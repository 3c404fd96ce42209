"""Findings about the core: its parameters, turns ratios, flux density, core loss, and a choke's figures."""

from __future__ import annotations

from dossier.calcs.magnetics.context import CHOKE, FARADAY, STEINMETZ, listing, make
from dossier.calcs.magnetics.losses import choke_figures, core_loss, transformer_flux
from dossier.calcs.magnetics.saturation import family_of, rule_for
from dossier.calcs.magnetics.voltages import LINES, winding_voltages
from dossier.citations import IEC_60205
from dossier.findings import Measure, Verdict, common_practice, judge
from dossier.units import Q_, fmt

MAKER_DATA = common_practice("a core's effective parameters A_e, l_e and A_L as its maker's data sheet gives them")
FIELD_HEADROOM = 0.10
FIELD_PRACTICE = common_practice("DC field kept below where the maker's permeability-versus-field curve has fallen too far")


def core_finding(ctx):
    core = ctx.core
    values = [Measure("effective area A_e", core.effective_area), Measure("path length l_e", core.path_length),
              Measure("effective volume V_e", core.volume.to("cm**3"))]
    values += [Measure(label, q) for label, q in (("window area A_w", core.window_area), ("bare mean turn", core.mean_turn_length), ("A_L", core.al)) if q is not None]
    sources = (IEC_60205,) if ctx.magnetic.core.shape == "toroid" else (MAKER_DATA,)
    return make("MAG-CORE", ctx.ref, f"Core of {ctx.ref}: effective parameters", Verdict.INFO, values=tuple(values),
                method=core.method, explanation=f"{listing(values[1:])} A_L: {core.al_basis}.", keys=(ctx.key("core"),), sources=sources)


def ratio_findings(ctx):
    if ctx.drive is None:
        return []
    voltages = winding_voltages(ctx.record, ctx.magnetic)
    reference = next(w for w in ctx.magnetic.windings if w.name == ctx.drive.winding)
    return [_ratio(ctx, i, w, reference, voltages) for i, w in enumerate(ctx.magnetic.windings) if w is not reference]


def _ratio(ctx, position, winding, reference, voltages):
    ratio = Q_(reference.turns / winding.turns)
    values = [Measure(f"turns ratio {reference.name} : {winding.name}", ratio)]
    values += [Measure(f"peak voltage at {line} line", voltages[winding.name][line]) for line in LINES]
    if winding.centre_tap:
        values += [Measure(f"each half, peak at {line} line", voltages[f"{winding.name}/half"][line]) for line in LINES]
    return make("MAG-RATIO", ctx.subject(winding), f"Turns ratio and voltages of {ctx.subject(winding)}", Verdict.INFO,
                values=tuple(values), explanation=listing(values), method=f"voltage across '{reference.name}' scaled by turns; drive: {ctx.drive.basis}",
                keys=(ctx.winding_key(position, "turns"), ctx.drive.key), sources=(FARADAY,))


def flux_findings(ctx):
    if ctx.magnetic.role == "choke":
        return _choke_flux(ctx)
    peak = transformer_flux(ctx, "high")
    if peak is None:
        return []
    drive = ctx.drive
    formula = "V / (4 f N A_e)" if drive.waveform == "square" else "V_rms / (4.44 f N A_e)"
    when = " at high line" if ctx.magnetic.excitation is None else ""
    extra = tuple(Measure(f"peak at {line} line", transformer_flux(ctx, line)) for line in ("low", "nominal"))
    return [_flux(ctx, peak, f"Peak flux density in {ctx.ref}{when}", extra + (Measure("frequency", drive.frequency),),
                  f"B_pk = {formula} at {fmt(drive.frequency)}, {drive.winding} turns; drive: {drive.basis}", drive.key)]


def _choke_flux(ctx):
    figures = choke_figures(ctx)
    if figures is None:
        return []
    return [_flux(ctx, figures.peak_flux, f"Peak flux density in {ctx.ref} at peak current",
                  (Measure("peak current", figures.peak_current),), "B_pk = L I_pk / (N A_e)", ctx.key("windings", 0, "current"))]


def _flux(ctx, peak, title, extra, method, drive_key):
    material = ctx.magnetic.core.material
    family, how = family_of(material, ctx.frequency)
    rule = rule_for(family)
    verdict = judge(peak, material.saturation_flux.to("T"), "<=", rule.headroom)
    return make("MAG-FLUX", ctx.ref, title, verdict, values=(Measure("peak flux density", peak),),
                limit=Measure(_saturation_label(ctx), material.saturation_flux.to("T")), relation="<=",
                method=f"{method}; {family} ({how}): marginal within {rule.headroom:.0%} of saturation",
                extra=extra, explanation=rule.advice if verdict in (Verdict.FAIL, Verdict.MARGINAL) else "",
                keys=(ctx.key("core", "material", "saturation_flux"), drive_key), sources=(FARADAY, rule.source))


def _saturation_label(ctx) -> str:
    at = ctx.magnetic.core.material.saturation_temperature
    return f"saturation at {fmt(at)}" if at is not None else "saturation (temperature not stated)"


def core_loss_findings(ctx):
    found = core_loss(ctx)
    if found is None:
        return []
    extra = (Measure("loss per volume", found.density), Measure("peak flux density used", found.flux), Measure("frequency", ctx.frequency))
    return [make("MAG-CORE-LOSS", ctx.ref, f"Core loss of {ctx.ref}", Verdict.INFO,
                 values=(Measure("core loss", found.loss),), extra=extra, explanation=listing(extra),
                 method="Steinmetz: P = k f^alpha B^beta V_e" + (" at the ripple flux" if ctx.magnetic.role == "choke" else " at nominal line"),
                 keys=(ctx.key("core", "material", "steinmetz"),), sources=(STEINMETZ,))]


def choke_findings(ctx):
    if ctx.magnetic.role != "choke":
        return []
    figures = choke_figures(ctx)
    if figures is None:
        return []
    extra = [Measure("inductance A_L N^2", figures.inductance), Measure("stored energy L I_pk^2 / 2", figures.energy),
             Measure("DC current", figures.current), Measure("peak current", figures.peak_current)]
    if figures.ripple is not None:
        extra.append(Measure("ripple current, peak to peak", figures.ripple))
    return [_choke_field(ctx, figures, tuple(extra))]


def _choke_field(ctx, figures, extra):
    limit = ctx.magnetic.core.material.max_field
    common = dict(values=(Measure("peak field N I / l_e", figures.field),), extra=extra, keys=(ctx.key("windings", 0, "current"),),
                  method="L = A_L N^2; H = N I_pk / l_e; ripple dI = V D / (f L) from the declared excitation",
                  sources=(CHOKE, FIELD_PRACTICE))
    title = f"Choke {ctx.ref}: inductance, energy and field"
    if limit is None:
        return make("MAG-CHOKE", ctx.ref, title, Verdict.INFO, explanation=f"{listing(extra)} Declare core.material.max_field to check the field.", **common)
    return make("MAG-CHOKE", ctx.ref, title, judge(figures.field, limit.to("kA/m"), "<=", FIELD_HEADROOM),
                limit=Measure("material's field limit", limit.to("kA/m")), relation="<=", **common)
