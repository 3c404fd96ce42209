"""Switches: what each blocks in its topology, against the rating the record says it gives.

A bipolar transistor has three voltage ratings: V_CBO (collector-base, emitter open), V_CES (collector-emitter,
base shorted to the emitter) and V_CEO (collector-emitter, base open), V_CEO the lowest. Only V_CEO holds whatever
the base circuit does; V_CES holds while the base is held off through a low impedance. A MOSFET is rated by V_DSS,
an IGBT by V_CES (makers' datasheets; Mohan et al., power semiconductor devices; from memory).
"""

from __future__ import annotations

from dossier.calcs.stress.roles import BLOCKING_FACTOR
from dossier.calcs.stress.voltages import Rail, Voltages


def blocking(voltages: Voltages, index: int, stage) -> Rail | None:
    factor = BLOCKING_FACTOR.get(stage.topology)
    supply = voltages.supply_of(index)
    if factor is None or supply is None:
        return None
    formula = f"V_block = {factor} x V_in ({stage.topology}); {supply.formula}"
    return Rail(factor * supply.voltage, formula, f"{supply.basis}, {stage.topology} stage '{stage.name}'", ("stages", index, "topology"),
                notes=supply.notes, sources=supply.sources)


def rating_doubt(device) -> str | None:
    """Why the declared rating may not be the one that applies (a key into words.RATING_KIND_NOTES), or None."""
    if device.kind != "bjt":
        return None
    kind = device.voltage_rating_kind
    if kind is None:
        return "unstated"
    if kind == "V_CBO":
        return "cbo"
    if kind == "V_CES" and not device.base_held_off:
        return "ces-base-open"
    return None


def rating_name(device) -> str:
    """The rating the comparison uses, as the finding labels it."""
    if device.kind == "mosfet":
        return "V_DSS"
    if device.kind == "igbt":
        return "V_CES"
    return device.voltage_rating_kind or "V_CEO (read so: unstated)"
