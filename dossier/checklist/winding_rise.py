"""The resistance method for a winding at mains voltage: its rise worked out from its resistance, cold and hot.

A thermocouple held to a mains transformer's primary while the unit runs puts a hand next to a live winding.
The copper formula of the appliance standards measures the same rise from outside with the mains unplugged:
R1 and the room temperature t1 before the soak, R2 and t2 straight after it, and
dT = (R2 - R1) / R1 x (234.5 + t1) - (t2 - t1) (IEC 60335-1, clause 11.3; dossier.standards.copper).
"""

from __future__ import annotations

from dataclasses import replace

from dossier.checklist.items import Item, Origin, Phase, at_most, slug
from dossier.citations import IEC_60335_1
from dossier.standards.copper import COPPER_CONSTANT
from dossier.units import fmt

RESISTANCE_METHOD = replace(IEC_60335_1, clause=(
    "11.3: winding temperature rise by the resistance method, dT = (R2 - R1) / R1 x (k + t1) - (t2 - t1), "
    "k = 234.5 for copper"))
MEASURE_WITHIN = "30 s"  # the winding cools from the moment the power is off (common practice: measure at once)
MAINS_ROLES = ("mains-transformer",)


def mains_winding(record, magnetic):
    """The winding at mains voltage the method is offered for: a mains transformer's first primary; else None."""
    if record.mains is None or magnetic.role not in MAINS_ROLES:
        return None
    return next((w for w in magnetic.windings if w.role == "primary"), magnetic.windings[0])


def rise_item(magnetic, winding, estimate, cold_estimate, limit, sources, why) -> Item:
    """The rise by the resistance method in place of a thermocouple; the key stays the soak point's.

    R1 is taken before the run within the same item, so a sheet already filled in keeps its keys.
    """
    guess = f" The estimate at full load is a rise of about {fmt(estimate)}." if estimate is not None else ""
    cold = f" (the design works out about {fmt(cold_estimate)} at 20 degC)" if cold_estimate is not None else ""
    k = COPPER_CONSTANT.to("K").magnitude
    return Item(
        key=f"soak-{slug(magnetic.ref)}", phase=Phase.SOAK, origin=Origin.BUILD,
        title=f"Temperature rise of {magnetic.ref} {winding.name} by the resistance method",
        steps=(
            f"Do not hold a thermocouple to {magnetic.ref}: its {winding.name} is at mains voltage while the unit runs. "
            f"Before the soak, with the mains unplugged and the unit at room temperature for some hours, measure the "
            f"resistance R1 of the {winding.name} at its terminals{cold} and the room temperature t1, and write both "
            f"beside this item; mark the points you measured at. At the end of the soak switch off, unplug the mains lead, and within {MEASURE_WITHIN} measure the resistance "
            f"R2 at the same points as R1, and the room temperature t2. Work out the rise "
            f"dT = (R2 - R1) / R1 x ({k:g} + t1) - (t2 - t1), {k:g} K being copper's constant, and enter it in kelvin.{guess}"
        ),
        unit="K",
        expected=at_most(limit) if limit is not None else None,
        sources=tuple(sources) + (RESISTANCE_METHOD,),
        note=why if limit is not None else f"No limit for {magnetic.ref} could be worked out from the record; note the reading.",
    )
