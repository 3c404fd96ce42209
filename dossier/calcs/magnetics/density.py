"""The current-density limit of a winding from the size of its core: McLyman's J = K_j A_p^x.

McLyman, Transformer and Inductor Design Handbook (3rd edition, 2004), chapter 5, tabulates K_j and x by core
configuration for a 25 and a 50 degC temperature rise, with A_p = W_a A_c in cm^4 and J in A/cm^2 (values from
memory). A small core sheds its heat over more surface per watt, so it may carry a higher density.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.units import Q_

# configuration: (K_j at 25 degC rise, K_j at 50 degC rise, x); McLyman 3rd ed., chapter 5 (from memory)
KJ_TABLE = {
    "pot": (433, 632, -0.17),
    "powder": (403, 590, -0.12),
    "lamination": (366, 534, -0.12),
    "c-core": (323, 468, -0.14),
    "single-coil": (395, 569, -0.14),
    "tape-wound": (250, 365, -0.13),
}
INSULATION_CLASSES = {"A": 105, "E": 120, "B": 130, "F": 155, "H": 180, "N": 200, "R": 220}  # IEC 60085:2007, Table 1
HARSHEST_CLASS = "A"
SHAPE_CONFIGURATION = {"ei-lamination": "lamination", "ui-lamination": "lamination", "c-core": "c-core"}
# Forced air: no McLyman row; the flat common-practice figure stays.
FORCED_AIR_LIMIT = Q_(8, "A/mm**2")
UNSIZED_LIMIT = Q_(5, "A/mm**2")  # upper end of the 2-5 A/mm^2 band for small naturally cooled transformers (common practice)


@dataclass(frozen=True)
class DensityLimit:
    limit: object
    configuration: str
    how: str
    rise: int
    kj: float
    exponent: float
    area_product: object


def configuration_of(core, family: str) -> tuple[str, str]:
    """(McLyman configuration, how it was found): declared; a toroid by its material; else the lowest K_j (harsher)."""
    if core.configuration is not None:
        return core.configuration, "declared"
    if core.shape == "toroid":
        found = "tape-wound" if family == "silicon-steel" else "powder"
        return found, f"a {family} toroid; declare core.configuration to change it"
    if core.shape in SHAPE_CONFIGURATION:
        return SHAPE_CONFIGURATION[core.shape], f"from the shape {core.shape}"
    lowest = min(KJ_TABLE, key=lambda name: KJ_TABLE[name][0])
    return lowest, "not declared: the lowest K_j of the table taken (harsher reading; declare core.configuration)"


def rise_row(allowed_rise) -> int:
    """The table's 50 degC row only when that much rise is allowed; else the 25 degC row (harsher)."""
    return 50 if allowed_rise is not None and allowed_rise.to("K").magnitude >= 50 else 25


def class_temperature(letter: str):
    return Q_(INSULATION_CLASSES[letter], "degC")


def core_size_limit(core, geometry, family: str, allowed_rise) -> DensityLimit | None:
    """J = K_j A_p^x for natural cooling; None when the window area is not known."""
    if geometry.window_area is None:
        return None
    configuration, how = configuration_of(core, family)
    kj25, kj50, exponent = KJ_TABLE[configuration]
    rise = rise_row(allowed_rise)
    kj = kj50 if rise == 50 else kj25
    product = (geometry.window_area * geometry.effective_area).to("cm**4")
    limit = Q_(kj * product.magnitude**exponent, "A/cm**2").to("A/mm**2")
    return DensityLimit(limit, configuration, how, rise, kj, exponent, product)
