"""Isolation calc: the clearance, creepage and groove width IEC 60664-1 requires, from the derived inputs."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.isolation.inputs import Inputs, Site
from dossier.standards import iec60664 as std
from dossier.units import Q_

DOUBLED_GRADES = ("reinforced", "double")


@dataclass(frozen=True)
class ClearanceNeed:
    basic_impulse: float
    impulse: float
    table_mm: float
    factor: float
    edition2_mm: float | None

    @property
    def required_mm(self) -> float:
        return round(self.table_mm * self.factor, 6)


@dataclass(frozen=True)
class CreepageNeed:
    group: str
    column: str
    basic_mm: float
    graded_mm: float
    clearance_mm: float | None
    off_board_mm: float | None = None

    @property
    def required_mm(self) -> float:
        return self.floored(self.graded_mm)

    @property
    def off_board_required_mm(self) -> float | None:
        return None if self.off_board_mm is None else self.floored(self.off_board_mm)

    def floored(self, creepage_mm: float) -> float:
        """Creepage is never less than the required clearance."""
        return round(max(creepage_mm, self.clearance_mm or 0.0), 6)


def impulse_voltages(inputs: Inputs, grade: str) -> tuple[float, float]:
    """(rated impulse voltage from Table F.1, the impulse voltage the clearance is dimensioned for)."""
    basic = std.rated_impulse_voltage(inputs.supply.to("V").magnitude, inputs.category)
    return basic, std.reinforced_impulse_voltage(basic) if grade in DOUBLED_GRADES else basic


def clearance_need(inputs: Inputs, grade: str) -> ClearanceNeed:
    basic, impulse = impulse_voltages(inputs, grade)
    factor = std.altitude_factor(inputs.altitude.to("m").magnitude)
    edition2 = _edition2_clearance(basic, inputs.pollution_degree, factor) if grade in DOUBLED_GRADES else None
    return ClearanceNeed(basic, impulse, std.clearance_mm(impulse, inputs.pollution_degree), factor, edition2)


def _edition2_clearance(basic: float, pollution_degree: int, factor: float) -> float | None:
    try:
        return round(std.clearance_mm(std.next_impulse_step(basic), pollution_degree) * factor, 6)
    except std.OutsideTable:
        return None


def creepage_need(inputs: Inputs, site: Site, group: str, clearance_mm: float | None) -> CreepageNeed:
    volts, pd, board = inputs.creepage_voltage.to("V").magnitude, inputs.pollution_degree, site.barrier.printed_board
    column = std.creepage_column(pd, group, board)
    basic = std.basic_creepage_mm(volts, pd, group, board)
    factor = std.REINFORCED_CREEPAGE_FACTOR if site.grade in DOUBLED_GRADES else 1
    # the value without the printed-board column, for product standards that have no such column
    off_board = std.basic_creepage_mm(volts, pd, group, False) * factor if column.startswith("board-") else None
    return CreepageNeed(group, column, basic, basic * factor, clearance_mm, off_board)


def minimum_groove(site: Site, inputs: Inputs):
    """Clause 6.8's minimum width, reduced by the declared clearance when that is below 3 mm."""
    return Q_(std.minimum_groove_mm(inputs.pollution_degree, site.barrier.clearance.to("mm").magnitude), "mm")


def bridged_slots(site: Site, inputs: Inputs) -> list[int]:
    """Indices of slots the declared creepage counts on but which are too narrow to interrupt the path."""
    try:
        minimum = minimum_groove(site, inputs)
    except std.OutsideTable:
        return []
    return [j for j, slot in enumerate(site.barrier.slots) if slot.credited and slot.width < minimum]


def judged_slot_index(site: Site) -> int:
    """The narrowest slot the creepage counts on; if none is counted on, the narrowest slot."""
    slots = site.barrier.slots
    credited = [j for j, slot in enumerate(slots) if slot.credited] or list(range(len(slots)))
    return min(credited, key=lambda j: slots[j].width)

