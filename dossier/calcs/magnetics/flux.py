"""Findings about the core: its parameters, turns ratios, flux density, core loss, and a choke's figures."""

from __future__ import annotations

from dossier.calcs.magnetics import words
from dossier.calcs.magnetics.context import CHOKE, FARADAY, FORWARD_RESET, STEINMETZ, make
from dossier.calcs.magnetics.losses import choke_figures, core_loss, flux_swing, remanence, transformer_flux
from dossier.calcs.magnetics.saturation import family_of, rule_for
from dossier.calcs.magnetics.steel import steel_loss_finding

from dossier.calcs.shared.winding_voltages import LINES, winding_voltages
from dossier.calcs.shared.lamination import LAMINATION_SOURCES
from dossier.citations import IEC_60205, IGSE
from dossier.record.magnetics import LAMINATED
from dossier.findings import Measure, Verdict, common_practice, judge
from dossier.units import Q_

MAKER_DATA = common_practice("a core's effective parameters A_e, l_e and A_L as its maker's data sheet gives them")
FIELD_HEADROOM = 0.10
FIELD_PRACTICE = common_practice("DC field kept below where the maker's permeability-versus-field curve has fallen too far")


def core_finding(ctx):
    core = ctx.core
    shape = ctx.magnetic.core.shape
    volume_label = "iron volume" if shape in LAMINATED else "effective volume V_e"
    values = [Measure("effective area A_e", core.effective_area), Measure("path length l_e", core.path_length),
              Measure(volume_label, core.volume.to("cm**3"))]
    values += [Measure(label, q) for label, q in (("window area A_w", core.window_area), ("bare mean turn", core.mean_turn_length), ("A_L", core.al)) if q is not None]
    sources = {"toroid": (IEC_60205,), "declared": (MAKER_DATA,)}.get(shape, LAMINATION_SOURCES)
    return make("MAG-CORE", ctx.ref, words.core_title(ctx.ref), Verdict.INFO, values=tuple(values),
                method=core.method, explanation=words.core_text(values[1:], core.al_basis), keys=(ctx.key("core"),), sources=sources)


def ratio_findings(ctx):
    if ctx.drive is None:
        return []
    voltages = winding_voltages(ctx.record, ctx.magnetic)
    reference = next(w for w in ctx.magnetic.windings if w.name == ctx.drive.winding)
    return [_ratio(ctx, i, w, reference, voltages) for i, w in enumerate(ctx.magnetic.windings) if w is not reference]


def _lines(ctx) -> tuple:
    """The line conditions worth naming: all three when the drive follows the mains, else one figure."""
    return LINES if ctx.drive.varies_with_line else (None,)


def _ratio(ctx, position, winding, reference, voltages):
    ratio = Q_(reference.turns / winding.turns)
    values = [Measure(words.ratio_label(reference.name, winding.name), ratio)]
    values += [Measure(words.peak_label(line), voltages[winding.name][line or "high"]) for line in _lines(ctx)]
    if winding.centre_tap:
        values += [Measure(words.half_label(line), voltages[f"{winding.name}/half"][line or "high"]) for line in _lines(ctx)]
    return make("MAG-RATIO", ctx.subject(winding), words.ratio_title(ctx.subject(winding)), Verdict.INFO,
                values=tuple(values), explanation=words.listing(values), method=words.ratio_method(reference.name, ctx.drive.basis),
                keys=(ctx.winding_key(position, "turns"), ctx.drive.key), sources=(FARADAY,))


def flux_findings(ctx):
    if ctx.magnetic.role == "choke":
        return _choke_flux(ctx)
    peak = transformer_flux(ctx, "high")
    if peak is None:
        return []
    drive = ctx.drive
    unipolar = drive.polarity == "unipolar"
    extra = [Measure(f"peak at {line} line", transformer_flux(ctx, line)) for line in ("low", "nominal") if drive.varies_with_line]
    extra.append(Measure("frequency", drive.frequency))
    basis = None
    if unipolar:
        value, basis = remanence(ctx)
        extra += [Measure("flux swing delta-B", flux_swing(ctx, "high")), Measure("remanence B_r", value)]
    method = words.flux_method(drive.waveform, drive.polarity, drive, drive.winding, basis)
    sources = (FARADAY, FORWARD_RESET) if unipolar else (FARADAY,)
    return [_flux(ctx, peak, words.flux_title(ctx.ref, drive.varies_with_line), tuple(extra), method, drive.key, sources)]


def _choke_flux(ctx):
    figures = choke_figures(ctx)
    if figures is None:
        return []
    return [_flux(ctx, figures.peak_flux, words.choke_flux_title(ctx.ref), (Measure("peak current", figures.peak_current),),
                  "B_pk = L I_pk / (N A_e)", ctx.key("windings", 0, "current"), (FARADAY,))]


def _flux(ctx, peak, title, extra, method, drive_key, sources):
    material = ctx.magnetic.core.material
    family, how = family_of(material, ctx.frequency)
    rule = rule_for(family)
    verdict = judge(peak, material.saturation_flux.to("T"), "<=", rule.headroom)
    return make("MAG-FLUX", ctx.ref, title, verdict, values=(Measure("peak flux density", peak),),
                limit=Measure(words.saturation_label(material.saturation_temperature), material.saturation_flux.to("T")), relation="<=",
                method=words.saturation_method(method, family, how, rule.headroom),
                extra=extra, explanation=rule.advice if verdict in (Verdict.FAIL, Verdict.MARGINAL) else "",
                keys=(ctx.key("core", "material", "saturation_flux"), drive_key), sources=sources + (rule.source,))


def core_loss_findings(ctx):
    found = core_loss(ctx)
    if found is None:
        return []
    if found.method == "specific-loss":
        return [steel_loss_finding(ctx, found)]
    extra = (Measure("loss per volume", found.density), Measure("peak flux density used", found.flux),
             Measure("flux swing delta-B", found.swing), Measure("frequency", ctx.frequency))
    sources = (STEINMETZ,) if found.method == "sine" else (STEINMETZ, IGSE)
    keys = (ctx.key("core", "material", "steinmetz"),) + ((ctx.drive.key,) if ctx.drive else ())
    return [make("MAG-CORE-LOSS", ctx.ref, words.core_loss_title(ctx.ref), Verdict.INFO,
                 values=(Measure("core loss", found.loss),), extra=extra, explanation=words.listing(extra),
                 method=words.core_loss_method(found.method, ctx.magnetic.role == "choke"), keys=keys, sources=sources)]


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
                  method=words.CHOKE_METHOD, sources=(CHOKE, FIELD_PRACTICE))
    title = words.choke_title(ctx.ref)
    if limit is None:
        return make("MAG-CHOKE", ctx.ref, title, Verdict.INFO, explanation=f"{words.listing(extra)} {words.CHOKE_FIELD_HINT}", **common)
    return make("MAG-CHOKE", ctx.ref, title, judge(figures.field, limit.to("kA/m"), "<=", FIELD_HEADROOM),
                limit=Measure("material's field limit", limit.to("kA/m")), relation="<=", **common)
