"""How close to saturation a core may run, by material family, and what to say when it runs closer.

Ferrite's saturation flux density falls as it warms (power grades: about 0.49 T at 25 degC, 0.39 T at 100 degC)
and a saturating ferrite core lets a switch's current climb without limit, so a quarter of headroom is kept
below the hot figure. Silicon steel at mains frequency keeps its saturation over the working temperature range,
and the flux is already worked out at high line, so a tenth is kept; mains transformers are customarily wound
for 1.2-1.5 T on non-oriented laminations and up to about 1.7 T on grain-oriented tape. Iron powder saturates
softly, its permeability falling first; it keeps the ferrite quarter, and a choke's DC field is checked apart.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.findings import Source, common_practice
from dossier.units import Q_

STEEL_UP_TO = Q_(400, "Hz")  # above this a wound core is taken to be ferrite unless the record says otherwise


@dataclass(frozen=True)
class Rule:
    headroom: float
    source: Source
    advice: str


RULES = {
    "ferrite": Rule(0.25, common_practice(
        "ferrite: peak flux density kept at least a quarter below saturation at the hot temperature; saturation "
        "falls as the core warms (makers' datasheets: about 0.49 T at 25 degC, 0.39 T at 100 degC for power ferrite)"),
        "A ferrite core that saturates lets the switch current climb without limit. More turns, a larger core or a "
        "higher frequency lower the flux."),
    "iron-powder": Rule(0.25, common_practice(
        "iron powder: saturation is soft and the permeability falls first; peak flux density kept a quarter below "
        "the saturation figure, the DC field judged on its own (from memory)"),
        "Iron powder loses inductance well before it saturates. A larger core or fewer ampere-turns lower the flux."),
    "silicon-steel": Rule(0.10, common_practice(
        "silicon steel at mains frequency: peak flux density at high line kept at least a tenth below saturation; "
        "steel's saturation barely changes with temperature, and mains transformers are wound for 1.2-1.5 T on "
        "non-oriented laminations, up to about 1.7 T on grain-oriented tape (from memory)"),
        "Near saturation a steel core's magnetising current rises steeply: the primary runs hot, the core hums and "
        "the switch-on surge grows. More primary turns or a larger core lower the flux; check too that the "
        "saturation figure is the material's, not the maker's suggested working flux density."),
}


def family_of(material, frequency) -> tuple[str, str]:
    """(family, how it was found): declared, else judged from the operating frequency."""
    if material.family is not None:
        return material.family, "declared"
    if frequency is not None and frequency <= STEEL_UP_TO:
        return "silicon-steel", "taken from the frequency (declare core.material.family if it is not steel)"
    return "ferrite", "taken from the frequency (declare core.material.family if it is not ferrite)"


def rule_for(family: str) -> Rule:
    return RULES[family]
