"""Each winding's resistance (cold and hot) and no-load peak, as the magnetics calc hands them on to the rails'
regulation and the checklist: one function of the record, so every caller gets the same figures."""

from __future__ import annotations

from dossier.calcs.shared.regulation import WindingFigures
from dossier.calcs.shared.winding_resistance import hot_temperature, laid, layout_resistance
from dossier.calcs.shared.winding_voltages import winding_voltages


def winding_figures(record) -> tuple[WindingFigures, ...]:
    """Every winding of every magnetic in the record, in record order."""
    return tuple(figure for index, magnetic in enumerate(record.magnetics) for figure in _of_magnetic(record, index, magnetic))


def _of_magnetic(record, index: int, magnetic):
    fill = laid(magnetic.core, magnetic.windings)
    hot, _ = hot_temperature(magnetic.core.material)
    peaks = winding_voltages(record, magnetic)
    for position, winding in enumerate(magnetic.windings):
        layout = fill.layouts[position] if fill else None
        peak = peaks.get(winding.name, {}).get("nominal")
        yield WindingFigures(
            ref=magnetic.ref, magnetic=index, position=position, name=winding.name, role=winding.role, turns=winding.turns,
            centre_tap=winding.centre_tap, resistance=layout_resistance(winding, layout, hot), cold=layout_resistance(winding, layout),
            temperature=hot, peak=peak, key=("magnetics", index, "windings", position),
        )
