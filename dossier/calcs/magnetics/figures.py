"""Each winding's resistance (cold and hot) and no-load peak, as the magnetics calc hands them on to the rails'
regulation and the checklist: one function of the record, so every caller gets the same figures."""

from __future__ import annotations

from dossier.calcs.magnetics.context import context_of
from dossier.calcs.magnetics.losses import winding_resistance
from dossier.calcs.magnetics.voltages import winding_voltages
from dossier.calcs.shared.regulation import WindingFigures


def winding_figures(record) -> tuple[WindingFigures, ...]:
    """Every winding of every magnetic in the record, in record order."""
    return tuple(figure for index, magnetic in enumerate(record.magnetics) for figure in _of_magnetic(record, index, magnetic))


def _of_magnetic(record, index: int, magnetic):
    ctx = context_of(record, index, magnetic)
    peaks = winding_voltages(record, magnetic)
    for position, winding in enumerate(magnetic.windings):
        peak = peaks.get(winding.name, {}).get("nominal")
        yield WindingFigures(
            ref=magnetic.ref, magnetic=index, position=position, name=winding.name, role=winding.role, turns=winding.turns,
            centre_tap=winding.centre_tap, resistance=winding_resistance(ctx, position, ctx.hot), cold=winding_resistance(ctx, position),
            temperature=ctx.hot, peak=peak, key=ctx.winding_key(position),
        )
