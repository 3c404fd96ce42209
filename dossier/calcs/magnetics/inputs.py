"""Findings for checks that could not be made, each pointing at the key to fill in."""

from __future__ import annotations

from dossier.calcs.magnetics import words
from dossier.calcs.magnetics.context import CHOKE, FARADAY, TEMPERATURE_RISE, make
from dossier.citations import IEC_60028
from dossier.findings import Verdict

DRIVEN_ROLES = ("transformer", "mains-transformer", "base-drive", "gate-drive")  # a current-sense core is judged only when declared


def input_findings(ctx):
    found = [_drive(ctx), _frequency(ctx), _choke(ctx), _surface(ctx)]
    found += [_current(ctx, i, w) for i, w in enumerate(ctx.magnetic.windings)]
    return [finding for finding in found if finding is not None]


def _missing(ctx, subject, what, key, hint, source):
    """An optional value is missing: information, naming the key to add."""
    return make("MAG-INPUT", subject, words.not_checked_title(what, subject), Verdict.INFO, explanation=hint, keys=(key,), sources=(source,))


def _drive(ctx):
    if ctx.drive is not None or ctx.magnetic.role not in DRIVEN_ROLES:
        return None
    return _missing(ctx, ctx.ref, "Flux density and winding voltages", ctx.key(),
                    words.DRIVE_HINT, FARADAY)


def _frequency(ctx):
    if ctx.drive is None or ctx.drive.frequency is not None:
        return None
    return _missing(ctx, ctx.ref, "Flux density", ctx.key(),
                    words.FREQUENCY_HINT, FARADAY)


def _choke(ctx):
    if ctx.magnetic.role != "choke" or (ctx.core.al is not None and ctx.currents[0] is not None):
        return None
    return _missing(ctx, ctx.ref, "Inductance and field", ctx.key("core"),
                    words.CHOKE_HINT, CHOKE)


def _surface(ctx):
    if ctx.magnetic.core.shape != "declared" or ctx.magnetic.core.surface_area is not None:
        return None
    return _missing(ctx, ctx.ref, "Temperature rise", ctx.key("core"),
                    words.SURFACE_HINT, TEMPERATURE_RISE)


def _current(ctx, position, winding):
    if ctx.currents[position] is not None:
        return None
    return _missing(ctx, ctx.subject(winding), "Current density and copper loss", ctx.winding_key(position),
                    words.CURRENT_HINT, IEC_60028)
