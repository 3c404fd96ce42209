"""Everything the magnetics findings need about one wound component, worked out once."""

from __future__ import annotations

from dataclasses import dataclass, replace

from dossier.calcs.shared.finding_kit import maker
from dossier.calcs.shared.core_geometry import CoreGeometry, geometry
from dossier.calcs.magnetics.currents import winding_current
from dossier.calcs.shared.winding_fill import Fill
from dossier.calcs.shared.winding_resistance import hot_temperature, laid
from dossier.calcs.shared.winding_voltages import Drive, drive_of
from dossier.citations import MCLYMAN, MOHAN_POWER_ELECTRONICS
from dossier.units import Q_

MCLYMAN_3 = replace(MCLYMAN, edition="3rd edition, 2004")
FARADAY = replace(MCLYMAN_3, clause="Faraday's law with waveform factor 4.0 (square) and 4.44 (sine); from memory")
STEINMETZ = replace(MCLYMAN_3, clause="core loss as k f^alpha B^beta from the maker's loss curves; from memory")
TEMPERATURE_RISE = replace(MCLYMAN_3, clause="temperature rise T_r = 450 psi^0.826 (psi in W/cm^2), chapter on efficiency, regulation and temperature rise; from memory")
CHOKE = replace(MCLYMAN_3, clause="inductor design: L = A_L N^2, energy L I^2 / 2, field N I / l_e; from memory")
CURRENT_DENSITY = replace(MCLYMAN_3, clause=(
    "J = K_j A_p^x (A/cm^2, A_p in cm^4), chapter 5 'Transformer Design Trade-Offs', table of K_j and x by core "
    "configuration for 25 and 50 degC rise (table number and values from memory)"))
FORWARD_RESET = replace(MOHAN_POWER_ELECTRONICS, clause=(
    "forward converter: the core is reset every cycle and its flux swings one way, from the remanence, by V t_on / (N A_e) "
    "(from memory)"))
SKIN = replace(MCLYMAN_3, clause="skin effect in copper, penetration depth 6.62 / sqrt(f) cm at 20 degC, taken here at the hot temperature; from memory")


@dataclass(frozen=True)
class Context:
    record: object
    index: int
    magnetic: object
    core: CoreGeometry
    drive: Drive | None
    fill: Fill | None
    currents: tuple
    hot: object
    hot_basis: str

    @property
    def ref(self) -> str:
        return self.magnetic.ref

    def key(self, *path) -> tuple:
        return ("magnetics", self.index, *path)

    def winding_key(self, position: int, *path) -> tuple:
        return self.key("windings", position, *path)

    def subject(self, winding) -> str:
        return f"{self.ref} {winding.name}"

    @property
    def frequency(self):
        return self.drive.frequency if self.drive else None


def context_of(record, index: int, magnetic) -> Context:
    drive = drive_of(record, magnetic)
    hot, hot_basis = hot_temperature(magnetic.core.material)
    return Context(
        record=record,
        index=index,
        magnetic=magnetic,
        core=geometry(magnetic.core),
        drive=drive,
        fill=laid(magnetic.core, magnetic.windings),
        currents=tuple(winding_current(record, magnetic, w, drive) for w in magnetic.windings),
        hot=hot,
        hot_basis=hot_basis,
    )


_finding = maker("magnetics")


def make(code: str, subject: str, title: str, verdict, **details):
    """A magnetics finding."""
    return _finding(code=code, subject=subject, title=title, verdict=verdict, **details)
