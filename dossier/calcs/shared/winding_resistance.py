"""A winding's DC resistance from how it is laid on its core: turns x mean turn x copper's resistivity (IEC 60028),
cold at 20 degC or hot at the core material's maximum temperature (100 degC when the material gives none)."""

from __future__ import annotations

from dossier.calcs.shared.bobbin import lay_bobbin
from dossier.calcs.shared.winding_fill import lay
from dossier.record.magnetics import LAMINATED
from dossier.standards.copper import REFERENCE_TEMPERATURE, resistance
from dossier.units import Q_

DEFAULT_HOT = Q_(100, "degC")


def laid(core, windings):
    """The windings laid on the core: on a bobbin for a laminated core, round the section of a toroid."""
    return lay_bobbin(core, windings) if core.shape in LAMINATED else lay(core, windings)


def hot_temperature(material):
    """(the temperature a winding is taken hot at, why): the material's maximum, else 100 degC."""
    if material.max_temperature is not None:
        return material.max_temperature.to("degC"), "the material's maximum temperature"
    return DEFAULT_HOT, "100 degC taken: the material declares no maximum temperature"


def layout_resistance(winding, layout, temperature=REFERENCE_TEMPERATURE):
    """DC resistance of a whole winding from its layout; None when its mean turn length is not known."""
    if layout is None or layout.mean_turn_length is None:
        return None
    return resistance(winding.turns * layout.mean_turn_length, layout.copper_area, temperature)
