"""Flux densities and losses of one wound component, from its context."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.magnetics import formulas as m
from dossier.standards.copper import REFERENCE_TEMPERATURE, resistance
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


def reference_turns(ctx) -> float:
    return next(w.turns for w in ctx.magnetic.windings if w.name == ctx.drive.winding)


def transformer_flux(ctx, line: str):
    """Peak flux density from Faraday's law at one line condition; None without a drive or frequency."""
    drive = ctx.drive
    if drive is None or drive.frequency is None:
        return None
    turns, area = reference_turns(ctx), ctx.core.effective_area
    if drive.waveform == "sine":
        return m.flux_sine(drive.rms[line], drive.frequency, turns, area)
    return m.flux_square(drive.amplitude[line], drive.frequency, turns, area, drive.duty)


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
    """Steinmetz core loss at nominal line (a choke: at its ripple flux); None without parameters."""
    steinmetz = ctx.magnetic.core.material.steinmetz
    flux = _ac_flux(ctx)
    if steinmetz is None or flux is None:
        return None
    density = m.steinmetz_density(steinmetz.k, steinmetz.alpha, steinmetz.beta, ctx.frequency, flux)
    return CoreLoss((density * ctx.core.volume).to("W"), density.to("mW / cm ** 3"), flux, "nominal")


def _ac_flux(ctx):
    if ctx.magnetic.role != "choke":
        return transformer_flux(ctx, "nominal")
    figures = choke_figures(ctx)
    return figures.ac_flux if figures else None


def winding_resistance(ctx, position: int, temperature=REFERENCE_TEMPERATURE):
    """DC resistance of a whole winding; None when its mean turn length is not known."""
    winding, layout = ctx.magnetic.windings[position], _layout(ctx, position)
    if layout is None or layout.mean_turn_length is None:
        return None
    return resistance(winding.turns * layout.mean_turn_length, layout.copper_area, temperature)


def winding_loss(ctx, position: int):
    """I^2 R at the hot temperature; a centre-tapped winding's halves each carry the current half the time."""
    current, hot = ctx.currents[position], winding_resistance(ctx, position, ctx.hot)
    if current is None or hot is None:
        return None
    return m.copper_loss(current.value, hot)


def copper_losses(ctx) -> dict:
    return {w.name: winding_loss(ctx, i) for i, w in enumerate(ctx.magnetic.windings)}


def _layout(ctx, position: int):
    return ctx.fill.layouts[position] if ctx.fill else None
