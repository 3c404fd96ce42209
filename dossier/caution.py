"""The safety caution, worded once and shown wherever mains work is concerned."""

from dossier.units import fmt

MAINS_CAUTION = (
    "Mains voltages can kill. These findings support a review; they do not replace local codes and "
    "regulations, the standards themselves, or inspection by a licensed, qualified person."
)

POWER_UP_CAUTION = (
    "Mains voltages can kill, and charged capacitors stay dangerous after the plug is pulled. "
    "Follow local codes and licensed practice, and do not work alone."
)


def beyond_mains_caution(rails: list[str]) -> str:
    """The caution's words for hazardous voltages beyond the mains, each rail as 'B+ (up to 400 V DC)'; '' for none."""
    if not rails:
        return ""
    return (
        "This unit also makes hazardous voltages beyond the mains: " + "; ".join(rails) + ". They can stay charged "
        "after switch-off and after the plug is pulled: wait the discharge time, then measure each before touching."
    )


def rail_label(hazard) -> str:
    """'B+ (up to 400 V DC)': a hazardous rail (dossier.calcs.rails.hazards.RailHazard) as the cautions name it."""
    return f"{hazard.name} (up to {fmt(hazard.worst)} {hazard.kind.upper()})"
