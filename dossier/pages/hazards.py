"""The hazards a build presents, read from its record (not from the calcs): what to respect on the bench."""

from __future__ import annotations

from dossier.caution import rail_label
from dossier.wording import quantity_text


def hazards(record, rails=()) -> list[str]:
    """Plain sentences, most serious first; empty for a build with nothing hazardous declared. rails: the rails
    calc's hazards (dossier.calcs.rails.hazards.RailHazard), the voltages beyond the mains."""
    found = [
        _mains(record),
        *(_rail(hazard) for hazard in rails),
        _stored_charge(record),
        *_live_tabs(record),
        _earthing(record),
        _battery(record),
    ]
    return [sentence for sentence in found if sentence]


def _mains(record) -> str:
    if not record.has_mains:
        return ""
    stages = [stage.name for stage in record.stages if stage.side == "mains"]
    where = f" It is present in: {', '.join(stages)}." if stages else ""
    return f"Mains voltage, {quantity_text(record.mains.nominal)} at {quantity_text(record.mains.frequency)}.{where}"


def _rail(hazard) -> str:
    where = " It is brought out to a terminal someone can touch." if hazard.accessible else ""
    return (f"Hazardous voltage beyond the mains: rail {rail_label(hazard)} at no load and high line, above the "
            f"{quantity_text(hazard.limit)} {hazard.kind.upper()} limit for touch; it stays charged after switch-off.{where}")


def _stored_charge(record) -> str:
    capacitance = record.protection.bulk_capacitance
    if capacitance is None:
        return ""
    return (
        f"Stored charge: {quantity_text(capacitance)} of bulk capacitance charges to the rectified mains peak "
        "and can stay charged after the plug is pulled; discharge and measure before touching."
    )


def _live_tabs(record) -> list[str]:
    live = [device for device in record.devices.semiconductors if device.tab_live]
    sentences = []
    for heatsink in sorted({device.heatsink for device in live}):
        refs = ", ".join(device.ref for device in live if device.heatsink == heatsink)
        bare = [device.ref for device in live if device.heatsink == heatsink and not device.insulated]
        sentences.append(_tab_sentence(refs, heatsink, bare))
    return sentences


def _tab_sentence(refs: str, heatsink: str, bare: list[str]) -> str:
    if not heatsink:
        return f"Live metal tabs on {refs}."
    if bare:
        return f"Heatsink {heatsink} is live: {', '.join(bare)} sit on it without insulation."
    return f"Live metal tabs on {refs}, insulated from heatsink {heatsink}: the insulation is all that separates it from mains."


def _earthing(record) -> str:
    earth = record.protection.earth
    if earth is None:
        return "Protective class not declared: how touchable metal is kept safe is unknown." if record.has_mains else ""
    if earth.protective_class == "I":
        bonding = f" ({earth.bonding})" if earth.bonding else ""
        return f"Class I: touchable metal relies on the protective earth{bonding}; check the earth bond before power-up."
    return "Class II: safety relies on double or reinforced insulation; no protective earth."


def _battery(record) -> str:
    battery = record.output.battery if record.output is not None else None
    if battery is None:
        return ""
    return (
        f"Battery: {quantity_text(battery.capacity)} {battery.chemistry}. A short across its leads can deliver very "
        "high current; fuse the lead close to the battery and charge where gas can disperse."
    )
