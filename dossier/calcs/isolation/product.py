"""Isolation calc: clearance and creepage by a product standard's tables, where the record names one."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.isolation.inputs import Inputs, Site
from dossier.calcs.isolation.needs import ClearanceNeed
from dossier.standards.product import ProductStandard, Requirement


@dataclass(frozen=True)
class ProductClearance:
    """The product standard's transient clearance, with the IEC 60664-1 steady-state floor and altitude factor."""

    table: Requirement
    steady_mm: float
    factor: float
    basic_standard_mm: float  # what IEC 60664-1 alone would ask

    @property
    def required_mm(self) -> float:
        return round(max(self.table.value, self.steady_mm) * self.factor, 6)

    @property
    def steady_governs(self) -> bool:
        return self.steady_mm > self.table.value


@dataclass(frozen=True)
class ProductCreepage:
    table: Requirement
    clearance_mm: float
    basic_standard_mm: float | None

    @property
    def required_mm(self) -> float:
        return round(max(self.table.value, self.clearance_mm), 6)

    @property
    def raised_to_clearance(self) -> bool:
        return self.clearance_mm > self.table.value


def product_clearance(standard: ProductStandard, inputs: Inputs, site: Site, need: ClearanceNeed) -> ProductClearance:
    """The standard's table entered with the rated impulse voltage; Table F.8's steady-state clearance stays a floor."""
    table = standard.clearance(need.basic_impulse, inputs.pollution_degree, site.grade,
                               working_v=inputs.creepage_voltage.to("V").magnitude, category=inputs.category)
    return ProductClearance(table, need.steady_mm, need.factor, need.required_mm)


def product_creepage(standard: ProductStandard, inputs: Inputs, site: Site, group: str, clearance_mm: float | None,
                     basic_standard_mm: float | None) -> ProductCreepage:
    volts = inputs.creepage_voltage.to("V").magnitude
    table = standard.creepage(volts, inputs.pollution_degree, group, site.barrier.printed_board, site.grade)
    return ProductCreepage(table, clearance_mm or 0.0, basic_standard_mm)
