"""The touch limit of a touchable heatsink: the record's or common practice's margin, or, under a product standard
that holds accessible-part limits, that standard's figure for metal by how the part is touched -- the lower of the
two when both apply (the harsher reading)."""

from __future__ import annotations

from dataclasses import dataclass, replace

from dossier.calcs.shared.margins import margin
from dossier.calcs.shared.standard_choice import RECORD_KEY
from dossier.citations import IEC_60335_1, IEC_61010_1, IEC_61558_1, IEC_62368_1
from dossier.findings import Source
from dossier.units import Q_

DEFAULT_CONTACT = "held"  # the record silent on contact: the lower limit, for a part held or touched for longer
SOURCES = {"iec-62368-1": IEC_62368_1, "iec-60335-1": IEC_60335_1, "iec-61010-1": IEC_61010_1, "iec-61558-1": IEC_61558_1}


@dataclass(frozen=True)
class Touch:
    limit: object  # degC
    source: Source
    from_record: bool
    standard_words: str  # what the product standard said, or '' when none applies
    keys: tuple


def touch_limit(record, heatsink, index: int, standard, origin: str) -> Touch:
    own = margin(record, "touch_temperature")
    if standard is None:
        return Touch(own.value.to("degC"), own.source, own.from_record, "", ())
    keys = (("devices", "heatsinks", index, "contact"),) + ((RECORD_KEY,) if origin == "record" else ())
    if standard.touch is None:
        said = f"{standard.title} holds no accessible-part temperature limit here, so the default applies"
        return Touch(own.value.to("degC"), own.source, own.from_record, said, keys)
    contact = heatsink.contact or DEFAULT_CONTACT
    rule = standard.touch.for_contact(contact)
    room = record.environment.max_ambient.to("degC")
    limit = Q_(room.magnitude + rule.degrees, "degC") if rule.rise else Q_(rule.degrees, "degC")
    said = _standard_words(standard, rule, contact, heatsink.contact is None, room)
    source = replace(SOURCES[standard.key], edition=standard.edition_text, clause=rule.table)
    if own.from_record and own.value.to("degC") < limit:
        return Touch(own.value.to("degC"), own.source, True, said + "; the record's own lower limit is kept", keys)
    return Touch(limit, source, False, said, keys)


def _standard_words(standard, rule, contact: str, silent: bool, room) -> str:
    how = "a rise of {:g} K over the room's highest, {}".format(rule.degrees, room) if rule.rise else f"{rule.degrees:g} degC"
    text = f"{standard.title} {rule.table}: {how} for metal {'held or touched for longer' if contact == 'held' else 'touched briefly'}"
    if silent:
        text += (" (the record does not say how it is touched: the lower, held figure is taken, the harsher reading; "
                 "declare devices.heatsinks[].contact: brief to make it exact)")
    return text
