"""The margins the stress and thermal calcs judge by: the record's own, else common practice."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.citations import IEC_62368_1
from dossier.findings import Source, common_practice
from dossier.units import Q_, fmt


@dataclass(frozen=True)
class Margin:
    value: object
    source: Source
    from_record: bool


# name -> (default, what common practice or the cited source says); every default is overridable
# in the record under devices.margins.
DEFAULTS = {
    "switch_voltage": (Q_(1.25), common_practice(
        "a switch's voltage rating at least 1.25 x the highest voltage it blocks (run at no more than 80 %), "
        "to leave room for switching spikes (from memory)")),
    "rectifier_voltage": (Q_(1.5), common_practice(
        "a rectifier's reverse-voltage rating 1.5 to 2 x its peak inverse voltage, for ringing and spikes; "
        "the lower end is used (from memory)")),
    "capacitor_voltage": (Q_(1.1), common_practice(
        "a capacitor run at no more than about 90 % of its rated voltage at the highest line (from memory)")),
    "junction": (Q_(25, "K"), common_practice(
        "keep a junction at least 25 K below its maximum rating for life and for estimate error (from memory)")),
    "touch_temperature": (Q_(60, "degC"), Source(
        title=IEC_62368_1.title,
        publisher=IEC_62368_1.publisher,
        edition="edition 3.0, 2018",
        clause=("Table 38, touch temperature limits for accessible parts (TS1), measured at 25 degC ambient (the table "
                "confirmed in public discussion of the standard); 60 degC for bare metal touched for a short time (the "
                "figure from memory; IEC 60335-1 Table 3 sets rises instead, for appliances)"),
    )),
}


def margin(record, name: str) -> Margin:
    """The margin called name: the record's value with its basis, or the default with its source."""
    chosen = getattr(record.devices.margins, name)
    default, source = DEFAULTS[name]
    if chosen is None:
        return Margin(default, source, from_record=False)
    return Margin(chosen, _record_source(record, name, chosen), from_record=True)


def _record_source(record, name: str, value) -> Source:
    basis = record.devices.margins.basis or "the builder's record"
    return common_practice(f"{name.replace('_', ' ')} margin {fmt(value)} set by {basis}")
