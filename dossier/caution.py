"""The safety caution, worded once and shown wherever mains work is concerned."""

MAINS_CAUTION = (
    "Mains voltages can kill. These findings support a review; they do not replace local codes and "
    "regulations, the standards themselves, or inspection by a licensed, qualified person."
)

POWER_UP_CAUTION = (
    "Mains voltages can kill, and charged capacitors stay dangerous after the plug is pulled. "
    "Follow local codes and licensed practice, and do not work alone."
)
