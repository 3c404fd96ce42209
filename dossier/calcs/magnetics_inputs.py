"""Findings for checks that could not be made, each pointing at the key to fill in."""

from __future__ import annotations

from dossier.calcs.magnetics_context import make
from dossier.findings import Verdict

DRIVEN_ROLES = ("transformer", "mains-transformer", "base-drive")  # a current-sense core is judged only when declared


def input_findings(ctx):
    found = [_drive(ctx), _frequency(ctx), _choke(ctx), _surface(ctx)]
    found += [_current(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings)]
    return [finding for finding in found if finding is not None]


def _missing(ctx, subject, what, verdict, key, hint):
    return make("MAG-INPUT", subject, f"{what} of {subject} not checked", verdict, explanation=hint, keys=(key,))


def _drive(ctx):
    if ctx.drive is not None or ctx.magnetic.role not in DRIVEN_ROLES:
        return None
    return _missing(ctx, ctx.ref, "Flux density and winding voltages", Verdict.MARGINAL, ctx.key(),
                    "The record does not say what drives it: declare an excitation (waveform, voltage, frequency, winding), "
                    "or for a converter transformer give the converter stage's topology.")


def _frequency(ctx):
    if ctx.drive is None or ctx.drive.frequency is not None:
        return None
    return _missing(ctx, ctx.ref, "Flux density", Verdict.MARGINAL, ctx.key(),
                    "The operating frequency is not known: add 'frequency' (e.g. 40 kHz) to this magnetic.")


def _choke(ctx):
    if ctx.magnetic.role != "choke" or (ctx.core.al is not None and ctx.currents[0] is not None):
        return None
    return _missing(ctx, ctx.ref, "Inductance and field", Verdict.MARGINAL, ctx.key("core"),
                    "A choke needs core.al (or the material's initial_permeability) and its winding's current.")


def _surface(ctx):
    if ctx.magnetic.core.shape == "toroid" or ctx.magnetic.core.surface_area is not None:
        return None
    return _missing(ctx, ctx.ref, "Temperature rise", Verdict.INFO, ctx.key("core"),
                    "Declare core.surface_area (outside surface of the wound part) to estimate the temperature rise.")


def _current(ctx, position, winding):
    if ctx.currents[position] is not None:
        return None
    return _missing(ctx, ctx.subject(winding), "Current density and copper loss", Verdict.INFO, ctx.winding_key(position),
                    "Declare the winding's RMS current ('current: 1.2 A'); it could not be derived from the output rating.")
