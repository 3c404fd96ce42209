"""Isolation calc: the clearance, creepage and groove width IEC 60664-1 requires, from the derived inputs."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.isolation.inputs import DOUBLED_GRADES, Inputs, Reading, Site
from dossier.standards import iec60664 as std
from dossier.units import Q_

F2_POINTS = tuple((volts, None) for volts, _ in std.CLEARANCE_F2)
F5_POINTS = tuple((volts, None) for volts in std.CREEPAGE_ROWS)


def reading_used(points, x: float, reading: Reading) -> str:
    """'on a row', 'next row up' or 'interpolated': how a table was read at x."""
    if std.on_a_row(points, x):
        return "on a row"
    return "interpolated" if reading.interpolated else "next row up"


@dataclass(frozen=True)
class ClearanceNeed:
    basic_impulse: float
    impulse: float
    transient_mm: float
    steady_peak: float
    steady_mm: float
    factor: float
    edition2_mm: float | None
    transient_reading: str
    steady_reading: str
    altitude_reading: str

    @property
    def table_mm(self) -> float:
        return max(self.transient_mm, self.steady_mm)

    @property
    def steady_governs(self) -> bool:
        return self.steady_mm > self.transient_mm

    @property
    def required_mm(self) -> float:
        return round(self.table_mm * self.factor, 6)

    @property
    def transient_required_mm(self) -> float:
        return round(self.transient_mm * self.factor, 6)


@dataclass(frozen=True)
class CreepageNeed:
    group: str
    column: str
    basic_mm: float
    graded_mm: float
    clearance_mm: float
    reading: str
    off_board_mm: float | None = None

    @property
    def required_mm(self) -> float:
        return self.floored(self.graded_mm)

    @property
    def off_board_required_mm(self) -> float | None:
        return None if self.off_board_mm is None else self.floored(self.off_board_mm)

    @property
    def raised_to_clearance(self) -> bool:
        return self.clearance_mm > self.graded_mm

    def floored(self, creepage_mm: float) -> float:
        """Creepage is never less than the required clearance."""
        return round(max(creepage_mm, self.clearance_mm), 6)


def impulse_voltages(inputs: Inputs, grade: str) -> tuple[float, float]:
    """(rated impulse voltage from Table F.1, the impulse voltage the clearance is dimensioned for)."""
    basic = std.rated_impulse_voltage(inputs.supply.to("V").magnitude, inputs.category)
    return basic, std.reinforced_impulse_voltage(basic) if grade in DOUBLED_GRADES else basic


def steady_peak_voltage(inputs: Inputs, grade: str) -> float:
    """The peak the steady-state clearance (Table F.8) is dimensioned for: 160 % for reinforced and double."""
    peak = inputs.working_peak.to("V").magnitude
    return std.reinforced_steady_voltage(peak) if grade in DOUBLED_GRADES else peak


def clearance_need(inputs: Inputs, grade: str) -> ClearanceNeed:
    basic, impulse = impulse_voltages(inputs, grade)
    interpolated, altitude = inputs.reading.interpolated, inputs.altitude.to("m").magnitude
    factor = std.altitude_factor(altitude, interpolated)
    edition2 = _edition2_clearance(basic, inputs.pollution_degree, factor) if grade in DOUBLED_GRADES else None
    peak = steady_peak_voltage(inputs, grade)
    return ClearanceNeed(
        basic, impulse, std.clearance_mm(impulse, inputs.pollution_degree, interpolated),
        peak, std.steady_clearance_mm(peak, interpolated), factor, edition2,
        reading_used(F2_POINTS, impulse, inputs.reading), reading_used(std.STEADY_CLEARANCE_F8, peak, inputs.reading),
        reading_used(std.ALTITUDE_A2, altitude, inputs.reading),
    )


def _edition2_clearance(basic: float, pollution_degree: int, factor: float) -> float | None:
    try:
        return round(std.clearance_mm(std.next_impulse_step(basic), pollution_degree) * factor, 6)
    except std.OutsideTable:
        return None


def creepage_need(inputs: Inputs, site: Site, group: str, clearance_mm: float) -> CreepageNeed:
    volts, pd, board = inputs.creepage_voltage.to("V").magnitude, inputs.pollution_degree, site.barrier.printed_board
    interpolated = inputs.reading.interpolated
    column = std.creepage_column(pd, group, board)
    basic = std.basic_creepage_mm(volts, pd, group, board, interpolated)
    factor = std.REINFORCED_CREEPAGE_FACTOR if site.grade in DOUBLED_GRADES else 1
    # the value without the printed-board column, for product standards that have no such column
    off_board = std.basic_creepage_mm(volts, pd, group, False, interpolated) * factor if column.startswith("board-") else None
    return CreepageNeed(group, column, basic, basic * factor, clearance_mm, reading_used(F5_POINTS, volts, inputs.reading), off_board)


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
