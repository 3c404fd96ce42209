"""Flux densities and losses of one wound component, from its context."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.magnetics import formulas as m
from dossier.calcs.magnetics.saturation import family_of
from dossier.calcs.magnetics.steel import steel_loss, uses_specific_loss
from dossier.calcs.shared.winding_resistance import layout_resistance
from dossier.standards.copper import REFERENCE_TEMPERATURE, resistance, skin_depth
from dossier.units import Q_


@dataclass(frozen=True)
class ChokeFigures:
    inductance: object
    current: object
    ripple: object
    peak_current: object
    peak_flux: object
    ac_flux: object
    field: object
    energy: object


@dataclass(frozen=True)
class CoreLoss:
    loss: object
    density: object
    flux: object
    line: str
    swing: object = None
    method: str = "sine"


# Remanence taken when the material declares none: harsher than power grades' data (from memory).
DEFAULT_REMANENCE = {"ferrite": Q_(0.2, "T"), "iron-powder": Q_(0.2, "T"), "silicon-steel": Q_(1.0, "T")}


def reference_turns(ctx) -> float:
    return next(w.turns for w in ctx.magnetic.windings if w.name == ctx.drive.winding)


def transformer_flux(ctx, line: str):
    """Peak flux density from Faraday's law at one line condition; None without a drive or frequency.

    A unipolar drive's flux starts from the remanence and rises by the whole swing: B_pk = B_r + delta-B.
    """
    swing = flux_swing(ctx, line)
    if swing is None:
        return None
    if ctx.drive.polarity == "unipolar":
        return (remanence(ctx)[0] + swing).to("T")
    return (swing / 2).to("T")


def flux_swing(ctx, line: str):
    """Peak-to-peak flux density delta-B at one line condition (Faraday's law); None without a drive or frequency."""
    drive = ctx.drive
    if drive is None or drive.frequency is None:
        return None
    turns, area = reference_turns(ctx), ctx.core.effective_area
    if drive.waveform == "sine":
        return 2 * m.flux_sine(drive.rms[line], drive.frequency, turns, area)
    if drive.polarity == "unipolar":
        return m.flux_unipolar_swing(drive.amplitude[line], drive.frequency, turns, area, drive.duty)
    return 2 * m.flux_square(drive.amplitude[line], drive.frequency, turns, area, drive.duty)


def remanence(ctx) -> tuple:
    """(B_r, how it was found): the material's, else a harsher figure for its family."""
    material = ctx.magnetic.core.material
    if material.remanence is not None:
        return material.remanence.to("T"), "declared"
    family, _ = family_of(material, ctx.frequency)
    return DEFAULT_REMANENCE[family], f"not declared: {DEFAULT_REMANENCE[family].magnitude:g} T taken for {family} (harsher reading; from memory)"


def flux_segments(shape: str, duty: float) -> tuple:
    """(share of the period, change in units of delta-B) for each straight part of the flux waveform.

    bipolar square: up during D/2, down during D/2, flat in the dead times; unipolar: up during D, reset down
    in the same time (at most the rest of the period); triangle (a choke's ripple): up during D, down during 1 - D.
    """
    if shape == "unipolar":
        return ((duty, 1.0), (min(duty, 1 - duty), -1.0))
    if shape == "triangle":
        return ((duty, 1.0), (1 - duty, -1.0))
    return ((duty / 2, 1.0), (duty / 2, -1.0))


def choke_figures(ctx) -> ChokeFigures | None:
    """A choke's first winding carrying its declared current; None without A_L or current."""
    winding, current = ctx.magnetic.windings[0], ctx.currents[0]
    if ctx.core.al is None or current is None:
        return None
    inductance = m.inductance(ctx.core.al, winding.turns)
    ripple = _ripple(ctx, inductance)
    peak = current.value + (ripple / 2 if ripple is not None else Q_(0, "A"))
    area = ctx.core.effective_area
    ac = m.choke_flux(inductance, ripple / 2, winding.turns, area) if ripple is not None else None
    return ChokeFigures(
        inductance=inductance,
        current=current.value,
        ripple=ripple,
        peak_current=peak.to("A"),
        peak_flux=m.choke_flux(inductance, peak, winding.turns, area),
        ac_flux=ac,
        field=m.field_strength(winding.turns, peak, ctx.core.path_length),
        energy=m.stored_energy(inductance, peak),
    )


def _ripple(ctx, inductance):
    excitation = ctx.magnetic.excitation
    if excitation is None:
        return None
    return m.ripple_current(excitation.voltage, excitation.frequency, ctx.drive.duty, inductance)


def core_loss(ctx) -> CoreLoss | None:
    """Core loss at nominal line (a choke: at its ripple flux); None without parameters.

    A sine flux by the Steinmetz equation; any other by the improved generalised Steinmetz equation (iGSE) from the
    flux waveform the drive gives. Silicon steel in a transformer: from its loss per kilogram (steel.py).
    """
    steinmetz = ctx.magnetic.core.material.steinmetz
    found = _swing_and_shape(ctx)
    if found is not None and uses_specific_loss(ctx):
        return steel_loss(ctx, found[0] / 2)
    if steinmetz is None or found is None:
        return None
    swing, shape = found
    k, alpha, beta = steinmetz.k, steinmetz.alpha, steinmetz.beta
    if shape == "sine":
        density = m.steinmetz_density(k, alpha, beta, ctx.frequency, swing / 2)
    else:
        density = m.igse_density(k, alpha, beta, ctx.frequency, swing, flux_segments(shape, ctx.drive.duty))
    return CoreLoss((density * ctx.core.volume).to("W"), density.to("mW / cm ** 3"), (swing / 2).to("T"), "nominal", swing.to("T"), shape)


def _swing_and_shape(ctx):
    """(delta-B, waveform shape) of the flux the core loss is worked out at; None when not known."""
    if ctx.magnetic.role == "choke":
        figures = choke_figures(ctx)
        if figures is None or figures.ac_flux is None:
            return None
        return 2 * figures.ac_flux, "triangle"
    swing = flux_swing(ctx, "nominal")
    if swing is None:
        return None
    return swing, ("sine" if ctx.drive.waveform == "sine" else ctx.drive.polarity)


def winding_resistance(ctx, position: int, temperature=REFERENCE_TEMPERATURE):
    """DC resistance of a whole winding; None when its mean turn length is not known."""
    return layout_resistance(ctx.magnetic.windings[position], _layout(ctx, position), temperature)


def winding_loss(ctx, position: int):
    """I^2 R F_R at the hot temperature (F_R by Dowell where it applies and is known, else 1); a centre-tapped
    winding's halves each carry the current half the time."""
    current, hot = ctx.currents[position], winding_resistance(ctx, position, ctx.hot)
    if current is None or hot is None:
        return None
    found = proximity(ctx, position)
    factor = found.factor if found is not None and found.factor is not None else 1.0
    return m.copper_loss(current.value, hot) * factor


# Proximity loss is worked out at and above this frequency; at mains frequencies it is neglected (common practice).
PROXIMITY_FROM = Q_(1, "kHz")


@dataclass(frozen=True)
class Proximity:
    """Dowell's resistance factor of one winding at the drive's fundamental."""

    factor: float | None  # None: the layer count is not known
    delta: float
    layers: int | None
    layers_declared: bool
    depth: object


def proximity(ctx, position: int) -> Proximity | None:
    """Dowell's F_R for a transformer winding at or above 1 kHz; None where it does not apply."""
    if ctx.magnetic.role == "choke" or ctx.frequency is None or ctx.frequency < PROXIMITY_FROM:
        return None
    winding, layout = ctx.magnetic.windings[position], _layout(ctx, position)
    depth = skin_depth(ctx.frequency, ctx.hot)
    pitch = layout.overall if layout is not None else winding.wire
    delta = m.dowell_delta_round(winding.wire, pitch, depth)
    layers = winding.layers if winding.layers is not None else (layout.layers if layout is not None else None)
    factor = m.dowell_factor(delta, layers) if layers is not None else None
    return Proximity(factor, delta, layers, winding.layers is not None, depth)


def copper_losses(ctx) -> dict:
    return {w.name: winding_loss(ctx, i) for i, w in enumerate(ctx.magnetic.windings)}


def _layout(ctx, position: int):
    return ctx.fill.layouts[position] if ctx.fill else None
