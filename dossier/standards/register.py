"""The product standards held, by name and edition; IEC 60664-1 is the default and needs no entry."""

from __future__ import annotations

from dossier.standards import iec60335, iec61010, iec61558, iec62368
from dossier.standards.product import BASIC_EDITION, BASIC_STANDARD, ProductStandard

HELD: dict[tuple[str, int], ProductStandard] = {
    (s.key, s.edition): s for s in (iec62368.STANDARD, iec60335.STANDARD, iec61010.STANDARD, iec61558.STANDARD)
}


def held_names() -> tuple[str, ...]:
    """'iec-60664-1 edition 3', 'iec-62368-1 edition 3', ...: what a record or archive.yaml may name."""
    return (f"{BASIC_STANDARD} edition {BASIC_EDITION}", *(f"{key} edition {edition}" for key, edition in HELD))


def is_held(key: str, edition: int) -> bool:
    return (key, edition) == (BASIC_STANDARD, BASIC_EDITION) or (key, edition) in HELD


def product_standard(key: str, edition: int) -> ProductStandard | None:
    """The product standard held under this name and edition; None for IEC 60664-1 (the basic standard)."""
    if (key, edition) == (BASIC_STANDARD, BASIC_EDITION):
        return None
    return HELD[(key, edition)]
