"""A winding's temperature rise by the resistance method, for windings at a hazardous voltage where a thermocouple
would have to touch them: its resistance cold before the soak and hot straight after it.

  dT = (R2 - R1) / R1 x (234.5 + t1) - (t2 - t1)     copper; t1 the room at the cold reading, t2 at the end
(IEC 60335-1, 11.3; IEC 60076-2 the same with 235).
"""

from __future__ import annotations

from dossier.checklist.items import Item, Origin, Phase, at_most, slug
from dossier.citations import IEC_60076_2, IEC_60335_1_RESISTANCE_METHOD
from dossier.units import Q_

COPPER_CONSTANT = 234.5  # degC: the inverse of copper's temperature coefficient at 0 degC, IEC 60335-1 11.3


def rise_by_resistance(cold, cold_room, hot, end_room):
    """Winding rise in kelvin from its cold and hot resistances and the room at each reading."""
    ratio = ((hot - cold) / cold).to("").magnitude
    t1, t2 = cold_room.to("degC").magnitude, end_room.to("degC").magnitude
    return Q_(ratio * (COPPER_CONSTANT + t1) - (t2 - t1), "K")


def winding_by_resistance(part, limit) -> list[Item]:
    ref = part.ref
    sources = (IEC_60335_1_RESISTANCE_METHOD, IEC_60076_2)
    cold = Item(
        key=f"winding-{slug(ref)}-cold", phase=Phase.UNPOWERED, origin=Origin.BUILD, title=f"Cold resistance of {ref}'s primary",
        steps=(f"Unplugged, after the unit has stood in the room for some hours, measure the DC resistance of {ref}'s primary "
               "at its terminals (a four-wire meter for under 10 ohm) and note the room temperature t1 beside it."),
        unit="ohm", sources=sources,
    )
    hot = Item(
        key=f"soak-{slug(ref)}", phase=Phase.SOAK, origin=Origin.BUILD, title=f"Temperature rise of {ref} by the resistance method",
        steps=(f"No thermocouple on {ref}: its windings sit at a hazardous voltage. At the end of the soak switch off, unplug, "
               "discharge, and within a minute measure the same winding's resistance R2 the same way; note the room t2. "
               f"Enter dT = (R2 - R1) / R1 x (234.5 + t1) - (t2 - t1) in kelvin, R1 and t1 from the cold reading."),
        unit="K", expected=at_most(limit.rise) if limit is not None else None, sources=sources + (limit.sources if limit else ()),
        note=limit.why if limit is not None else f"No limit for {ref} could be worked out from the record; note the reading.",
    )
    return [cold, hot]
