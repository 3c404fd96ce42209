"""Which product standard a record is judged against: its own choice, else the archive's default, else none
(IEC 60664-1, the basic standard). Shared by the calcs whose limits follow the product standard."""

from __future__ import annotations

from dossier.standards.product import ProductStandard
from dossier.standards.register import product_standard

RECORD_KEY = ("standard",)


def chosen_product_standard(record, default=None) -> tuple[ProductStandard | None, str]:
    """(the product standard or None for IEC 60664-1, where it was named: 'record', 'archive' or 'default')."""
    if record.standard is not None:
        return product_standard(record.standard.name, record.standard.edition), "record"
    if default is not None:
        return product_standard(default.name, default.edition), "archive"
    return None, "default"
