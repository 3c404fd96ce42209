"""A mains transformer as the mains fuse sees it: its primary, its rated current, its windings referred to the primary.

The winding resistances come from the record (a measured `resistance`) or from the wire and the mean turn of
the winding as the magnetics calc lays it on the core, in annealed copper (IEC 60028). A cold winding has the
least resistance (the harsher reading for a switch-on surge); a hot one the most (the harsher reading for how
much current a secondary short draws).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.calcs.shared.core_geometry import geometry
from dossier.calcs.shared.winding_fill import lay
from dossier.standards.copper import MU_0, resistance
from dossier.units import Q_

MAINS_TRANSFORMER = "mains-transformer"
COLD = Q_(20, "degC")
# The hot end for a winding: class A insulation's 105 degC (IEC 60085), the harsher reading for a short's current.
HOT = Q_(105, "degC")


@dataclass(frozen=True)
class Winding:
    name: str
    position: int
    turns: float
    resistance: object | None  # at the temperature asked for; None when it cannot be worked out
    declared: bool


@dataclass(frozen=True)
class Transformer:
    """One mains transformer: where it is in the record, its primary and secondaries and its core."""

    index: int
    magnetic: object
    primary: Winding
    secondaries: tuple
    core_area: object
    path_length: object

    @property
    def ref(self) -> str:
        return self.magnetic.ref

    def key(self, *path) -> tuple:
        return ("magnetics", self.index, *path)


def mains_transformers(record, temperature=COLD) -> list[Transformer]:
    return [_transformer(index, magnetic, temperature) for index, magnetic in enumerate(record.magnetics) if magnetic.role == MAINS_TRANSFORMER]


def has_mains_transformer(record) -> bool:
    return any(magnetic.role == MAINS_TRANSFORMER for magnetic in record.magnetics)


def _transformer(index: int, magnetic, temperature) -> Transformer:
    core = geometry(magnetic.core)
    layouts = _layouts(magnetic)
    windings = [_winding(magnetic, position, layouts, temperature) for position in range(len(magnetic.windings))]
    first = next((w for w in windings if magnetic.windings[w.position].role == "primary"), windings[0])
    secondaries = tuple(w for w in windings if magnetic.windings[w.position].role == "secondary")
    return Transformer(index, magnetic, first, secondaries, core.effective_area, core.path_length)


def _layouts(magnetic):
    try:
        fill = lay(magnetic.core, magnetic.windings)
    except (ValueError, ZeroDivisionError):  # a winding that cannot be laid: no computed resistance
        return None
    return fill.layouts if fill is not None else None


def _winding(magnetic, position: int, layouts, temperature) -> Winding:
    winding = magnetic.windings[position]
    if winding.resistance is not None:
        return Winding(winding.name, position, winding.turns, _at(winding.resistance, temperature), True)
    layout = layouts[position] if layouts else None
    if layout is None or layout.mean_turn_length is None:
        return Winding(winding.name, position, winding.turns, None, False)
    return Winding(winding.name, position, winding.turns, resistance(winding.turns * layout.mean_turn_length, layout.copper_area, temperature), False)


def _at(measured, temperature):
    """A resistance measured at room temperature (taken as 20 degC) moved to another by copper's coefficient."""
    return (measured * resistance(Q_(1, "m"), Q_(1, "mm**2"), temperature) / resistance(Q_(1, "m"), Q_(1, "mm**2"), COLD)).to("ohm")


def referred(winding: Winding, primary: Winding):
    """A secondary's resistance seen from the primary: R_s (N_p / N_s)^2."""
    if winding.resistance is None:
        return None
    return (winding.resistance * (primary.turns / winding.turns) ** 2).to("ohm")


def air_core_inductance(transformer: Transformer):
    """The primary's inductance with the core saturated (relative permeability 1): mu_0 N^2 A_e / l_e.

    The core's own section and path stand for the space the saturated winding encloses: the winding's build adds
    area, so this is the least the inductance can be (the harsher reading).
    """
    return (MU_0 * transformer.primary.turns**2 * transformer.core_area / transformer.path_length).to("mH")


def normal_peak_flux(transformer: Transformer, rms_voltage, frequency):
    """Peak flux density of the steady sine: B = sqrt 2 V / (2 pi f N A_e) (Faraday's law)."""
    return (math.sqrt(2) * rms_voltage / (2 * math.pi * frequency * transformer.primary.turns * transformer.core_area)).to("T")


def rated_primary_current(record, transformer: Transformer):
    """(current, basis): rated power over the nominal mains, else the primary's declared current; None if neither."""
    magnetic = transformer.magnetic
    if magnetic.rated_power is not None:
        return (magnetic.rated_power / record.mains.nominal).to("A"), "rated_power"
    declared = magnetic.windings[transformer.primary.position].current
    if declared is not None:
        return declared.to("A"), "primary current"
    return None, ""
