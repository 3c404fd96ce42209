"""Isolation calc: which standard a record is judged against, and from where that choice came."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.shared.standard_choice import chosen_product_standard
from dossier.standards.product import BASIC_TITLE, ProductStandard

STANDARD_LABEL = "product standard"  # the Measure every standard-dependent finding carries, read by the changes


@dataclass(frozen=True)
class Chosen:
    """The standard in force for one record: None is IEC 60664-1 alone; origin says where it was named."""

    standard: ProductStandard | None
    origin: str  # 'record', 'archive' or 'default'

    @property
    def name(self) -> str:
        return BASIC_TITLE if self.standard is None else f"{self.standard.title} {self.standard.edition_text}"

    @property
    def keys(self) -> tuple[tuple, ...]:
        return (("standard",),) if self.origin == "record" else ()


def chosen_standard(record, default=None) -> Chosen:
    """The record's own choice, else the archive's default (archive.yaml standard), else IEC 60664-1."""
    return Chosen(*chosen_product_standard(record, default))
